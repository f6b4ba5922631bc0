import { describe, expect, it } from 'vitest';
import { chapterLink, EXAMPLE_VIDEO_URL } from './chapter-link';
import { currencyDigits, formatBudgetInput, formatMoney, parseBudget } from './money';
import { keyFromName, uniqueKey } from './system-keys';

// Minor-unit digits per ISO 4217 (the standard's list one, "Minor unit" column): JPY 0, EUR 2, BHD 3.
describe('currencyDigits', () => {
  it('follows ISO 4217 minor units', () => {
    expect(currencyDigits('JPY')).toBe(0);
    expect(currencyDigits('EUR')).toBe(2);
    expect(currencyDigits('BHD')).toBe(3);
    expect(currencyDigits('eur')).toBeNull();
    expect(currencyDigits('XYZZ')).toBeNull();
  });
});

describe('parseBudget', () => {
  it('converts exactly, without float rounding', () => {
    expect(parseBudget('1234.5', 'EUR')).toEqual({ ok: true, minor: 123450 });
    expect(parseBudget('1234', 'JPY')).toEqual({ ok: true, minor: 1234 });
    expect(parseBudget('0.07', 'EUR')).toEqual({ ok: true, minor: 7 });
    // 1.005 * 100 is 100.49999999999999 in binary floating point.
    expect(parseBudget('1.005', 'BHD')).toEqual({ ok: true, minor: 1005 });
    expect(parseBudget('4 500,25', 'EUR')).toEqual({ ok: true, minor: 450025 });
    expect(parseBudget('1234.00', 'JPY')).toEqual({ ok: true, minor: 1234 });
    expect(parseBudget('  ', 'EUR')).toEqual({ ok: true, minor: null });
  });

  it('refuses more decimals than the currency has, signs and junk', () => {
    expect(parseBudget('12.345', 'EUR').ok).toBe(false);
    expect(parseBudget('12.5', 'JPY').ok).toBe(false);
    expect(parseBudget('-5', 'EUR').ok).toBe(false);
    expect(parseBudget('€5', 'EUR').ok).toBe(false);
    expect(parseBudget('1e3', 'EUR').ok).toBe(false);
    expect(parseBudget('5', 'ZZ').ok).toBe(false);
    expect(parseBudget('100000000000', 'EUR')).toEqual({ ok: true, minor: 1e13 });
    expect(parseBudget('100000000000.01', 'EUR').ok).toBe(false);
    expect(parseBudget('100000000000', 'JPY')).toEqual({ ok: true, minor: 100000000000 });
  });

  it('round-trips with the form text', () => {
    expect(formatBudgetInput(123450, 'EUR')).toBe('1234.50');
    expect(formatBudgetInput(5, 'EUR')).toBe('0.05');
    expect(formatBudgetInput(1234, 'JPY')).toBe('1234');
    expect(formatBudgetInput(1005, 'BHD')).toBe('1.005');
    expect(formatBudgetInput(null, 'EUR')).toBe('');
    expect(formatMoney(123450, 'EUR')).toBe('1,234.50 EUR');
  });
});

describe('chapterLink', () => {
  it('puts the seconds in the query by default and in the fragment after #', () => {
    expect(chapterLink(EXAMPLE_VIDEO_URL, 't={seconds}', 65)).toBe('https://video.example/watch?v=k7Rq2bHatch&t=65');
    expect(chapterLink(EXAMPLE_VIDEO_URL, '#t={seconds}', 65)).toBe('https://video.example/watch?v=k7Rq2bHatch#t=65');
    expect(chapterLink('https://video.example/v/9?t=3', 'start={seconds}&autoplay=1', 0)).toBe(
      'https://video.example/v/9?t=3&start=0&autoplay=1',
    );
    expect(chapterLink('https://video.example/v/9?t=3', 't={seconds}s', 65)).toBe('https://video.example/v/9?t=65s');
  });

  it('gives nothing for a pattern without {seconds} or a bad address', () => {
    expect(chapterLink(EXAMPLE_VIDEO_URL, 't=65', 65)).toBeNull();
    expect(chapterLink('not a url', 't={seconds}', 65)).toBeNull();
  });
});

describe('system keys', () => {
  it('makes keys from names and keeps them unique', () => {
    expect(keyFromName('Bodywork & Paint')).toBe('bodywork-paint');
    expect(keyFromName('Zündung')).toBe('zundung');
    expect(keyFromName('!!!')).toBe('system');
    expect(uniqueKey('Cooling', new Set(['cooling']))).toBe('cooling-2');
    expect(uniqueKey('Cooling', new Set(['cooling', 'cooling-2']))).toBe('cooling-3');
    expect(uniqueKey('x'.repeat(60), new Set(['x'.repeat(40)]))).toBe(`${'x'.repeat(38)}-2`);
  });
});
