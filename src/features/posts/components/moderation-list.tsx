import { DateText } from '../../../components/ui/date-text';
import { StateMessage } from '../../../components/ui/state-message';
import { paths } from '../../../shared/paths';
import type { ModerationQueue } from '../../../shared/schemas/posts';
import { PostActions } from './post-actions';
import { PostCard } from './post-card';

/** Reported and hidden posts, each with its reports and the recorded actions; admins hide or restore. */
export function ModerationList({ queue }: { queue: ModerationQueue }) {
  if (!queue.items.length)
    return (
      <StateMessage kind="empty" title="Nothing to moderate.">
        <p>Reported posts and hidden ones show here with their reasons.</p>
      </StateMessage>
    );
  const viewer = { signedIn: true, isTeam: false, isAdmin: true };
  return (
    <ul className="divide-y divide-rule border-y border-rule">
      {queue.items.map(({ post, reports, actions }) => (
        <li key={post.id} className="py-4">
          <PostCard
            post={post}
            momentHref={`${paths.episode(post.build.ownerHandle, post.build.slug, post.episode.slug)}#post-${post.id}`}
            context={
              <div className="mb-2">
                <p className="label-condensed">
                  {post.build.title} · Ep. {post.episode.number}
                </p>
                {reports.map((r, i) => (
                  <p key={i} className="text-[14px] text-caution">
                    Reported by {r.reporter}, <DateText iso={r.createdAt} />: {r.reason}
                  </p>
                ))}
                {actions.map((a, i) => (
                  <p key={`a${i}`} className="text-[14px] text-slate">
                    {a.action === 'hide' ? 'Hidden' : 'Restored'} by {a.actor}, <DateText iso={a.createdAt} />: {a.reason}
                  </p>
                ))}
              </div>
            }
            actions={<PostActions post={post} viewer={viewer} />}
          />
        </li>
      ))}
    </ul>
  );
}
