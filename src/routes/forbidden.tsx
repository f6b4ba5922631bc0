import { ButtonLink } from '../components/ui/button';
import { accountPaths } from '../features/accounts/paths';
import { paths } from '../shared/paths';

/** The 403 page: signed in, but this is someone else's to change. */
export function Forbidden() {
  return (
    <section aria-labelledby="forbidden-heading" className="max-w-measure">
      <title>Not yours to change — Rivet &amp; Reel</title>
      <meta name="robots" content="noindex" />
      <p className="label-condensed text-oxide">Error 403</p>
      <h1 id="forbidden-heading" className="mt-1 font-serif text-[27px] leading-tight font-bold md:text-[38px]">
        This is not yours to change
      </h1>
      <p className="mt-3 font-serif text-[17px] leading-relaxed text-ink-2">
        You are signed in, but this page is for another role: a build’s owner, its editors, or the site’s admins. If you think you should
        have access, ask the person who runs it.
      </p>
      <div className="mt-6 flex flex-wrap gap-3">
        <ButtonLink to={paths.home()} variant="primary">
          Go to the front page
        </ButtonLink>
        <ButtonLink to={accountPaths.settings()}>Your account</ButtonLink>
      </div>
    </section>
  );
}
