import { useNavigate } from 'react-router';
import { Button, ButtonLink } from '../components/ui/button';
import { PageHeading } from '../components/ui/page-heading';
import { StateMessage } from '../components/ui/state-message';
import { useRedeemSignInLink } from '../features/accounts/api/redeem-sign-in-link';
import { useFragmentToken } from '../features/accounts/hooks/use-fragment-token';
import { accountPaths, safeReturnTo } from '../features/accounts/paths';
import { ApiError } from '../lib/api-client';

/**
 * Where the e-mailed link lands. Opening it changes nothing (mail scanners fetch links); the
 * "Sign in" button POSTs the token from the fragment.
 */
export function SignInLinkPage() {
  const fragment = useFragmentToken();
  const redeem = useRedeemSignInLink();
  const navigate = useNavigate();

  const signIn = (token: string) =>
    redeem.mutate(token, {
      onSuccess: ({ returnTo }) => void navigate(safeReturnTo(returnTo), { replace: true }),
    });

  return (
    <>
      <title>Sign in with your e-mail link — Rivet &amp; Reel</title>
      <meta name="robots" content="noindex" />
      <PageHeading label="Account" title="Sign in with your e-mail link" />
      <div className="mt-6 max-w-measure">
        {fragment.state === 'reading' ? (
          <StateMessage kind="loading" title="Reading the link…" />
        ) : fragment.state === 'missing' ? (
          <StateMessage
            kind="empty"
            title="This address has no sign-in token."
            action={<ButtonLink to={accountPaths.signIn()}>Ask for a new link</ButtonLink>}
          >
            <p>Open the link from the e-mail exactly as it arrived; some mail programs cut long links in two. Or ask for a new one.</p>
          </StateMessage>
        ) : redeem.isError && isLinkInvalid(redeem.error) ? (
          <StateMessage
            kind="error"
            title="This sign-in link has been used or has expired."
            action={
              <ButtonLink to={accountPaths.signIn()} variant="primary">
                Ask for a new link
              </ButtonLink>
            }
          >
            <p>Each link works once, for 20 minutes after it was sent. Ask for a new one and use the newest e-mail.</p>
          </StateMessage>
        ) : (
          <div className="border border-rule bg-card px-5 py-6">
            <p className="text-ink-2">
              Pressing the button signs you in on this device and takes you back to the page you were on. The link then stops working.
            </p>
            {redeem.isError ? (
              <p role="alert" className="mt-3 font-semibold text-oxide-2">
                Signing in did not work: {redeem.error.message}
              </p>
            ) : null}
            <Button className="mt-4" onClick={() => signIn(fragment.token)} disabled={redeem.isPending || redeem.isSuccess}>
              {redeem.isPending || redeem.isSuccess ? 'Signing in…' : 'Sign in'}
            </Button>
          </div>
        )}
      </div>
    </>
  );
}

function isLinkInvalid(error: Error): boolean {
  return error instanceof ApiError && (error.code === 'link_invalid' || error.status === 400);
}
