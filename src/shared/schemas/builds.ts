import { z } from 'zod';
import { DEFAULT_VIDEO_LINK_PATTERN, VEHICLE_KINDS, VISIBILITIES } from '../constants/builds';

export { DEFAULT_SYSTEMS, DEFAULT_VIDEO_LINK_PATTERN, VEHICLE_KINDS, VISIBILITIES } from '../constants/builds';

export const systemKey = z.string().regex(/^[a-z0-9][a-z0-9-]{0,39}$/, 'lower-case letters, digits and dashes');
export const buildSystem = z.object({
  key: systemKey,
  name: z.string().trim().min(1, 'needs a name').max(40),
  safetyCritical: z.boolean(),
});
export type BuildSystem = z.infer<typeof buildSystem>;

/** ISO 4217 alphabetic code, as the runtime's Intl knows them. */
export const currencyCode = z
  .string()
  .regex(/^[A-Z]{3}$/, 'a three-letter ISO 4217 code such as EUR')
  .refine((c) => (Intl.supportedValuesOf?.('currency') ?? []).includes(c), 'not an ISO 4217 currency code');

/**
 * How a chapter links to a moment of a hosted video: `{seconds}` is replaced by the start time.
 * Starting with `#` it becomes the URL's fragment, otherwise query parameters (`t={seconds}`).
 */
export const videoLinkPattern = z
  .string()
  .trim()
  .max(100)
  .regex(
    /^#?[A-Za-z0-9_.~-]+=[A-Za-z0-9_.~{}-]*\{seconds\}[A-Za-z0-9_.~{}-]*(&[A-Za-z0-9_.~-]+=[A-Za-z0-9_.~{}-]*)*$/,
    'like t={seconds} or #t={seconds}',
  );

const buildFields = {
  title: z.string().trim().min(1, 'needs a title').max(120),
  vehicleKind: z.enum(VEHICLE_KINDS),
  vehicleMake: z.string().trim().max(60).nullable(),
  vehicleModel: z.string().trim().max(60).nullable(),
  vehicleYear: z.string().trim().max(20).nullable(),
  summary: z.string().trim().max(2000).nullable(),
  currency: currencyCode,
  /** In minor units of `currency` (cents, pence); null when there is no budget. */
  budgetMinor: z.number().int().min(0).max(1e13).nullable(),
  visibility: z.enum(VISIBILITIES),
  videoLinkPattern,
  systems: z
    .array(buildSystem)
    .max(40)
    .refine((s) => new Set(s.map((x) => x.key)).size === s.length, 'each system needs its own key'),
};

export const buildCreate = z.object({
  ...buildFields,
  vehicleMake: buildFields.vehicleMake.optional().default(null),
  vehicleModel: buildFields.vehicleModel.optional().default(null),
  vehicleYear: buildFields.vehicleYear.optional().default(null),
  summary: buildFields.summary.optional().default(null),
  budgetMinor: buildFields.budgetMinor.optional().default(null),
  visibility: buildFields.visibility.default('private'),
  videoLinkPattern: videoLinkPattern.default(DEFAULT_VIDEO_LINK_PATTERN),
  systems: buildFields.systems.optional(),
});
export type BuildCreate = z.infer<typeof buildCreate>;

export const buildUpdate = z
  .object(buildFields)
  .partial()
  .refine((v) => Object.keys(v).length > 0, { message: 'nothing to change', path: ['title'] });
export type BuildUpdate = z.infer<typeof buildUpdate>;

export const build = z.object({
  id: z.number().int(),
  slug: z.string(),
  owner: z.object({ id: z.number().int(), handle: z.string(), displayName: z.string() }),
  ...buildFields,
  role: z.enum(['owner', 'editor']).nullable(),
  hoursWorked: z.number(),
  episodeCount: z.number().int(),
  pendingTransferTo: z.object({ userId: z.number().int(), displayName: z.string() }).nullable(),
  deletedAt: z.string().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Build = z.infer<typeof build>;

export const buildTransferCreate = z.object({ toUserId: z.number().int().positive() });
