import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { DateText } from '../../../components/ui/date-text';
import { Notice } from '../../../components/ui/notice';
import { Plate, type PlateTone } from '../../../components/ui/plate';
import { StateMessage } from '../../../components/ui/state-message';
import { TextField } from '../../../components/ui/text-field';
import { ApiError } from '../../../lib/api-client';
import { emailAddress, type Invitation } from '../../../shared/schemas/accounts';
import type { SponsorMember } from '../../../shared/schemas/sponsor-admin';
import { useInviteMember, useRemoveMember, useResendMemberInvitation, useRevokeMemberInvitation } from '../api/admin-sponsors';

const statusTone: Record<Invitation['status'], PlateTone> = { pending: 'brass', accepted: 'gauge', revoked: 'slate', expired: 'caution' };

type Pending = { kind: 'member'; member: SponsorMember } | { kind: 'invitation'; invitation: Invitation } | null;

/** Members of an organisation and their invitations: invite, resend, revoke, remove (each removal confirmed). */
export function SponsorMembers({
  sponsorId,
  sponsorName,
  members,
  invitations,
}: {
  sponsorId: number;
  sponsorName: string;
  members: SponsorMember[];
  invitations: Invitation[];
}) {
  const removeMember = useRemoveMember(sponsorId);
  const revoke = useRevokeMemberInvitation(sponsorId);
  const resend = useResendMemberInvitation(sponsorId);
  const [pending, setPending] = useState<Pending>(null);
  const close = () => {
    setPending(null);
    removeMember.reset();
    revoke.reset();
  };
  const open = invitations.filter((i) => i.status !== 'accepted');

  return (
    <div className="space-y-6">
      {members.length === 0 ? (
        <StateMessage kind="empty" title="No members yet.">
          <p>Invite the people at {sponsorName} who should see its summary; each gets a link by e-mail.</p>
        </StateMessage>
      ) : (
        <ul className="divide-y divide-rule border-y border-rule bg-card" aria-label="Members">
          {members.map((m) => (
            <li key={m.userId} className="flex flex-wrap items-center gap-3 px-4 py-3">
              <span className="min-w-0 flex-1">
                <span className="block font-semibold">{m.displayName}</span>
                <span className="text-sm break-all text-slate">
                  @{m.handle}
                  {m.email ? ` · ${m.email}` : ''} · member since <DateText iso={m.since} />
                </span>
              </span>
              <Button variant="secondary" onClick={() => setPending({ kind: 'member', member: m })} aria-label={`Remove ${m.displayName}`}>
                Remove
              </Button>
            </li>
          ))}
        </ul>
      )}

      {open.length ? (
        <div>
          <h3 className="label-condensed mb-2">Invitations</h3>
          {resend.isError ? (
            <Notice kind="error" className="mb-3">
              Not sent again: {resend.error.message}
            </Notice>
          ) : null}
          {resend.isSuccess ? (
            <Notice kind="success" className="mb-3">
              Sent again to {resend.data.email}.
            </Notice>
          ) : null}
          <ul className="divide-y divide-rule border-y border-rule bg-card">
            {open.map((inv) => (
              <li key={inv.id} className="flex flex-wrap items-center gap-3 px-4 py-3">
                <span className="min-w-0 flex-1">
                  <span className="block font-semibold break-all">{inv.email}</span>
                  <span className="text-sm text-slate">
                    Sent <DateText iso={inv.lastSentAt} />
                  </span>
                </span>
                <Plate tone={statusTone[inv.status]}>{inv.status}</Plate>
                {inv.status === 'pending' || inv.status === 'expired' ? (
                  <Button
                    variant="secondary"
                    disabled={resend.isPending}
                    onClick={() => resend.mutate(inv.id)}
                    aria-label={`Resend the invitation to ${inv.email}`}
                  >
                    Resend
                  </Button>
                ) : null}
                {inv.status === 'pending' ? (
                  <Button
                    variant="secondary"
                    onClick={() => setPending({ kind: 'invitation', invitation: inv })}
                    aria-label={`Revoke the invitation to ${inv.email}`}
                  >
                    Revoke
                  </Button>
                ) : null}
              </li>
            ))}
          </ul>
        </div>
      ) : null}

      <InviteMemberForm sponsorId={sponsorId} />

      <ConfirmDialog
        open={pending !== null}
        title={
          pending?.kind === 'member'
            ? `Remove ${pending.member.displayName} from ${sponsorName}?`
            : `Revoke the invitation to ${pending?.kind === 'invitation' ? pending.invitation.email : ''}?`
        }
        confirmLabel={pending?.kind === 'member' ? 'Remove member' : 'Revoke invitation'}
        cancelLabel="Keep"
        pending={removeMember.isPending || revoke.isPending}
        error={
          removeMember.isError
            ? `Not removed: ${removeMember.error.message}`
            : revoke.isError
              ? `Not revoked: ${revoke.error.message}`
              : undefined
        }
        onConfirm={() => {
          if (pending?.kind === 'member') removeMember.mutate(pending.member.userId, { onSuccess: close });
          else if (pending?.kind === 'invitation') revoke.mutate(pending.invitation.id, { onSuccess: close });
        }}
        onClose={close}
      >
        {pending?.kind === 'member' ? (
          <p>They stop seeing the summary of {sponsorName} and its notices at once. Their account stays.</p>
        ) : (
          <p>The link in the e-mail stops working. You can invite the address again later.</p>
        )}
      </ConfirmDialog>
    </div>
  );
}

function InviteMemberForm({ sponsorId }: { sponsorId: number }) {
  const invite = useInviteMember(sponsorId);
  const [email, setEmail] = useState('');
  const [error, setError] = useState<string | undefined>();
  const submit = (e: FormEvent) => {
    e.preventDefault();
    const parsed = emailAddress.safeParse(email.trim());
    if (!parsed.success) return setError(parsed.error.issues[0]?.message ?? 'must be an e-mail address');
    setError(undefined);
    invite.mutate(parsed.data, {
      onSuccess: () => setEmail(''),
      onError: (err) => setError(err instanceof ApiError ? err.fields?.email?.[0] : undefined),
    });
  };
  return (
    <form noValidate onSubmit={submit} className="max-w-md space-y-3">
      <TextField
        label="Invite a member by e-mail"
        hint="They get a link that works once, for 7 days."
        type="email"
        inputMode="email"
        autoComplete="off"
        spellCheck={false}
        value={email}
        onChange={(e) => setEmail(e.target.value)}
        error={error}
      />
      {invite.isSuccess ? <Notice kind="success">Invitation sent to {invite.data.email}.</Notice> : null}
      {invite.isError && !error ? <Notice kind="error">The invitation could not be sent: {invite.error.message}</Notice> : null}
      <Button type="submit" disabled={invite.isPending}>
        {invite.isPending ? 'Sending…' : 'Send invitation'}
      </Button>
    </form>
  );
}
