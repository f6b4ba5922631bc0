import type { DisclosureJson } from '../../../shared/schemas/sponsors';

/**
 * The disclosure bar (LOOK.md): brass border, brass-soft fill, an ink tag with the kind of support,
 * then the plain sentences, and the sponsors credited with logo and name.
 */
export function DisclosureBar({ disclosure }: { disclosure: DisclosureJson }) {
  return (
    <section aria-label="Disclosure" data-testid="disclosure" className="mt-4 border border-brass bg-brass-soft px-4 py-3">
      <p className="text-[16px] leading-relaxed text-ink">
        <span className="mr-2 inline-block bg-ink px-2 py-0.5 font-condensed text-[13px] font-semibold tracking-[0.12em] text-paper uppercase">
          {disclosure.label}
        </span>
        {disclosure.text}
      </p>
      {disclosure.sponsors.length ? (
        <ul className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-[15px]">
          {disclosure.sponsors.map((s) => (
            <li key={s.id} className="flex items-center gap-2">
              {s.logoUrl ? (
                <img src={s.logoUrl} alt="" width={24} height={24} className="h-6 w-6 border border-rule bg-card object-contain" />
              ) : null}
              {s.website ? (
                <a href={s.website} rel="sponsored noopener noreferrer" className="font-semibold">
                  {s.name}
                </a>
              ) : (
                <span className="font-semibold text-ink">{s.name}</span>
              )}
            </li>
          ))}
        </ul>
      ) : null}
    </section>
  );
}
