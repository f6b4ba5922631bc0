import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import type { DraftField } from '../model/draft';
import type { SetAside } from '../model/autosave-state';
import { formatLocalDateTime } from '../model/local-time';
import { fieldLabel } from '../model/field-labels';

function fieldList(fields: readonly DraftField[]): string {
  return fields.map(fieldLabel).join(', ');
}

/** Changes from an earlier visit on this device, made on an older version: restore or discard. */
export function SetAsideNotice({ setAside, onRestore, onDiscard }: { setAside: SetAside; onRestore: () => void; onDiscard: () => void }) {
  const fields = Object.keys(setAside.changes) as DraftField[];
  return (
    <section aria-labelledby="set-aside-heading" className="border border-l-4 border-rule border-l-caution bg-caution-soft px-4 py-4">
      <h2 id="set-aside-heading" className="font-serif text-lg font-bold">
        Unsaved changes from this device
      </h2>
      <p className="mt-2 text-ink">
        On {formatLocalDateTime(new Date(setAside.changedAt).toISOString())} you changed {fieldList(fields)} without them reaching the
        server. The episode has been saved since then, so they were not put back by themselves: restoring saves them over the newer version.
      </p>
      <div className="mt-4 flex flex-wrap gap-3">
        <Button onClick={onRestore}>Restore my changes</Button>
        <Button variant="secondary" onClick={onDiscard}>
          Discard them
        </Button>
      </div>
    </section>
  );
}

/** Said once when changes left on this device on the same version were put back and are being saved. */
export function RestoredNotice({ fields, onDismiss }: { fields: readonly DraftField[]; onDismiss: () => void }) {
  return (
    <Notice kind="info">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <p>Put back your unsaved changes from this device ({fieldList(fields)}); they are being saved now.</p>
        <Button variant="secondary" onClick={onDismiss}>
          OK
        </Button>
      </div>
    </Notice>
  );
}
