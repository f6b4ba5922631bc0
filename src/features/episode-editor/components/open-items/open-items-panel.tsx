import { useState } from 'react';
import { Button } from '../../../../components/ui/button';
import { ConfirmDialog } from '../../../../components/ui/confirm-dialog';
import { Notice } from '../../../../components/ui/notice';
import { StateMessage } from '../../../../components/ui/state-message';
import type { OpenItem } from '../../../../shared/schemas/episodes';
import { useOpenItems } from '../../api/get-open-items';
import { useCreateOpenItem, useDeleteOpenItem, useUpdateOpenItem } from '../../api/open-item-mutations';
import { AddOpenItemForm } from './add-open-item-form';
import { OpenItemRow } from './open-item-row';

/**
 * The build's open items as this episode starts, plus those opened in it. They save at once
 * (not with the autosave): each is its own record, shared by the episodes it spans.
 */
export function OpenItemsPanel({ buildId, episodeId }: { buildId: number; episodeId: number }) {
  const { data, error, isFetching, refetch } = useOpenItems(buildId, episodeId);
  const create = useCreateOpenItem(buildId, episodeId);
  const update = useUpdateOpenItem(buildId, episodeId);
  const remove = useDeleteOpenItem(buildId, episodeId);
  const [deleting, setDeleting] = useState<OpenItem | null>(null);
  const failed = create.error ?? update.error;

  const closeDelete = () => {
    setDeleting(null);
    remove.reset();
  };

  return (
    <section aria-labelledby="open-items-heading">
      <h2 id="open-items-heading" className="label-condensed border-b-2 border-ink pb-2">
        Open items
      </h2>
      <p className="mt-2 text-[15px] text-slate">
        Work still open when this episode starts. Tick what this session finished; add what it leaves for later.
      </p>
      {!data ? (
        <div className="mt-3">
          {error ? (
            <StateMessage
              kind="error"
              title="The open items could not be loaded."
              action={
                <Button onClick={() => void refetch()} disabled={isFetching}>
                  {isFetching ? 'Trying again…' : 'Try again'}
                </Button>
              }
            >
              <p>{error.message}</p>
            </StateMessage>
          ) : (
            <StateMessage kind="loading" title="Loading the open items…" />
          )}
        </div>
      ) : data.items.length === 0 ? (
        <p className="mt-3 text-ink-2">Nothing is open on this build.</p>
      ) : (
        <ul className="mt-3 grid gap-3 md:grid-cols-2">
          {data.items.map((item) => (
            <OpenItemRow
              key={item.id}
              item={item}
              episodeId={episodeId}
              busy={update.isPending && update.variables?.id === item.id}
              onClosedChange={(closed) => update.mutate({ id: item.id, closedInEpisodeId: closed ? episodeId : null })}
              onDelete={() => setDeleting(item)}
            />
          ))}
        </ul>
      )}
      {failed ? (
        <Notice kind="error" className="mt-3">
          That change to the open items was not saved: {failed.message}
        </Notice>
      ) : null}
      <AddOpenItemForm episodeId={episodeId} pending={create.isPending} onAdd={(body) => create.mutateAsync(body)} />
      <ConfirmDialog
        open={deleting !== null}
        title={`Delete the open item “${deleting?.title ?? ''}”?`}
        confirmLabel="Delete open item"
        pending={remove.isPending}
        error={remove.isError ? `It could not be deleted: ${remove.error.message}` : undefined}
        onConfirm={() => deleting && remove.mutate(deleting.id, { onSuccess: closeDelete })}
        onClose={closeDelete}
      >
        <p>
          It goes from this episode and from the build’s list of open work. To record that it was done, tick “Closed in this episode”
          instead.
        </p>
      </ConfirmDialog>
    </section>
  );
}
