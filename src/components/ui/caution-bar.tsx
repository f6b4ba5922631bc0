/**
 * The caution bar of LOOK.md: caution-soft fill, a 4 px caution rule, a condensed label and plain
 * sentences that defer to the workshop manual and local rules.
 */
export function CautionBar({ label = 'Safety-critical', texts }: { label?: string; texts: readonly string[] }) {
  if (!texts.length) return null;
  return (
    <div
      role="note"
      aria-label={label}
      className="flex flex-col gap-x-3 gap-y-1 border-l-4 border-caution bg-caution-soft px-4 py-2.5 text-[15px] text-ink sm:flex-row sm:items-baseline"
    >
      <p className="shrink-0 font-condensed text-[13px] font-semibold tracking-label whitespace-nowrap text-caution uppercase">{label}</p>
      <div className="space-y-1">
        {texts.map((t) => (
          <p key={t}>{t}</p>
        ))}
      </div>
    </div>
  );
}
