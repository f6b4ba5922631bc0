import { describe, expect, it } from 'vitest';
import { safeReturnTo } from './return-to';
import { returnTo } from './schemas/accounts';

const cases: Array<[string | null | undefined, string]> = [
  ['/builds/moss-garage/alderton-175', '/builds/moss-garage/alderton-175'],
  ['/builds?q=brakes#at-312', '/builds?q=brakes#at-312'],
  ['/', '/'],
  [`/${'a'.repeat(499)}`, `/${'a'.repeat(499)}`],
  // Too long, missing, or leaving the site: the front page.
  [`/${'a'.repeat(500)}`, '/'],
  [null, '/'],
  [undefined, '/'],
  ['', '/'],
  ['//elsewhere.example/steal', '/'],
  ['/\\elsewhere.example', '/'],
  ['https://elsewhere.example/', '/'],
  ['javascript:alert(1)', '/'],
  ['builds/relative', '/'],
  [' /leading-space', '/'],
];

describe('safeReturnTo', () => {
  it('keeps same-site paths and sends everything else to the front page', () => {
    for (const [value, expected] of cases) expect(safeReturnTo(value), String(value)).toBe(expected);
  });

  it('follows the returnTo schema the server applies', () => {
    for (const [value] of cases) {
      const parsed = returnTo.safeParse(value ?? '');
      expect(safeReturnTo(value), String(value)).toBe(parsed.success ? parsed.data : '/');
    }
  });
});
