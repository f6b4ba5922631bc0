// How a recorded figure reads in words, shared by the public figure cards and the editor's rows.

import { findGrade } from './fasteners';
import { TIGHTENING_METHOD_LABELS, VALUE_SOURCE_LABELS, type TighteningMethod, type ValueSource } from './constants/figures';
import { convertTorque, formatNumber, roundTorque, TORQUE_UNIT_LABELS, type TorqueUnit, type WrenchRange } from './torque';

/** "then 90°, then 90°" for torque plus angle; empty for the other methods. */
export function angleText(stages: readonly number[]): string {
  return stages.map((a) => `then ${formatNumber(a)}°`).join(', ');
}

/** "Fitted class 10.9 · specified class 8.8", or what is known of it. */
export function gradeText(fitted: string | null, specified: string | null): string | null {
  const label = (code: string) => findGrade(code)?.label ?? code;
  const parts = [fitted ? `Fitted: ${label(fitted)}` : null, specified ? `Specified: ${label(specified)}` : null].filter(Boolean);
  return parts.length ? parts.join(' · ') : null;
}

/** "Wrench 20–100 N·m", in the unit asked for (rounded when converted) or as recorded. */
export function wrenchText(range: WrenchRange, unit: TorqueUnit | null): string {
  const to = unit ?? range.unit;
  const show = (v: number) => formatNumber(to === range.unit ? v : roundTorque(convertTorque(v, range.unit, to)));
  return `Wrench ${show(range.min)}–${show(range.max)} ${TORQUE_UNIT_LABELS[to]}`;
}

export function methodText(method: TighteningMethod): string {
  return TIGHTENING_METHOD_LABELS[method];
}

export function sourceText(source: ValueSource): string {
  return `Source: ${VALUE_SOURCE_LABELS[source].toLowerCase()}`;
}
