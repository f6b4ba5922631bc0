import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { Plate } from '../../../components/ui/plate';
import { StateMessage } from '../../../components/ui/state-message';
import type { z } from 'zod';
import type { buildMember } from '../../../shared/schemas/accounts';
import { useBuildMembers } from '../api/get-build-members';
import { useRemoveBuildMember } from '../api/remove-build-member';
import { Avatar } from './avatar';

type BuildMember = z.infer<typeof buildMember>;

interface TeamMembersProps {
  buildId: number;
  buildTitle: string;
  /** Owners may remove editors; editors see the list read-only. */
  canManage: boolean;
}

export function TeamMembers({ buildId, buildTitle, canManage }: TeamMembersProps) {
  const { data, error, isFetching, refetch } = useBuildMembers(buildId);
  const [removing, setRemoving] = useState<BuildMember | null>(null);
  const remove = useRemoveBuildMember(buildId);

  if (!data) {
    return error ? (
      <StateMessage
        kind="error"
        title="The build team could not be loaded."
        action={
          <Button onClick={() => void refetch()} disabled={isFetching}>
            {isFetching ? 'Trying again…' : 'Try again'}
          </Button>
        }
      >
        <p>{error.message}</p>
      </StateMessage>
    ) : (
      <StateMessage kind="loading" title="Loading the build team…" />
    );
  }

  const close = () => {
    setRemoving(null);
    remove.reset();
  };

  return (
    <>
      {data.items.length === 0 ? (
        <StateMessage kind="empty" title="Nobody is on this build team." />
      ) : (
        <ul className="divide-y divide-rule border-y border-rule bg-card">
          {data.items.map((m) => (
            <li key={m.userId} className="flex flex-wrap items-center gap-x-3 gap-y-2 px-4 py-3">
              <Avatar name={m.displayName} url={m.avatarUrl} size={36} />
              <span className="min-w-0 flex-1">
                <span className="block font-semibold">{m.displayName}</span>
                <span className="font-mono text-sm break-all text-slate">@{m.handle}</span>
              </span>
              <Plate tone={m.role === 'owner' ? 'oxide' : 'slate'}>{m.role}</Plate>
              {canManage && m.role === 'editor' ? (
                <Button variant="secondary" onClick={() => setRemoving(m)} aria-label={`Remove ${m.displayName} from the build team`}>
                  Remove
                </Button>
              ) : null}
            </li>
          ))}
        </ul>
      )}
      <ConfirmDialog
        open={removing !== null}
        title={`Remove ${removing?.displayName ?? ''} from the build team?`}
        confirmLabel="Remove editor"
        pending={remove.isPending}
        error={remove.isError ? `They could not be removed: ${remove.error.message}` : undefined}
        onConfirm={() => removing && remove.mutate(removing.userId, { onSuccess: close })}
        onClose={close}
      >
        <p>
          @{removing?.handle} will no longer be able to edit {buildTitle}. The episodes, parts and answers they wrote stay on the build.
        </p>
      </ConfirmDialog>
    </>
  );
}
