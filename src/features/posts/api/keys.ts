import type { InboxQuery } from '../../../shared/schemas/posts';

/** Query-key factory for posts: an episode's, the inbox, the moderation queue. */
export const postKeys = {
  all: ['posts'] as const,
  episode: (episodeId: number) => [...postKeys.all, 'episode', episodeId] as const,
  inbox: (q: InboxQuery) => [...postKeys.all, 'inbox', q] as const,
  moderation: () => [...postKeys.all, 'moderation'] as const,
};
