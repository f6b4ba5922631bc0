import { useState } from 'react';
import { Button } from '../../../../components/ui/button';
import { ConfirmDialog } from '../../../../components/ui/confirm-dialog';
import { Plate, type PlateTone } from '../../../../components/ui/plate';
import { useApi } from '../../../../lib/api-context';
import type { Episode } from '../../../../shared/schemas/episodes';
import { publishEpisode, scheduleEpisode, unpublishEpisode } from '../../api/publishing';
import { formatLocalDateTime, localTimeZoneName } from '../../model/local-time';
import { useHydrated } from '../../hooks/use-hydrated';
import { publishProblemLines } from '../../model/publish-problems';
import { ScheduleForm } from './schedule-form';

interface PublishControlsProps {
  episode: Episode;
  /** Saves what is unsaved, then runs the action with the current version (autosave's `commit`). */
  commit: (action: (version: number) => Promise<Episode>) => Promise<Episode>;
}

const plateTone: Record<Episode['status'], PlateTone> = { draft: 'slate', scheduled: 'brass', published: 'gauge' };

type Outcome = { kind: 'done'; text: string } | { kind: 'error'; text: string; lines: string[] } | null;

/** The status plate and what can be done from it: publish now, schedule, back to draft. */
export function PublishControls({ episode, commit }: PublishControlsProps) {
  const api = useApi();
  const [pending, setPending] = useState(false);
  const [outcome, setOutcome] = useState<Outcome>(null);
  const [confirmUnpublish, setConfirmUnpublish] = useState(false);
  const hydrated = useHydrated();
  const zone = hydrated ? localTimeZoneName() : '';
  // Times are said in the reader's zone, which only the browser knows.
  const when = (iso: string) => (hydrated ? `${formatLocalDateTime(iso)} (${zone})` : '…');

  const act = async (action: (version: number) => Promise<Episode>, done: (ep: Episode) => string) => {
    setPending(true);
    setOutcome(null);
    try {
      const ep = await commit(action);
      setOutcome({ kind: 'done', text: done(ep) });
    } catch (err) {
      const lines = publishProblemLines(err);
      const text = err instanceof Error ? err.message : 'It did not work.';
      setOutcome({ kind: 'error', text: lines.length ? 'Not published yet. Fix these first:' : text, lines });
    } finally {
      setPending(false);
      setConfirmUnpublish(false);
    }
  };

  const publishNow = () =>
    act(
      (v) => publishEpisode(api, episode.id, v),
      () => 'Published. Readers can see it now.',
    );
  const schedule = (publishAt: string) =>
    act(
      (v) => scheduleEpisode(api, episode.id, v, publishAt),
      (ep) => `Scheduled for ${when(ep.publishAt ?? publishAt)}. The checks run again at that time.`,
    );
  const unpublish = () =>
    act(
      (v) => unpublishEpisode(api, episode.id, v),
      () => 'Back to draft. Readers no longer see it.',
    );

  return (
    <section aria-labelledby="publish-heading">
      <h2 id="publish-heading" className="label-condensed border-b-2 border-ink pb-2">
        Publishing
      </h2>
      <div className="mt-3 flex flex-wrap items-center gap-3">
        <Plate tone={plateTone[episode.status]}>{episode.status}</Plate>
        <p className="text-ink-2">
          {episode.status === 'draft' ? 'Only the build team can see this episode.' : null}
          {episode.status === 'scheduled' && episode.publishAt ? `Publishes on ${when(episode.publishAt)}.` : null}
          {episode.status === 'published' && episode.publishedAt ? `Published on ${when(episode.publishedAt)}.` : null}
        </p>
      </div>
      {episode.status === 'draft' && episode.publishError ? (
        <div role="alert" className="mt-3 border border-l-4 border-rule border-l-oxide-2 bg-card px-4 py-3">
          <p className="font-semibold text-ink">It was scheduled but did not go out: the checks failed at that time.</p>
          <p className="mt-1 text-ink-2">{episode.publishError}</p>
        </div>
      ) : null}
      <div className="mt-4 space-y-4">
        {episode.status !== 'published' ? (
          <>
            <Button onClick={() => void publishNow()} disabled={pending}>
              {pending ? 'Working…' : 'Publish now'}
            </Button>
            <ScheduleForm
              current={episode.status === 'scheduled' ? episode.publishAt : null}
              pending={pending}
              onSchedule={(at) => void schedule(at)}
            />
          </>
        ) : null}
        {episode.status !== 'draft' ? (
          <Button variant="secondary" onClick={() => setConfirmUnpublish(true)} disabled={pending}>
            {episode.status === 'scheduled' ? 'Cancel the schedule' : 'Unpublish'}
          </Button>
        ) : null}
      </div>
      <div role="status" className="mt-3">
        {outcome?.kind === 'done' ? <p className="text-gauge">{outcome.text}</p> : null}
      </div>
      {outcome?.kind === 'error' ? (
        <div role="alert" className="mt-3 border border-l-4 border-rule border-l-oxide-2 bg-card px-4 py-3">
          <p className="font-semibold text-ink">{outcome.text}</p>
          {outcome.lines.length ? (
            <ul className="mt-1 list-disc pl-5 text-ink-2">
              {outcome.lines.map((l) => (
                <li key={l}>{l}</li>
              ))}
            </ul>
          ) : null}
        </div>
      ) : null}
      <ConfirmDialog
        open={confirmUnpublish}
        title={episode.status === 'scheduled' ? 'Cancel the scheduled publishing?' : `Unpublish “${episode.title}”?`}
        confirmLabel={episode.status === 'scheduled' ? 'Back to draft' : 'Unpublish'}
        cancelLabel="Keep it as it is"
        tone="primary"
        pending={pending}
        onConfirm={() => void unpublish()}
        onClose={() => setConfirmUnpublish(false)}
      >
        <p>
          {episode.status === 'scheduled'
            ? 'The episode goes back to draft and will not publish by itself.'
            : 'Readers no longer see it; links to it answer “not found” until you publish it again. Nothing is deleted.'}
        </p>
      </ConfirmDialog>
    </section>
  );
}
