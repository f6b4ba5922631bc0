import { describe, expect, it } from 'vitest';
import { figureChecks, FIGURE_CAUTION, type CheckableFigure } from '../../src/shared/figure-checks';
import { needsCaution } from '../../src/shared/safety';
import { DEFAULT_SYSTEMS } from '../../src/shared/schemas/builds';
import { figureInput } from '../../src/shared/schemas/figures';

const base: CheckableFigure = { thread: 'M8', gradeFitted: '8.8', gradeSpecified: '8.8', value: 25, unit: 'N-m', wrenchRange: null };

describe('figure checks', () => {
  it('flags 4.8 fitted in place of 8.8 (ISO 898-1: Rm 420 < 800 MPa)', () => {
    const checks = figureChecks({ ...base, gradeFitted: '4.8' });
    expect(checks.map((c) => c.kind)).toEqual(['weaker-substitute']);
    expect(checks[0]!.label).toBe('Weaker than specified');
    expect(checks[0]!.text).toMatch(/Class 4\.8 is weaker than the Class 8\.8 specified/);
    expect(checks[0]!.text).toMatch(/workshop manual/);
  });
  it('flags stainless A2-70 for 8.8 and not 10.9 for 8.8 (ISO 3506-1 vs ISO 898-1)', () => {
    expect(figureChecks({ ...base, gradeFitted: 'A2-70' })).toHaveLength(1);
    expect(figureChecks({ ...base, gradeFitted: '10.9' })).toEqual([]);
  });
  it('does not compare when a grade is missing', () => {
    expect(figureChecks({ ...base, gradeFitted: null, gradeSpecified: '8.8' })).toEqual([]);
  });

  // Common practice, no published source: a torque wrench is used only within its marked range.
  it('flags 19.9 N·m on a wrench whose range starts at 20 N·m, and not exactly 20 N·m', () => {
    const wrenchRange = { min: 20, max: 100, unit: 'N-m' as const };
    const below = figureChecks({ ...base, value: 19.9, wrenchRange });
    expect(below.map((c) => c.kind)).toEqual(['below-wrench-range']);
    expect(below[0]!.text).toMatch(/tightening by feel is not a measured torque/);
    expect(figureChecks({ ...base, value: 20, wrenchRange })).toEqual([]);
  });
  it('flags in a mix of units: 8 N·m on a 15–80 lbf·ft wrench, 120 lbf·ft on a 20–100 N·m wrench', () => {
    expect(figureChecks({ ...base, value: 8, wrenchRange: { min: 15, max: 80, unit: 'lbf-ft' } })[0]!.kind).toBe('below-wrench-range');
    expect(figureChecks({ ...base, value: 120, unit: 'lbf-ft', wrenchRange: { min: 20, max: 100, unit: 'N-m' } })[0]!.kind).toBe(
      'above-wrench-range',
    );
  });
  it('both checks can apply at once', () => {
    const checks = figureChecks({ ...base, gradeFitted: 'A2-70', value: 5, wrenchRange: { min: 20, max: 100, unit: 'N-m' } });
    expect(checks.map((c) => c.kind)).toEqual(['weaker-substitute', 'below-wrench-range']);
  });
  it('the plain caution defers to the workshop manual, names brakes, steering and suspension, and local rules', () => {
    expect(FIGURE_CAUTION).toMatch(/workshop manual/);
    expect(FIGURE_CAUTION).toMatch(/Brakes, steering and suspension/);
    expect(FIGURE_CAUTION).toMatch(/roadworthiness rules and licensed practice/);
  });
});

describe('a figure on a safety-critical system makes the episode show its caution (needsCaution)', () => {
  it("counts a figure's system key like a chapter's (DESIGN.md: brakes is safety-critical by default)", () => {
    expect(needsCaution({ raisedVehicle: false, systemKeys: ['brakes'] }, DEFAULT_SYSTEMS).needed).toBe(true);
  });
});

describe('figure input validation', () => {
  const ok = {
    fastener: 'Caliper bolts',
    thread: 'M10x1.25',
    gradeFitted: '10.9',
    gradeSpecified: '10.9',
    method: 'torque',
    value: 40,
    unit: 'lbf-ft',
    angleStages: [],
    source: 'workshop-manual',
    wrenchRange: { min: 20, max: 100, unit: 'N-m' },
    systemKey: 'brakes',
    note: null,
  };
  const fields = (v: unknown) => {
    const r = figureInput.safeParse(v);
    return r.success ? [] : r.error.issues.map((i) => i.path.join('.'));
  };
  it('accepts a complete figure', () => expect(fields(ok)).toEqual([]));
  it('names bad threads, grades, units and angles', () => {
    expect(fields({ ...ok, thread: 'M9' })).toEqual(['thread']);
    expect(fields({ ...ok, gradeFitted: '9.9' })).toEqual(['gradeFitted']);
    expect(fields({ ...ok, unit: 'ft-lb' })).toEqual(['unit']);
    expect(fields({ ...ok, method: 'torque-angle', angleStages: [400] })).toEqual(['angleStages.0']);
    expect(fields({ ...ok, method: 'torque-angle' })).toEqual(['angleStages']);
    expect(fields({ ...ok, angleStages: [90] })).toEqual(['angleStages']);
    expect(fields({ ...ok, wrenchRange: { min: 50, max: 20, unit: 'N-m' } })).toEqual(['wrenchRange.max']);
  });
  it('needs a value except by hand to snug', () => {
    expect(fields({ ...ok, value: null })).toEqual(['value']);
    expect(fields({ ...ok, method: 'snug', value: null, wrenchRange: null })).toEqual([]);
  });
});
