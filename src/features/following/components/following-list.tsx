import { Link } from 'react-router';
import { DateText } from '../../../components/ui/date-text';
import { StateMessage } from '../../../components/ui/state-message';
import { paths } from '../../../shared/paths';
import type { FollowingResponse } from '../../../shared/schemas/following';
import { useFollow } from '../api/mutations';

/** New episodes from followed builds and creators, newest first, and what is followed. */
export function FollowingList({ data }: { data: FollowingResponse }) {
  const follow = useFollow();
  const nothing = !data.builds.length && !data.creators.length;
  return (
    <div className="grid grid-cols-1 gap-8 lg:grid-cols-[minmax(0,1fr)_18rem]">
      <section aria-labelledby="following-episodes">
        <h2 id="following-episodes" className="label-condensed mb-3">
          New episodes
        </h2>
        {nothing ? (
          <StateMessage kind="empty" title="You follow nothing yet.">
            <p>
              Follow a build or its creator from any episode page.{' '}
              <Link to={paths.builds()} className="underline underline-offset-2">
                Browse the builds
              </Link>
              .
            </p>
          </StateMessage>
        ) : !data.episodes.length ? (
          <StateMessage kind="empty" title="No episodes yet from what you follow." />
        ) : (
          <ul className="divide-y divide-rule border-y border-rule">
            {data.episodes.map((e) => (
              <li key={e.id} className="py-3">
                <p className="label-condensed">
                  {e.build.title} · Ep. {e.number} · <DateText iso={e.publishedAt} />
                </p>
                <Link to={paths.episode(e.owner.handle, e.build.slug, e.slug)} className="font-serif text-[19px] font-bold">
                  {e.title}
                </Link>
                {e.summary ? <p className="mt-1 max-w-measure text-ink-2">{e.summary}</p> : null}
              </li>
            ))}
          </ul>
        )}
      </section>
      <aside aria-labelledby="following-what" className="min-w-0">
        <h2 id="following-what" className="label-condensed mb-3">
          You follow
        </h2>
        <ul className="space-y-1">
          {data.builds.map((b) => (
            <li key={`b${b.id}`} className="flex items-center justify-between gap-2">
              <Link to={paths.build(b.ownerHandle, b.slug)}>{b.title}</Link>
              <button
                type="button"
                className="min-h-11 px-2 text-[14px] text-oxide-2 underline"
                onClick={() => follow.mutate({ target: { kind: 'build', buildId: b.id }, follow: false })}
              >
                Unfollow<span className="sr-only"> {b.title}</span>
              </button>
            </li>
          ))}
          {data.creators.map((c) => (
            <li key={`c${c.id}`} className="flex items-center justify-between gap-2">
              <Link to={paths.creator(c.handle)}>{c.displayName} (all builds)</Link>
              <button
                type="button"
                className="min-h-11 px-2 text-[14px] text-oxide-2 underline"
                onClick={() => follow.mutate({ target: { kind: 'creator', handle: c.handle }, follow: false })}
              >
                Unfollow<span className="sr-only"> {c.displayName}</span>
              </button>
            </li>
          ))}
        </ul>
      </aside>
    </div>
  );
}
