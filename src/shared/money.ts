/**
 * Money for parts lines: integers in each currency's minor unit, never floating point.
 *
 * THE ROUNDING RULE (the one place it is written; README "Money" repeats it):
 * 1. A line's amount is quantity × unit price, rounded ONCE to the minor unit, half away from zero.
 *    The unit price is what the creator typed, gross or net as they said.
 * 2. Tax is worked out from that rounded amount and rounded once, half away from zero:
 *    - price entered including tax: tax = amount × rate / (100 % + rate)   (at 20 %: exactly 1/6)
 *      net = amount − tax, gross = amount;
 *    - price entered excluding tax: tax = amount × rate, net = amount, gross = net + tax.
 * 3. A line in another currency is converted to the build's currency line by line, each of its
 *    amounts (net, tax, gross, avoided cost) rounded once, half away from zero, with the rate the
 *    creator recorded (build-currency units per one unit of the line's currency).
 * 4. Totals are sums of those rounded line amounts and are never rounded again.
 * PostgreSQL's round(numeric) also rounds half away from zero, so the SQL totals follow the same rule.
 */
import currencyCodes from 'currency-codes';

/** Showing amounts lives in money-format.ts, which the public pages load without the ISO 4217 table. */
export { formatMinor } from './money-format';

/** Quantities carry at most three decimals (e.g. 2.125 litres); stored as numeric(12,3). */
export const QUANTITY_SCALE = 3;
/** Exchange rates carry at most eight decimals; stored as numeric(18,8). */
export const RATE_SCALE = 8;
/** Tax rates in basis points: 2000 = 20 %. */
export const TAX_BP_FULL = 10_000;

/** The ISO 4217 minor-unit exponent of a currency (GBP 2, JPY 0, KWD 3), or null for an unknown code. */
export function currencyExponent(code: string): number | null {
  const entry = currencyCodes.code(code.toUpperCase());
  if (!entry) return null;
  return typeof entry.digits === 'number' ? entry.digits : null;
}

/** Every ISO 4217 alphabetic code the data knows with a minor unit. */
export function knownCurrencies(): string[] {
  return currencyCodes.codes().filter((c) => currencyExponent(c) !== null);
}

/** n / d rounded to an integer, half away from zero (d > 0). */
export function roundDiv(n: bigint, d: bigint): bigint {
  if (d <= 0n) throw new RangeError('divisor must be positive');
  const sign = n < 0n ? -1n : 1n;
  const a = n < 0n ? -n : n;
  return (sign * (2n * a + d)) / (2n * d);
}

/** A decimal string ("2.5", "0.125") as an integer of 10^-scale units; null when it has more places or is not a number. */
export function parseScaled(text: string, scale: number): bigint | null {
  const m = /^(-)?(\d{1,15})(?:\.(\d+))?$/.exec(text.trim());
  if (!m) return null;
  const frac = m[3] ?? '';
  if (frac.length > scale) return null;
  const v = BigInt(m[2]! + frac.padEnd(scale, '0'));
  return m[1] ? -v : v;
}

/** The inverse of parseScaled, without trailing zeros: 2500n at scale 3 → "2.5". */
export function formatScaled(value: bigint, scale: number): string {
  const neg = value < 0n;
  const digits = (neg ? -value : value).toString().padStart(scale + 1, '0');
  const int = digits.slice(0, digits.length - scale);
  const frac = digits.slice(digits.length - scale).replace(/0+$/, '');
  return `${neg ? '-' : ''}${int}${frac ? `.${frac}` : ''}`;
}

export interface LineMoneyInput {
  /** Decimal string, up to three places. */
  quantity: string;
  unitPriceMinor: number;
  taxRateBp: number;
  taxIncluded: boolean;
}

export interface LineAmounts {
  netMinor: number;
  taxMinor: number;
  grossMinor: number;
}

const num = (v: bigint): number => {
  const n = Number(v);
  if (!Number.isSafeInteger(n)) throw new RangeError(`amount ${v} is outside the safe integer range`);
  return n;
};

/** A line's net, tax and gross in its own currency, by the rounding rule above. */
export function lineAmounts(line: LineMoneyInput): LineAmounts {
  const q = parseScaled(line.quantity, QUANTITY_SCALE);
  if (q === null) throw new RangeError(`not a quantity: ${line.quantity}`);
  const amount = roundDiv(q * BigInt(line.unitPriceMinor), 10n ** BigInt(QUANTITY_SCALE));
  const bp = BigInt(line.taxRateBp);
  if (line.taxIncluded) {
    const tax = roundDiv(amount * bp, BigInt(TAX_BP_FULL) + bp);
    return { netMinor: num(amount - tax), taxMinor: num(tax), grossMinor: num(amount) };
  }
  const tax = roundDiv(amount * bp, BigInt(TAX_BP_FULL));
  return { netMinor: num(amount), taxMinor: num(tax), grossMinor: num(amount + tax) };
}

/**
 * An amount in the line's currency converted to the build's: × rate, shifted between the two
 * exponents, rounded once half away from zero. `rate` is a decimal string (up to eight places).
 */
export function convertMinor(amountMinor: number, rate: string, fromCurrency: string, toCurrency: string): number {
  const from = currencyExponent(fromCurrency);
  const to = currencyExponent(toCurrency);
  const r = parseScaled(rate, RATE_SCALE);
  if (from === null || to === null) throw new RangeError(`unknown currency ${from === null ? fromCurrency : toCurrency}`);
  if (r === null || r <= 0n) throw new RangeError(`not a rate: ${rate}`);
  const shift = to - from;
  const n = BigInt(amountMinor) * r * (shift > 0 ? 10n ** BigInt(shift) : 1n);
  const d = 10n ** BigInt(RATE_SCALE) * (shift < 0 ? 10n ** BigInt(-shift) : 1n);
  return num(roundDiv(n, d));
}

/** Minor units as a decimal string for forms and CSV: 1234 EUR → "12.34", 500 JPY → "500". */
export function minorToDecimal(minor: number, currency: string): string {
  const exp = currencyExponent(currency) ?? 2;
  const neg = minor < 0;
  const digits = String(Math.abs(minor)).padStart(exp + 1, '0');
  const int = digits.slice(0, digits.length - exp);
  const frac = exp ? `.${digits.slice(digits.length - exp)}` : '';
  return `${neg ? '-' : ''}${int}${frac}`;
}

/** A typed amount ("12.3", "12.34") in minor units; null when it is not a number or has too many places. */
export function decimalToMinor(text: string, currency: string): number | null {
  const exp = currencyExponent(currency);
  if (exp === null) return null;
  const v = parseScaled(text.replace(/[\s,]/g, ''), exp);
  if (v === null) return null;
  const n = Number(v);
  return Number.isSafeInteger(n) ? n : null;
}
