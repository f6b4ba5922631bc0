// The checks every recorded figure gets, and the plain cautions that go with figures, warnings
// and calculator results (DESIGN.md "Safety"). The product never vouches for a figure.

import { findGrade, isWeakerGrade } from './fasteners';
import { findThread } from './threads';
import { formatTorque, wrenchRangePosition, type TorqueUnit, type WrenchRange } from './torque';

export type FigureCheckKind = 'weaker-substitute' | 'below-wrench-range' | 'above-wrench-range';

export interface FigureCheck {
  kind: FigureCheckKind;
  /** The caution bar's short label. */
  label: string;
  /** One plain sentence. */
  text: string;
}

/** What the checks need of a figure (stored or still in the editor's form). */
export interface CheckableFigure {
  thread: string;
  gradeFitted: string | null;
  gradeSpecified: string | null;
  value: number | null;
  unit: TorqueUnit;
  wrenchRange: WrenchRange | null;
}

const DEFER = "check the vehicle's workshop manual, and local roadworthiness rules and licensed practice come first";

/** On every figure, whatever it is. */
export const FIGURE_CAUTION =
  'These figures are for the vehicle in this episode: check the workshop manual for yours. Brakes, steering and suspension fasteners are safety-critical; local roadworthiness rules and licensed practice come first.';

/** On every calculator result. */
export const CALCULATOR_CAUTION =
  'A calculation from published tables, not a figure for your vehicle: check its workshop manual. Brakes, steering and suspension fasteners are safety-critical; local roadworthiness rules and licensed practice come first.';

/** On every tightening-torque estimate, beside the calculator caution. */
export const ESTIMATE_CAUTION =
  'This is an estimate from a textbook formula, not a specification. The real figure depends on the joint, the threads’ condition and the manufacturer’s design: use the workshop manual’s figure where there is one.';

/** Runs the weaker-substitute and wrench-range checks; an empty list means nothing to flag. */
export function figureChecks(f: CheckableFigure): FigureCheck[] {
  const checks: FigureCheck[] = [];
  const thread = findThread(f.thread);
  if (thread && f.gradeFitted && f.gradeSpecified && isWeakerGrade(f.gradeFitted, f.gradeSpecified, thread.diameterMm)) {
    const fitted = findGrade(f.gradeFitted)?.label ?? f.gradeFitted;
    const specified = findGrade(f.gradeSpecified)?.label ?? f.gradeSpecified;
    checks.push({
      kind: 'weaker-substitute',
      label: 'Weaker than specified',
      text: `${fitted} is weaker than the ${specified} specified (lower minimum strength): it can stretch or break at the specified torque. Fit the specified grade or stronger; ${DEFER}.`,
    });
  }
  if (f.value !== null && f.wrenchRange) {
    const position = wrenchRangePosition(f.value, f.unit, f.wrenchRange);
    const range = `${formatTorque(f.wrenchRange.min, f.wrenchRange.unit)} to ${formatTorque(f.wrenchRange.max, f.wrenchRange.unit)}`;
    if (position === 'below')
      checks.push({
        kind: 'below-wrench-range',
        label: 'Below wrench range',
        text: `${formatTorque(f.value, f.unit)} is below the wrench’s range (${range}), so the wrench did not measure it: tightening by feel is not a measured torque. Use a wrench whose range covers the figure; ${DEFER}.`,
      });
    if (position === 'above')
      checks.push({
        kind: 'above-wrench-range',
        label: 'Above wrench range',
        text: `${formatTorque(f.value, f.unit)} is above the wrench’s range (${range}), so the wrench did not measure it: tightening by feel is not a measured torque. Use a wrench whose range covers the figure; ${DEFER}.`,
      });
  }
  return checks;
}
