import { useState } from 'react';
import { Button } from '../../../../components/ui/button';
import { ConfirmDialog } from '../../../../components/ui/confirm-dialog';
import { StateMessage } from '../../../../components/ui/state-message';
import type { BuildSystem } from '../../../../shared/schemas/builds';
import type { Figure } from '../../../../shared/schemas/figures';
import { useFigures } from '../../api/get-figures';
import { useCreateFigure, useDeleteFigure, useReplaceFigure } from '../../api/figure-mutations';
import { draftFromFigure, EMPTY_FIGURE_DRAFT } from '../../model/figure-draft';
import { FigureForm } from './figure-form';
import { FigureRow } from './figure-row';

/**
 * The episode's workshop figures: torque and fasteners, each checked (weaker substitutes, wrench
 * range). They save at once, like open items, not with the autosave.
 */
export function FiguresPanel({ episodeId, systems }: { episodeId: number; systems: readonly BuildSystem[] }) {
  const { data, error, isFetching, refetch } = useFigures(episodeId);
  const create = useCreateFigure(episodeId);
  const replace = useReplaceFigure(episodeId);
  const remove = useDeleteFigure(episodeId);
  const [editing, setEditing] = useState<number | null>(null);
  const [deleting, setDeleting] = useState<Figure | null>(null);

  const closeDelete = () => {
    setDeleting(null);
    remove.reset();
  };

  return (
    <section aria-labelledby="figures-heading">
      <h2 id="figures-heading" className="label-condensed border-b-2 border-ink pb-2">
        Figures
      </h2>
      <p className="mt-2 text-[15px] text-slate">
        Torque figures and fasteners used in this session. Readers see each in their own unit, with its checks and a caution.
      </p>
      {!data ? (
        <div className="mt-3">
          {error ? (
            <StateMessage
              kind="error"
              title="The figures could not be loaded."
              action={
                <Button onClick={() => void refetch()} disabled={isFetching}>
                  {isFetching ? 'Trying again…' : 'Try again'}
                </Button>
              }
            >
              <p>{error.message}</p>
            </StateMessage>
          ) : (
            <StateMessage kind="loading" title="Loading the figures…" />
          )}
        </div>
      ) : data.items.length === 0 ? (
        <p className="mt-3 text-ink-2">No figures yet.</p>
      ) : (
        <ul className="mt-3 space-y-3">
          {data.items.map((f) =>
            editing === f.id ? (
              <li key={f.id}>
                <FigureForm
                  title={`Edit ${f.fastener}`}
                  initial={draftFromFigure(f)}
                  systems={systems}
                  submitLabel="Save figure"
                  pending={replace.isPending}
                  onSubmit={(body) => replace.mutateAsync({ id: f.id, body }).then(() => setEditing(null))}
                  onCancel={() => setEditing(null)}
                />
              </li>
            ) : (
              <FigureRow key={f.id} figure={f} busy={remove.isPending} onEdit={() => setEditing(f.id)} onDelete={() => setDeleting(f)} />
            ),
          )}
        </ul>
      )}
      <FigureForm
        title="Add a figure"
        initial={EMPTY_FIGURE_DRAFT}
        systems={systems}
        submitLabel="Add figure"
        pending={create.isPending}
        onSubmit={(body) => create.mutateAsync(body)}
      />
      <ConfirmDialog
        open={deleting !== null}
        title={`Delete the figure “${deleting?.fastener ?? ''}”?`}
        confirmLabel="Delete figure"
        pending={remove.isPending}
        error={remove.isError ? `It could not be deleted: ${remove.error.message}` : undefined}
        onConfirm={() => deleting && remove.mutate(deleting.id, { onSuccess: closeDelete })}
        onClose={closeDelete}
      >
        <p>It goes from this episode, and readers no longer see it.</p>
      </ConfirmDialog>
    </section>
  );
}
