import { z } from 'zod';
import {
  buildCreate,
  DEFAULT_SYSTEMS,
  DEFAULT_VIDEO_LINK_PATTERN,
  type Build,
  type BuildCreate,
  type BuildUpdate,
} from '../../../shared/schemas/builds';
import { DEFAULT_CURRENCY } from './currencies';
import { formatBudgetInput, parseBudget } from './money';
import { copySystems } from './system-keys';

/**
 * The build form: `buildCreate` with the budget as the decimal a person types. The conversion to
 * minor units happens inside the schema, so the resolver hands the submit handler a `BuildCreate`.
 */
export const buildFormSchema = buildCreate
  .omit({ budgetMinor: true })
  .extend({ budget: z.string().max(40) })
  .superRefine((values, ctx) => {
    const parsed = parseBudget(values.budget, values.currency);
    if (!parsed.ok) ctx.addIssue({ code: 'custom', path: ['budget'], message: parsed.message });
  })
  .transform(({ budget, ...rest }): BuildCreate => {
    const parsed = parseBudget(budget, rest.currency);
    return { ...rest, budgetMinor: parsed.ok ? parsed.minor : null };
  });

export type BuildFormValues = z.input<typeof buildFormSchema>;

/** What a new build starts with; the currency may be replaced by the browser's region after mount. */
export function newBuildValues(): BuildFormValues {
  return {
    title: '',
    vehicleKind: 'car',
    vehicleMake: null,
    vehicleModel: null,
    vehicleYear: null,
    summary: null,
    currency: DEFAULT_CURRENCY,
    budget: '',
    visibility: 'private',
    videoLinkPattern: DEFAULT_VIDEO_LINK_PATTERN,
    systems: copySystems(DEFAULT_SYSTEMS),
  };
}

/** The form's values for a saved build. */
export function buildValues(b: Build): BuildFormValues {
  return {
    title: b.title,
    vehicleKind: b.vehicleKind,
    vehicleMake: b.vehicleMake,
    vehicleModel: b.vehicleModel,
    vehicleYear: b.vehicleYear,
    summary: b.summary,
    currency: b.currency,
    budget: formatBudgetInput(b.budgetMinor, b.currency),
    visibility: b.visibility,
    videoLinkPattern: b.videoLinkPattern,
    systems: copySystems(b.systems),
  };
}

const EDITABLE = [
  'title',
  'vehicleKind',
  'vehicleMake',
  'vehicleModel',
  'vehicleYear',
  'summary',
  'currency',
  'budgetMinor',
  'visibility',
  'videoLinkPattern',
  'systems',
] as const satisfies ReadonlyArray<keyof BuildCreate & keyof Build>;

/** Only the fields that differ from the saved build, for a PATCH; empty when nothing changed. */
export function changedFields(saved: Build, next: BuildCreate): BuildUpdate {
  const patch: Record<string, unknown> = {};
  for (const name of EDITABLE) {
    const before = saved[name];
    const after = next[name];
    if (after === undefined) continue;
    if (JSON.stringify(before) !== JSON.stringify(after)) patch[name] = after;
  }
  return patch as BuildUpdate;
}

/** Systems present in the saved build that the new list no longer has (by key). */
export function removedSystems(saved: Build, next: BuildCreate): Build['systems'] {
  const keep = new Set((next.systems ?? []).map((s) => s.key));
  return saved.systems.filter((s) => !keep.has(s.key));
}
