import { sql } from 'kysely';
import type { Workbench } from '../../src/shared/schemas/episodes';
import type { Db } from '../db/kysely';
import { TRASH_DAYS } from './builds';
import { getInbox } from './posts-read';

const iso = (d: Date | null) => d?.toISOString() ?? null;
const purgeAfter = (d: Date) => new Date(d.getTime() + TRASH_DAYS * 86_400_000).toISOString();

/** A creator's home: their builds with totals, drafts, scheduled episodes, the trash, transfers offered. */
export async function getWorkbench(db: Db, userId: number): Promise<Workbench> {
  const builds = await db
    .selectFrom('build_members as m')
    .innerJoin('builds as b', 'b.id', 'm.build_id')
    .leftJoin('episodes as e', (j) => j.onRef('e.build_id', '=', 'b.id').on('e.deleted_at', 'is', null))
    .select((eb) => [
      'b.id',
      'b.slug',
      'b.title',
      'b.visibility',
      'm.role',
      eb.fn.count<number>('e.id').as('episode_count'),
      eb.fn.count<number>('e.id').filterWhere('e.status', '=', 'published').as('published_count'),
      eb.fn.max('e.published_at').as('last_published_at'),
      eb.fn.coalesce(eb.fn.sum<number>('e.minutes_worked'), sql<number>`0`).as('minutes'),
    ])
    .where('m.user_id', '=', userId)
    .where('b.deleted_at', 'is', null)
    .groupBy(['b.id', 'm.role'])
    .orderBy('b.updated_at', 'desc')
    .execute();

  const episodes = (status: 'draft' | 'scheduled') =>
    db
      .selectFrom('episodes as e')
      .innerJoin('builds as b', 'b.id', 'e.build_id')
      .innerJoin('build_members as m', (j) => j.onRef('m.build_id', '=', 'b.id').on('m.user_id', '=', userId))
      .select([
        'e.id',
        'e.build_id',
        'e.number',
        'e.slug',
        'e.title',
        'e.status',
        'e.publish_at',
        'e.published_at',
        'e.minutes_worked',
        'e.updated_at',
        'b.title as build_title',
      ])
      .where('e.status', '=', status)
      .where('e.deleted_at', 'is', null)
      .where('b.deleted_at', 'is', null)
      .orderBy(status === 'draft' ? 'e.updated_at' : 'e.publish_at', status === 'draft' ? 'desc' : 'asc')
      .limit(50)
      .execute();
  const [drafts, scheduled, trashedBuilds, trashedEpisodes, transfers, onOrder] = await Promise.all([
    episodes('draft'),
    episodes('scheduled'),
    db
      .selectFrom('builds')
      .select(['id', 'title', 'deleted_at'])
      .where('owner_id', '=', userId)
      .where('deleted_at', '>', sql<Date>`now() - make_interval(days => ${TRASH_DAYS})`)
      .execute(),
    db
      .selectFrom('episodes as e')
      .innerJoin('builds as b', 'b.id', 'e.build_id')
      .select(['e.id', 'e.title', 'e.deleted_at', 'b.title as build_title'])
      .where('b.owner_id', '=', userId)
      .where('b.deleted_at', 'is', null)
      .where('e.deleted_at', '>', sql<Date>`now() - make_interval(days => ${TRASH_DAYS})`)
      .execute(),
    db
      .selectFrom('builds as b')
      .innerJoin('users as u', 'u.id', 'b.owner_id')
      .select(['b.id', 'b.title', 'u.display_name'])
      .where('b.pending_transfer_to', '=', userId)
      .where('b.deleted_at', 'is', null)
      .execute(),
    db
      .selectFrom('part_lines as pl')
      .innerJoin('episodes as e', 'e.id', 'pl.episode_id')
      .innerJoin('builds as b', 'b.id', 'pl.build_id')
      .innerJoin('build_members as m', (j) => j.onRef('m.build_id', '=', 'b.id').on('m.user_id', '=', userId))
      .leftJoin('open_items as o', 'o.id', 'pl.open_item_id')
      .select([
        'pl.id',
        'pl.description',
        'pl.gross_minor',
        'pl.currency',
        'b.id as build_id',
        'b.title as build_title',
        'e.id as episode_id',
        'e.number',
        'o.title as open_item_title',
      ])
      .where('pl.status', '=', 'on-order')
      .where('e.deleted_at', 'is', null)
      .where('b.deleted_at', 'is', null)
      .orderBy('pl.created_at')
      .limit(50)
      .execute(),
  ]);
  const summary = (r: (typeof drafts)[number]) => ({
    id: r.id,
    buildId: r.build_id,
    number: r.number,
    slug: r.slug,
    title: r.title,
    status: r.status,
    publishAt: iso(r.publish_at),
    publishedAt: iso(r.published_at),
    hoursWorked: r.minutes_worked === null ? null : r.minutes_worked / 60,
    updatedAt: r.updated_at.toISOString(),
    buildTitle: r.build_title,
  });
  const inbox = await getInbox(db, userId, { order: 'unanswered' }, 20);
  return {
    unansweredPosts: inbox.items
      .filter((p) => p.unanswered && !p.hidden)
      .slice(0, 8)
      .map((p) => ({
        id: p.id,
        kind: p.kind,
        excerpt: p.body.length > 120 ? `${p.body.slice(0, 119)}…` : p.body,
        authorName: p.author.displayName,
        createdAt: p.createdAt,
        buildTitle: p.build.title,
        episodeNumber: p.episode.number,
      })),
    openPostCount: inbox.openCount,
    builds: builds.map((b) => ({
      id: b.id,
      slug: b.slug,
      title: b.title,
      visibility: b.visibility,
      role: b.role,
      episodeCount: Number(b.episode_count),
      publishedCount: Number(b.published_count),
      lastPublishedAt: b.last_published_at ? new Date(b.last_published_at).toISOString() : null,
      hoursWorked: Number(b.minutes) / 60,
    })),
    drafts: drafts.map(summary),
    scheduled: scheduled.map(summary),
    deleted: [
      ...trashedBuilds.map((b) => ({
        kind: 'build' as const,
        id: b.id,
        title: b.title,
        buildTitle: null,
        deletedAt: b.deleted_at!.toISOString(),
        purgeAfter: purgeAfter(b.deleted_at!),
      })),
      ...trashedEpisodes.map((e) => ({
        kind: 'episode' as const,
        id: e.id,
        title: e.title,
        buildTitle: e.build_title,
        deletedAt: e.deleted_at!.toISOString(),
        purgeAfter: purgeAfter(e.deleted_at!),
      })),
    ],
    pendingTransfers: transfers.map((t) => ({ buildId: t.id, buildTitle: t.title, fromDisplayName: t.display_name })),
    onOrder: onOrder.map((l) => ({
      id: l.id,
      description: l.description,
      grossMinor: l.gross_minor,
      currency: l.currency,
      buildId: l.build_id,
      buildTitle: l.build_title,
      episodeId: l.episode_id,
      episodeNumber: l.number,
      openItemTitle: l.open_item_title,
    })),
  };
}
