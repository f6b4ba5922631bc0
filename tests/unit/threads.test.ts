import { describe, expect, it } from 'vitest';
import { hexSizesForThread, parseSpannerSize, threadsForSpanner } from '../../src/shared/hex-sizes';
import { findThread, metricStressArea, THREADS, unifiedStressAreaIn2 } from '../../src/shared/threads';

describe('ISO metric threads', () => {
  // ISO 261/262 coarse pitches (REFERENCES.md).
  it.each([
    ['M5', 0.8],
    ['M6', 1],
    ['M8', 1.25],
    ['M10', 1.5],
    ['M12', 1.75],
    ['M14', 2],
    ['M16', 2],
  ] as const)('%s coarse pitch is %d mm (ISO 261/262)', (code, pitch) => {
    expect(findThread(code)).toMatchObject({ family: 'iso-coarse', pitchMm: pitch });
  });

  // ISO 261/262 fine pitches: memory.
  it.each([
    ['M8x1', 1],
    ['M10x1.25', 1.25],
    ['M10x1', 1],
    ['M12x1.5', 1.5],
    ['M12x1.25', 1.25],
    ['M14x1.5', 1.5],
    ['M16x1.5', 1.5],
  ] as const)('%s fine (ISO 261/262, memory)', (code, pitch) => {
    expect(findThread(code)).toMatchObject({ family: 'iso-fine', pitchMm: pitch });
  });

  // Tensile stress areas, ISO 898-1 formula, as tabulated there (REFERENCES.md): rounded to 0.1 mm².
  it.each([
    ['M5', 14.2],
    ['M6', 20.1],
    ['M8', 36.6],
    ['M10', 58.0],
    ['M12', 84.3],
  ] as const)('%s stress area %d mm² (ISO 898-1)', (code, area) => {
    expect(findThread(code)!.stressAreaMm2).toBeCloseTo(area, 1);
  });
  it('M14 115 mm², M16 157 mm² (ISO 898-1 table, memory)', () => {
    expect(metricStressArea(14, 2)).toBeCloseTo(115, 0);
    expect(metricStressArea(16, 2)).toBeCloseTo(157, 0);
  });
});

describe('unified inch threads — ASME B1.1 via REFERENCES.md', () => {
  it.each([
    ['1/4-20 UNC', 20, 0.0318],
    ['1/4-28 UNF', 28, 0.0364],
    ['5/16-18 UNC', 18, 0.0524],
    ['5/16-24 UNF', 24, 0.058],
    ['3/8-16 UNC', 16, 0.0775],
    ['3/8-24 UNF', 24, 0.0878],
    ['7/16-14 UNC', 14, 0.1063],
    ['7/16-20 UNF', 20, 0.1187],
    ['1/2-13 UNC', 13, 0.1419],
    ['1/2-20 UNF', 20, 0.1599],
  ] as const)('%s: %d tpi, %d in²', (code, tpi, in2) => {
    const t = findThread(code)!;
    expect(t.threadsPerInch).toBe(tpi);
    expect(t.stressAreaMm2! / 645.16).toBeCloseTo(in2, 6);
  });
  it('the formula rounds differently at 5/16-24 and 1/2-20 (0.0581, 0.1600); the product uses the table', () => {
    expect(unifiedStressAreaIn2(0.3125, 24)).toBeCloseTo(0.0581, 4);
    expect(unifiedStressAreaIn2(0.5, 20)).toBeCloseTo(0.16, 4);
    expect(unifiedStressAreaIn2(0.25, 20)).toBeCloseTo(0.0318, 4);
  });
});

describe('Whitworth threads (threads per inch)', () => {
  // 1/4–3/8: REFERENCES.md; 7/16 and 1/2: BS 84, memory.
  it.each([
    ['1/4 BSW', 20],
    ['1/4 BSF', 26],
    ['5/16 BSW', 18],
    ['5/16 BSF', 22],
    ['3/8 BSW', 16],
    ['3/8 BSF', 20],
    ['7/16 BSW', 14],
    ['1/2 BSW', 12],
    ['1/2 BSF', 16],
  ] as const)('%s: %d tpi', (code, tpi) => {
    expect(findThread(code)!.threadsPerInch).toBe(tpi);
  });
  it('has no stress area in our sources', () => {
    expect(findThread('1/4 BSW')!.stressAreaMm2).toBeNull();
  });
});

it('covers M5–M16 and 1/4–1/2 in in every family the issue names', () => {
  const families = new Set(THREADS.map((t) => t.family));
  expect([...families]).toEqual(['iso-coarse', 'iso-fine', 'unc', 'unf', 'bsw', 'bsf']);
});

describe('across flats', () => {
  // ISO 272: M5 8, M6 10, M8 13, M10 16, M12 18, M14 21, M16 24 (REFERENCES.md).
  it.each([
    ['M5', 8],
    ['M6', 10],
    ['M8', 13],
    ['M10', 16],
    ['M12', 18],
    ['M14', 21],
    ['M16', 24],
  ] as const)('%s: %d mm in ISO 272', (code, af) => {
    expect(hexSizesForThread(code).find((g) => g.families.includes('iso-272'))?.acrossFlats).toBe(af);
  });

  // Older DIN 931/933/934 and the JIS B 1180 annex: M10 17, M12 19, M14 22; JIS small hex: M8 12,
  // M10 14, M12 17, M14 19 (REFERENCES.md).
  it('M10 shows every family where they differ: 16 ISO, 17 DIN and JIS annex, 14 JIS small', () => {
    expect(hexSizesForThread('M10')).toEqual([
      { acrossFlats: 16, unit: 'mm', families: ['iso-272'] },
      { acrossFlats: 17, unit: 'mm', families: ['din', 'jis-annex'] },
      { acrossFlats: 14, unit: 'mm', families: ['jis-small'] },
    ]);
  });
  it.each([
    ['M12', 19, 17],
    ['M14', 22, 19],
  ] as const)('%s: DIN %d mm, JIS small %d mm', (code, din, small) => {
    const groups = hexSizesForThread(code);
    expect(groups.find((g) => g.families.includes('din'))?.acrossFlats).toBe(din);
    expect(groups.find((g) => g.families.includes('jis-small'))?.acrossFlats).toBe(small);
  });
  it('a fine thread takes the head of its size (M10x1.25 like M10)', () => {
    expect(hexSizesForThread('M10x1.25')).toEqual(hexSizesForThread('M10'));
  });
  // ASME B18.2.1 hex cap screws (REFERENCES.md).
  it.each([
    ['1/4-20 UNC', 7 / 16],
    ['5/16-24 UNF', 1 / 2],
    ['3/8-16 UNC', 9 / 16],
    ['7/16-20 UNF', 5 / 8],
    ['1/2-13 UNC', 3 / 4],
  ] as const)('%s: %d in (ASME B18.2.1)', (code, af) => {
    expect(hexSizesForThread(code)).toEqual([{ acrossFlats: af, unit: 'in', families: ['asme'] }]);
  });
  it('has no head size for Whitworth in our tables', () => {
    expect(hexSizesForThread('1/4 BSW')).toEqual([]);
  });

  it('from a spanner: 17 mm fits M10 (DIN, JIS annex) and M12 (JIS small)', () => {
    expect(threadsForSpanner(17, 'mm')).toEqual([
      { size: 'M10', families: ['din', 'jis-annex'] },
      { size: 'M12', families: ['jis-small'] },
    ]);
  });
  it('from a spanner: 13 mm fits M8 in ISO, DIN and the JIS annex; 12 mm the JIS small M8', () => {
    expect(threadsForSpanner(13, 'mm')).toEqual([{ size: 'M8', families: ['iso-272', 'din', 'jis-annex'] }]);
    expect(threadsForSpanner(12, 'mm')).toEqual([{ size: 'M8', families: ['jis-small'] }]);
  });
  it('from a spanner: 9/16 in fits 3/8 in cap screws', () => {
    expect(threadsForSpanner(9 / 16, 'in')).toEqual([{ size: '3/8 in', families: ['asme'] }]);
  });
  it('a 15 mm spanner matches no standard bolt head in our tables', () => {
    expect(threadsForSpanner(15, 'mm')).toEqual([]);
  });
});

describe('reading a spanner size as typed (arithmetic)', () => {
  it.each([
    ['13', 13],
    ['9/16', 0.5625],
    ['1 1/8', 1.125],
    ['0,5625', 0.5625],
    ['abc', null],
    ['1/0', null],
    ['0', null],
  ] as const)('%s → %s', (text, size) => expect(parseSpannerSize(text)).toBe(size));
});
