import { vehicleLine } from '../../src/shared/vehicle';
import type { EpisodeListItem } from '../../src/shared/schemas/episodes';
import type { listLatestEpisodes } from '../db/episodes.queries';

type LatestRow = Awaited<ReturnType<typeof listLatestEpisodes>>['rows'][number];

/** `id/sha|key` from the query → the picture's address at its 960 px size (or the largest there is). */
function coverUrl(cover: string | null): string | null {
  if (!cover) return null;
  const [ref, key] = cover.split('|');
  return `/files/${ref}/${key!.split('/').pop()}`;
}

/** Maps a joined episode row to the API's list item. */
export function presentEpisodeListItem(row: LatestRow): EpisodeListItem {
  return {
    id: row.id,
    number: row.number,
    slug: row.slug,
    title: row.title,
    summary: row.summary,
    publishedAt: (row.published_at ?? new Date(0)).toISOString(),
    coverUrl: coverUrl(row.cover),
    build: {
      id: row.build_id,
      slug: row.build_slug,
      title: row.build_title,
      vehicle: vehicleLine({
        vehicleKind: row.vehicle_kind,
        vehicleMake: row.vehicle_make,
        vehicleModel: row.vehicle_model,
        vehicleYear: row.vehicle_year,
      }),
    },
    creator: { handle: row.handle, displayName: row.display_name },
  };
}
