import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { DateText } from '../../../components/ui/date-text';
import { Notice } from '../../../components/ui/notice';
import { Plate, type PlateTone } from '../../../components/ui/plate';
import { StateMessage } from '../../../components/ui/state-message';
import type { Invitation } from '../../../shared/schemas/accounts';
import { useInvitations } from '../api/get-invitations';
import { useResendInvitation, useRevokeInvitation } from '../api/invitation-mutations';
import { rateLimitText } from './rate-limit-text';

const statusTone: Record<Invitation['status'], PlateTone> = { pending: 'brass', accepted: 'gauge', revoked: 'slate', expired: 'caution' };

/** The owner's view of invitations to the build: status, resend, revoke. */
export function TeamInvitations({ buildId, buildTitle }: { buildId: number; buildTitle: string }) {
  const { data, error, isFetching, refetch } = useInvitations(buildId);
  const resend = useResendInvitation(buildId);
  const revoke = useRevokeInvitation(buildId);
  const [revoking, setRevoking] = useState<Invitation | null>(null);

  if (!data) {
    return error ? (
      <StateMessage
        kind="error"
        title="The invitations could not be loaded."
        action={
          <Button onClick={() => void refetch()} disabled={isFetching}>
            {isFetching ? 'Trying again…' : 'Try again'}
          </Button>
        }
      >
        <p>{error.message}</p>
      </StateMessage>
    ) : (
      <StateMessage kind="loading" title="Loading the invitations…" />
    );
  }

  const closeRevoke = () => {
    setRevoking(null);
    revoke.reset();
  };

  return (
    <>
      {resend.isSuccess ? (
        <Notice kind="success" className="mb-4">
          Sent again to {resend.data.email}.
        </Notice>
      ) : null}
      {resend.isError ? (
        <Notice kind="error" className="mb-4">
          {rateLimitText(resend.error) ?? `The invitation could not be sent again: ${resend.error.message}`}
        </Notice>
      ) : null}
      {data.items.length === 0 ? (
        <StateMessage kind="empty" title="No invitations yet.">
          <p>Invite someone below and their invitation shows here until they accept it.</p>
        </StateMessage>
      ) : (
        <ul className="divide-y divide-rule border-y border-rule bg-card">
          {data.items.map((inv) => (
            <li key={inv.id} className="flex flex-wrap items-center gap-x-3 gap-y-2 px-4 py-3">
              <span className="min-w-0 flex-1">
                <span className="block font-semibold break-all">{inv.email}</span>
                <span className="text-sm text-slate">
                  Sent <DateText iso={inv.lastSentAt} />
                  {inv.status === 'pending' ? (
                    <>
                      {' '}
                      · expires <DateText iso={inv.expiresAt} />
                    </>
                  ) : null}
                </span>
              </span>
              <Plate tone={statusTone[inv.status]}>{inv.status}</Plate>
              {inv.status === 'pending' || inv.status === 'expired' ? (
                <span className="flex gap-2">
                  <Button
                    variant="secondary"
                    disabled={resend.isPending && resend.variables === inv.id}
                    onClick={() => resend.mutate(inv.id)}
                    aria-label={`Resend the invitation to ${inv.email}`}
                  >
                    Resend
                  </Button>
                  {inv.status === 'pending' ? (
                    <Button variant="secondary" onClick={() => setRevoking(inv)} aria-label={`Revoke the invitation to ${inv.email}`}>
                      Revoke
                    </Button>
                  ) : null}
                </span>
              ) : null}
            </li>
          ))}
        </ul>
      )}
      <ConfirmDialog
        open={revoking !== null}
        title={`Revoke the invitation to ${revoking?.email ?? ''}?`}
        confirmLabel="Revoke invitation"
        cancelLabel="Keep it"
        pending={revoke.isPending}
        error={revoke.isError ? `The invitation could not be revoked: ${revoke.error.message}` : undefined}
        onConfirm={() => revoking && revoke.mutate(revoking.id, { onSuccess: closeRevoke })}
        onClose={closeRevoke}
      >
        <p>The link in their e-mail stops working, and they do not join the team of {buildTitle}. You can invite them again later.</p>
      </ConfirmDialog>
    </>
  );
}
