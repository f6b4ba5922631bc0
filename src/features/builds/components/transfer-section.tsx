import { useId, useState } from 'react';
import { Link } from 'react-router';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { Notice } from '../../../components/ui/notice';
import { SelectField } from '../../../components/ui/select-field';
import { StateMessage } from '../../../components/ui/state-message';
import type { Build } from '../../../shared/schemas/builds';
import { useCancelTransfer, useOfferTransfer } from '../api/build-mutations';

export interface TransferCandidate {
  userId: number;
  handle: string;
  displayName: string;
}

interface TransferSectionProps {
  build: Build;
  /** The build's editors; null while the team is loading. */
  editors: readonly TransferCandidate[] | null;
  editorsError: string | null;
  teamHref: string;
}

/** The owner offers the build to one of its editors, or withdraws a pending offer. */
export function TransferSection({ build, editors, editorsError, teamHref }: TransferSectionProps) {
  const selectId = useId();
  const [chosen, setChosen] = useState<number | null>(null);
  const [confirming, setConfirming] = useState(false);
  const offer = useOfferTransfer(build.id);
  const cancel = useCancelTransfer(build.id);

  if (build.pendingTransferTo) {
    return (
      <div className="space-y-4">
        <Notice kind="info">
          You offered this build to <strong>{build.pendingTransferTo.displayName}</strong>. It stays yours until they accept it on their
          Workbench.
        </Notice>
        {cancel.isError ? <Notice kind="error">The offer could not be withdrawn: {cancel.error.message}</Notice> : null}
        <Button variant="secondary" onClick={() => cancel.mutate()} disabled={cancel.isPending}>
          {cancel.isPending ? 'Withdrawing…' : 'Withdraw the offer'}
        </Button>
      </div>
    );
  }

  if (editorsError) {
    return (
      <StateMessage kind="error" title="The build team could not be loaded.">
        <p>{editorsError}</p>
      </StateMessage>
    );
  }
  if (!editors) return <StateMessage kind="loading" title="Loading the build team…" />;
  if (editors.length === 0) {
    return (
      <StateMessage kind="empty" title="There is nobody to hand the build to yet.">
        <p>
          Only an editor of the build can take it over.{' '}
          <Link to={teamHref} className="underline underline-offset-2">
            Invite one on the Build team page
          </Link>{' '}
          first.
        </p>
      </StateMessage>
    );
  }

  const recipient = editors.find((e) => e.userId === (chosen ?? editors[0]?.userId)) ?? null;
  const close = () => {
    setConfirming(false);
    offer.reset();
  };

  return (
    <div className="space-y-4">
      <p className="max-w-measure text-ink-2">
        The editor you choose becomes the owner once they accept; you stay on the build team as an editor.
      </p>
      <SelectField
        id={selectId}
        label="Editor to hand the build to"
        className="max-w-sm"
        value={recipient?.userId ?? ''}
        onChange={(event) => setChosen(Number(event.target.value))}
      >
        {editors.map((e) => (
          <option key={e.userId} value={e.userId}>
            {e.displayName} (@{e.handle})
          </option>
        ))}
      </SelectField>
      <Button variant="secondary" onClick={() => setConfirming(true)} disabled={!recipient}>
        Offer the build
      </Button>
      <ConfirmDialog
        open={confirming}
        tone="primary"
        title={`Offer ${build.title} to ${recipient?.displayName ?? ''}?`}
        confirmLabel="Send the offer"
        pending={offer.isPending}
        error={offer.isError ? `The offer could not be sent: ${offer.error.message}` : undefined}
        onConfirm={() => recipient && offer.mutate(recipient.userId, { onSuccess: close })}
        onClose={close}
      >
        <p>
          When @{recipient?.handle} accepts, they own the build: its settings, its editors and deleting it. You stay on the build team as an
          editor. Until then you can withdraw the offer here.
        </p>
      </ConfirmDialog>
    </div>
  );
}
