// Strength grades of bolts and screws, and the weaker-substitute comparison (DESIGN.md
// "Computation"). Strengths in MPa; inch grades converted from psi with NIST SP 811's factor.

export const GRADE_FAMILIES = ['iso-898-1', 'sae-j429', 'iso-3506'] as const;
export type GradeFamily = (typeof GRADE_FAMILIES)[number];

export const GRADE_FAMILY_LABELS: Record<GradeFamily, string> = {
  'iso-898-1': 'ISO 898-1 property classes (carbon and alloy steel)',
  'sae-j429': 'SAE J429 grades (inch, steel)',
  'iso-3506': 'ISO 3506-1 stainless (austenitic)',
};

export interface GradeStrength {
  /** Minimum tensile strength Rm (MPa). */
  tensileMin: number;
  /** Minimum yield strength ReL, or Rp0.2 where there is no marked yield (MPa). */
  yieldMin: number;
  /** Proof stress Sp (MPa); ISO 3506-1 gives none for stainless bolts. */
  proofStress: number | null;
  /** The standard (and table) these numbers come from, shown beside them. */
  source: string;
}

export interface Grade {
  code: string;
  label: string;
  family: GradeFamily;
}

/** 1 psi = 6.894 757 × 10³ Pa (NIST SP 811, Appendix B). */
export const PSI_TO_MPA = 6.894757e-3;

// ISO 898-1, Table 3 (REFERENCES.md): class → [Rm min, ReL/Rp0.2 min, Sp]. 8.8 splits at d = 16 mm.
const ISO_898_1: Record<string, [number, number, number]> = {
  '4.6': [400, 240, 225],
  '4.8': [420, 340, 310],
  '5.8': [520, 420, 380],
  '8.8': [800, 640, 580],
  '10.9': [1040, 940, 830],
  '12.9': [1220, 1100, 970],
};
const ISO_898_1_8_8_OVER_16: [number, number, number] = [830, 660, 600];

// SAE J429 as tabulated in Shigley & Mischke, Mechanical Engineering Design, 5th ed., p. 341
// (REFERENCES.md), in psi: grade → size ranges [up to in, proof, yield, tensile].
const SAE_J429: Record<string, Array<[number, number, number, number]>> = {
  'SAE 2': [
    [0.75, 55_000, 57_000, 74_000],
    [1.5, 33_000, 36_000, 60_000],
  ],
  'SAE 5': [
    [1, 85_000, 92_000, 120_000],
    [1.5, 74_000, 81_000, 105_000],
  ],
  'SAE 8': [[1.5, 120_000, 130_000, 150_000]],
};

// ISO 3506-1:2020, austenitic A2/A4 (REFERENCES.md, via supplier copies): class → [Rm min, Rp0.2 min].
// No proof stress: clause 6.3 leaves torque / clamp-force properties of stainless unspecified.
const ISO_3506: Record<string, [number, number]> = { '50': [500, 210], '70': [700, 450], '80': [800, 600] };

export const GRADES: readonly Grade[] = [
  ...Object.keys(ISO_898_1).map((c) => ({ code: c, label: `Class ${c}`, family: 'iso-898-1' as const })),
  ...Object.keys(SAE_J429).map((c) => ({ code: c, label: `SAE grade ${c.slice(4)}`, family: 'sae-j429' as const })),
  ...['A2', 'A4'].flatMap((steel) =>
    Object.keys(ISO_3506).map((c) => ({ code: `${steel}-${c}`, label: `Stainless ${steel}-${c}`, family: 'iso-3506' as const })),
  ),
];

export const GRADE_CODES = GRADES.map((g) => g.code);
const byCode = new Map(GRADES.map((g) => [g.code, g]));

export function findGrade(code: string): Grade | undefined {
  return byCode.get(code);
}

/**
 * The minimum strengths of a grade for a bolt of the given nominal diameter (mm), or undefined
 * when the code is unknown or the size is outside the grade's table.
 */
export function gradeStrength(code: string, diameterMm: number): GradeStrength | undefined {
  const iso = ISO_898_1[code];
  if (iso) {
    const [tensileMin, yieldMin, proofStress] = code === '8.8' && diameterMm > 16 ? ISO_898_1_8_8_OVER_16 : iso;
    const split = code === '8.8' ? (diameterMm > 16 ? ' (d > 16 mm)' : ' (d ≤ 16 mm)') : '';
    return { tensileMin, yieldMin, proofStress, source: `ISO 898-1, class ${code}${split}` };
  }
  const sae = SAE_J429[code];
  if (sae) {
    const inches = diameterMm / 25.4;
    const row = sae.find(([upTo]) => inches <= upTo + 1e-9);
    if (!row) return undefined;
    const [, proof, yieldPsi, tensile] = row;
    return {
      tensileMin: tensile * PSI_TO_MPA,
      yieldMin: yieldPsi * PSI_TO_MPA,
      proofStress: proof * PSI_TO_MPA,
      source: `SAE J429 grade ${code.slice(4)} (${proof / 1000} kpsi proof, ${tensile / 1000} kpsi tensile)`,
    };
  }
  const stainless = /^(A2|A4)-(50|70|80)$/.exec(code);
  if (stainless) {
    const [tensileMin, yieldMin] = ISO_3506[stainless[2]!]!;
    return { tensileMin, yieldMin, proofStress: null, source: `ISO 3506-1, ${code}` };
  }
  return undefined;
}

/**
 * Is the fitted grade weaker than the one specified? Across families, by the minimum tensile
 * strength and the proof stress; where either has no proof stress (stainless), by the minimum
 * yield (Rp0.2) instead. An A2-70 for an 8.8 is weaker; a 10.9 for an 8.8 is not.
 */
export function isWeakerGrade(fitted: string, specified: string, diameterMm: number): boolean {
  const f = gradeStrength(fitted, diameterMm);
  const s = gradeStrength(specified, diameterMm);
  if (!f || !s) return false;
  if (f.tensileMin < s.tensileMin) return true;
  if (f.proofStress !== null && s.proofStress !== null) return f.proofStress < s.proofStress;
  return f.yieldMin < s.yieldMin;
}
