import { ButtonLink } from '../components/ui/button';
import { paths } from '../shared/paths';

/** Shown for unknown paths and for anything hidden from this reader (drafts, private builds answer 404 too). */
export function NotFound() {
  return (
    <section aria-labelledby="not-found-heading" className="max-w-measure">
      <title>Page not found — Rivet &amp; Reel</title>
      <meta name="robots" content="noindex" />
      <p className="label-condensed text-oxide">Error 404</p>
      <h1 id="not-found-heading" className="mt-1 font-serif text-[27px] leading-tight font-bold md:text-[38px]">
        Nothing on this bench
      </h1>
      <p className="mt-3 font-serif text-[17px] leading-relaxed text-ink-2">
        The page you asked for is not here: the link may be mistyped, or the episode may have been moved or taken down.
      </p>
      <div className="mt-6">
        <ButtonLink to={paths.home()} variant="primary">
          Go to the front page
        </ButtonLink>
      </div>
    </section>
  );
}
