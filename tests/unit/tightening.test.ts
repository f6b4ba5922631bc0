import { describe, expect, it } from 'vitest';
import { gradeStrength } from '../../src/shared/fasteners';
import { findThread } from '../../src/shared/threads';
import { estimateTightening, NUT_FACTORS, proofLoad, REUSED_PRELOAD_FRACTION, tighteningTorque } from '../../src/shared/tightening';
import { convertTorque } from '../../src/shared/torque';

describe('proof loads', () => {
  // ISO 898-1 load table, published values (REFERENCES.md). The product shows the published value.
  it('M8 class 8.8 = 21 200 N (ISO 898-1), shown as published', () => {
    expect(proofLoad('M8', '8.8')).toMatchObject({ newtons: 21_200, kind: 'published' });
  });
  it('M8 class 4.8 = 11 400 N (ISO 898-1), although As × Sp = 11 346 N', () => {
    expect(proofLoad('M8', '4.8')).toMatchObject({ newtons: 11_400, kind: 'published' });
    expect(findThread('M8')!.stressAreaMm2! * 310).toBeCloseTo(11_346, -1);
  });
  it('M10 class 8.8 = 33 700 N (ISO 898-1), where As × Sp = 33 640 N', () => {
    expect(proofLoad('M10', '8.8')!.newtons).toBe(33_700);
  });
  it('every published value (the rest from memory of ISO 898-1) is within 1 % of As × Sp', () => {
    for (const size of ['M5', 'M6', 'M8', 'M10', 'M12', 'M14', 'M16'])
      for (const grade of ['4.6', '4.8', '5.8', '8.8', '10.9', '12.9']) {
        const thread = findThread(size)!;
        const computed = thread.stressAreaMm2! * gradeStrength(grade, thread.diameterMm)!.proofStress!;
        const published = proofLoad(size, grade)!;
        expect(published.kind).toBe('published');
        expect(Math.abs(published.newtons - computed) / computed, `${size} ${grade}`).toBeLessThan(0.01);
      }
  });
  it('fine metric and inch threads use As × Sp (computed)', () => {
    const fine = proofLoad('M10x1.25', '8.8')!;
    expect(fine.kind).toBe('computed');
    expect(fine.newtons).toBeCloseTo(findThread('M10x1.25')!.stressAreaMm2! * 580, 6);
    // SAE J429 grade 5, 1/2-13 UNC: 0.1419 in² (ASME B1.1) × 85 000 psi = 12 061.5 lbf (derived).
    expect(proofLoad('1/2-13 UNC', 'SAE 5')!.newtons / 4.4482216152605).toBeCloseTo(12_061.5, 1);
  });
  it('stainless has none (ISO 3506-1 gives no proof load for bolts)', () => {
    expect(proofLoad('M8', 'A2-70')).toBeUndefined();
  });
});

describe("tightening-torque estimate — Shigley's Mechanical Engineering Design, 9th ed., §8-8", () => {
  it('Eq. 8-27: T = K · Fi · d', () => {
    expect(tighteningTorque(0.2, 1000, 0.01)).toBeCloseTo(2, 12);
  });
  it('Eq. 8-31: Fi = 0.75 Fp for reused fasteners', () => {
    expect(REUSED_PRELOAD_FRACTION).toBe(0.75);
  });
  it('Table 8-15: K = 0.30 black, 0.20 zinc-plated, 0.18 lubricated; 0.20 when unknown', () => {
    expect(Object.fromEntries(NUT_FACTORS.map((n) => [n.condition, n.k]))).toEqual({
      unknown: 0.2,
      'non-plated-black': 0.3,
      'zinc-plated': 0.2,
      lubricated: 0.18,
    });
  });
  it('derived (not printed in the book): M10 class 8.8, Fp 33 700 N → Fi 25 275 N → T ≈ 50.6 N·m', () => {
    const e = estimateTightening('M10', '8.8');
    if (!e.ok) throw new Error(e.reason);
    expect(e.preloadN).toBeCloseTo(25_275, 6);
    expect(e.k).toBe(0.2);
    expect(e.torqueNm).toBeCloseTo(50.55, 2);
  });
  it('derived: 1/2-13 UNC grade 5, Fi = 0.75 × 12 061.5 lbf → T = 0.2 × 9 046 lbf × 0.5 in ≈ 904.6 lbf·in', () => {
    const e = estimateTightening('1/2-13 UNC', 'SAE 5');
    if (!e.ok) throw new Error(e.reason);
    expect(convertTorque(e.torqueNm, 'N-m', 'lbf-in')).toBeCloseTo(904.6, 1);
  });
  it('the condition changes K (lubricated: 0.18)', () => {
    const e = estimateTightening('M10', '8.8', 'lubricated');
    expect(e.ok && e.torqueNm).toBeCloseTo(0.18 * 25_275 * 0.01, 6);
  });
  it('gives no estimate for stainless or for Whitworth (no stress area in our sources)', () => {
    expect(estimateTightening('M8', 'A2-70').ok).toBe(false);
    expect(estimateTightening('1/4 BSW', 'SAE 5').ok).toBe(false);
    expect(estimateTightening('M9', '8.8').ok).toBe(false);
  });
});
