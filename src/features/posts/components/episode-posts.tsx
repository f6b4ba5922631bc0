import { useState } from 'react';
import { StateMessage } from '../../../components/ui/state-message';
import { formatTime } from '../../../shared/chapters';
import { momentAnchor } from '../../../shared/paths';
import { groupByChapter, postMoment } from '../../../shared/post-anchors';
import { POST_STATES, STATE_LABELS, type PostKind, type PostState } from '../../../shared/constants/posts';
import { useEpisodePosts } from '../api/get-episode-posts';
import { PostActions } from './post-actions';
import { PostCard } from './post-card';
import { PostForm, type PostChapter } from './post-form';

/** Posts by chapter under the episode: counts, a filter by kind and state, the form to post. */
export function EpisodePosts({
  episodeId,
  chapters,
  signInPath,
}: {
  episodeId: number;
  chapters: readonly PostChapter[];
  signInPath: string;
}) {
  const { data, error } = useEpisodePosts(episodeId);
  const [kind, setKind] = useState<PostKind | ''>('');
  const [state, setState] = useState<PostState | ''>('');
  if (!chapters.length) return null;
  if (!data)
    return error ? (
      <StateMessage kind="error" title="The posts could not be loaded." />
    ) : (
      <StateMessage kind="loading" title="Loading posts…" />
    );
  const viewer = { signedIn: data.signedIn, isTeam: data.isTeam, isAdmin: data.isAdmin };
  const shown = data.items.filter((p) => (!kind || p.kind === kind) && (!state || p.state === state));
  const groups = groupByChapter(chapters, shown);
  const select = 'min-h-11 border border-rule bg-card px-2 text-[15px] text-ink';
  return (
    <section aria-labelledby="posts-heading" className="mt-10">
      <div className="flex flex-wrap items-end justify-between gap-3 border-b-2 border-ink pb-2">
        <h2 id="posts-heading" className="font-serif text-[22px] font-bold">
          Posts <span className="font-sans text-[15px] font-normal text-slate">({data.items.length})</span>
        </h2>
        <div className="flex flex-wrap gap-3">
          <label className="flex items-center gap-2 text-[14px] text-slate">
            Kind
            <select className={select} value={kind} onChange={(e) => setKind(e.target.value as PostKind | '')}>
              <option value="">All</option>
              <option value="question">Questions</option>
              <option value="suggestion">Suggestions</option>
            </select>
          </label>
          <label className="flex items-center gap-2 text-[14px] text-slate">
            State
            <select className={select} value={state} onChange={(e) => setState(e.target.value as PostState | '')}>
              <option value="">All</option>
              {POST_STATES.map((s) => (
                <option key={s} value={s}>
                  {STATE_LABELS[s]}
                </option>
              ))}
            </select>
          </label>
        </div>
      </div>
      {!data.items.length ? (
        <p className="mt-4 text-ink-2">No questions or suggestions yet. Ask about a step, or point out a better way.</p>
      ) : null}
      {data.items.length && !shown.length ? <p className="mt-4 text-ink-2">No posts match these filters.</p> : null}
      {groups.map((posts, i) =>
        posts.length ? (
          <section key={chapters[i]!.startSeconds} aria-label={`Posts on ${chapters[i]!.title}`} className="mt-5">
            <h3 className="flex items-baseline justify-between gap-2 border-b border-rule pb-1 font-condensed text-[15px] font-semibold tracking-[0.08em] uppercase">
              <span>
                <span className="font-mono text-[13px] text-oxide-2 normal-case">{formatTime(chapters[i]!.startSeconds)}</span>{' '}
                {chapters[i]!.title}
              </span>
              <span className="text-slate">
                {posts.length} post{posts.length === 1 ? '' : 's'}
              </span>
            </h3>
            <ul className="mt-3 space-y-5">
              {posts.map((p) => (
                <li key={p.id}>
                  <PostCard
                    post={p}
                    momentHref={`#${momentAnchor(postMoment(p))}`}
                    actions={<PostActions post={p} viewer={viewer} />}
                    replyActions={(r) => <PostActions post={r} viewer={viewer} />}
                  />
                </li>
              ))}
            </ul>
          </section>
        ) : null,
      )}
      {data.canPost ? (
        <PostForm episodeId={episodeId} chapters={chapters} />
      ) : !data.signedIn ? (
        <p className="mt-6 text-ink-2">
          <a href={signInPath} className="underline underline-offset-2">
            Sign in
          </a>{' '}
          to ask a question or make a suggestion on a chapter.
        </p>
      ) : null}
    </section>
  );
}
