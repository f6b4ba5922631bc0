// Proof loads and the tightening-torque estimate. An estimate from a textbook formula is never a
// specification: every screen that shows one says so, with the figure caution beside it.

import { findGrade, gradeStrength } from './fasteners';
import { findThread, type ThreadSpec } from './threads';

// ISO 898-1, proof loads for ISO metric coarse threads (N), class → M5…M16. Confirmed
// (REFERENCES.md): M8 8.8 = 21 200, M8 4.8 = 11 400, M10 8.8 = 33 700. The rest: ISO 898-1's
// load table (memory); each is within 1 % of As × Sp, which the unit tests check.
const SIZES = ['M5', 'M6', 'M8', 'M10', 'M12', 'M14', 'M16'] as const;
const PUBLISHED_PROOF_LOADS: Record<string, readonly number[]> = {
  '4.6': [3_200, 4_520, 8_240, 13_000, 19_000, 25_900, 35_300],
  '4.8': [4_400, 6_230, 11_400, 18_000, 26_100, 35_700, 48_700],
  '5.8': [5_400, 7_640, 13_900, 22_000, 32_000, 43_700, 59_700],
  '8.8': [8_230, 11_600, 21_200, 33_700, 48_900, 67_000, 91_000],
  '10.9': [11_800, 16_700, 30_400, 48_100, 70_000, 95_500, 130_000],
  '12.9': [13_800, 19_500, 35_500, 56_300, 81_800, 112_000, 152_000],
};

export interface ProofLoad {
  newtons: number;
  /** `published`: ISO 898-1's load table; `computed`: As × Sp (fine metric and inch threads). */
  kind: 'published' | 'computed';
  source: string;
}

/**
 * The proof load of a thread in a grade. The product shows ISO 898-1's published table value
 * for metric coarse threads (M8 8.8: 21 200 N, where As × Sp gives 21 228 N) and As × Sp
 * elsewhere. None for stainless (ISO 3506-1 gives no proof load) or threads without a stress area.
 */
export function proofLoad(threadCode: string, gradeCode: string): ProofLoad | undefined {
  const thread = findThread(threadCode);
  if (!thread || !findGrade(gradeCode)) return undefined;
  const strength = gradeStrength(gradeCode, thread.diameterMm);
  if (!strength || strength.proofStress === null || thread.stressAreaMm2 === null) return undefined;
  const i = SIZES.indexOf(thread.code as (typeof SIZES)[number]);
  const published = i >= 0 ? PUBLISHED_PROOF_LOADS[gradeCode]?.[i] : undefined;
  if (published !== undefined)
    return { newtons: published, kind: 'published', source: `ISO 898-1 proof load table, ${thread.code} class ${gradeCode}` };
  return {
    newtons: thread.stressAreaMm2 * strength.proofStress,
    kind: 'computed',
    source: `stress area × proof stress (${strength.source})`,
  };
}

// Nut factor K by condition: Budynas & Nisbett, Shigley's Mechanical Engineering Design, 9th ed.,
// Table 8-15 (non-plated black finish 0.30, zinc-plated 0.20, lubricated 0.18); 0.20 when the
// condition is unknown (§8-8).
export const NUT_FACTORS = [
  { condition: 'unknown', label: 'Condition unknown', k: 0.2 },
  { condition: 'non-plated-black', label: 'Non-plated, black finish', k: 0.3 },
  { condition: 'zinc-plated', label: 'Zinc-plated', k: 0.2 },
  { condition: 'lubricated', label: 'Lubricated', k: 0.18 },
] as const;
export type NutCondition = (typeof NUT_FACTORS)[number]['condition'];

/** Shigley's Eq. 8-31: preload 75 % of proof load for reused fasteners in non-permanent joints. */
export const REUSED_PRELOAD_FRACTION = 0.75;

/** Shigley's Eq. 8-27: T = K · Fi · d, in N·m for Fi in N and d in m. */
export function tighteningTorque(k: number, preloadN: number, diameterM: number): number {
  return k * preloadN * diameterM;
}

export type TighteningEstimate =
  | {
      ok: true;
      thread: ThreadSpec;
      proofLoad: ProofLoad;
      preloadN: number;
      k: number;
      /** The estimate in N·m. */
      torqueNm: number;
    }
  | { ok: false; reason: string };

/** The tightening-torque estimate for a thread, grade and condition (reused fasteners, 75 % of proof load). */
export function estimateTightening(threadCode: string, gradeCode: string, condition: NutCondition = 'unknown'): TighteningEstimate {
  const thread = findThread(threadCode);
  if (!thread) return { ok: false, reason: 'That thread is not in our tables.' };
  const grade = findGrade(gradeCode);
  if (!grade) return { ok: false, reason: 'That grade is not in our tables.' };
  if (grade.family === 'iso-3506')
    return {
      ok: false,
      reason:
        'ISO 3506-1 gives no proof load or clamp-force properties for stainless bolts, so there is no estimate. Lubricate stainless threads to avoid galling.',
    };
  if (thread.stressAreaMm2 === null)
    return { ok: false, reason: 'Our sources give no tensile stress area for this thread, so there is no estimate.' };
  const load = proofLoad(threadCode, gradeCode);
  if (!load) return { ok: false, reason: 'That grade has no strength for this size in our tables.' };
  const k = NUT_FACTORS.find((n) => n.condition === condition)?.k ?? 0.2;
  const preloadN = REUSED_PRELOAD_FRACTION * load.newtons;
  return { ok: true, thread, proofLoad: load, preloadN, k, torqueNm: tighteningTorque(k, preloadN, thread.diameterMm / 1000) };
}
