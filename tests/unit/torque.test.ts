import { unit } from 'mathjs';
import { describe, expect, it } from 'vitest';
import {
  convertTorque,
  formatTorque,
  NEWTON_METRES_PER_UNIT,
  roundTorque,
  TORQUE_UNITS,
  wrenchRangePosition,
  type TorqueUnit,
} from '../../src/shared/torque';

// Reference converter: mathjs 15 (devDependency). `lbf inch`, not `lbf in`: `in` is a keyword in
// mathjs expressions. mathjs names the unit of each of ours:
const MATHJS: Record<TorqueUnit, string> = { 'N-m': 'N m', 'lbf-ft': 'lbf ft', 'lbf-in': 'lbf inch', 'kgf-m': 'kgf m' };

describe('torque conversion factors', () => {
  // NIST SP 811, Appendix B (factors rounded to 7 significant figures there; kgf·m exact).
  it.each([
    ['lbf-ft', 1.355818, 6],
    ['lbf-in', 0.1129848, 7],
    ['kgf-m', 9.80665, 10],
  ] as const)('1 %s in N·m matches NIST SP 811 Appendix B (%d)', (u, nist, digits) => {
    expect(NEWTON_METRES_PER_UNIT[u]).toBeCloseTo(nist, digits);
  });

  // Exact from the definitions (lb = 0.453 592 37 kg, gn = 9.806 65 m/s², ft = 0.3048 m): REFERENCES.md.
  it('1 lbf·ft is 1.355 817 948 331 400 4 N·m from the exact definitions', () => {
    expect(NEWTON_METRES_PER_UNIT['lbf-ft']).toBeCloseTo(1.3558179483314, 13);
    expect(NEWTON_METRES_PER_UNIT['lbf-in'] * 12).toBeCloseTo(NEWTON_METRES_PER_UNIT['lbf-ft'], 14);
  });

  // mathjs as the reference converter: unit(20, 'N m').toNumber('lbf ft') ≈ 14.751 242 985 5 (REFERENCES.md).
  it('20 N·m is 14.751 242 985 5 lbf·ft, as mathjs says', () => {
    expect(convertTorque(20, 'N-m', 'lbf-ft')).toBeCloseTo(14.7512429855, 9);
    expect(unit(20, 'N m').toNumber('lbf ft')).toBeCloseTo(14.7512429855, 9);
  });

  const samples = [0.5, 1, 8, 20, 47.5, 120, 350];
  for (const from of TORQUE_UNITS)
    for (const to of TORQUE_UNITS)
      it(`${from} → ${to} agrees with mathjs`, () => {
        for (const v of samples) {
          const ours = convertTorque(v, from, to);
          const theirs = unit(v, MATHJS[from]).toNumber(MATHJS[to]);
          expect(Math.abs(ours - theirs) / theirs).toBeLessThan(1e-12);
        }
      });

  it('round-trips without drift', () => {
    expect(convertTorque(convertTorque(25, 'N-m', 'lbf-in'), 'lbf-in', 'N-m')).toBeCloseTo(25, 12);
  });
});

describe('rounding for reading (three significant figures, whole numbers from 100)', () => {
  // Arithmetic only; the recorded value is shown as entered.
  it.each([
    [18.439, 18.4],
    [2.5493, 2.55],
    [221.27, 221],
    [0.11298, 0.113],
    [1234.5, 1235],
  ])('%d → %d', (v, r) => expect(roundTorque(v)).toBe(r));

  it('formats with the unit symbol', () => {
    expect(formatTorque(25, 'N-m')).toBe('25 N·m');
    expect(formatTorque(18.4, 'lbf-ft')).toBe('18.4 lbf·ft');
    expect(formatTorque(2.55, 'kgf-m')).toBe('2.55 kgf·m');
    expect(formatTorque(221, 'lbf-in')).toBe('221 lbf·in');
  });
});

describe('wrench range', () => {
  // Common practice, no published source: a wrench is used within its marked range, ends included.
  const range = { min: 20, max: 100, unit: 'N-m' as const };
  it('flags just under the bottom of the range (19.9 N·m on a 20–100 N·m wrench)', () => {
    expect(wrenchRangePosition(19.9, 'N-m', range)).toBe('below');
  });
  it('does not flag exactly the bottom of the range (20 N·m)', () => {
    expect(wrenchRangePosition(20, 'N-m', range)).toBeNull();
  });
  it('flags above the top and not at it', () => {
    expect(wrenchRangePosition(100, 'N-m', range)).toBeNull();
    expect(wrenchRangePosition(100.1, 'N-m', range)).toBe('above');
  });
  it('compares across units: a range in lbf·ft, a figure in N·m', () => {
    // 15 lbf·ft = 20.337 N·m (NIST SP 811 factor): 20 N·m is below a 15–80 lbf·ft wrench, 21 N·m is not.
    const inch = { min: 15, max: 80, unit: 'lbf-ft' as const };
    expect(wrenchRangePosition(20, 'N-m', inch)).toBe('below');
    expect(wrenchRangePosition(21, 'N-m', inch)).toBeNull();
    expect(wrenchRangePosition(convertTorque(15, 'lbf-ft', 'N-m'), 'N-m', inch)).toBeNull();
    // 80 lbf·ft = 108.47 N·m: 110 N·m is above; 960 lbf·in (= 80 lbf·ft exactly) is not.
    expect(wrenchRangePosition(110, 'N-m', inch)).toBe('above');
    expect(wrenchRangePosition(960, 'lbf-in', inch)).toBeNull();
    expect(wrenchRangePosition(1, 'kgf-m', { min: 5, max: 25, unit: 'N-m' })).toBeNull();
  });
});
