import { useNavigate } from 'react-router';
import { Button, ButtonLink } from '../components/ui/button';
import { PageHeading } from '../components/ui/page-heading';
import { StateMessage } from '../components/ui/state-message';
import { useAcceptInvitation } from '../features/accounts/api/accept-invitation';
import { useSession } from '../features/accounts/api/get-session';
import { useInvitationLookup } from '../features/accounts/api/lookup-invitation';
import { useFragmentToken } from '../features/accounts/hooks/use-fragment-token';
import { accountPaths } from '../features/accounts/paths';
import { ApiError } from '../lib/api-client';
import type { InvitationLookup } from '../shared/schemas/accounts';

export function InvitationAcceptPage() {
  const fragment = useFragmentToken();
  const token = fragment.state === 'found' ? fragment.token : null;
  const lookup = useInvitationLookup(token);

  return (
    <>
      <title>Your invitation — Rivet &amp; Reel</title>
      <meta name="robots" content="noindex" />
      <PageHeading
        label="Invitation"
        title={lookup.data?.kind === 'sponsor-member' ? 'Join a sponsor organisation' : 'Join a build team'}
      />
      <div className="mt-6 max-w-measure">
        {fragment.state === 'missing' ? (
          <StateMessage kind="empty" title="This address has no invitation token.">
            <p>Open the link from the invitation e-mail exactly as it arrived; some mail programs cut long links in two.</p>
          </StateMessage>
        ) : lookup.data && token ? (
          <InvitationDetails invitation={lookup.data} token={token} />
        ) : lookup.isError ? (
          <LookupFailed error={lookup.error} retry={() => void lookup.refetch()} />
        ) : (
          <StateMessage kind="loading" title="Looking up the invitation…" />
        )}
      </div>
    </>
  );
}

function LookupFailed({ error, retry }: { error: Error; retry: () => void }) {
  if (error instanceof ApiError && error.status < 500 && error.status !== 429) {
    return (
      <StateMessage kind="error" title="This invitation link does not work.">
        <p>It may be mistyped, or replaced by a newer invitation. Ask the build's owner to send it again.</p>
      </StateMessage>
    );
  }
  return (
    <StateMessage kind="error" title="The invitation could not be looked up." action={<Button onClick={retry}>Try again</Button>}>
      <p>{error.message}</p>
    </StateMessage>
  );
}

const ended: Record<Exclude<InvitationLookup['status'], 'pending'>, { title: string; text: string }> = {
  accepted: {
    title: 'This invitation has already been accepted.',
    text: 'Each invitation works once. If it was you, the build is in your build teams.',
  },
  revoked: {
    title: 'This invitation was withdrawn.',
    text: 'The build’s owner revoked it. Ask them for a new one if you still mean to help.',
  },
  expired: { title: 'This invitation has expired.', text: 'Invitations work for 7 days. Ask the build’s owner to send it again.' },
};

function InvitationDetails({ invitation, token }: { invitation: InvitationLookup; token: string }) {
  const what =
    invitation.kind === 'build-editor'
      ? `You are invited to help edit ${invitation.target.title}`
      : `You are invited to join ${invitation.target.title}`;
  return (
    <section aria-labelledby="invitation-heading" className="border border-rule bg-card px-5 py-6">
      <h2 id="invitation-heading" className="font-serif text-xl leading-snug font-bold">
        {what}
      </h2>
      <p className="mt-2 text-ink-2">
        {invitation.invitedBy ? `${invitation.invitedBy} sent it to ` : 'It was sent to '}
        <span className="font-semibold break-all text-ink">{invitation.email}</span>.
        {invitation.kind === 'build-editor'
          ? ' Editors write, publish and schedule episodes and keep the parts, figures and open items; the owner keeps the build’s settings.'
          : null}
      </p>
      {invitation.status === 'pending' ? (
        <AcceptAction token={token} kind={invitation.kind} targetTitle={invitation.target.title} />
      ) : (
        <div className="mt-4 border-t border-rule pt-4">
          <p className="font-semibold text-ink">{ended[invitation.status].title}</p>
          <p className="mt-1 text-ink-2">{ended[invitation.status].text}</p>
        </div>
      )}
    </section>
  );
}

function AcceptAction({ token, kind, targetTitle }: { token: string; kind: InvitationLookup['kind']; targetTitle: string }) {
  const { data: session, isPending: sessionPending } = useSession();
  const accept = useAcceptInvitation();
  const navigate = useNavigate();

  if (sessionPending) return <p className="mt-4 text-slate">Checking whether you are signed in…</p>;

  if (!session?.account) {
    return (
      <div className="mt-4 border-t border-rule pt-4">
        <p className="text-ink-2">Sign in first (or make an account the same way); you come straight back here to accept.</p>
        <ButtonLink to={accountPaths.signIn(accountPaths.invitationAccept(token))} variant="primary" className="mt-3">
          Sign in to accept
        </ButtonLink>
      </div>
    );
  }

  const onAccept = () =>
    accept.mutate(token, {
      onSuccess: ({ targetId }) => {
        const notice =
          kind === 'build-editor'
            ? `You joined the build team of ${targetTitle}.`
            : `You joined ${targetTitle}. Its sponsor summary is in your account menu.`;
        void navigate(kind === 'build-editor' ? accountPaths.team(targetId) : '/', { state: { notice } });
      },
    });

  return (
    <div className="mt-4 border-t border-rule pt-4">
      <p className="text-ink-2">
        You will accept as <span className="font-semibold text-ink">{session.account.displayName}</span> (@{session.account.handle}).
      </p>
      {accept.isError ? (
        <p role="alert" className="mt-3 font-semibold text-oxide-2">
          {accept.error instanceof ApiError && accept.error.status === 401
            ? 'Your session has ended. Sign in again to accept.'
            : `The invitation could not be accepted: ${accept.error.message}`}
        </p>
      ) : null}
      <Button className="mt-3" onClick={onAccept} disabled={accept.isPending || accept.isSuccess}>
        {accept.isPending || accept.isSuccess ? 'Accepting…' : 'Accept'}
      </Button>
    </div>
  );
}
