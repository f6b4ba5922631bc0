// Tightening methods and value sources without the figure schemas (src/shared/schemas/figures.ts),
// for code that must not load zod: the public episode page.

export const TIGHTENING_METHODS = ['torque', 'torque-angle', 'snug'] as const;
export type TighteningMethod = (typeof TIGHTENING_METHODS)[number];
export const TIGHTENING_METHOD_LABELS: Record<TighteningMethod, string> = {
  torque: 'Torque',
  'torque-angle': 'Torque plus angle',
  snug: 'By hand to snug',
};

export const VALUE_SOURCES = ['workshop-manual', 'common-practice', 'measured', 'estimate'] as const;
export type ValueSource = (typeof VALUE_SOURCES)[number];
export const VALUE_SOURCE_LABELS: Record<ValueSource, string> = {
  'workshop-manual': 'Workshop manual',
  'common-practice': 'Common practice',
  measured: 'Measured',
  estimate: 'Estimate',
};
