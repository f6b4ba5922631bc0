import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { DateText } from '../../../components/ui/date-text';
import { Notice } from '../../../components/ui/notice';
import { Plate } from '../../../components/ui/plate';
import type { AdminAccount, AdminAccountAction } from '../../../shared/schemas/accounts';
import { useAccountAction } from '../api/act-on-account';
import { actionCopy, rowActions } from './account-actions';

const th = 'px-2 py-2 text-left font-condensed text-[13px] font-semibold tracking-label text-slate uppercase';
const td = 'px-2 py-3 align-top';

interface Pending {
  account: AdminAccount;
  action: AdminAccountAction;
}

/** The accounts of one page; the signed-in admin's own row has no actions (nobody suspends themselves). */
export function AccountsTable({ items, currentUserId }: { items: AdminAccount[]; currentUserId: number }) {
  const [pending, setPending] = useState<Pending | null>(null);
  const act = useAccountAction();
  const copy = pending ? actionCopy[pending.action] : null;

  const close = () => {
    setPending(null);
    act.reset();
  };

  return (
    <>
      {act.isSuccess && !pending ? (
        <Notice kind="success" className="mb-4">
          Done: @{act.data.handle} is now {act.data.suspendedAt ? 'suspended' : 'active'}
          {act.data.isAdmin ? ', with admin rights' : ''}.
        </Notice>
      ) : null}
      <table className="w-full border-collapse bg-card text-[15px]">
        <caption className="sr-only">Accounts</caption>
        <thead className="border-b-2 border-ink">
          <tr>
            <th scope="col" className={th}>
              Account
            </th>
            <th scope="col" className={`${th} hidden sm:table-cell`}>
              Joined
            </th>
            <th scope="col" className={th}>
              State
            </th>
            <th scope="col" className={th}>
              Actions
            </th>
          </tr>
        </thead>
        <tbody>
          {items.map((a) => (
            <tr key={a.id} className="border-b border-rule">
              <th scope="row" className={`${td} text-left font-normal`}>
                <span className="block font-semibold text-ink">{a.displayName}</span>
                <span className="block font-mono text-sm break-all text-slate">@{a.handle}</span>
                <span className="block text-sm break-all text-ink-2">{a.email ?? 'no e-mail address'}</span>
                <span className="block text-sm text-slate sm:hidden">
                  Joined <DateText iso={a.createdAt} />
                </span>
              </th>
              <td className={`${td} hidden text-ink-2 sm:table-cell`}>
                <DateText iso={a.createdAt} />
              </td>
              <td className={td}>
                <span className="flex flex-col items-start gap-1">
                  {a.suspendedAt ? <Plate tone="caution">Suspended</Plate> : <Plate tone="gauge">Active</Plate>}
                  {a.isAdmin ? <Plate tone="oxide">Admin</Plate> : null}
                </span>
              </td>
              <td className={td}>
                {a.id === currentUserId ? (
                  <span className="text-sm text-slate">You</span>
                ) : (
                  <span className="flex flex-col items-stretch gap-2 lg:flex-row">
                    {rowActions(a).map((action) => (
                      <Button
                        key={action}
                        variant="secondary"
                        className="px-3 whitespace-nowrap"
                        aria-label={`${actionCopy[action].label} @${a.handle}`}
                        onClick={() => setPending({ account: a, action })}
                      >
                        {actionCopy[action].label}
                      </Button>
                    ))}
                  </span>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <ConfirmDialog
        open={pending !== null}
        title={pending && copy ? copy.title(pending.account) : ''}
        confirmLabel={copy?.confirm ?? ''}
        tone={copy?.tone}
        pending={act.isPending}
        error={act.isError ? `That did not work: ${act.error.message}` : undefined}
        onConfirm={() =>
          pending && act.mutate({ userId: pending.account.id, action: pending.action }, { onSuccess: () => setPending(null) })
        }
        onClose={close}
      >
        <p>{copy?.body}</p>
      </ConfirmDialog>
    </>
  );
}
