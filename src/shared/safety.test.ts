import { describe, expect, it } from 'vitest';
import { cautionText, needsCaution } from './safety';
import { DEFAULT_SYSTEMS } from './schemas/builds';

// Sources: which systems are safety-critical by default and when the bar shows — DESIGN.md
// "Safety"; the cooling wording — REFERENCES.md "Safety cautions" (hot pressurised caps: general
// workshop guidance, Auto Repair For Dummies 2nd ed.; poisonous, sweet-tasting coolant and its
// disposal: US EPA "How do I dispose of used antifreeze?", ATSDR ToxFAQs for ethylene glycol);
// raised vehicle on rated stands, never a jack alone — common practice.

const systems = [...DEFAULT_SYSTEMS];

describe('needsCaution', () => {
  it('is not needed for non-critical systems only', () => {
    expect(needsCaution({ raisedVehicle: false, systemKeys: ['body', 'interior', 'engine'] }, systems)).toEqual({
      needed: false,
      reasons: [],
    });
  });

  it.each(['brakes', 'steering', 'suspension', 'fuel', 'cooling', 'electrical'])(
    'is needed for %s (safety-critical by default, DESIGN.md)',
    (key) => {
      const r = needsCaution({ raisedVehicle: false, systemKeys: [key] }, systems);
      expect(r.needed).toBe(true);
      expect(r.reasons).toEqual([{ kind: 'system', key, name: systems.find((s) => s.key === key)?.name }]);
    },
  );

  it('is needed for work under a raised vehicle, listed first; systems in build order, once each', () => {
    const r = needsCaution({ raisedVehicle: true, systemKeys: ['steering', 'brakes', 'brakes', 'body'] }, systems);
    expect(r.reasons).toEqual([
      { kind: 'raised-vehicle' },
      { kind: 'system', key: 'brakes', name: 'Brakes' },
      { kind: 'system', key: 'steering', name: 'Steering' },
    ]);
  });

  it("follows the build's own flags and ignores keys the build does not have", () => {
    const own = [
      { key: 'brakes', name: 'Brakes', safetyCritical: false },
      { key: 'hydraulics', name: 'Tipping hydraulics', safetyCritical: true },
    ];
    expect(needsCaution({ raisedVehicle: false, systemKeys: ['brakes', 'unknown'] }, own).needed).toBe(false);
    expect(needsCaution({ raisedVehicle: false, systemKeys: ['hydraulics'] }, own).reasons).toEqual([
      { kind: 'system', key: 'hydraulics', name: 'Tipping hydraulics' },
    ]);
  });
});

describe('cautionText', () => {
  it('gives one sentence per reason, each deferring to the manual, regulations and licensed practice', () => {
    const texts = cautionText([
      { kind: 'system', key: 'brakes', name: 'Brakes' },
      { kind: 'system', key: 'cooling', name: 'Cooling' },
    ]);
    expect(texts).toHaveLength(2);
    for (const t of texts) {
      expect(t).toContain("follow the vehicle's workshop manual, local regulations and licensed practice");
      expect(t.endsWith('.')).toBe(true);
    }
    expect(texts[0]).toContain('Brakes');
  });

  it('names hot pressurised caps and poisonous coolant for the cooling system (REFERENCES.md)', () => {
    const [t] = cautionText([{ kind: 'system', key: 'cooling', name: 'Cooling' }]);
    expect(t).toMatch(/cap on a hot engine/);
    expect(t).toMatch(/under pressure/);
    expect(t).toMatch(/poisonous/);
  });

  it('asks for rated stands on firm level ground, never a jack alone (common practice)', () => {
    const [t] = cautionText([{ kind: 'raised-vehicle' }]);
    expect(t).toMatch(/stands rated for its weight/);
    expect(t).toMatch(/firm level ground/);
    expect(t).toMatch(/never .* on a jack alone/);
  });

  it('is empty without reasons', () => {
    expect(cautionText([])).toEqual([]);
  });
});
