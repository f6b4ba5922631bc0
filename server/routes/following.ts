import { z } from 'zod';
import { idParam } from '../../src/shared/schemas/accounts';
import {
  followBody,
  markRead,
  noticePreferences,
  unsubscribeBody,
  unsubscribeQuery,
  type FollowingResponse,
  type NoticePreferences,
  type NotificationsResponse,
} from '../../src/shared/schemas/following';
import { signedIn } from '../auth/policy';
import { buildResource } from '../auth/resources';
import { HttpError } from '../http/http-error';
import { defineRoute } from '../http/registry';
import {
  followBuild,
  followCreator,
  getFollowing,
  getNotifications,
  markNotificationsRead,
  unfollowBuild,
  unfollowCreator,
  unsubscribe,
} from '../services/following';
import { getNoticePreferences, setNoticePreferences } from '../services/notice-recipients';
import { verifyUnsubscribeToken } from '../services/unsubscribe-tokens';

const buildParams = z.object({ buildId: idParam });
const creatorParams = z.object({ handle: z.string().min(1).max(60) });

export const followingRoutes = [
  defineRoute({
    method: 'put',
    path: '/builds/:buildId/follow',
    summary: 'Follow a build (new episodes reach you as notices)',
    action: 'follow',
    params: buildParams,
    body: followBody,
    resource: buildResource,
    handler: async ({ deps, actor, params }) => void (await followBuild(deps.db, signedIn(actor).userId, params.buildId)),
  }),
  defineRoute({
    method: 'delete',
    path: '/builds/:buildId/follow',
    summary: 'Stop following a build',
    action: 'follow',
    params: buildParams,
    resource: buildResource,
    handler: async ({ deps, actor, params }) => void (await unfollowBuild(deps.db, signedIn(actor).userId, params.buildId)),
  }),
  defineRoute({
    method: 'put',
    path: '/creators/:handle/follow',
    summary: 'Follow a creator: all their public builds',
    action: 'follow',
    params: creatorParams,
    body: followBody,
    handler: async ({ deps, actor, params }) => void (await followCreator(deps.db, signedIn(actor).userId, params.handle)),
  }),
  defineRoute({
    method: 'delete',
    path: '/creators/:handle/follow',
    summary: 'Stop following a creator',
    action: 'follow',
    params: creatorParams,
    handler: async ({ deps, actor, params }) => void (await unfollowCreator(deps.db, signedIn(actor).userId, params.handle)),
  }),
  defineRoute({
    method: 'get',
    path: '/following',
    summary: 'What the account follows and the latest episodes from it',
    action: 'account.self',
    handler: async ({ deps, actor }): Promise<FollowingResponse> => getFollowing(deps.db, signedIn(actor).userId),
  }),
  defineRoute({
    method: 'get',
    path: '/notifications',
    summary: "The account's notifications, unread count and (for build teams) open posts",
    action: 'account.self',
    handler: async ({ deps, actor }): Promise<NotificationsResponse> => {
      const a = signedIn(actor);
      return getNotifications(deps.db, a.userId, [...a.builds.keys()]);
    },
  }),
  defineRoute({
    method: 'post',
    path: '/notifications/read',
    summary: 'Mark notifications read (some, or all)',
    action: 'account.self',
    body: markRead,
    handler: async ({ deps, actor, body }) =>
      void (await markNotificationsRead(deps.db, signedIn(actor).userId, 'all' in body ? 'all' : body.ids)),
  }),
  defineRoute({
    method: 'get',
    path: '/account/notices',
    summary: 'Which notices the account gets, and how often',
    action: 'account.self',
    handler: async ({ deps, actor }): Promise<NoticePreferences> => getNoticePreferences(deps.db, signedIn(actor).userId),
  }),
  defineRoute({
    method: 'put',
    path: '/account/notices',
    summary: 'Change which notices the account gets',
    action: 'account.self',
    body: noticePreferences,
    handler: async ({ deps, actor, body }): Promise<NoticePreferences> => setNoticePreferences(deps.db, signedIn(actor).userId, body),
  }),
  defineRoute({
    method: 'post',
    path: '/unsubscribe',
    summary: 'One-click unsubscribe (RFC 8058): a signed per-recipient token, no session or CSRF token needed',
    action: 'site.read',
    query: unsubscribeQuery,
    body: unsubscribeBody,
    handler: async ({ deps, query }) => {
      if (!verifyUnsubscribeToken(deps.config.SESSION_SECRET, query.u, query.s, query.t))
        throw new HttpError(403, 'invalid_token', 'This unsubscribe link is not valid');
      await unsubscribe(deps.db, query.u, query.s);
    },
  }),
];
