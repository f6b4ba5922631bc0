// Hex head (and nut) widths across flats, in both directions: from a thread to the spanner, and
// from a spanner to the threads it may fit. Size families differ at some sizes; all are shown.

import { findThread, isMetric, type ThreadSpec } from './threads';

export const HEX_FAMILIES = ['iso-272', 'din', 'jis-annex', 'jis-small', 'asme'] as const;
export type HexFamily = (typeof HEX_FAMILIES)[number];

export const HEX_FAMILY_LABELS: Record<HexFamily, string> = {
  'iso-272': 'ISO 272 (ISO 4014/4017 bolts, ISO 4032 nuts)',
  din: 'Older DIN 931/933/934',
  'jis-annex': 'JIS B 1180 annex (old series)',
  'jis-small': 'JIS small hex (Japanese machines)',
  asme: 'ASME B18.2.1 hex cap screws',
};

export type SpannerUnit = 'mm' | 'in';

// Widths across flats per family and size. Metric in mm, inch in inches.
// ISO 272: M5 8, M6 10, M8 13, M10 16, M12 18, M14 21, M16 24 (REFERENCES.md).
// Older DIN 931/933/934: M10 17, M12 19, M14 22 (REFERENCES.md); M5 8, M6 10, M8 13, M16 24 as ISO (memory).
// JIS B 1180 annex: M10 17, M12 19, M14 22 as DIN (REFERENCES.md, from the Japan Fastener Industry
// Association bulletin on the 2014 revision); M5 8, M6 10, M8 13, M16 24 (memory).
// JIS small hex: M8 12, M10 14, M12 17, M14 19 (REFERENCES.md, same bulletin).
// ASME B18.2.1 hex cap screws: 1/4 → 7/16, 5/16 → 1/2, 3/8 → 9/16, 7/16 → 5/8, 1/2 → 3/4 in (REFERENCES.md).
const TABLE: Record<HexFamily, Record<string, number>> = {
  'iso-272': { M5: 8, M6: 10, M8: 13, M10: 16, M12: 18, M14: 21, M16: 24 },
  din: { M5: 8, M6: 10, M8: 13, M10: 17, M12: 19, M14: 22, M16: 24 },
  'jis-annex': { M5: 8, M6: 10, M8: 13, M10: 17, M12: 19, M14: 22, M16: 24 },
  'jis-small': { M8: 12, M10: 14, M12: 17, M14: 19 },
  asme: { '1/4 in': 7 / 16, '5/16 in': 1 / 2, '3/8 in': 9 / 16, '7/16 in': 5 / 8, '1/2 in': 3 / 4 },
};

const FRACTIONS: Record<string, string> = { 0.4375: '7/16', 0.5: '1/2', 0.5625: '9/16', 0.625: '5/8', 0.75: '3/4' };

export function unitOf(family: HexFamily): SpannerUnit {
  return family === 'asme' ? 'in' : 'mm';
}

/** ASME cap screws carry unified threads; the metric families metric ones; Whitworth heads are not in our tables. */
function familyFits(family: HexFamily, thread: ThreadSpec): boolean {
  if (family === 'asme') return thread.family === 'unc' || thread.family === 'unf';
  return isMetric(thread);
}

/** "13 mm", "9/16 in". */
export function formatSpanner(size: number, unit: SpannerUnit): string {
  return unit === 'mm' ? `${size} mm` : `${FRACTIONS[String(size)] ?? size} in`;
}

export interface HexSizeGroup {
  acrossFlats: number;
  unit: SpannerUnit;
  families: HexFamily[];
}

/**
 * The spanner sizes for a thread's hex head, one group per distinct width with the families
 * that use it (M10: 16 mm in ISO 272; 17 mm in older DIN and the JIS annex; 14 mm JIS small).
 * Empty when our tables hold no head size for it (Whitworth, for instance).
 */
export function hexSizesForThread(threadCode: string): HexSizeGroup[] {
  const thread = findThread(threadCode);
  if (!thread) return [];
  const groups: HexSizeGroup[] = [];
  for (const family of HEX_FAMILIES) {
    if (!familyFits(family, thread)) continue;
    const af = TABLE[family][thread.size];
    if (af === undefined) continue;
    const same = groups.find((g) => g.acrossFlats === af && g.unit === unitOf(family));
    if (same) same.families.push(family);
    else groups.push({ acrossFlats: af, unit: unitOf(family), families: [family] });
  }
  return groups;
}

export interface SpannerMatch {
  /** The bolt size the spanner fits: `M10`, `3/8 in`. */
  size: string;
  families: HexFamily[];
}

/**
 * The bolt sizes whose hex head takes this spanner, in every family. Metric spanners match
 * metric heads and inch spanners inch heads; an empty list means no standard head in our tables.
 */
export function threadsForSpanner(size: number, unit: SpannerUnit): SpannerMatch[] {
  const matches: SpannerMatch[] = [];
  for (const family of HEX_FAMILIES) {
    if (unitOf(family) !== unit) continue;
    for (const [boltSize, af] of Object.entries(TABLE[family])) {
      if (Math.abs(af - size) > 1e-6) continue;
      const same = matches.find((m) => m.size === boltSize);
      if (same) same.families.push(family);
      else matches.push({ size: boltSize, families: [family] });
    }
  }
  return matches;
}

/** Every spanner size in the tables, for the look-up's list of choices. */
export function knownSpannerSizes(unit: SpannerUnit): number[] {
  const sizes = new Set<number>();
  for (const family of HEX_FAMILIES) if (unitOf(family) === unit) for (const af of Object.values(TABLE[family])) sizes.add(af);
  return [...sizes].sort((a, b) => a - b);
}

/** Reads a spanner size as typed: "13", "13.0", "9/16", "0.5625", "1 1/8" (whole and fraction). Null when unreadable. */
export function parseSpannerSize(text: string): number | null {
  const t = text.trim().replace(',', '.');
  const mixed = /^(?:(\d+)\s+)?(\d+)\s*\/\s*(\d+)$/.exec(t);
  if (mixed) {
    const den = Number(mixed[3]);
    if (den === 0) return null;
    return Number(mixed[1] ?? 0) + Number(mixed[2]) / den;
  }
  if (!/^\d+(\.\d+)?$/.test(t)) return null;
  const n = Number(t);
  return n > 0 ? n : null;
}
