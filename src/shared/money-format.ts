// Showing amounts of money, without the full ISO 4217 table (the currency-codes package, about 5 kB
// gzipped) that src/shared/money.ts uses for arithmetic and validation: the public pages only show
// amounts. tests/unit/money.test.ts checks this list against currency-codes for every code it knows.

/** ISO 4217 minor units other than 2 (list one); every other code shows two decimals. */
const MINOR_UNITS_NOT_TWO = new Map<string, number>([
  ...['BIF', 'CLP', 'DJF', 'GNF', 'ISK', 'JPY', 'KMF', 'KRW', 'PYG', 'RWF', 'UGX', 'UYI', 'VND', 'VUV', 'XAF', 'XOF', 'XPF'].map(
    (c) => [c, 0] as const,
  ),
  // Precious metals, SDR, funds and test codes: no minor unit in ISO 4217, 0 in the reference data.
  ...['XAG', 'XAU', 'XBA', 'XBB', 'XBC', 'XBD', 'XDR', 'XPD', 'XPT', 'XSU', 'XTS', 'XUA', 'XXX'].map((c) => [c, 0] as const),
  ...['BHD', 'IQD', 'JOD', 'KWD', 'LYD', 'OMR', 'TND'].map((c) => [c, 3] as const),
  ...['CLF', 'UYW'].map((c) => [c, 4] as const),
]);

/** The decimals an amount in this currency is shown with: its ISO 4217 minor unit, 2 for a code not in the list. */
export function displayExponent(code: string): number {
  return MINOR_UNITS_NOT_TWO.get(code.toUpperCase()) ?? 2;
}

// Building an Intl.NumberFormat costs far more than formatting with one (a server-rendered episode
// page formats hundreds of amounts): one formatter per currency, made on first use.
const formatters = new Map<string, { exp: number; format: Intl.NumberFormat }>();

/** For display only (never for arithmetic): 1234 EUR → "€12.34", in a fixed locale so server and browser agree. */
export function formatMinor(minor: number, currency: string): string {
  let f = formatters.get(currency);
  if (!f) {
    const exp = displayExponent(currency);
    f = {
      exp,
      format: new Intl.NumberFormat('en-GB', { style: 'currency', currency, minimumFractionDigits: exp, maximumFractionDigits: exp }),
    };
    formatters.set(currency, f);
  }
  return f.format.format(minor / 10 ** f.exp);
}
