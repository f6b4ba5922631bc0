import { useState } from 'react';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { STATE_LABELS, STATES_BY_KIND, type PostState } from '../../../shared/constants/posts';
import type { Post, Reply } from '../../../shared/schemas/posts';
import { useDeletePost, useEditPost, useModeratePost, useReply, useReportPost, useSetPostState } from '../api/post-mutations';
import { ShortTextForm } from './reason-form';

export type PostMode = 'reply' | 'edit' | 'report' | 'hide' | 'adopt' | null;
export interface Viewer {
  signedIn: boolean;
  isTeam: boolean;
  isAdmin: boolean;
}

const linkButton =
  'min-h-11 px-1 font-condensed text-[14px] font-semibold tracking-[0.08em] text-oxide-2 uppercase underline-offset-2 hover:underline';

/** What the viewer may do with a post or reply: reply, edit, delete, report; the team sets states and hides. */
export function PostActions({
  post,
  viewer,
  mode: controlled,
  onModeChange,
}: {
  post: Post | Reply;
  viewer: Viewer;
  mode?: PostMode;
  onModeChange?: (m: PostMode) => void;
}) {
  const [own, setOwn] = useState<PostMode>(null);
  const mode = controlled !== undefined ? controlled : own;
  const setMode = onModeChange ?? setOwn;
  const [confirmDelete, setConfirmDelete] = useState(false);
  const reply = useReply();
  const edit = useEditPost();
  const remove = useDeletePost();
  const report = useReportPost();
  const moderate = useModeratePost();
  const state = useSetPostState();
  if (!viewer.signedIn) return null;
  const top = 'kind' in post ? post : null;
  const close = () => setMode(null);
  const setState = (s: PostState) => (s === 'adopted' ? setMode('adopt') : state.mutate({ postId: post.id, change: { state: s } }));

  return (
    <div className="mt-1">
      <div className="flex flex-wrap items-center gap-x-2">
        {top ? (
          <button type="button" className={linkButton} onClick={() => setMode('reply')}>
            Reply
          </button>
        ) : null}
        {post.mine && post.editableUntil ? (
          <button type="button" className={linkButton} onClick={() => setMode('edit')}>
            Edit
          </button>
        ) : null}
        {post.mine ? (
          <button type="button" className={linkButton} onClick={() => setConfirmDelete(true)}>
            Delete
          </button>
        ) : (
          <button type="button" className={linkButton} onClick={() => setMode('report')}>
            Report
          </button>
        )}
        {viewer.isTeam || viewer.isAdmin ? (
          <button
            type="button"
            className={linkButton}
            onClick={() =>
              post.hidden ? moderate.mutate({ postId: post.id, hidden: false, reason: 'Restored after review' }) : setMode('hide')
            }
          >
            {post.hidden ? 'Restore' : 'Hide'}
          </button>
        ) : null}
        {top && viewer.isTeam ? (
          <label className="ml-auto flex items-center gap-2 text-[14px] text-slate">
            State
            <select
              value={top.state}
              onChange={(e) => setState(e.target.value as PostState)}
              disabled={state.isPending}
              className="min-h-11 border border-rule bg-card px-2 text-[15px] text-ink"
            >
              {STATES_BY_KIND[top.kind].map((s) => (
                <option key={s} value={s}>
                  {STATE_LABELS[s]}
                </option>
              ))}
            </select>
          </label>
        ) : null}
      </div>
      {mode === 'reply' && top ? (
        <ShortTextForm
          label="Your reply"
          submitLabel="Post reply"
          multiline
          pending={reply.isPending}
          error={reply.error}
          onCancel={close}
          onSubmit={(body) => reply.mutate({ postId: post.id, body }, { onSuccess: close })}
        />
      ) : null}
      {mode === 'edit' ? (
        <ShortTextForm
          label="Edit your post"
          submitLabel="Save"
          multiline
          initial={post.body}
          pending={edit.isPending}
          error={edit.error}
          onCancel={close}
          onSubmit={(body) => edit.mutate({ postId: post.id, body }, { onSuccess: close })}
        />
      ) : null}
      {mode === 'report' ? (
        <ShortTextForm
          label="Why should the moderators look at this?"
          submitLabel="Report"
          pending={report.isPending}
          error={report.error}
          onCancel={close}
          onSubmit={(reason) => report.mutate({ postId: post.id, reason }, { onSuccess: close })}
        />
      ) : null}
      {mode === 'hide' ? (
        <ShortTextForm
          label="Why hide it? (recorded)"
          submitLabel="Hide"
          pending={moderate.isPending}
          error={moderate.error}
          onCancel={close}
          onSubmit={(reason) => moderate.mutate({ postId: post.id, hidden: true, reason }, { onSuccess: close })}
        />
      ) : null}
      {mode === 'adopt' ? (
        <ShortTextForm
          label="What changed? (shown on the chapter)"
          submitLabel="Adopt"
          pending={state.isPending}
          error={state.error}
          onCancel={close}
          onSubmit={(note) => state.mutate({ postId: post.id, change: { state: 'adopted', note } }, { onSuccess: close })}
        />
      ) : null}
      {state.error && mode !== 'adopt' ? (
        <p role="alert" className="text-[14px] text-oxide-2">
          The state could not be changed; try again.
        </p>
      ) : null}
      <ConfirmDialog
        open={confirmDelete}
        title="Delete this post?"
        confirmLabel="Delete"
        pending={remove.isPending}
        error={remove.error ? 'It could not be deleted; try again.' : undefined}
        onClose={() => setConfirmDelete(false)}
        onConfirm={() => remove.mutate(post.id, { onSuccess: () => setConfirmDelete(false) })}
      >
        <p>The post and any replies under it go for good.</p>
      </ConfirmDialog>
    </div>
  );
}
