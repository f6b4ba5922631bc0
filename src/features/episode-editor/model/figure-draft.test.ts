import { describe, expect, it } from 'vitest';
import { draftChecks, draftToBody, EMPTY_FIGURE_DRAFT, validateDraft } from './figure-draft';

const draft = { ...EMPTY_FIGURE_DRAFT, fastener: 'Housing bolts', value: '25' };

describe('figure draft', () => {
  it('converts typed text to the API body: decimal comma, angles, an empty wrench range as none', () => {
    const body = draftToBody({ ...draft, value: '12,5', method: 'torque-angle', angleStages: '90, 90' });
    expect(body).toMatchObject({ value: 12.5, angleStages: [90, 90], wrenchRange: null, gradeFitted: null, systemKey: null });
  });

  it('names the form field of each problem', () => {
    const r = validateDraft({ ...draft, value: 'tight', wrenchMin: '50', wrenchMax: '20', method: 'torque-angle', angleStages: '400' });
    expect(r.ok).toBe(false);
    if (!r.ok) expect(Object.keys(r.errors).sort()).toEqual(['angleStages', 'value', 'wrenchMax']);
  });

  // ISO 898-1: class 4.8 (Rm 420 MPa) is weaker than 8.8 (Rm 800 MPa). Wrench range: common practice.
  it('shows the checks while typing', () => {
    expect(draftChecks({ ...draft, gradeFitted: '4.8', gradeSpecified: '8.8' }).map((c) => c.kind)).toEqual(['weaker-substitute']);
    expect(draftChecks({ ...draft, value: '19.9', wrenchMin: '20', wrenchMax: '100' }).map((c) => c.kind)).toEqual(['below-wrench-range']);
    expect(draftChecks({ ...draft, value: '20', wrenchMin: '20', wrenchMax: '100' })).toEqual([]);
  });
});
