import type { ReactNode } from 'react';

/** A screen's title block: a condensed label above the serif title, and an optional lead paragraph. */
export function PageHeading({ label, title, children }: { label?: string; title: string; children?: ReactNode }) {
  return (
    <header className="max-w-measure">
      {label ? <p className="label-condensed text-oxide">{label}</p> : null}
      <h1 className="mt-1 font-serif text-[27px] leading-tight font-bold md:text-[38px]">{title}</h1>
      {children ? <div className="mt-3 font-serif text-[17px] leading-relaxed text-ink-2">{children}</div> : null}
    </header>
  );
}
