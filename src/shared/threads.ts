// Screw threads the figures and calculators know (DESIGN.md "Computation"). Each table names its
// source beside it; "memory" marks values not confirmed against a copy of the standard.

export const THREAD_FAMILIES = ['iso-coarse', 'iso-fine', 'unc', 'unf', 'bsw', 'bsf'] as const;
export type ThreadFamily = (typeof THREAD_FAMILIES)[number];

export const THREAD_FAMILY_LABELS: Record<ThreadFamily, string> = {
  'iso-coarse': 'ISO metric coarse',
  'iso-fine': 'ISO metric fine',
  unc: 'Unified coarse (UNC)',
  unf: 'Unified fine (UNF)',
  bsw: 'British Standard Whitworth (BSW)',
  bsf: 'British Standard Fine (BSF)',
};

export interface ThreadSpec {
  /** Stable code stored with a figure: `M8`, `M10x1.25`, `1/4-20 UNC`, `1/4 BSW`. */
  code: string;
  label: string;
  family: ThreadFamily;
  /** The size as the trade says it: `M8`, `1/4 in`. */
  size: string;
  diameterMm: number;
  /** Metric threads: the pitch in mm. */
  pitchMm: number | null;
  /** Inch threads: threads per inch. */
  threadsPerInch: number | null;
  /** Tensile stress area in mm², or null where our sources give none. */
  stressAreaMm2: number | null;
  /** Where the stress area comes from, shown beside it. */
  stressAreaSource: string | null;
}

const INCH_MM = 25.4;
const SQUARE_INCH_MM2 = 645.16;

/**
 * Tensile stress area of an ISO metric thread, ISO 898-1 (and ISO 724's basic dimensions):
 * As = π/4 · ((d2 + d3)/2)², d2 = d − 0.649519·P, d3 = d − 1.226869·P.
 */
export function metricStressArea(d: number, pitch: number): number {
  const d2 = d - 0.649519 * pitch;
  const d3 = d - 1.226869 * pitch;
  return (Math.PI / 4) * ((d2 + d3) / 2) ** 2;
}

/** ASME B1.1's formula for unified threads: As = 0.7854 · (D − 0.9743/n)², in square inches. */
export function unifiedStressAreaIn2(diameterIn: number, threadsPerInch: number): number {
  return 0.7854 * (diameterIn - 0.9743 / threadsPerInch) ** 2;
}

// ISO 261 / ISO 262 pitches. Coarse: M5 0.8, M6 1.0, M8 1.25, M10 1.5, M12 1.75, M14 2.0, M16 2.0
// (REFERENCES.md, confirmed). Fine: M5 0.5, M6 0.75, M8 1, M10 1.25 and 1, M12 1.5 and 1.25,
// M14 1.5, M16 1.5 (ISO 261 / ISO 262, memory).
const METRIC: ReadonlyArray<[number, number, 'coarse' | 'fine']> = [
  [5, 0.8, 'coarse'],
  [5, 0.5, 'fine'],
  [6, 1, 'coarse'],
  [6, 0.75, 'fine'],
  [8, 1.25, 'coarse'],
  [8, 1, 'fine'],
  [10, 1.5, 'coarse'],
  [10, 1.25, 'fine'],
  [10, 1, 'fine'],
  [12, 1.75, 'coarse'],
  [12, 1.5, 'fine'],
  [12, 1.25, 'fine'],
  [14, 2, 'coarse'],
  [14, 1.5, 'fine'],
  [16, 2, 'coarse'],
  [16, 1.5, 'fine'],
];

// ASME B1.1 unified inch threads: size (in), threads per inch and tensile stress area (in²) from
// its table (REFERENCES.md, confirmed through engineering tables). The table rounds differently
// from the formula at 5/16-24 and 1/2-20; the table's value is the one used.
const UNIFIED: ReadonlyArray<[string, number, 'unc' | 'unf', number, number]> = [
  ['1/4', 0.25, 'unc', 20, 0.0318],
  ['1/4', 0.25, 'unf', 28, 0.0364],
  ['5/16', 0.3125, 'unc', 18, 0.0524],
  ['5/16', 0.3125, 'unf', 24, 0.058],
  ['3/8', 0.375, 'unc', 16, 0.0775],
  ['3/8', 0.375, 'unf', 24, 0.0878],
  ['7/16', 0.4375, 'unc', 14, 0.1063],
  ['7/16', 0.4375, 'unf', 20, 0.1187],
  ['1/2', 0.5, 'unc', 13, 0.1419],
  ['1/2', 0.5, 'unf', 20, 0.1599],
];

// British Standard Whitworth and Fine (BS 84), threads per inch: 1/4 BSW 20, BSF 26; 5/16 BSW 18,
// BSF 22; 3/8 BSW 16, BSF 20 (REFERENCES.md); 7/16 BSW 14, BSF 18; 1/2 BSW 12, BSF 16 (memory).
// Our sources give no tensile stress area for these, so none is shown.
const WHITWORTH: ReadonlyArray<[string, number, 'bsw' | 'bsf', number]> = [
  ['1/4', 0.25, 'bsw', 20],
  ['1/4', 0.25, 'bsf', 26],
  ['5/16', 0.3125, 'bsw', 18],
  ['5/16', 0.3125, 'bsf', 22],
  ['3/8', 0.375, 'bsw', 16],
  ['3/8', 0.375, 'bsf', 20],
  ['7/16', 0.4375, 'bsw', 14],
  ['7/16', 0.4375, 'bsf', 18],
  ['1/2', 0.5, 'bsw', 12],
  ['1/2', 0.5, 'bsf', 16],
];

function metricSpec([d, p, kind]: (typeof METRIC)[number]): ThreadSpec {
  const code = kind === 'coarse' ? `M${d}` : `M${d}x${p}`;
  return {
    code,
    label: kind === 'coarse' ? `M${d} × ${p} (coarse)` : `M${d} × ${p} (fine)`,
    family: kind === 'coarse' ? 'iso-coarse' : 'iso-fine',
    size: `M${d}`,
    diameterMm: d,
    pitchMm: p,
    threadsPerInch: null,
    stressAreaMm2: metricStressArea(d, p),
    stressAreaSource: 'ISO 898-1 formula',
  };
}

function unifiedSpec([size, inches, family, tpi, areaIn2]: (typeof UNIFIED)[number]): ThreadSpec {
  const code = `${size}-${tpi} ${family.toUpperCase()}`;
  return {
    code,
    label: code,
    family,
    size: `${size} in`,
    diameterMm: inches * INCH_MM,
    pitchMm: null,
    threadsPerInch: tpi,
    stressAreaMm2: areaIn2 * SQUARE_INCH_MM2,
    stressAreaSource: `ASME B1.1 table: ${areaIn2} in²`,
  };
}

function whitworthSpec([size, inches, family, tpi]: (typeof WHITWORTH)[number]): ThreadSpec {
  const code = `${size} ${family.toUpperCase()}`;
  return {
    code,
    label: `${code} (${tpi} tpi)`,
    family,
    size: `${size} in`,
    diameterMm: inches * INCH_MM,
    pitchMm: null,
    threadsPerInch: tpi,
    stressAreaMm2: null,
    stressAreaSource: null,
  };
}

/** Every thread, metric first, in size order within each family. */
export const THREADS: readonly ThreadSpec[] = [...METRIC.map(metricSpec), ...UNIFIED.map(unifiedSpec), ...WHITWORTH.map(whitworthSpec)];

export const THREAD_CODES = THREADS.map((t) => t.code);

const byCode = new Map(THREADS.map((t) => [t.code, t]));

export function findThread(code: string): ThreadSpec | undefined {
  return byCode.get(code);
}

export function isMetric(thread: ThreadSpec): boolean {
  return thread.family === 'iso-coarse' || thread.family === 'iso-fine';
}
