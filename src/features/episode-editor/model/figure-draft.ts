// The figure form's state as typed (strings), and its conversion to the API's figure input.

import { figureChecks, type FigureCheck } from '../../../shared/figure-checks';
import { figureInput, type Figure, type FigureInput, type TighteningMethod, type ValueSource } from '../../../shared/schemas/figures';
import type { TorqueUnit } from '../../../shared/torque';

export interface FigureDraft {
  fastener: string;
  thread: string;
  gradeFitted: string;
  gradeSpecified: string;
  method: TighteningMethod;
  value: string;
  unit: TorqueUnit;
  /** Angles in degrees, separated by commas or spaces: "90, 90". */
  angleStages: string;
  source: ValueSource;
  wrenchMin: string;
  wrenchMax: string;
  wrenchUnit: TorqueUnit;
  systemKey: string;
  note: string;
}

export type FigureDraftField = keyof FigureDraft;

export const EMPTY_FIGURE_DRAFT: FigureDraft = {
  fastener: '',
  thread: 'M8',
  gradeFitted: '',
  gradeSpecified: '',
  method: 'torque',
  value: '',
  unit: 'N-m',
  angleStages: '',
  source: 'workshop-manual',
  wrenchMin: '',
  wrenchMax: '',
  wrenchUnit: 'N-m',
  systemKey: '',
  note: '',
};

const text = (n: number | null | undefined) => (n === null || n === undefined ? '' : String(n));

export function draftFromFigure(f: Figure): FigureDraft {
  return {
    fastener: f.fastener,
    thread: f.thread,
    gradeFitted: f.gradeFitted ?? '',
    gradeSpecified: f.gradeSpecified ?? '',
    method: f.method,
    value: text(f.value),
    unit: f.unit,
    angleStages: f.angleStages.join(', '),
    source: f.source,
    wrenchMin: text(f.wrenchRange?.min),
    wrenchMax: text(f.wrenchRange?.max),
    wrenchUnit: f.wrenchRange?.unit ?? 'N-m',
    systemKey: f.system?.key ?? '',
    note: f.note ?? '',
  };
}

/** "12,5" is read as 12.5 (a decimal comma); text that is not a number goes on as is, for the schema to name. */
function number(s: string): number | string | null {
  const t = s.trim();
  if (t === '') return null;
  const n = Number(t.replace(',', '.'));
  return Number.isFinite(n) ? n : t;
}

/** What the form would send: loosely typed, so the shared schema reports every problem by field. */
export function draftToBody(d: FigureDraft): Record<string, unknown> {
  const noRange = d.wrenchMin.trim() === '' && d.wrenchMax.trim() === '';
  return {
    fastener: d.fastener,
    thread: d.thread,
    gradeFitted: d.gradeFitted || null,
    gradeSpecified: d.gradeSpecified || null,
    method: d.method,
    value: number(d.value),
    unit: d.unit,
    angleStages:
      d.method === 'torque-angle'
        ? d.angleStages
            .split(/[\s,;]+/)
            .filter(Boolean)
            .map((a) => number(a))
        : [],
    source: d.source,
    wrenchRange: noRange ? null : { min: number(d.wrenchMin), max: number(d.wrenchMax), unit: d.wrenchUnit },
    systemKey: d.systemKey || null,
    note: d.note.trim() === '' ? null : d.note,
  };
}

/** An API field path ("wrenchRange.max", "angleStages.0") → the form field that shows its message. */
export function draftField(path: string): FigureDraftField | null {
  if (path.startsWith('angleStages')) return 'angleStages';
  if (path === 'wrenchRange.min' || path === 'wrenchRange') return 'wrenchMin';
  if (path === 'wrenchRange.max') return 'wrenchMax';
  if (path === 'wrenchRange.unit') return 'wrenchUnit';
  return path in EMPTY_FIGURE_DRAFT ? (path as FigureDraftField) : null;
}

export type DraftErrors = Partial<Record<FigureDraftField, string>>;

/** Validates with the shared schema the server uses; the first message per field. */
export function validateDraft(d: FigureDraft): { ok: true; input: FigureInput } | { ok: false; errors: DraftErrors } {
  const parsed = figureInput.safeParse(draftToBody(d));
  if (parsed.success) return { ok: true, input: parsed.data };
  const errors: DraftErrors = {};
  for (const issue of parsed.error.issues) {
    const field = draftField(issue.path.join('.'));
    if (field && !errors[field]) errors[field] = issue.message;
  }
  return { ok: false, errors };
}

/** The checks readers will see, worked out from what is typed so far (numbers that do not parse are left out). */
export function draftChecks(d: FigureDraft): FigureCheck[] {
  const body = draftToBody(d);
  const num = (v: unknown) => (typeof v === 'number' && v > 0 ? v : null);
  const range = body.wrenchRange as { min: unknown; max: unknown } | null;
  const min = range ? num(range.min) : null;
  const max = range ? num(range.max) : null;
  return figureChecks({
    thread: d.thread,
    gradeFitted: d.gradeFitted || null,
    gradeSpecified: d.gradeSpecified || null,
    value: num(body.value),
    unit: d.unit,
    wrenchRange: min !== null && max !== null && min < max ? { min, max, unit: d.wrenchUnit } : null,
  });
}
