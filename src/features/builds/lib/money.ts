/**
 * Budget amounts: a decimal typed by a person <-> integer minor units of the build's currency.
 * String arithmetic only, so "1234.5" EUR is exactly 123450 and never 123449.99999.
 * (Belongs in src/shared/money.ts once the money module of the ledger lands there.)
 */

const THREE_LETTERS = /^[A-Z]{3}$/;
const DECIMAL = /^(\d+)(?:[.,](\d*))?$/;

/** The largest budget the API takes (buildCreate: budgetMinor ≤ 1e13). */
export const MAX_BUDGET_MINOR = 1e13;

/** ISO 4217 minor-unit digits as the runtime's Intl knows them (JPY 0, EUR 2, BHD 3); null for a code it does not know. */
export function currencyDigits(currency: string): number | null {
  if (!THREE_LETTERS.test(currency)) return null;
  try {
    return new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions().maximumFractionDigits ?? null;
  } catch {
    return null;
  }
}

export type BudgetParse = { ok: true; minor: number | null } | { ok: false; message: string };

/**
 * Reads a typed amount ("1234.5", "1234,50", "" for none) in the currency's minor units.
 * Spaces and apostrophes as thousands separators are allowed; a comma or point is the decimal mark.
 */
export function parseBudget(text: string, currency: string): BudgetParse {
  const cleaned = text.trim().replace(/[\s\u00a0\u202f']/g, '');
  if (cleaned === '') return { ok: true, minor: null };
  const digits = currencyDigits(currency);
  if (digits === null) return { ok: false, message: 'choose a currency first' };
  const match = DECIMAL.exec(cleaned);
  if (!match) return { ok: false, message: 'an amount such as 1500 or 1500.50, without the currency sign' };
  const whole = match[1] ?? '0';
  // Trailing zeros past the currency's digits change nothing ("1234.00" yen is 1234 yen).
  const fraction = (match[2] ?? '').replace(/0+$/, '');
  if (fraction.length > digits) {
    return {
      ok: false,
      message: digits === 0 ? `${currency} has no minor unit: a whole amount` : `at most ${digits} decimals in ${currency}`,
    };
  }
  const minorText = `${whole}${fraction.padEnd(digits, '0')}`.replace(/^0+(?=\d)/, '');
  if (minorText.length > 14 || Number(minorText) > MAX_BUDGET_MINOR) return { ok: false, message: 'that budget is too large' };
  return { ok: true, minor: Number(minorText) };
}

/** The form's text for a stored budget: 123450 EUR → "1234.50", 1234 JPY → "1234", null → "". */
export function formatBudgetInput(minor: number | null, currency: string): string {
  if (minor === null) return '';
  const digits = currencyDigits(currency) ?? 2;
  const text = String(Math.trunc(minor)).padStart(digits + 1, '0');
  return digits === 0 ? text : `${text.slice(0, -digits)}.${text.slice(-digits)}`;
}

/** A budget for reading ("€1,234.50"); fixed locale so server and browser print the same. */
export function formatMoney(minor: number, currency: string): string {
  const digits = currencyDigits(currency);
  if (digits === null) return `${formatBudgetInput(minor, 'EUR')} ${currency}`;
  const text = formatBudgetInput(minor, currency);
  const [whole = '0', fraction] = text.split('.');
  const grouped = whole.replace(/\B(?=(\d{3})+(?!\d))/g, ',');
  return `${grouped}${fraction ? `.${fraction}` : ''} ${currency}`;
}
