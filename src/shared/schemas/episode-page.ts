import { z } from 'zod';
import { figureList } from './figures';
import { buildTotals, episodeParts } from './parts';
import { episodePosts } from './posts';
import { episodeReading } from './reading';

/**
 * Everything the episode page shows, in one response (`GET /api/builds/:buildId/episode-page/:episodeSlug`):
 * the address, the reading, and the sections beside it. A section that failed on the server is null,
 * and the page then asks for it on its own.
 */
export const episodePage = z.object({
  episodeId: z.number().int(),
  slug: z.string(),
  movedFrom: z.string().nullable(),
  reading: episodeReading,
  parts: episodeParts.nullable(),
  totals: buildTotals.nullable(),
  figures: figureList.nullable(),
  posts: episodePosts.nullable(),
});
export type EpisodePage = z.infer<typeof episodePage>;
