import type { ReactNode } from 'react';
import { DateText } from '../../../components/ui/date-text';
import type { Post, Reply } from '../../../shared/schemas/posts';
import { LinkedText } from './linked-text';
import { MomentLink, StateTag } from './post-meta';

const KIND_LABEL = { question: 'Question', suggestion: 'Suggestion' } as const;

function Byline({ item, label }: { item: Reply; label?: string }) {
  return (
    <p className="flex flex-wrap items-baseline gap-x-2 text-[14px] text-slate">
      <span className="font-semibold text-ink">{item.author.displayName}</span>
      {item.byTeam ? (
        <span className="font-condensed text-xs font-semibold tracking-[0.12em] text-oxide-2 uppercase">Build team</span>
      ) : null}
      {label ? <span className="font-condensed text-xs font-semibold tracking-[0.12em] uppercase">{label}</span> : null}
      <DateText iso={item.createdAt} />
      {item.editedAt ? <span>(edited)</span> : null}
      {item.hidden ? <span className="font-semibold text-caution">Hidden</span> : null}
    </p>
  );
}

/**
 * One post: the moment at the left in mono oxide, author and kind, the state tag, the text, an
 * adopted suggestion's note, then replies (the build team's with an oxide rule on the left).
 */
export function PostCard({
  post,
  momentHref,
  context,
  actions,
  replyActions,
}: {
  post: Post;
  momentHref: string | null;
  /** A line above the post naming where it is (the inbox names build and episode). */
  context?: ReactNode;
  actions?: ReactNode;
  replyActions?: (reply: Reply) => ReactNode;
}) {
  return (
    <article
      id={`post-${post.id}`}
      aria-label={`${KIND_LABEL[post.kind]} by ${post.author.displayName}`}
      className="grid grid-cols-[3.5rem_minmax(0,1fr)] gap-x-3"
    >
      <div className="pt-0.5">
        <MomentLink seconds={post.atSeconds ?? post.chapterStartSeconds} href={momentHref} />
      </div>
      <div className="min-w-0">
        {context}
        <div className="flex flex-wrap items-center justify-between gap-2">
          <Byline item={post} label={KIND_LABEL[post.kind]} />
          <StateTag state={post.state} />
        </div>
        <div className="mt-1 text-[16px] text-ink">
          <LinkedText text={post.body} />
        </div>
        {post.hidden && post.hiddenReason ? <p className="mt-1 text-[14px] text-caution">Hidden: {post.hiddenReason}</p> : null}
        {post.state === 'adopted' && post.adoptedNote ? (
          <p className="mt-2 border-l-4 border-gauge bg-gauge-soft px-3 py-1.5 text-[15px] text-ink">
            <span className="font-condensed text-xs font-semibold tracking-[0.12em] text-gauge uppercase">Adopted · </span>
            {post.adoptedNote}
          </p>
        ) : null}
        {actions}
        {post.replies.length ? (
          <ul className="mt-3 space-y-3">
            {post.replies.map((r) => (
              <li key={r.id} id={`post-${r.id}`} className={`border-l-2 pl-3 ${r.byTeam ? 'border-oxide' : 'border-rule'}`}>
                <Byline item={r} />
                <div className="mt-0.5 text-[15px] text-ink">
                  <LinkedText text={r.body} />
                </div>
                {replyActions?.(r)}
              </li>
            ))}
          </ul>
        ) : null}
      </div>
    </article>
  );
}
