import type { SponsorRef } from '../../../shared/schemas/sponsors';

/** The build's sponsors on its page: logo (if any) and name, linked to the sponsor's website. */
export function SponsorCredits({ sponsors }: { sponsors: readonly SponsorRef[] }) {
  if (!sponsors.length) return null;
  return (
    <section aria-labelledby="sponsors-heading" className="mt-10">
      <h2 id="sponsors-heading" className="label-condensed border-b-2 border-ink pb-2">
        Supported by
      </h2>
      <ul className="mt-3 flex flex-wrap gap-4">
        {sponsors.map((s) => {
          const body = (
            <>
              {s.logoUrl ? (
                <img src={s.logoUrl} alt="" width={40} height={40} className="h-10 w-10 border border-rule bg-card object-contain" />
              ) : null}
              <span className="font-semibold">{s.name}</span>
            </>
          );
          return (
            <li key={s.id}>
              {s.website ? (
                <a href={s.website} rel="sponsored noopener noreferrer" className="flex items-center gap-2">
                  {body}
                </a>
              ) : (
                <span className="flex items-center gap-2 text-ink">{body}</span>
              )}
            </li>
          );
        })}
      </ul>
    </section>
  );
}
