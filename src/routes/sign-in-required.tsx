import { useLocation } from 'react-router';
import { ButtonLink } from '../components/ui/button';
import { accountPaths } from '../features/accounts/paths';
import { paths } from '../shared/paths';

/** The 401 page: this needs a signed-in person, and signing in comes straight back here. */
export function SignInRequired() {
  const { pathname, search } = useLocation();
  return (
    <section aria-labelledby="sign-in-required-heading" className="max-w-measure">
      <title>Sign in to continue — Rivet &amp; Reel</title>
      <meta name="robots" content="noindex" />
      <p className="label-condensed text-oxide">Error 401</p>
      <h1 id="sign-in-required-heading" className="mt-1 font-serif text-[27px] leading-tight font-bold md:text-[38px]">
        Sign in to continue
      </h1>
      <p className="mt-3 font-serif text-[17px] leading-relaxed text-ink-2">
        This page belongs to a signed-in account. Sign in with GitHub or an e-mail link, and you come straight back here.
      </p>
      <div className="mt-6 flex flex-wrap gap-3">
        <ButtonLink to={accountPaths.signIn(`${pathname}${search}`)} variant="primary">
          Sign in
        </ButtonLink>
        <ButtonLink to={paths.home()}>Go to the front page</ButtonLink>
      </div>
    </section>
  );
}
