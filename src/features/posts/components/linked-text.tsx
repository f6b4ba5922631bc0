import { find } from 'linkifyjs';
import type { ReactNode } from 'react';

/**
 * Plain text with its web addresses made into links: React elements only, never an HTML string.
 * Only http(s) addresses become links; paragraphs follow blank lines.
 */
export function LinkedText({ text }: { text: string }) {
  return (
    <>
      {text.split(/\n{2,}/).map((para, i) => (
        <p key={i} className="mt-1.5 break-words whitespace-pre-line first:mt-0">
          {linkify(para)}
        </p>
      ))}
    </>
  );
}

function linkify(text: string): ReactNode[] {
  const out: ReactNode[] = [];
  let at = 0;
  for (const m of find(text, 'url')) {
    if (!/^https?:\/\//i.test(m.href)) continue;
    if (m.start > at) out.push(text.slice(at, m.start));
    out.push(
      <a key={m.start} href={m.href} rel="nofollow ugc noopener noreferrer" className="break-all underline underline-offset-2">
        {m.value}
      </a>,
    );
    at = m.end;
  }
  if (at < text.length) out.push(text.slice(at));
  return out;
}
