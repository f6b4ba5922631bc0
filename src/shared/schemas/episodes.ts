import { z } from 'zod';
import { pagedList, pageQuery } from './common';

/** One published episode as listed on the front page. */
export const episodeListItem = z.object({
  id: z.number().int(),
  number: z.number().int(),
  slug: z.string(),
  title: z.string(),
  summary: z.string().nullable(),
  publishedAt: z.string(),
  coverUrl: z.string().nullable(),
  build: z.object({ id: z.number().int(), slug: z.string(), title: z.string() }),
  creator: z.object({ handle: z.string(), displayName: z.string() }),
});
export type EpisodeListItem = z.infer<typeof episodeListItem>;

export const latestEpisodesQuery = pageQuery;
export type LatestEpisodesQuery = z.infer<typeof latestEpisodesQuery>;

export const latestEpisodesResponse = pagedList(episodeListItem);
export type LatestEpisodesResponse = z.infer<typeof latestEpisodesResponse>;
