import { z } from 'zod';
import { TIGHTENING_METHODS, VALUE_SOURCES } from '../constants/figures';
import { GRADE_CODES } from '../fasteners';
import { THREAD_CODES } from '../threads';
import { TORQUE_UNITS } from '../torque';
import { systemKey } from './builds';

export { TIGHTENING_METHOD_LABELS, TIGHTENING_METHODS, VALUE_SOURCE_LABELS, VALUE_SOURCES } from '../constants/figures';
export type { TighteningMethod, ValueSource } from '../constants/figures';

const torqueUnit = z.enum(TORQUE_UNITS, { message: `one of ${TORQUE_UNITS.join(', ')}` });
const gradeCode = z.enum(GRADE_CODES as [string, ...string[]], { message: 'not a strength grade in our tables' }).nullable();
const torqueValue = z.number({ message: 'a number' }).positive('more than zero').max(100_000, 'too large');

export const wrenchRange = z
  .object({ min: torqueValue, max: torqueValue, unit: torqueUnit })
  .refine((r) => r.min < r.max, { message: 'the top of the range must be above its bottom', path: ['max'] });

/** A figure as the editor sends it; the method decides which of value and angles are needed. */
export const figureInput = z
  .object({
    fastener: z.string().trim().min(1, 'name the fastener').max(120),
    thread: z.enum(THREAD_CODES as [string, ...string[]], { message: 'not a thread in our tables' }),
    gradeFitted: gradeCode,
    gradeSpecified: gradeCode,
    method: z.enum(TIGHTENING_METHODS, { message: `one of ${TIGHTENING_METHODS.join(', ')}` }),
    value: torqueValue.nullable(),
    unit: torqueUnit,
    /** Torque plus angle: each stage's angle in degrees, in order (two stages of 90° = [90, 90]). */
    angleStages: z
      .array(z.number({ message: 'a number of degrees' }).positive('more than zero degrees').max(360, 'at most 360 degrees'))
      .max(6, 'at most six stages'),
    source: z.enum(VALUE_SOURCES, { message: `one of ${VALUE_SOURCES.join(', ')}` }),
    wrenchRange: wrenchRange.nullable(),
    systemKey: systemKey.nullable(),
    note: z.string().trim().max(2000).nullable(),
  })
  .superRefine((f, ctx) => {
    if (f.method !== 'snug' && f.value === null) ctx.addIssue({ code: 'custom', path: ['value'], message: 'needs a torque value' });
    if (f.method === 'torque-angle' && f.angleStages.length === 0)
      ctx.addIssue({ code: 'custom', path: ['angleStages'], message: 'needs at least one angle stage' });
    if (f.method !== 'torque-angle' && f.angleStages.length > 0)
      ctx.addIssue({ code: 'custom', path: ['angleStages'], message: 'angles belong to the torque-plus-angle method only' });
  });
export type FigureInput = z.infer<typeof figureInput>;

export const figureCheck = z.object({
  kind: z.enum(['weaker-substitute', 'below-wrench-range', 'above-wrench-range']),
  label: z.string(),
  text: z.string(),
});

/** A figure as readers and the editor get it: what was recorded, the checks, and the cautions. */
export const figure = z.object({
  id: z.number().int(),
  episodeId: z.number().int(),
  position: z.number().int(),
  fastener: z.string(),
  thread: z.string(),
  threadLabel: z.string(),
  gradeFitted: z.string().nullable(),
  gradeSpecified: z.string().nullable(),
  method: z.enum(TIGHTENING_METHODS),
  value: z.number().nullable(),
  unit: z.enum(TORQUE_UNITS),
  angleStages: z.array(z.number()),
  source: z.enum(VALUE_SOURCES),
  wrenchRange: z.object({ min: z.number(), max: z.number(), unit: z.enum(TORQUE_UNITS) }).nullable(),
  system: z.object({ key: z.string(), name: z.string(), safetyCritical: z.boolean() }).nullable(),
  note: z.string().nullable(),
  checks: z.array(figureCheck),
  /** The plain caution every figure carries. */
  caution: z.string(),
});
export type Figure = z.infer<typeof figure>;
export const figureList = z.object({ items: z.array(figure) });
export type FigureList = z.infer<typeof figureList>;
