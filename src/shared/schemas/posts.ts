import { z } from 'zod';
import { POST_KINDS, POST_STATES } from '../constants/posts';

// Posts: questions and suggestions on an episode, anchored to a chapter (by its start) and
// optionally a moment; replies one level deep. DESIGN.md, "Post".

export { EDIT_WINDOW_MINUTES, POST_KINDS, POST_STATES, STATE_LABELS, STATES_BY_KIND } from '../constants/posts';
export type { PostKind, PostState } from '../constants/posts';

const body = z.string().trim().min(1, 'write something first').max(4000);

export const postCreate = z.object({
  kind: z.enum(POST_KINDS),
  /** The chapter, named by its start (chapters get new ids on every editor save). */
  chapterStartSeconds: z.number().int().min(0),
  /** Optional moment inside that chapter, in seconds from the start of the video. */
  atSeconds: z.number().int().min(0).nullable().optional(),
  body,
});
export type PostCreate = z.infer<typeof postCreate>;

export const replyCreate = z.object({ body });
export const postEdit = z.object({ body });

export const postStateChange = z
  .object({ state: z.enum(POST_STATES), note: z.string().trim().min(1).max(500).optional() })
  .refine((v) => v.state !== 'adopted' || v.note !== undefined, { path: ['note'], message: 'say briefly what changed' });
export type PostStateChange = z.infer<typeof postStateChange>;

export const postReport = z.object({ reason: z.string().trim().min(3, 'give a reason').max(500) });
export const postModeration = z.object({ hidden: z.boolean(), reason: z.string().trim().min(3, 'give a reason').max(500) });

const author = z.object({ handle: z.string(), displayName: z.string() });

export const reply = z.object({
  id: z.number().int(),
  author,
  byTeam: z.boolean(),
  body: z.string(),
  createdAt: z.string(),
  editedAt: z.string().nullable(),
  hidden: z.boolean(),
  mine: z.boolean(),
  editableUntil: z.string().nullable(),
});
export type Reply = z.infer<typeof reply>;

export const post = reply.extend({
  kind: z.enum(POST_KINDS),
  state: z.enum(POST_STATES),
  chapterStartSeconds: z.number().int(),
  atSeconds: z.number().int().nullable(),
  adoptedNote: z.string().nullable(),
  hiddenReason: z.string().nullable(),
  replies: z.array(reply),
});
export type Post = z.infer<typeof post>;

export const episodePosts = z.object({
  items: z.array(post),
  /** What the viewer may do here. */
  canPost: z.boolean(),
  isTeam: z.boolean(),
  signedIn: z.boolean(),
  isAdmin: z.boolean(),
});
export type EpisodePosts = z.infer<typeof episodePosts>;

/** Inbox filters; an empty string means "any" (a form's blank option). */
const blank = (v: unknown) => (v === '' ? undefined : v);
export const inboxQuery = z.object({
  buildId: z.preprocess(blank, z.coerce.number().int().min(1).optional()),
  episodeId: z.preprocess(blank, z.coerce.number().int().min(1).optional()),
  kind: z.preprocess(blank, z.enum(POST_KINDS).optional()),
  state: z.preprocess(blank, z.enum(POST_STATES).optional()),
  order: z.preprocess(blank, z.enum(['unanswered', 'newest']).default('unanswered')),
});
export type InboxQuery = z.infer<typeof inboxQuery>;

export const inboxItem = post.extend({
  episode: z.object({ id: z.number().int(), number: z.number().int(), title: z.string(), slug: z.string() }),
  build: z.object({ id: z.number().int(), title: z.string(), slug: z.string(), ownerHandle: z.string() }),
  /** True while no one of the build team has replied. */
  unanswered: z.boolean(),
});
export type InboxItem = z.infer<typeof inboxItem>;
export const inboxResponse = z.object({
  items: z.array(inboxItem),
  openCount: z.number().int(),
  builds: z.array(z.object({ id: z.number().int(), title: z.string() })),
});
export type InboxResponse = z.infer<typeof inboxResponse>;

export const moderationItem = z.object({
  post: inboxItem,
  reports: z.array(z.object({ reason: z.string(), createdAt: z.string(), reporter: z.string() })),
  actions: z.array(z.object({ action: z.enum(['hide', 'restore']), reason: z.string(), createdAt: z.string(), actor: z.string() })),
});
export const moderationQueue = z.object({ items: z.array(moderationItem) });
export type ModerationQueue = z.infer<typeof moderationQueue>;
