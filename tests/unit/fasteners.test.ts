import { describe, expect, it } from 'vitest';
import { gradeStrength, isWeakerGrade, PSI_TO_MPA } from '../../src/shared/fasteners';

describe('ISO 898-1 property classes (MPa: Rm min, ReL/Rp0.2 min, Sp) — ISO 898-1 Table 3 via REFERENCES.md', () => {
  it.each([
    ['4.6', 400, 240, 225],
    ['4.8', 420, 340, 310],
    ['5.8', 520, 420, 380],
    ['8.8', 800, 640, 580],
    ['10.9', 1040, 940, 830],
    ['12.9', 1220, 1100, 970],
  ] as const)('class %s', (code, rm, rel, sp) => {
    expect(gradeStrength(code, 10)).toMatchObject({ tensileMin: rm, yieldMin: rel, proofStress: sp });
  });

  it('8.8 splits at d = 16 mm: 800/640/580 up to 16 mm, 830/660/600 above (ISO 898-1 Table 3)', () => {
    expect(gradeStrength('8.8', 16)).toMatchObject({ tensileMin: 800, yieldMin: 640, proofStress: 580 });
    expect(gradeStrength('8.8', 20)).toMatchObject({ tensileMin: 830, yieldMin: 660, proofStress: 600 });
  });
});

describe('SAE J429 grades — Shigley & Mischke 5th ed. p. 341 via REFERENCES.md (psi → MPa by NIST SP 811)', () => {
  const mpa = (psi: number) => psi * PSI_TO_MPA;
  it('grade 2, 1/4–3/4 in: proof 55 000, yield 57 000, tensile 74 000 psi', () => {
    const s = gradeStrength('SAE 2', 12.7)!;
    expect(s.proofStress).toBeCloseTo(mpa(55_000), 6);
    expect(s.yieldMin).toBeCloseTo(mpa(57_000), 6);
    expect(s.tensileMin).toBeCloseTo(mpa(74_000), 6);
  });
  it('grade 2 over 3/4 in: proof 33 000, tensile 60 000 psi', () => {
    expect(gradeStrength('SAE 2', 25.4)!.proofStress).toBeCloseTo(mpa(33_000), 6);
    expect(gradeStrength('SAE 2', 25.4)!.tensileMin).toBeCloseTo(mpa(60_000), 6);
  });
  it('grade 5, 1/4–1 in: 85 000 / 92 000 / 120 000 psi; over 1 in: 74 000 / 81 000 / 105 000', () => {
    expect(gradeStrength('SAE 5', 6.35)).toMatchObject({ proofStress: mpa(85_000), yieldMin: mpa(92_000), tensileMin: mpa(120_000) });
    expect(gradeStrength('SAE 5', 30)).toMatchObject({ proofStress: mpa(74_000), yieldMin: mpa(81_000), tensileMin: mpa(105_000) });
  });
  it('grade 8, 1/4–1 1/2 in: 120 000 / 130 000 / 150 000 psi', () => {
    expect(gradeStrength('SAE 8', 12.7)).toMatchObject({ proofStress: mpa(120_000), yieldMin: mpa(130_000), tensileMin: mpa(150_000) });
  });
  it('1 psi = 6.894 757 kPa (NIST SP 811 Appendix B)', () => {
    expect(PSI_TO_MPA * 1000).toBeCloseTo(6.894757, 6);
  });
});

describe('ISO 3506-1:2020 stainless (MPa: Rm min, Rp0.2 min) — supplier copies via REFERENCES.md', () => {
  it.each([
    ['A2-50', 500, 210],
    ['A2-70', 700, 450],
    ['A2-80', 800, 600],
    ['A4-50', 500, 210],
    ['A4-70', 700, 450],
    ['A4-80', 800, 600],
  ] as const)('%s', (code, rm, rp) => {
    expect(gradeStrength(code, 8)).toMatchObject({ tensileMin: rm, yieldMin: rp, proofStress: null });
  });
});

describe('weaker substitutes, compared across families (values above)', () => {
  it('4.8 fitted in place of 8.8 is weaker (ISO 898-1: Rm 420 < 800)', () => {
    expect(isWeakerGrade('4.8', '8.8', 8)).toBe(true);
  });
  it('A2-70 in place of 8.8 is weaker (ISO 3506-1 Rm 700 < ISO 898-1 Rm 800)', () => {
    expect(isWeakerGrade('A2-70', '8.8', 8)).toBe(true);
  });
  it('A2-80 in place of 8.8 is weaker: same Rm, lower Rp0.2 (600 < 640)', () => {
    expect(isWeakerGrade('A2-80', '8.8', 8)).toBe(true);
  });
  it('10.9 in place of 8.8 is not weaker, nor the same class', () => {
    expect(isWeakerGrade('10.9', '8.8', 8)).toBe(false);
    expect(isWeakerGrade('8.8', '8.8', 8)).toBe(false);
  });
  it('SAE grade 5 for 8.8 is not weaker (827 ≥ 800 MPa tensile, 586 ≥ 580 MPa proof); grade 2 is', () => {
    expect(isWeakerGrade('SAE 5', '8.8', 8)).toBe(false);
    expect(isWeakerGrade('SAE 2', '8.8', 8)).toBe(true);
  });
  it('SAE grade 5 in place of grade 8 is weaker; 8.8 in place of A2-70 is not', () => {
    expect(isWeakerGrade('SAE 5', 'SAE 8', 9.525)).toBe(true);
    expect(isWeakerGrade('8.8', 'A2-70', 8)).toBe(false);
  });
  it('unknown grades are not flagged', () => {
    expect(isWeakerGrade('9.9', '8.8', 8)).toBe(false);
  });
});
