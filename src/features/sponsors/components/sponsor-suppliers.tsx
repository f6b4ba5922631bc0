import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { Notice } from '../../../components/ui/notice';
import { StateMessage } from '../../../components/ui/state-message';
import { TextField } from '../../../components/ui/text-field';
import type { SponsorSupplier } from '../../../shared/schemas/sponsor-admin';
import { useLinkSupplier, useSupplierSearch, useUnlinkSupplier } from '../api/admin-sponsors';

/** The suppliers an organisation stands behind: on their part lines the sponsor is suggested, never set. */
export function SponsorSuppliers({
  sponsorId,
  sponsorName,
  linked,
}: {
  sponsorId: number;
  sponsorName: string;
  linked: SponsorSupplier[];
}) {
  const [q, setQ] = useState('');
  const search = useSupplierSearch(q.trim());
  const link = useLinkSupplier(sponsorId);
  const unlink = useUnlinkSupplier(sponsorId);
  const [unlinking, setUnlinking] = useState<SponsorSupplier | null>(null);
  const linkedIds = new Set(linked.map((s) => s.id));
  const close = () => {
    setUnlinking(null);
    unlink.reset();
  };

  return (
    <div className="space-y-5">
      {linked.length === 0 ? (
        <StateMessage kind="empty" title="No linked suppliers.">
          <p>
            Link the supplier records {sponsorName} stands behind; part lines from them then suggest {sponsorName} as the sponsor.
          </p>
        </StateMessage>
      ) : (
        <ul className="divide-y divide-rule border-y border-rule bg-card">
          {linked.map((s) => (
            <li key={s.id} className="flex flex-wrap items-center gap-3 px-4 py-3">
              <span className="min-w-0 flex-1 font-semibold">{s.name}</span>
              <Button variant="secondary" onClick={() => setUnlinking(s)} aria-label={`Unlink ${s.name}`}>
                Unlink
              </Button>
            </li>
          ))}
        </ul>
      )}
      <div className="max-w-lg">
        <TextField label="Find a supplier to link" type="search" value={q} onChange={(e) => setQ(e.target.value)} maxLength={120} />
        {link.isError ? (
          <Notice kind="error" className="mt-3">
            Not linked: {link.error.message}
          </Notice>
        ) : null}
        {q.trim() ? (
          search.data ? (
            search.data.items.length ? (
              <ul className="mt-3 divide-y divide-rule border-y border-rule bg-card" aria-label="Matching suppliers">
                {search.data.items.map((s) => (
                  <li key={s.id} className="flex flex-wrap items-center gap-3 px-4 py-2">
                    <span className="min-w-0 flex-1">{s.name}</span>
                    {linkedIds.has(s.id) ? (
                      <span className="text-[15px] text-slate">Linked</span>
                    ) : (
                      <Button
                        variant="secondary"
                        disabled={link.isPending}
                        onClick={() => link.mutate(s.id)}
                        aria-label={`Link ${s.name} to ${sponsorName}`}
                      >
                        Link
                      </Button>
                    )}
                  </li>
                ))}
              </ul>
            ) : (
              <p className="mt-3 text-slate">No supplier record matches “{q.trim()}”.</p>
            )
          ) : search.isError ? (
            <Notice kind="error" className="mt-3">
              The suppliers could not be searched: {search.error.message}
            </Notice>
          ) : (
            <p className="mt-3 text-slate" role="status">
              Searching…
            </p>
          )
        ) : null}
      </div>
      <ConfirmDialog
        open={unlinking !== null}
        title={`Unlink ${unlinking?.name ?? ''} from ${sponsorName}?`}
        confirmLabel="Unlink supplier"
        cancelLabel="Keep it"
        pending={unlink.isPending}
        error={unlink.isError ? `Not unlinked: ${unlink.error.message}` : undefined}
        onConfirm={() => unlinking && unlink.mutate(unlinking.id, { onSuccess: close })}
        onClose={close}
      >
        <p>New part lines from this supplier stop suggesting {sponsorName}. Support already recorded on part lines stays as it is.</p>
      </ConfirmDialog>
    </div>
  );
}
