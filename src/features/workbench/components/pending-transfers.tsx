import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import type { Workbench } from '../../../shared/schemas/episodes';
import { useAcceptTransfer } from '../api/workbench-mutations';

/** Builds their owners offered to me; accepting makes me the owner and them an editor. */
export function PendingTransfers({ transfers }: { transfers: Workbench['pendingTransfers'] }) {
  const accept = useAcceptTransfer();
  return (
    <div className="space-y-3">
      <ul className="space-y-3">
        {transfers.map((t) => (
          <li key={t.buildId} className="flex flex-wrap items-center gap-x-4 gap-y-3 border border-dashed border-brass bg-card px-4 py-3">
            <p className="min-w-0 flex-1 basis-56">
              <strong>{t.fromDisplayName}</strong> offers you the build <strong>{t.buildTitle}</strong>. Accept it and you own it; they stay
              on its team as an editor.
            </p>
            <Button onClick={() => accept.mutate(t.buildId)} disabled={accept.isPending} aria-label={`Accept the build ${t.buildTitle}`}>
              {accept.isPending && accept.variables === t.buildId ? 'Accepting…' : 'Accept'}
            </Button>
          </li>
        ))}
      </ul>
      {accept.isError ? <Notice kind="error">The build could not be taken over: {accept.error.message}</Notice> : null}
    </div>
  );
}
