import { z } from 'zod';

// Following, notices and their preferences.

export const followBody = z.object({}).strict();

export const followingResponse = z.object({
  builds: z.array(z.object({ id: z.number().int(), title: z.string(), slug: z.string(), ownerHandle: z.string() })),
  creators: z.array(z.object({ id: z.number().int(), handle: z.string(), displayName: z.string() })),
  episodes: z.array(
    z.object({
      id: z.number().int(),
      number: z.number().int(),
      title: z.string(),
      slug: z.string(),
      summary: z.string().nullable(),
      publishedAt: z.string(),
      build: z.object({ id: z.number().int(), title: z.string(), slug: z.string() }),
      owner: z.object({ handle: z.string(), displayName: z.string() }),
    }),
  ),
});
export type FollowingResponse = z.infer<typeof followingResponse>;

export const NOTICE_KINDS = ['new-episode', 'reply', 'state-change', 'new-post', 'sponsor-episode'] as const;
export const notification = z.object({
  id: z.number().int(),
  kind: z.enum(NOTICE_KINDS),
  text: z.string(),
  /** A site path to what it is about. */
  path: z.string(),
  createdAt: z.string(),
  read: z.boolean(),
});
export type Notification = z.infer<typeof notification>;
export const notificationsResponse = z.object({
  items: z.array(notification),
  unreadCount: z.number().int(),
  openPostCount: z.number().int(),
});
export type NotificationsResponse = z.infer<typeof notificationsResponse>;
export const markRead = z.union([z.object({ ids: z.array(z.number().int()).min(1).max(200) }), z.object({ all: z.literal(true) })]);

export const noticePreferences = z.object({
  newEpisodes: z.enum(['each', 'weekly', 'none']),
  replies: z.boolean(),
  stateChanges: z.boolean(),
  newPosts: z.enum(['each', 'daily', 'none']),
});
export type NoticePreferences = z.infer<typeof noticePreferences>;
export const DEFAULT_NOTICE_PREFERENCES: NoticePreferences = { newEpisodes: 'each', replies: true, stateChanges: true, newPosts: 'each' };

/** What a one-click unsubscribe link stops; each e-mail names its own. */
export const UNSUBSCRIBE_SCOPES = ['new-episodes', 'replies', 'state-changes', 'new-posts'] as const;
export type UnsubscribeScope = (typeof UNSUBSCRIBE_SCOPES)[number];
export const unsubscribeQuery = z.object({
  u: z.coerce.number().int().min(1),
  s: z.enum(UNSUBSCRIBE_SCOPES),
  t: z.string().regex(/^[A-Za-z0-9_-]{20,100}$/),
});
/** RFC 8058 sends `List-Unsubscribe=One-Click` as a form body; it is not needed to act. */
export const unsubscribeBody = z.looseObject({});
