import { useCallback, useMemo, useState } from 'react';
import { Button } from '../../../../components/ui/button';
import { Notice } from '../../../../components/ui/notice';
import { StateMessage } from '../../../../components/ui/state-message';
import { computeTotals } from '../../../../shared/parts-totals';
import type { PartLine, PartLineInput } from '../../../../shared/schemas/parts';
import { useEpisodeParts } from '../../api/get-episode-parts';
import { useCreatePartLine, useDeletePartLine, useUpdatePartLine } from '../../api/part-line-mutations';
import { changedInput, emptyPartLineValues, lineToInput, lineToValues, totalsLineOf } from '../../lib/part-line-form';
import { PartLineEditor, type PartsContext } from './part-line-editor';
import { PartsTable } from './parts-table';
import { LinesTotals } from '../lines-totals';

/**
 * The episode's parts list in the editor. Each line saves on its own (not with the autosave):
 * a new row on Enter, an edited one on Enter or when the focus leaves it; a delete can be undone.
 */
export function PartsPanel({ episodeId, ctx }: { episodeId: number; ctx: PartsContext }) {
  const { data, error, isFetching, refetch } = useEpisodeParts(episodeId);
  const create = useCreatePartLine(episodeId);
  const update = useUpdatePartLine();
  const remove = useDeletePartLine();
  const [editingId, setEditingId] = useState<number | null>(null);
  const [draft, setDraft] = useState<{ id: number | 'new'; input: PartLineInput } | null>(null);
  const [deleted, setDeleted] = useState<PartLine | null>(null);
  const chapterStarts = useMemo(() => ctx.chapters.map((c) => c.startSeconds), [ctx.chapters]);
  const systemName = useCallback((key: string | null) => ctx.systems.find((s) => s.key === key)?.name ?? key, [ctx.systems]);

  const onNewDraft = useCallback(
    (input: PartLineInput | null) => setDraft((d) => (input ? { id: 'new', input } : d?.id === 'new' ? null : d)),
    [],
  );
  const onEditDraft = useCallback(
    (input: PartLineInput | null) => setDraft((d) => (input && editingId !== null ? { id: editingId, input } : d?.id === 'new' ? d : null)),
    [editingId],
  );

  const totals = useMemo(() => {
    if (!data) return null;
    const lines = data.items.map((l) => (draft && draft.id === l.id ? draft.input : lineToInput(l)));
    // A new row counts once it has a description and a price worth adding.
    if (draft?.id === 'new' && draft.input.description) lines.push(draft.input);
    return computeTotals(lines.map(totalsLineOf), ctx.buildCurrency);
  }, [data, draft, ctx.buildCurrency]);

  const { mutate: removeLine } = remove;
  const deleteLine = useCallback((line: PartLine) => removeLine(line.id, { onSuccess: () => setDeleted(line) }), [removeLine]);
  const editLine = useCallback((line: PartLine) => setEditingId(line.id), []);
  const stopEditing = useCallback(() => setEditingId(null), []);
  const { mutateAsync: updateLine } = update;
  const renderEditor = useCallback(
    (line: PartLine, index: number) => (
      <PartLineEditor
        key={line.id}
        ctx={ctx}
        mode="edit"
        rowLabel={`line ${index + 1}`}
        defaultValues={lineToValues(line, chapterStarts)}
        keepAtSeconds={line.atSeconds}
        onDraft={onEditDraft}
        onCancel={stopEditing}
        onSubmit={async (input) => {
          const patch = changedInput(lineToInput(line), input);
          if (Object.keys(patch).length) await updateLine({ id: line.id, ...patch });
          setEditingId(null);
        }}
      />
    ),
    [ctx, chapterStarts, onEditDraft, stopEditing, updateLine],
  );
  const undo = () => {
    if (!deleted) return;
    create.mutate({ ...lineToInput(deleted), position: deleted.position }, { onSuccess: () => setDeleted(null) });
  };

  return (
    <section aria-labelledby="parts-heading">
      <h2 id="parts-heading" className="label-condensed border-b-2 border-ink pb-2">
        Parts
      </h2>
      <p className="mt-2 text-[15px] text-slate">
        Parts, consumables, tools, services and sales of this session. Type a line and press Enter; Tab moves between cells. Each line saves
        at once.
      </p>
      {!data ? (
        <div className="mt-3">
          {error ? (
            <StateMessage
              kind="error"
              title="The parts list could not be loaded."
              action={
                <Button onClick={() => void refetch()} disabled={isFetching}>
                  {isFetching ? 'Trying again…' : 'Try again'}
                </Button>
              }
            >
              <p>{error.message}</p>
            </StateMessage>
          ) : (
            <StateMessage kind="loading" title="Loading the parts list…" />
          )}
        </div>
      ) : (
        <>
          {data.items.length === 0 ? (
            <p className="mt-3 text-ink-2">No part lines yet. The first one goes in the row below.</p>
          ) : (
            <div className="mt-3">
              <PartsTable
                lines={data.items}
                systemName={systemName}
                editingId={editingId}
                busyId={remove.isPending ? (remove.variables ?? null) : null}
                onEdit={editLine}
                onDelete={deleteLine}
                renderEditor={renderEditor}
              />
            </div>
          )}
          {deleted ? (
            <Notice kind="info" className="mt-3 flex flex-wrap items-center justify-between gap-3">
              <span>Deleted “{deleted.description}”.</span>
              <Button variant="secondary" onClick={undo} disabled={create.isPending}>
                Undo
              </Button>
            </Notice>
          ) : null}
          {remove.isError ? (
            <Notice kind="error" className="mt-3">
              The line was not deleted: {remove.error.message}
            </Notice>
          ) : null}
          <div className="mt-4 border border-rule bg-card p-3">
            <PartLineEditor
              ctx={ctx}
              mode="new"
              rowLabel="New part line"
              defaultValues={emptyPartLineValues(ctx.buildCurrency)}
              onDraft={onNewDraft}
              onSubmit={(input) => create.mutateAsync(input)}
            />
          </div>
          {totals ? <LinesTotals title="Totals of this episode" totals={totals} live={draft !== null} /> : null}
        </>
      )}
    </section>
  );
}
