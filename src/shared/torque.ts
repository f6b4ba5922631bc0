// Torque units and their conversion (DESIGN.md "Computation"). Pure: no React, no Node APIs.

export const TORQUE_UNITS = ['N-m', 'lbf-ft', 'lbf-in', 'kgf-m'] as const;
export type TorqueUnit = (typeof TORQUE_UNITS)[number];

/** How each unit is written on screen (the trade's own symbols, with a middle dot). */
export const TORQUE_UNIT_LABELS: Record<TorqueUnit, string> = {
  'N-m': 'N·m',
  'lbf-ft': 'lbf·ft',
  'lbf-in': 'lbf·in',
  'kgf-m': 'kgf·m',
};

// Exact definitions (NIST SP 811, Appendix B; the international yard and pound agreement of 1959;
// the CGPM's standard acceleration of gravity gn): lb = 0.453 592 37 kg, gn = 9.806 65 m/s²,
// ft = 0.3048 m, in = 0.0254 m. NIST SP 811 Appendix B rounds the products to 1.355 818 N·m
// (lbf·ft), 0.112 984 8 N·m (lbf·in) and 9.806 65 N·m (kgf·m, exact).
const POUND_FORCE_N = 0.45359237 * 9.80665;
const FOOT_M = 0.3048;
const INCH_M = 0.0254;

/** Newton metres in one of each unit, worked out from the exact definitions above. */
export const NEWTON_METRES_PER_UNIT: Record<TorqueUnit, number> = {
  'N-m': 1,
  'lbf-ft': POUND_FORCE_N * FOOT_M,
  'lbf-in': POUND_FORCE_N * INCH_M,
  'kgf-m': 9.80665,
};

export function isTorqueUnit(value: unknown): value is TorqueUnit {
  return typeof value === 'string' && (TORQUE_UNITS as readonly string[]).includes(value);
}

export function toNewtonMetres(value: number, unit: TorqueUnit): number {
  return value * NEWTON_METRES_PER_UNIT[unit];
}

/** Converts a torque between units, unrounded. */
export function convertTorque(value: number, from: TorqueUnit, to: TorqueUnit): number {
  if (from === to) return value;
  return toNewtonMetres(value, from) / NEWTON_METRES_PER_UNIT[to];
}

/**
 * Rounds a converted value for reading: three significant figures, whole numbers from 100 up
 * (a click-type wrench is set to about 1 % at best, so more digits would claim a precision the
 * tool does not have). The recorded value is never rounded; only conversions are.
 */
export function roundTorque(value: number): number {
  if (!Number.isFinite(value) || value === 0) return value;
  const abs = Math.abs(value);
  if (abs >= 100) return Math.round(value);
  const digits = 3 - Math.ceil(Math.log10(abs + Number.EPSILON));
  const factor = 10 ** Math.max(0, digits);
  return Math.round(value * factor) / factor;
}

/** "25 N·m", "18.4 lbf·ft": the number as given (no trailing zeros) and the unit's symbol. */
export function formatTorque(value: number, unit: TorqueUnit): string {
  return `${formatNumber(value)} ${TORQUE_UNIT_LABELS[unit]}`;
}

/** A plain decimal with up to three places and no trailing zeros ("12.5", "40", "0.112"). */
export function formatNumber(value: number): string {
  return String(Math.round(value * 1000) / 1000);
}

export interface WrenchRange {
  min: number;
  max: number;
  unit: TorqueUnit;
}

// Comparing across units goes through floating point: 15 lbf·ft set on a wrench whose range is
// given as 15–80 lbf·ft must not be flagged because of a rounding error in the last bit.
const RELATIVE_TOLERANCE = 1e-9;

/**
 * Where a torque sits against a wrench's marked range, in any mix of units: `below` or `above`
 * when outside it, `null` inside. The ends themselves are inside (common practice: a wrench is
 * usable at the ends of its scale, e.g. exactly 20 N·m on a 20–100 N·m wrench).
 */
export function wrenchRangePosition(value: number, unit: TorqueUnit, range: WrenchRange): 'below' | 'above' | null {
  const nm = toNewtonMetres(value, unit);
  const min = toNewtonMetres(range.min, range.unit);
  const max = toNewtonMetres(range.max, range.unit);
  if (nm < min * (1 - RELATIVE_TOLERANCE)) return 'below';
  if (nm > max * (1 + RELATIVE_TOLERANCE)) return 'above';
  return null;
}
