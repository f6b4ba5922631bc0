import { useState } from 'react';
import { Link } from 'react-router';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { ApiError } from '../../../lib/api-client';
import type { Account } from '../../../shared/schemas/accounts';
import { useDeleteAccount } from '../api/delete-account';
import { accountPaths } from '../paths';

/** Deleting the account, behind a confirmation that says what goes and what stays. */
export function DeleteAccountSection({ account }: { account: Account }) {
  const [open, setOpen] = useState(false);
  const remove = useDeleteAccount();
  const owned = account.builds.filter((b) => b.role === 'owner');
  const editing = account.builds.length - owned.length;

  const close = () => {
    setOpen(false);
    remove.reset();
  };

  return (
    <section aria-labelledby="delete-heading" className="border border-l-4 border-rule border-l-oxide-2 bg-card px-5 py-5">
      <h2 id="delete-heading" className="label-condensed mb-3">
        Delete my account
      </h2>
      <p className="max-w-measure text-ink-2">
        Your account, its sign-in methods and your build-team places go. What you wrote stays on the builds, shown as by a former member.
      </p>
      {owned.length > 0 ? (
        <p className="mt-2 max-w-measure text-ink-2">
          You own {owned.length === 1 ? 'a build' : `${owned.length} builds`} ({owned.map((b) => b.buildTitle).join(', ')}): transfer{' '}
          {owned.length === 1 ? 'it' : 'them'} to an editor or delete {owned.length === 1 ? 'it' : 'them'} first. See{' '}
          <Link to={accountPaths.builds()} className="underline underline-offset-2">
            your build teams
          </Link>
          .
        </p>
      ) : null}
      <Button variant="danger" className="mt-4" onClick={() => setOpen(true)}>
        Delete my account
      </Button>
      <ConfirmDialog
        open={open}
        title={`Delete the account @${account.handle}?`}
        confirmLabel="Delete my account"
        cancelLabel="Keep my account"
        pending={remove.isPending}
        error={remove.isError ? deleteErrorText(remove.error) : undefined}
        onConfirm={() => remove.mutate()}
        onClose={close}
      >
        <p>
          This deletes {account.displayName}’s profile and sign-in methods ({account.signInMethods.map(methodName).join(' and ') || 'none'})
          {editing > 0 ? `, and your editor places on ${editing === 1 ? 'one build' : `${editing} builds`}` : ''}. You are signed out.
        </p>
        <p>
          Your episodes, posts and edits stay where they are, shown as by “former member”. This cannot be undone; download your data first
          for a copy.
        </p>
      </ConfirmDialog>
    </section>
  );
}

export function methodName(method: Account['signInMethods'][number]): string {
  return method === 'github' ? 'GitHub' : 'e-mail link';
}

function deleteErrorText(error: Error): string {
  if (error instanceof ApiError && error.code === 'owns_builds') return error.message;
  return `The account could not be deleted: ${error.message}`;
}
