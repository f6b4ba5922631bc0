import { z } from 'zod';
import { idParam } from '../../src/shared/schemas/accounts';
import {
  inboxQuery,
  postCreate,
  postEdit,
  postModeration,
  postReport,
  postStateChange,
  replyCreate,
  type EpisodePosts,
  type InboxResponse,
  type ModerationQueue,
} from '../../src/shared/schemas/posts';
import { signedIn } from '../auth/policy';
import { episodeResource, postResource } from '../auth/resources';
import { notFound } from '../http/http-error';
import { defineRoute } from '../http/registry';
import { createPost, createReply, deletePost, editPost, moderatePost, reportPost, setPostState } from '../services/posts';
import { getInbox, getModerationQueue, listEpisodePosts } from '../services/posts-read';

const episodeParams = z.object({ episodeId: idParam });
const postParams = z.object({ postId: idParam });
const byAccount = (actor: { userId: number } | null) => String(actor?.userId ?? 0);

export const postRoutes = [
  defineRoute({
    method: 'get',
    path: '/episodes/:episodeId/posts',
    summary: "An episode's questions and suggestions with their replies (hidden ones only for their author, the build team and admins)",
    action: 'episode.read',
    params: episodeParams,
    resource: episodeResource,
    handler: async ({ deps, actor, params, resource }): Promise<EpisodePosts> => {
      if (resource?.kind !== 'episode') throw notFound();
      return listEpisodePosts(deps.db, actor, params.episodeId, resource.buildId, resource.status === 'published');
    },
  }),
  defineRoute({
    method: 'post',
    path: '/episodes/:episodeId/posts',
    summary: 'Ask a question or make a suggestion on a chapter of a published episode',
    action: 'post.create',
    params: episodeParams,
    body: postCreate,
    resource: episodeResource,
    rateLimit: ({ actor }) => [['post-create', byAccount(actor)]],
    handler: async ({ deps, actor, params, body, res }) => {
      const id = await createPost(deps, signedIn(actor), params.episodeId, body);
      res.status(201);
      return { id };
    },
  }),
  defineRoute({
    method: 'post',
    path: '/posts/:postId/replies',
    summary: 'Reply to a question or suggestion (one level)',
    action: 'post.create',
    params: postParams,
    body: replyCreate,
    resource: postResource,
    rateLimit: ({ actor }) => [['post-create', byAccount(actor)]],
    handler: async ({ deps, actor, params, body, res }) => {
      const id = await createReply(deps, signedIn(actor), params.postId, body.body);
      res.status(201);
      return { id };
    },
  }),
  defineRoute({
    method: 'patch',
    path: '/posts/:postId',
    summary: 'The author edits their post within the edit window',
    action: 'post.author',
    params: postParams,
    body: postEdit,
    resource: postResource,
    handler: async ({ deps, params, body }) => void (await editPost(deps.db, params.postId, body.body)),
  }),
  defineRoute({
    method: 'delete',
    path: '/posts/:postId',
    summary: 'The author deletes their post (and its replies)',
    action: 'post.author',
    params: postParams,
    resource: postResource,
    handler: async ({ deps, params }) => void (await deletePost(deps.db, params.postId)),
  }),
  defineRoute({
    method: 'put',
    path: '/posts/:postId/state',
    summary: "The build team sets a post's state (a question: open, answered; a suggestion: open, adopted with a note, set aside)",
    action: 'post.answer',
    params: postParams,
    body: postStateChange,
    resource: postResource,
    handler: async ({ deps, actor, params, body }) => void (await setPostState(deps, signedIn(actor), params.postId, body)),
  }),
  defineRoute({
    method: 'post',
    path: '/posts/:postId/reports',
    summary: 'Report a post to the moderators, with a reason',
    action: 'post.report',
    params: postParams,
    body: postReport,
    resource: postResource,
    rateLimit: ({ actor }) => [['post-report', byAccount(actor)]],
    handler: async ({ deps, actor, params, body }) => void (await reportPost(deps.db, signedIn(actor), params.postId, body.reason)),
  }),
  defineRoute({
    method: 'put',
    path: '/posts/:postId/visibility',
    summary: 'Hide or restore a post with a recorded reason (admins; the build team on its own builds)',
    action: 'post.moderate',
    params: postParams,
    body: postModeration,
    resource: postResource,
    handler: async ({ deps, actor, params, body }) =>
      void (await moderatePost(deps.db, signedIn(actor), params.postId, body.hidden, body.reason)),
  }),
  defineRoute({
    method: 'get',
    path: '/inbox',
    summary: "The build team's inbox: every post on their builds, filtered, unanswered first by default",
    action: 'account.self',
    query: inboxQuery,
    handler: async ({ deps, actor, query }): Promise<InboxResponse> => getInbox(deps.db, signedIn(actor).userId, query),
  }),
  defineRoute({
    method: 'get',
    path: '/moderation/queue',
    summary: 'The moderation queue: reported and hidden posts with their reports and recorded actions',
    action: 'admin.moderation',
    handler: async ({ deps, actor }): Promise<ModerationQueue> => getModerationQueue(deps.db, signedIn(actor).userId),
  }),
];
