import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { StateMessage } from '../../../components/ui/state-message';
import { SUPPORT_KIND_LABELS, type Sponsorship } from '../../../shared/schemas/sponsors';
import { useDeleteSponsorship, useSaveSponsorship, useSponsorList, useSponsorships } from '../api/sponsorships';
import { SponsorshipForm } from './sponsorship-form';

const period = (s: Sponsorship) => (s.endsOn ? `${s.startsOn} to ${s.endsOn}` : `from ${s.startsOn}`);

/** Build settings: the owner's sponsorships — add, change, remove (after a confirmation). */
export function SponsorshipsSection({ buildId }: { buildId: number }) {
  const list = useSponsorships(buildId);
  const sponsors = useSponsorList().data?.items ?? [];
  const save = useSaveSponsorship(buildId);
  const remove = useDeleteSponsorship(buildId);
  const [editing, setEditing] = useState<number | null>(null);
  const [removing, setRemoving] = useState<Sponsorship | null>(null);

  return (
    <section aria-labelledby="sponsorships-heading" className="max-w-2xl">
      <h2 id="sponsorships-heading" className="label-condensed mb-4 border-b-2 border-ink pb-2">
        Sponsors
      </h2>
      <p className="text-ink-2">
        A sponsorship ties a sponsor to this build for a time. A paid one makes every episode published within its dates carry a disclosure;
        gifted and discounted parts are marked on their part lines.
      </p>
      {list.isPending ? <StateMessage kind="loading" title="Loading sponsorships…" /> : null}
      {list.error ? (
        <StateMessage kind="error" title="The sponsorships could not be loaded.">
          {list.error.message}
        </StateMessage>
      ) : null}
      {list.data ? (
        list.data.items.length ? (
          <ul className="mt-4 divide-y divide-rule border-y border-rule">
            {list.data.items.map((s) => (
              <li key={s.id} className="py-3">
                {editing === s.id ? (
                  <SponsorshipForm
                    sponsors={sponsors}
                    initial={s}
                    submitLabel="Save sponsorship"
                    onSave={async (input) => {
                      await save.mutateAsync({ id: s.id, input });
                      setEditing(null);
                    }}
                    onCancel={() => setEditing(null)}
                  />
                ) : (
                  <div className="flex flex-wrap items-center gap-3">
                    <span className="border border-brass bg-brass-soft px-1.5 py-0.5 font-condensed text-xs font-semibold tracking-[0.1em] text-brass-text uppercase">
                      {SUPPORT_KIND_LABELS[s.kind]}
                    </span>
                    <span className="font-semibold text-ink">{s.sponsor.name}</span>
                    <span className="font-mono text-[15px] text-slate">{period(s)}</span>
                    <span className="ml-auto flex gap-2">
                      <Button variant="secondary" onClick={() => setEditing(s.id)}>
                        Edit<span className="sr-only"> the sponsorship by {s.sponsor.name}</span>
                      </Button>
                      <Button variant="danger" onClick={() => setRemoving(s)}>
                        Remove<span className="sr-only"> the sponsorship by {s.sponsor.name}</span>
                      </Button>
                    </span>
                  </div>
                )}
              </li>
            ))}
          </ul>
        ) : (
          <p className="mt-4 text-slate">No sponsorships yet.</p>
        )
      ) : null}
      <h3 className="mt-6 font-semibold text-ink">Add a sponsorship</h3>
      <div className="mt-2">
        <SponsorshipForm
          sponsors={sponsors}
          initial={null}
          submitLabel="Add sponsorship"
          onSave={(input) => save.mutateAsync({ id: null, input })}
        />
      </div>
      <ConfirmDialog
        open={removing !== null}
        title={removing ? `Remove the sponsorship by ${removing.sponsor.name}?` : 'Remove the sponsorship?'}
        confirmLabel="Remove sponsorship"
        cancelLabel="Keep it"
        pending={remove.isPending}
        error={remove.isError ? `It could not be removed: ${remove.error.message}` : undefined}
        onConfirm={() => removing && remove.mutate(removing.id, { onSuccess: () => setRemoving(null) })}
        onClose={() => {
          setRemoving(null);
          remove.reset();
        }}
      >
        <p>Episodes published from now on no longer count this sponsorship in their disclosure. Part lines keep their own support.</p>
      </ConfirmDialog>
    </section>
  );
}
