import { sql } from 'kysely';
import { chapterLink } from '../../src/shared/chapters';
import { cautionText, needsCaution } from '../../src/shared/safety';
import type { BuildCard, BuildOverview, CreatorPage, EpisodeReading } from '../../src/shared/schemas/reading';
import type { BuildCardRow } from '../db/reading.queries';
import { isPublishedEpisode, listCreatorBuilds } from '../db/reading.queries';
import { listLatestEpisodes } from '../db/episodes.queries';
import type { Db } from '../db/kysely';
import { presentEpisodeListItem } from '../presenters/episodes';
import { presentImage } from '../presenters/media';
import { buildCoverRow } from './media/pictures';
import { findEpisodeReading } from '../db/episode-reading.queries';
import { buildSponsorCredits } from './sponsorships';

const iso = (d: Date | string | null): string | null => (d === null ? null : new Date(d).toISOString());
const hours = (minutes: number | null): number | null => (minutes === null ? null : minutes / 60);

/** Maps a build card row to the API's card. */
export function presentBuildCard(r: BuildCardRow): BuildCard {
  return {
    id: r.id,
    slug: r.slug,
    title: r.title,
    vehicleKind: r.vehicle_kind,
    vehicleMake: r.vehicle_make,
    vehicleModel: r.vehicle_model,
    vehicleYear: r.vehicle_year,
    summary: r.summary,
    owner: { handle: r.handle, displayName: r.display_name },
    episodeCount: Number(r.episode_count ?? 0),
    lastPublishedAt: iso(r.last_published_at ?? null),
  };
}

/** The build page's data; the caller has checked the reader may see the build. */
export async function getBuildOverview(db: Db, buildId: number): Promise<BuildOverview | null> {
  const b = await db
    .selectFrom('builds as b')
    .innerJoin('users as u', 'u.id', 'b.owner_id')
    .select([
      'b.id',
      'b.slug',
      'b.title',
      'b.visibility',
      'b.vehicle_kind',
      'b.vehicle_make',
      'b.vehicle_model',
      'b.vehicle_year',
      'b.summary',
      'b.currency',
      'b.budget_minor',
      'u.handle',
      'u.display_name',
    ])
    .where('b.id', '=', buildId)
    .executeTakeFirst();
  if (!b) return null;
  const [cover, editors, systems, episodes, openItems, sponsors] = await Promise.all([
    buildCoverRow(db, buildId),
    db
      .selectFrom('build_members as m')
      .innerJoin('users as u', 'u.id', 'm.user_id')
      .select(['u.handle', 'u.display_name'])
      .where('m.build_id', '=', buildId)
      .where('m.role', '=', 'editor')
      .where('u.deleted_at', 'is', null)
      .orderBy('u.display_name')
      .execute(),
    db.selectFrom('build_systems').select(['key', 'name', 'safety_critical']).where('build_id', '=', buildId).orderBy('position').execute(),
    db
      .selectFrom('episodes as e')
      .select((eb) => [
        'e.id',
        'e.number',
        'e.slug',
        'e.title',
        'e.summary',
        'e.published_at',
        'e.minutes_worked',
        eb
          .selectFrom('chapters as c')
          .select((eb2) => eb2.fn.countAll<number>().as('n'))
          .whereRef('c.episode_id', '=', 'e.id')
          .as('chapter_count'),
      ])
      .where('e.build_id', '=', buildId)
      .where(isPublishedEpisode)
      .orderBy('e.number')
      .execute(),
    // Still open for readers: opened in a published episode, not closed in one.
    db
      .selectFrom('open_items as o')
      .innerJoin('episodes as e', 'e.id', 'o.opened_in_episode_id')
      .leftJoin('episodes as ce', 'ce.id', 'o.closed_in_episode_id')
      .select(['o.id', 'o.title', 'o.note', 'e.id as episode_id', 'e.number', 'e.slug', 'e.title as episode_title'])
      .where('o.build_id', '=', buildId)
      .where(isPublishedEpisode)
      .where((eb) =>
        eb.or([
          eb('ce.id', 'is', null),
          eb('ce.status', '<>', 'published'),
          eb('ce.published_at', '>', sql<Date>`now()`),
          eb('ce.deleted_at', 'is not', null),
        ]),
      )
      .orderBy('e.number')
      .orderBy('o.id')
      .execute(),
    buildSponsorCredits(db, buildId),
  ]);
  return {
    sponsors,
    id: b.id,
    slug: b.slug,
    title: b.title,
    visibility: b.visibility,
    vehicleKind: b.vehicle_kind,
    vehicleMake: b.vehicle_make,
    vehicleModel: b.vehicle_model,
    vehicleYear: b.vehicle_year,
    summary: b.summary,
    currency: b.currency,
    budgetMinor: b.budget_minor,
    owner: { handle: b.handle, displayName: b.display_name },
    cover: presentImage(cover),
    editors: editors.map((e) => ({ handle: e.handle, displayName: e.display_name })),
    systems: systems.map((s) => ({ key: s.key, name: s.name, safetyCritical: s.safety_critical })),
    hoursWorked: episodes.reduce((sum, e) => sum + (e.minutes_worked ?? 0), 0) / 60,
    episodes: episodes.map((e) => ({
      id: e.id,
      number: e.number,
      slug: e.slug,
      title: e.title,
      summary: e.summary,
      publishedAt: iso(e.published_at)!,
      hoursWorked: hours(e.minutes_worked),
      chapterCount: Number(e.chapter_count ?? 0),
    })),
    openItems: openItems.map((o) => ({
      id: o.id,
      title: o.title,
      note: o.note,
      openedIn: { id: o.episode_id, number: o.number, slug: o.slug, title: o.episode_title },
    })),
  };
}

/** The episode page's data, in one SQL round trip; the caller has checked the reader may see the episode. */
export async function getEpisodeReading(db: Db, episodeId: number): Promise<EpisodeReading | null> {
  const e = await findEpisodeReading(db, episodeId);
  if (!e) return null;
  const { chapters } = e;
  const systemList = e.systems.map((s) => ({ key: s.key, name: s.name, safetyCritical: s.safety_critical }));
  const byKey = new Map(systemList.map((s) => [s.key, s]));
  const caution = needsCaution(
    {
      raisedVehicle: e.raised_vehicle,
      systemKeys: [...chapters.flatMap((c) => (c.system_key ? [c.system_key] : [])), ...e.other_system_keys],
    },
    systemList,
  );
  return {
    id: e.id,
    number: e.number,
    slug: e.slug,
    title: e.title,
    summary: e.summary,
    status: e.status,
    publishedAt: iso(e.published_at),
    updatedAt: iso(e.updated_at)!,
    videoUrl: e.video_url,
    durationSeconds: e.duration_seconds,
    hoursWorked: hours(e.minutes_worked),
    writeUpHtml: e.write_up_html,
    cover: presentImage(e.cover),
    gallery: e.gallery.flatMap((m) => presentImage(m) ?? []),
    chapters: chapters.map((c, i) => ({
      id: c.id,
      startSeconds: c.start_seconds,
      endSeconds: chapters[i + 1]?.start_seconds ?? e.duration_seconds ?? null,
      title: c.title,
      system: c.system_key ? (byKey.get(c.system_key) ?? null) : null,
      notes: c.notes,
      videoLink: e.video_url ? safeChapterLink(e.video_url, c.start_seconds, e.video_link_pattern) : null,
    })),
    caution: cautionText(caution.reasons),
    systems: systemList,
    build: {
      id: e.build_id,
      slug: e.build_slug,
      title: e.build_title,
      visibility: e.visibility,
      vehicleKind: e.vehicle_kind,
      vehicleMake: e.vehicle_make,
      vehicleModel: e.vehicle_model,
      vehicleYear: e.vehicle_year,
      owner: { handle: e.handle, displayName: e.display_name },
    },
    previous: e.previous ?? null,
    next: e.next ?? null,
    openItems: {
      opened: e.opened.map((o) => ({ id: o.id, title: o.title, note: o.note, closed: o.closed })),
      closed: e.closed.map((o) => ({
        id: o.id,
        title: o.title,
        openedIn: { id: o.episode_id, number: o.number, slug: o.slug, title: o.episode_title },
      })),
    },
  };
}

function safeChapterLink(videoUrl: string, seconds: number, pattern: string): string | null {
  try {
    return chapterLink(videoUrl, seconds, pattern);
  } catch {
    return null;
  }
}

/** A creator's public page; null when there is no such (active) account. */
export async function getCreatorPage(db: Db, handle: string): Promise<CreatorPage | null> {
  const u = await db
    .selectFrom('users')
    .select(['id', 'handle', 'display_name', 'avatar_url'])
    .where(sql`lower(handle)`, '=', handle.toLowerCase())
    .where('deleted_at', 'is', null)
    .executeTakeFirst();
  if (!u) return null;
  const [builds, latest] = await Promise.all([
    listCreatorBuilds(db, u.id),
    listLatestEpisodes(db, { limit: 12, offset: 0, ownerId: u.id }),
  ]);
  return {
    handle: u.handle,
    displayName: u.display_name,
    avatarUrl: u.avatar_url,
    builds: builds.map(presentBuildCard),
    latestEpisodes: latest.rows.map(presentEpisodeListItem),
  };
}
