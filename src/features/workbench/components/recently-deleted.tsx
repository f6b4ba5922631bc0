import { Button } from '../../../components/ui/button';
import { DateText } from '../../../components/ui/date-text';
import { Notice } from '../../../components/ui/notice';
import type { Workbench } from '../../../shared/schemas/episodes';
import { useRestore } from '../api/workbench-mutations';

/** Builds and episodes deleted in the last 30 days, each with Undo until the job removes it for good. */
export function RecentlyDeleted({ items }: { items: Workbench['deleted'] }) {
  const restore = useRestore();
  return (
    <div className="space-y-3">
      <ul className="divide-y divide-rule border-y border-rule bg-card">
        {items.map((d) => {
          const busy = restore.isPending && restore.variables.kind === d.kind && restore.variables.id === d.id;
          return (
            <li key={`${d.kind}-${d.id}`} className="flex flex-wrap items-center gap-x-4 gap-y-2 px-4 py-3">
              <span className="min-w-0 flex-1 basis-56">
                <span className="label-condensed block">{d.kind === 'build' ? 'Build' : 'Episode'}</span>
                <span className="font-semibold">{d.title}</span>
                {d.buildTitle ? <span className="text-slate"> in {d.buildTitle}</span> : null}
                <span className="block text-[15px] text-slate">
                  Deleted <DateText iso={d.deletedAt} />; removed for good after <DateText iso={d.purgeAfter} />
                </span>
              </span>
              <Button
                variant="secondary"
                onClick={() => restore.mutate({ kind: d.kind, id: d.id })}
                disabled={restore.isPending}
                aria-label={`Undo deleting the ${d.kind} ${d.title}`}
              >
                {busy ? 'Restoring…' : 'Undo'}
              </Button>
            </li>
          );
        })}
      </ul>
      {restore.isError ? <Notice kind="error">It could not be restored: {restore.error.message}</Notice> : null}
      {restore.isSuccess ? <Notice kind="success">Restored. It is back where it was.</Notice> : null}
    </div>
  );
}
