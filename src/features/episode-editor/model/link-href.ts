import { isAllowedWriteUpHref } from '../../../shared/write-up';

export type LinkHrefResult = { ok: true; href: string } | { ok: false; message: string };

/**
 * What the link dialog accepts: full http, https and mailto addresses (the server's rule). A bare
 * "example.org/page" is read as https; anything with another scheme is refused, never rewritten.
 */
export function readLinkHref(input: string): LinkHrefResult {
  const text = input.trim();
  if (text === '') return { ok: false, message: 'Write the address the link goes to.' };
  const withScheme = /^[a-z][a-z0-9+.-]*:/i.test(text) ? text : `https://${text.replace(/^\/\//, '')}`;
  if (isAllowedWriteUpHref(withScheme)) return { ok: true, href: withScheme };
  return { ok: false, message: 'Only web addresses (http or https) and e-mail addresses (mailto:) can be linked.' };
}
