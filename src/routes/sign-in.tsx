import { useSearchParams } from 'react-router';
import { buttonClass, ButtonLink } from '../components/ui/button';
import { Notice } from '../components/ui/notice';
import { useSession } from '../features/accounts/api/get-session';
import { SignInForm } from '../features/accounts/components/sign-in-form';
import { accountPaths, safeReturnTo } from '../features/accounts/paths';
import { PageHeading } from '../components/ui/page-heading';

/** Why the server sent the reader back here (`?error=`), in words that say what to do next. */
const errorMessages: Record<string, string> = {
  github: 'Signing in with GitHub did not complete. Try again, or have a sign-in link e-mailed to you instead.',
  suspended: 'This account is suspended, so it cannot sign in. If you think that is a mistake, write to the site operators.',
};
const FALLBACK_ERROR = 'Signing in did not complete. Try again.';

export function SignInPage() {
  const [searchParams] = useSearchParams();
  const returnTo = safeReturnTo(searchParams.get('returnTo'));
  const errorCode = searchParams.get('error');
  const { data: session } = useSession();

  return (
    <>
      <title>Sign in — Rivet &amp; Reel</title>
      <meta name="description" content="Sign in to Rivet & Reel with GitHub or a one-time link sent by e-mail." />
      <meta name="robots" content="noindex" />
      <PageHeading label="Account" title="Sign in">
        Follow builds, ask about a step, suggest a better way, or publish your own restoration. No password: use GitHub, or a link we e-mail
        to you.
      </PageHeading>

      {errorCode ? (
        <Notice kind="error" className="mt-6 max-w-measure">
          {errorMessages[errorCode] ?? FALLBACK_ERROR}
        </Notice>
      ) : null}

      {session?.account ? (
        <Notice kind="info" className="mt-6 max-w-measure">
          <p>
            You are already signed in as <span className="font-semibold">{session.account.displayName}</span>.
          </p>
          <div className="mt-3 flex flex-wrap gap-3">
            <ButtonLink to={returnTo} variant="primary">
              Carry on
            </ButtonLink>
            <ButtonLink to={accountPaths.settings()}>Account settings</ButtonLink>
          </div>
        </Notice>
      ) : null}

      <div className="mt-8 grid max-w-4xl grid-cols-1 gap-6 md:grid-cols-2">
        <section aria-labelledby="github-heading" className="border border-rule bg-card px-5 py-5">
          <h2 id="github-heading" className="label-condensed mb-3 border-b-2 border-ink pb-2">
            With GitHub
          </h2>
          <p className="mb-4 text-ink-2">We read your name, picture and e-mail address from GitHub; nothing is posted there.</p>
          {/* A plain link: the OAuth dance is a chain of redirects through the server, not a fetch. */}
          <a href={accountPaths.github(returnTo)} className={buttonClass('primary')}>
            Continue with GitHub
          </a>
        </section>
        <section aria-labelledby="email-heading" className="border border-rule bg-card px-5 py-5">
          <h2 id="email-heading" className="label-condensed mb-3 border-b-2 border-ink pb-2">
            With an e-mail link
          </h2>
          <SignInForm returnTo={returnTo} />
        </section>
      </div>
    </>
  );
}
