import { useId } from 'react';
import type { OpenItem } from '../../../../shared/schemas/episodes';

interface OpenItemRowProps {
  item: OpenItem;
  episodeId: number;
  busy: boolean;
  onClosedChange: (closed: boolean) => void;
  onDelete: () => void;
}

/** One open item: a dashed brass card with "closed in this episode" and where it came from. */
export function OpenItemRow({ item, episodeId, busy, onClosedChange, onDelete }: OpenItemRowProps) {
  const id = useId();
  const closedHere = item.closedIn?.episodeId === episodeId;
  const closedElsewhere = item.closedIn !== null && !closedHere;
  const openedHere = item.openedIn.episodeId === episodeId;
  return (
    <li className="border border-dashed border-brass bg-card px-4 py-3">
      <p className="font-semibold text-ink">{item.title}</p>
      {item.note ? <p className="mt-0.5 text-[15px] text-ink-2">{item.note}</p> : null}
      <p id={`${id}-meta`} className="mt-1 text-[15px] text-slate">
        {openedHere ? 'Opened in this episode' : `Opened in episode ${item.openedIn.number}`}
        {closedElsewhere && item.closedIn ? ` · closed in episode ${item.closedIn.number}` : ''}
      </p>
      <div className="mt-2 flex flex-wrap items-center justify-between gap-3">
        {closedElsewhere ? (
          <span />
        ) : (
          <div className="flex items-center gap-2">
            <input
              id={`${id}-closed`}
              type="checkbox"
              checked={closedHere}
              disabled={busy}
              aria-describedby={`${id}-meta`}
              className="h-5 w-5 accent-ink"
              onChange={(e) => onClosedChange(e.target.checked)}
            />
            <label htmlFor={`${id}-closed`} className="text-ink">
              Closed in this episode<span className="sr-only">: {item.title}</span>
            </label>
          </div>
        )}
        {openedHere ? (
          <button
            type="button"
            onClick={onDelete}
            disabled={busy}
            className="min-h-11 px-2 font-condensed text-sm font-semibold tracking-label text-oxide-2 uppercase underline underline-offset-2"
          >
            Delete<span className="sr-only"> {item.title}</span>
          </button>
        ) : null}
      </div>
    </li>
  );
}
