/** Currencies offered first in the currency field; any other ISO 4217 code may be typed. */
export const COMMON_CURRENCIES: ReadonlyArray<{ code: string; name: string }> = [
  { code: 'EUR', name: 'Euro' },
  { code: 'GBP', name: 'Pound sterling' },
  { code: 'USD', name: 'US dollar' },
  { code: 'CAD', name: 'Canadian dollar' },
  { code: 'AUD', name: 'Australian dollar' },
  { code: 'NZD', name: 'New Zealand dollar' },
  { code: 'CHF', name: 'Swiss franc' },
  { code: 'SEK', name: 'Swedish krona' },
  { code: 'NOK', name: 'Norwegian krone' },
  { code: 'DKK', name: 'Danish krone' },
  { code: 'PLN', name: 'Polish złoty' },
  { code: 'CZK', name: 'Czech koruna' },
  { code: 'HUF', name: 'Hungarian forint' },
  { code: 'JPY', name: 'Japanese yen' },
  { code: 'ZAR', name: 'South African rand' },
  { code: 'BRL', name: 'Brazilian real' },
  { code: 'MXN', name: 'Mexican peso' },
  { code: 'INR', name: 'Indian rupee' },
];

export const DEFAULT_CURRENCY = 'EUR';

// Regions whose currency is not the euro; every other region of the euro area falls to the default.
const REGION_CURRENCY: Readonly<Record<string, string>> = {
  GB: 'GBP',
  US: 'USD',
  CA: 'CAD',
  AU: 'AUD',
  NZ: 'NZD',
  CH: 'CHF',
  LI: 'CHF',
  SE: 'SEK',
  NO: 'NOK',
  DK: 'DKK',
  PL: 'PLN',
  CZ: 'CZK',
  HU: 'HUF',
  JP: 'JPY',
  ZA: 'ZAR',
  BR: 'BRL',
  MX: 'MXN',
  IN: 'INR',
};

/** A likely currency for a browser language tag ("en-GB" → GBP), or null when the tag names no region we know. */
export function currencyForLocale(tag: string | undefined): string | null {
  if (!tag) return null;
  try {
    // Only a region the person chose ("en-GB"), not one guessed from the language ("en" is not the US).
    const region = new Intl.Locale(tag).region;
    if (!region) return null;
    return REGION_CURRENCY[region] ?? null;
  } catch {
    return null;
  }
}
