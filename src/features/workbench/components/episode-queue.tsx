import { Link } from 'react-router';
import { DateText } from '../../../components/ui/date-text';
import { LocalTime } from '../../../components/ui/local-time';
import { StateMessage } from '../../../components/ui/state-message';
import type { Workbench } from '../../../shared/schemas/episodes';
import { workbenchPaths } from '../paths';

type QueuedEpisode = Workbench['drafts'][number];

/** Drafts (with when they last changed) or scheduled episodes (with their publish time, in the reader's zone). */
export function EpisodeQueue({ kind, episodes }: { kind: 'drafts' | 'scheduled'; episodes: readonly QueuedEpisode[] }) {
  if (episodes.length === 0) {
    return (
      <StateMessage kind="empty" title={kind === 'drafts' ? 'No drafts.' : 'Nothing scheduled.'}>
        <p>
          {kind === 'drafts'
            ? 'Episodes you have started but not published show here.'
            : 'Episodes set to publish later show here with their time.'}
        </p>
      </StateMessage>
    );
  }
  return (
    <ul className="divide-y divide-rule border-y border-rule bg-card">
      {episodes.map((e) => (
        <li key={e.id} className="px-4 py-3">
          <p className="label-condensed text-oxide">
            {e.buildTitle} · Episode {e.number}
          </p>
          <Link to={workbenchPaths.episodeEditor(e.id)} className="font-semibold underline underline-offset-2">
            {e.title}
          </Link>
          <p className="mt-0.5 text-[15px] text-slate">
            {kind === 'scheduled' && e.publishAt ? (
              <>
                Publishes <LocalTime iso={e.publishAt} className="font-mono" />
              </>
            ) : (
              <>
                Last changed <DateText iso={e.updatedAt} />
              </>
            )}
          </p>
        </li>
      ))}
    </ul>
  );
}
