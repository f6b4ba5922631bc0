import { useState } from 'react';
import { Link } from 'react-router';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { DateText } from '../../../components/ui/date-text';
import { LocalTime } from '../../../components/ui/local-time';
import { StateMessage } from '../../../components/ui/state-message';
import type { EpisodeSummary } from '../../../shared/schemas/episodes';
import { useBuildEpisodes } from '../api/get-build-episodes';
import { useDeleteEpisode } from '../api/episode-mutations';
import { formatHours } from '../lib/hours';
import { EpisodeStatusPlate } from './status-plates';

interface EpisodeListProps {
  buildId: number;
  /** Owners may delete episodes (undo from the Workbench); editors only open them. */
  canDelete: boolean;
  editorHref: (episodeId: number) => string;
}

/** The build's episodes in number order, each with its status and a link to the editor. */
export function EpisodeList({ buildId, canDelete, editorHref }: EpisodeListProps) {
  const { data, error, isFetching, refetch } = useBuildEpisodes(buildId);
  const [deleting, setDeleting] = useState<EpisodeSummary | null>(null);
  const remove = useDeleteEpisode();

  if (!data) {
    return error ? (
      <StateMessage
        kind="error"
        title="The episodes could not be loaded."
        action={
          <Button onClick={() => void refetch()} disabled={isFetching}>
            {isFetching ? 'Trying again…' : 'Try again'}
          </Button>
        }
      >
        <p>{error.message}</p>
      </StateMessage>
    ) : (
      <StateMessage kind="loading" title="Loading the episodes…" />
    );
  }

  if (data.items.length === 0) {
    return (
      <StateMessage kind="empty" title="No episodes yet.">
        <p>Start the first one below: a title is enough, the rest is written in the editor.</p>
      </StateMessage>
    );
  }

  const episodes = [...data.items].sort((a, b) => a.number - b.number);
  const close = () => {
    setDeleting(null);
    remove.reset();
  };

  return (
    <>
      <ol className="divide-y divide-rule border-y border-rule bg-card">
        {episodes.map((e) => (
          <li key={e.id} className="flex flex-wrap items-center gap-x-4 gap-y-2 px-4 py-3">
            <span className="w-12 shrink-0 font-mono text-oxide-2" aria-hidden="true">
              {String(e.number).padStart(2, '0')}
            </span>
            <span className="min-w-0 flex-1 basis-48">
              <Link to={editorHref(e.id)} className="font-semibold underline underline-offset-2">
                <span className="sr-only">Episode {e.number}: </span>
                {e.title}
              </Link>
              <span className="mt-0.5 block text-[15px] text-slate">
                <EpisodeWhen episode={e} />
                {e.hoursWorked !== null ? ` · ${formatHours(e.hoursWorked)} worked` : ''}
              </span>
            </span>
            <EpisodeStatusPlate status={e.status} />
            {canDelete ? (
              <Button variant="secondary" onClick={() => setDeleting(e)} aria-label={`Delete episode ${e.number}, ${e.title}`}>
                Delete
              </Button>
            ) : null}
          </li>
        ))}
      </ol>
      <ConfirmDialog
        open={deleting !== null}
        title={`Delete episode ${deleting?.number ?? ''}, “${deleting?.title ?? ''}”?`}
        confirmLabel="Delete episode"
        pending={remove.isPending}
        error={remove.isError ? `The episode could not be deleted: ${remove.error.message}` : undefined}
        onConfirm={() => deleting && remove.mutate(deleting.id, { onSuccess: close })}
        onClose={close}
      >
        <p>
          The episode goes with its write-up, chapters and open items
          {deleting?.status === 'published' ? ', and readers can no longer open it' : ''}.
        </p>
        <p>You can undo this from your Workbench for 30 days; after that it is removed for good.</p>
      </ConfirmDialog>
    </>
  );
}

function EpisodeWhen({ episode }: { episode: EpisodeSummary }) {
  if (episode.status === 'published' && episode.publishedAt) {
    return (
      <>
        Published <DateText iso={episode.publishedAt} />
      </>
    );
  }
  if (episode.status === 'scheduled' && episode.publishAt) {
    return (
      <>
        Publishes <LocalTime iso={episode.publishAt} />
      </>
    );
  }
  return (
    <>
      Draft, last changed <DateText iso={episode.updatedAt} />
    </>
  );
}
