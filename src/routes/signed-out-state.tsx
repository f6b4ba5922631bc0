import { ButtonLink } from '../components/ui/button';
import { StateMessage } from '../components/ui/state-message';
import { accountPaths } from '../features/accounts/paths';

/** Shown by a signed-in screen whose person has just signed out in another tab (the loader redirects otherwise). */
export function SignedOutState({ returnTo }: { returnTo: string }) {
  return (
    <StateMessage
      kind="empty"
      title="You are signed out."
      action={
        <ButtonLink to={accountPaths.signIn(returnTo)} variant="primary">
          Sign in
        </ButtonLink>
      }
    >
      <p>Sign in again to see this page.</p>
    </StateMessage>
  );
}
