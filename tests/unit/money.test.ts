import currencyCodes from 'currency-codes';
import { describe, expect, it } from 'vitest';
import {
  convertMinor,
  currencyExponent,
  decimalToMinor,
  formatScaled,
  knownCurrencies,
  lineAmounts,
  minorToDecimal,
  parseScaled,
  roundDiv,
} from '../../src/shared/money';
import { displayExponent, formatMinor } from '../../src/shared/money-format';
import { computeTotals, type TotalsLine } from '../../src/shared/parts-totals';

describe('ISO 4217 minor units', () => {
  it('match the published list one (ISO 4217, maintenance agency SIX) for the usual suspects', () => {
    // ISO 4217 list one: GBP, EUR, USD 2 decimals; JPY 0; KWD and BHD 3; CLF 4.
    expect(currencyExponent('GBP')).toBe(2);
    expect(currencyExponent('EUR')).toBe(2);
    expect(currencyExponent('USD')).toBe(2);
    expect(currencyExponent('JPY')).toBe(0);
    expect(currencyExponent('KWD')).toBe(3);
    expect(currencyExponent('BHD')).toBe(3);
    expect(currencyExponent('CLF')).toBe(4);
    expect(currencyExponent('ZZZ')).toBeNull(); // not an ISO 4217 code
    expect(currencyExponent('EURO')).toBeNull();
  });

  it('agree with the currency-codes package for every code it knows', () => {
    for (const code of knownCurrencies()) expect(currencyExponent(code), code).toBe(currencyCodes.code(code)!.digits);
    expect(knownCurrencies().length).toBeGreaterThan(150);
  });

  it('are shown with the same decimals by money-format.ts, which carries only the codes that are not 2', () => {
    for (const code of currencyCodes.codes()) {
      expect(displayExponent(code), code).toBe(currencyExponent(code) ?? 2);
      expect(displayExponent(code.toLowerCase()), code).toBe(currencyExponent(code) ?? 2);
    }
    expect(displayExponent('ZZZ')).toBe(2);
    // Decimals: the currency-codes reference data (ISO 4217 list one). Symbols and layout: Unicode
    // CLDR's en-GB currency pattern as Node's Intl renders it (JPY as "JP¥", KWD by its code).
    expect(formatMinor(1234, 'EUR')).toBe('€12.34');
    expect(formatMinor(1234, 'GBP')).toBe('£12.34');
    expect(formatMinor(500, 'JPY')).toBe('JP¥500');
    expect(formatMinor(12345, 'KWD')).toBe('KWD\u00a012.345');
    expect(formatMinor(-1234, 'EUR')).toBe('-€12.34');
  });
});

describe('the rounding rule (src/shared/money.ts doc comment)', () => {
  it('rounds n/d half away from zero, never to even', () => {
    expect(roundDiv(1n, 2n)).toBe(1n); // 0.5 → 1
    expect(roundDiv(3n, 2n)).toBe(2n); // 1.5 → 2
    expect(roundDiv(5n, 2n)).toBe(3n); // 2.5 → 3 (banker's rounding would give 2)
    expect(roundDiv(-5n, 2n)).toBe(-3n);
    expect(roundDiv(4999n, 10000n)).toBe(0n);
    expect(roundDiv(5000n, 10000n)).toBe(1n);
  });

  it('rounds the line amount once, at the minor unit', () => {
    // Worked by hand: 2.5 × 1 cent = 2.5 cents → 3; 0.333 × 3 cents = 0.999 → 1; 1.5 × €12.34 = €18.51.
    expect(lineAmounts({ quantity: '2.5', unitPriceMinor: 1, taxRateBp: 0, taxIncluded: true }).grossMinor).toBe(3);
    expect(lineAmounts({ quantity: '0.333', unitPriceMinor: 3, taxRateBp: 0, taxIncluded: true }).grossMinor).toBe(1);
    expect(lineAmounts({ quantity: '1.5', unitPriceMinor: 1234, taxRateBp: 0, taxIncluded: true }).grossMinor).toBe(1851);
  });

  it('splits a price including 20 % VAT with the VAT fraction 1/6', () => {
    // HMRC, VAT Notice 700 (the VAT fraction): at the standard rate of 20 % the VAT in a VAT-inclusive
    // price is 1/6 of it. £120.00 → £20.00 VAT; £1.00 → 16.67p, rounded to 17p.
    expect(lineAmounts({ quantity: '1', unitPriceMinor: 12000, taxRateBp: 2000, taxIncluded: true })).toEqual({
      netMinor: 10000,
      taxMinor: 2000,
      grossMinor: 12000,
    });
    expect(lineAmounts({ quantity: '1', unitPriceMinor: 100, taxRateBp: 2000, taxIncluded: true })).toEqual({
      netMinor: 83,
      taxMinor: 17,
      grossMinor: 100,
    });
    for (const gross of [600, 1200, 6000, 599_994]) {
      expect(lineAmounts({ quantity: '1', unitPriceMinor: gross, taxRateBp: 2000, taxIncluded: true }).taxMinor).toBe(gross / 6);
    }
  });

  it('adds tax to a price entered without it, rounding a half up at the boundary', () => {
    // Hand-computed: 25 cents at 2 % = 0.5 cent → 1; 5 cents at 20 % = exactly 1.
    expect(lineAmounts({ quantity: '1', unitPriceMinor: 25, taxRateBp: 200, taxIncluded: false })).toEqual({
      netMinor: 25,
      taxMinor: 1,
      grossMinor: 26,
    });
    expect(lineAmounts({ quantity: '1', unitPriceMinor: 24, taxRateBp: 200, taxIncluded: false }).taxMinor).toBe(0); // 0.48 → 0
    expect(lineAmounts({ quantity: '1', unitPriceMinor: 5, taxRateBp: 2000, taxIncluded: false }).taxMinor).toBe(1);
  });

  it('handles JPY (no minor unit) and KWD (three places)', () => {
    // Japan's consumption tax at 10 %: the tax in an inclusive price is 10/110 of it (National Tax
    // Agency, consumption tax rate). 3 × ¥1,000 = ¥3,000 → ¥272.7… → ¥273.
    expect(lineAmounts({ quantity: '3', unitPriceMinor: 1000, taxRateBp: 1000, taxIncluded: true })).toEqual({
      netMinor: 2727,
      taxMinor: 273,
      grossMinor: 3000,
    });
    // KWD has 1000 fils: 1.5 × 2.125 KWD = 3.1875 → 3.188 KWD (hand-computed).
    expect(lineAmounts({ quantity: '1.5', unitPriceMinor: 2125, taxRateBp: 0, taxIncluded: true }).grossMinor).toBe(3188);
    expect(minorToDecimal(3188, 'KWD')).toBe('3.188');
    expect(minorToDecimal(3000, 'JPY')).toBe('3000');
    expect(decimalToMinor('12.5', 'JPY')).toBeNull();
    expect(decimalToMinor('12.345', 'KWD')).toBe(12345);
    expect(decimalToMinor('12.3', 'EUR')).toBe(1230);
  });

  it('converts with the recorded rate across exponents, rounding once', () => {
    // Hand-computed: £32.00 × 1.165 = €37.28; ¥1,000 × 0.0062 = €6.20; €10.00 × 0.3312 = 3.312 KWD.
    expect(convertMinor(3200, '1.165', 'GBP', 'EUR')).toBe(3728);
    expect(convertMinor(1000, '0.0062', 'JPY', 'EUR')).toBe(620);
    expect(convertMinor(1000, '0.3312', 'EUR', 'KWD')).toBe(3312);
    // €0.05 × 1.1 = 5.5 cents → 6 (half away from zero).
    expect(convertMinor(5, '1.1', 'EUR', 'USD')).toBe(6);
    expect(() => convertMinor(5, '0', 'EUR', 'USD')).toThrow();
  });

  it('reads and writes scaled decimals exactly', () => {
    expect(parseScaled('2.5', 3)).toBe(2500n);
    expect(parseScaled('2.5001', 3)).toBeNull();
    expect(parseScaled('abc', 3)).toBeNull();
    expect(formatScaled(2500n, 3)).toBe('2.5');
    expect(formatScaled(2000n, 2)).toBe('20');
    expect(formatScaled(5n, 3)).toBe('0.005');
  });
});

describe('totals by DESIGN.md ("Money words")', () => {
  const line = (over: Partial<TotalsLine>): TotalsLine => ({
    kind: 'part',
    source: 'new',
    status: 'arrived',
    quantity: '1',
    unitPriceMinor: 1000,
    taxRateBp: 0,
    taxIncluded: true,
    currency: 'EUR',
    fxRate: null,
    avoidedCostMinor: null,
    ...over,
  });

  it('spent is arrived + fitted, committed on order, planned needed; returned counts for nothing; sales are income', () => {
    const t = computeTotals(
      [
        line({ status: 'arrived' }),
        line({ status: 'fitted', unitPriceMinor: 500 }),
        line({ status: 'on-order', unitPriceMinor: 300 }),
        line({ status: 'needed', unitPriceMinor: 200 }),
        line({ status: 'returned', unitPriceMinor: 9999 }),
        line({ kind: 'sale', status: 'arrived', unitPriceMinor: 700 }),
        line({ source: 'reused', unitPriceMinor: 0, avoidedCostMinor: 450 }),
        line({ currency: 'GBP', fxRate: null }),
      ],
      'EUR',
    );
    expect(t.spent.grossMinor).toBe(1500);
    expect(t.committedMinor).toBe(300);
    expect(t.plannedMinor).toBe(200);
    expect(t.salesMinor).toBe(700);
    expect(t.savedByReuseMinor).toBe(450);
    expect(t.unconverted).toBe(1);
    expect(t.lines).toBe(8);
  });
});
