import type { ReactNode } from 'react';

/** Colours a plate may take; each is an AA text colour from LOOK.md (brass itself never colours text). */
export type PlateTone = 'ink' | 'oxide' | 'gauge' | 'brass' | 'caution' | 'slate';

const toneClass: Record<PlateTone, string> = {
  ink: 'text-ink-2',
  oxide: 'text-oxide-2',
  gauge: 'text-gauge',
  brass: 'text-brass-text',
  caution: 'text-caution',
  slate: 'text-slate',
};

/** A vehicle system (or similar tag) as a small square-cornered label; the border follows the text colour. */
export function Plate({ children, tone = 'ink' }: { children: ReactNode; tone?: PlateTone }) {
  return (
    <span
      className={`inline-block border border-current bg-card px-[7px] pt-1 pb-[3px] font-condensed text-xs leading-none font-semibold tracking-[0.14em] whitespace-nowrap uppercase ${toneClass[tone]}`}
    >
      {children}
    </span>
  );
}
