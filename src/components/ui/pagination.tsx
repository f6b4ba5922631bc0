import { ButtonLink } from './button';

/** Previous / "Page n of m" / next, as links (so paging works without JavaScript too). */
export function Pagination({
  page,
  totalPages,
  hrefFor,
  label,
}: {
  page: number;
  totalPages: number;
  hrefFor: (page: number) => string;
  /** What is being paged, for screen readers: "Pages of latest episodes". */
  label: string;
}) {
  if (totalPages <= 1) return null;
  return (
    <nav aria-label={label} className="mt-8 flex flex-wrap items-center justify-between gap-3">
      {page > 1 ? (
        <ButtonLink to={hrefFor(page - 1)} rel="prev">
          <span aria-hidden="true">←</span> Previous page
        </ButtonLink>
      ) : (
        <span />
      )}
      <p className="order-first w-full text-center font-condensed text-sm font-semibold tracking-label text-slate uppercase sm:order-none sm:w-auto">
        Page <span className="font-mono">{page}</span> of <span className="font-mono">{totalPages}</span>
      </p>
      {page < totalPages ? (
        <ButtonLink to={hrefFor(page + 1)} rel="next">
          Next page <span aria-hidden="true">→</span>
        </ButtonLink>
      ) : (
        <span />
      )}
    </nav>
  );
}
