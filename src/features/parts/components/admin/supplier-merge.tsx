import { useState } from 'react';
import { Button } from '../../../../components/ui/button';
import { ConfirmDialog } from '../../../../components/ui/confirm-dialog';
import { Notice } from '../../../../components/ui/notice';
import { StateMessage } from '../../../../components/ui/state-message';
import { TextField } from '../../../../components/ui/text-field';
import { useSuppliers, type Supplier } from '../../api/get-suppliers';
import { useMergeSuppliers } from '../../api/merge-suppliers';

/** The search results (from the URL's `q`), each of which can be merged into another supplier. */
export function SupplierMerge({ q }: { q: string }) {
  const { data, error, isFetching, refetch } = useSuppliers(q);
  const [from, setFrom] = useState<Supplier | null>(null);
  const [done, setDone] = useState<string | null>(null);

  if (!data) {
    return error ? (
      <StateMessage
        kind="error"
        title="The suppliers could not be loaded."
        action={
          <Button onClick={() => void refetch()} disabled={isFetching}>
            {isFetching ? 'Trying again…' : 'Try again'}
          </Button>
        }
      >
        <p>{error.message}</p>
      </StateMessage>
    ) : (
      <StateMessage kind="loading" title="Loading suppliers…" />
    );
  }
  return (
    <div className="space-y-6">
      {done ? <Notice kind="success">{done}</Notice> : null}
      {data.items.length === 0 ? (
        <StateMessage kind="empty" title={q ? `No supplier matches “${q}”.` : 'There are no suppliers yet.'} />
      ) : (
        <ul className="divide-y divide-rule border-y border-rule">
          {data.items.map((s) => (
            <li key={s.id} className="flex flex-wrap items-center justify-between gap-3 py-2">
              <span>
                <span className="font-semibold text-ink">{s.name}</span>
                {s.website ? <span className="ml-2 text-[14px] break-all text-slate">{s.website}</span> : null}
                <span className="ml-2 font-mono text-[13px] text-slate">#{s.id}</span>
              </span>
              <Button variant="secondary" onClick={() => setFrom(s)} aria-pressed={from?.id === s.id}>
                Merge into another…<span className="sr-only"> ({s.name})</span>
              </Button>
            </li>
          ))}
        </ul>
      )}
      {from ? (
        <MergeTarget
          key={from.id}
          from={from}
          onCancel={() => setFrom(null)}
          onMerged={(message) => {
            setFrom(null);
            setDone(message);
          }}
        />
      ) : null}
    </div>
  );
}

function MergeTarget({ from, onCancel, onMerged }: { from: Supplier; onCancel: () => void; onMerged: (message: string) => void }) {
  const [q, setQ] = useState('');
  const [into, setInto] = useState<Supplier | null>(null);
  const [confirming, setConfirming] = useState(false);
  const targets = useSuppliers(q.trim());
  const merge = useMergeSuppliers();
  const options = (targets.data?.items ?? []).filter((s) => s.id !== from.id);

  return (
    <section aria-labelledby="merge-heading" className="border border-rule bg-card p-4">
      <h2 id="merge-heading" className="font-serif text-lg font-bold">
        Merge “{from.name}” into…
      </h2>
      <TextField
        label="Find the supplier to keep"
        type="search"
        value={q}
        onChange={(e) => setQ(e.target.value)}
        className="mt-3 max-w-md"
      />
      <fieldset className="mt-3">
        <legend className="sr-only">Supplier to keep</legend>
        {options.length === 0 ? (
          <p className="text-ink-2">{targets.isFetching ? 'Searching…' : 'No other supplier matches.'}</p>
        ) : (
          <ul className="space-y-1">
            {options.map((s) => (
              <li key={s.id} className="flex items-center gap-2">
                <input
                  id={`merge-into-${s.id}`}
                  type="radio"
                  name="merge-into"
                  className="h-5 w-5 accent-ink"
                  checked={into?.id === s.id}
                  onChange={() => setInto(s)}
                />
                <label htmlFor={`merge-into-${s.id}`}>
                  {s.name} <span className="font-mono text-[13px] text-slate">#{s.id}</span>
                </label>
              </li>
            ))}
          </ul>
        )}
      </fieldset>
      <div className="mt-4 flex flex-wrap gap-3">
        <Button variant="danger" disabled={!into} onClick={() => setConfirming(true)}>
          Merge…
        </Button>
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
      </div>
      <ConfirmDialog
        open={confirming && into !== null}
        title={`Merge “${from.name}” into “${into?.name ?? ''}”?`}
        confirmLabel="Merge suppliers"
        pending={merge.isPending}
        error={merge.isError ? `They were not merged: ${merge.error.message}` : undefined}
        onClose={() => {
          setConfirming(false);
          merge.reset();
        }}
        onConfirm={() =>
          into &&
          merge.mutate(
            { fromId: from.id, intoId: into.id },
            { onSuccess: (r) => onMerged(`Merged “${from.name}” into “${into.name}”, which now has ${r.lines} part lines.`) },
          )
        }
      >
        <p>
          Every part line of every build that names “{from.name}” will name “{into?.name}” instead, and “{from.name}” leaves the supplier
          lists. This cannot be undone from here.
        </p>
      </ConfirmDialog>
    </section>
  );
}
