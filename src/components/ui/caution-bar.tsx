import type { ReactNode } from 'react';

/**
 * LOOK.md's caution bar: caution-soft fill, a 4 px caution rule on the left, a condensed label
 * ("Safety-critical", "Weaker than specified", "Below wrench range") and plain sentences that defer to
 * the workshop manual and local rules. A note landmark named by its label, so it can be found by ear.
 */
export function CautionBar({ label, children, className = '' }: { label: string; children: ReactNode; className?: string }) {
  return (
    <div role="note" aria-label={label} className={`border-l-4 border-caution bg-caution-soft px-4 py-3 ${className}`}>
      <p className="font-condensed text-sm font-semibold tracking-label text-caution uppercase">{label}</p>
      <div className="mt-1 space-y-1 text-[15px] text-ink">{children}</div>
    </div>
  );
}
