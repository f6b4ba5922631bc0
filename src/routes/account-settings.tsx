import { buttonClass } from '../components/ui/button';
import { PageHeading } from '../components/ui/page-heading';
import { StateMessage } from '../components/ui/state-message';
import { useSession } from '../features/accounts/api/get-session';
import { AccountSettingsForm } from '../features/accounts/components/account-settings-form';
import { Avatar } from '../features/accounts/components/avatar';
import { DeleteAccountSection, methodName } from '../features/accounts/components/delete-account-section';
import { accountPaths } from '../features/accounts/paths';
import type { Account } from '../shared/schemas/accounts';
import { SignedOutState } from './signed-out-state';

export function AccountSettingsPage() {
  const { data, error } = useSession();

  return (
    <>
      <title>Account settings — Rivet &amp; Reel</title>
      <meta name="robots" content="noindex" />
      <PageHeading label="Account" title="Account settings" />
      <div className="mt-6">
        {data?.account ? (
          <AccountSettings account={data.account} />
        ) : data ? (
          <SignedOutState returnTo={accountPaths.settings()} />
        ) : error ? (
          <StateMessage kind="error" title="Your account could not be loaded.">
            <p>{error.message}</p>
          </StateMessage>
        ) : (
          <StateMessage kind="loading" title="Loading your account…" />
        )}
      </div>
    </>
  );
}

function AccountSettings({ account }: { account: Account }) {
  return (
    <div className="space-y-10">
      <div className="flex items-center gap-4">
        <Avatar name={account.displayName} url={account.avatarUrl} size={56} />
        <p>
          <span className="block font-serif text-xl font-bold">{account.displayName}</span>
          <span className="font-mono text-[15px] text-slate">@{account.handle}</span>
        </p>
      </div>

      <section aria-labelledby="profile-heading">
        <h2 id="profile-heading" className="label-condensed mb-4 border-b-2 border-ink pb-2">
          Profile and notices
        </h2>
        <AccountSettingsForm account={account} />
      </section>

      <section aria-labelledby="methods-heading">
        <h2 id="methods-heading" className="label-condensed mb-4 border-b-2 border-ink pb-2">
          Ways to sign in
        </h2>
        {account.signInMethods.length ? (
          <ul className="max-w-md divide-y divide-rule border-y border-rule">
            {account.signInMethods.map((m) => (
              <li key={m} className="flex items-center justify-between gap-3 py-2.5">
                <span className="font-semibold first-letter:uppercase">{methodName(m)}</span>
                <span className="font-condensed text-sm font-semibold tracking-label text-gauge uppercase">Linked</span>
              </li>
            ))}
          </ul>
        ) : (
          <p className="text-ink-2">No sign-in method is linked.</p>
        )}
        <p className="mt-3 max-w-measure text-[15px] text-slate">
          Sign in with GitHub or an e-mail link to the same address, and both ways lead to this one account.
        </p>
      </section>

      <section aria-labelledby="data-heading">
        <h2 id="data-heading" className="label-condensed mb-4 border-b-2 border-ink pb-2">
          Your data
        </h2>
        <p className="mb-4 max-w-measure text-ink-2">A JSON file with your account, memberships and everything you wrote here.</p>
        {/* A plain link with download: the browser saves the server's JSON answer under the name the server gives it. */}
        <a href={accountPaths.export()} download className={buttonClass('secondary')}>
          Download my data
        </a>
      </section>

      <DeleteAccountSection account={account} />
    </div>
  );
}
