import { Link } from 'react-router';
import { StateMessage } from '../../../components/ui/state-message';
import { formatMinor } from '../../../shared/money';
import type { Workbench } from '../../../shared/schemas/episodes';
import { workbenchPaths } from '../paths';

/** Posts on the creator's builds that wait for a reply from the build team, newest first; the inbox has them all. */
export function UnansweredPostsPanel({ posts, openCount }: { posts: Workbench['unansweredPosts']; openCount: number }) {
  if (!posts.length)
    return (
      <StateMessage kind="empty" title="No unanswered posts.">
        <p>Questions and suggestions from readers that wait for an answer from the build team show here.</p>
        {openCount ? (
          <p>
            {openCount} still open in the{' '}
            <Link to="/inbox" className="underline underline-offset-2">
              inbox
            </Link>
            .
          </p>
        ) : null}
      </StateMessage>
    );
  return (
    <>
      <ul className="divide-y divide-rule border-y border-rule">
        {posts.map((p) => (
          <li key={p.id} className="py-2.5">
            <span className="block text-[14px] text-slate">
              {p.kind === 'question' ? 'Question' : 'Suggestion'} from {p.authorName} · {p.buildTitle} · ep. {p.episodeNumber}
            </span>
            <span className="block">{p.excerpt}</span>
          </li>
        ))}
      </ul>
      <p className="mt-2">
        <Link to="/inbox" className="underline underline-offset-2">
          Answer in the inbox
        </Link>{' '}
        · {openCount} open
      </p>
    </>
  );
}

/** Part lines on order across the creator's builds, each linked to its episode's editor. */
export function PartsOnOrderPanel({ lines }: { lines: Workbench['onOrder'] }) {
  if (!lines.length)
    return (
      <StateMessage kind="empty" title="No parts on order.">
        <p>Part lines marked “on order” show here until they arrive, with the open item they hold up.</p>
      </StateMessage>
    );
  return (
    <ul className="divide-y divide-rule border-y border-rule">
      {lines.map((l) => (
        <li key={l.id} className="flex flex-wrap items-baseline justify-between gap-x-3 py-2.5">
          <span className="min-w-0">
            <Link to={workbenchPaths.episodeEditor(l.episodeId)} className="font-semibold">
              {l.description}
            </Link>
            <span className="block text-[14px] text-slate">
              {l.buildTitle} · ep. {l.episodeNumber}
              {l.openItemTitle ? <> · holds up “{l.openItemTitle}”</> : null}
            </span>
          </span>
          <span className="font-mono text-brass-text">{formatMinor(l.grossMinor, l.currency)}</span>
        </li>
      ))}
    </ul>
  );
}
