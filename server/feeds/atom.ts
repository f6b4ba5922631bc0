import { Router, type Response } from 'express';
import { Feed } from 'feed';
import { sql } from 'kysely';
import { paths } from '../../src/shared/paths';
import type { AppDeps } from '../app-deps';
import { isPublishedEpisode } from '../db/reading.queries';
import type { Db } from '../db/kysely';
import { disclosureLine } from '../../src/shared/disclosure';
import { episodeDisclosure } from '../services/disclosure';

const FEED_SIZE = 30;

const feedPaths = paths.feeds;

function latestForFeed(db: Db, where: { buildId: number } | { publicOnly: true }) {
  let q = db
    .selectFrom('episodes as e')
    .innerJoin('builds as b', 'b.id', 'e.build_id')
    .innerJoin('users as u', 'u.id', 'b.owner_id')
    .select([
      'e.id',
      'e.number',
      'e.slug',
      'e.title',
      'e.summary',
      'e.write_up_html',
      'e.published_at',
      'e.updated_at',
      'b.slug as build_slug',
      'b.title as build_title',
      'u.handle',
      'u.display_name',
    ])
    .where(isPublishedEpisode)
    .where('b.deleted_at', 'is', null);
  q = 'buildId' in where ? q.where('b.id', '=', where.buildId) : q.where('b.visibility', '=', 'public');
  return q.orderBy('e.published_at', 'desc').orderBy('e.id', 'desc').limit(FEED_SIZE).execute();
}

type FeedRow = Awaited<ReturnType<typeof latestForFeed>>[number];

const escapeHtml = (t: string) =>
  t.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

async function addItems(db: Db, feed: Feed, origin: string, rows: FeedRow[], withBuild: boolean) {
  // Every supported episode's item opens with its disclosure, in the summary and in the content.
  const disclosures = await Promise.all(rows.map((r) => episodeDisclosure(db, r.id)));
  for (const [i, r] of rows.entries()) {
    const d = disclosures[i];
    const link = origin + paths.episode(r.handle, r.build_slug, r.slug);
    feed.addItem({
      title: withBuild ? `${r.build_title} — Ep. ${r.number}: ${r.title}` : `Ep. ${r.number}: ${r.title}`,
      id: link,
      link,
      date: r.updated_at,
      published: r.published_at ?? undefined,
      description: [d ? disclosureLine(d) : null, r.summary].filter(Boolean).join(' ') || undefined,
      // The stored write-up is already sanitised HTML (server/services/write-up-html.ts).
      content: d ? `<p><strong>${escapeHtml(d.label)}:</strong> ${escapeHtml(d.text)}</p>\n${r.write_up_html}` : r.write_up_html,
      author: [{ name: r.display_name, link: origin + paths.creator(r.handle) }],
    });
  }
}

function send(res: Response, feed: Feed) {
  res.status(200).type('application/atom+xml; charset=utf-8').setHeader('cache-control', 'public, max-age=300').send(feed.atom1());
}

/**
 * Atom feeds (RFC 4287) for readers to follow along: every public build's latest episodes, and one
 * build's (public or unlisted: readable by whoever has the link). Links are absolute, from PUBLIC_URL.
 */
export function feedRouter(deps: AppDeps): Router {
  const router = Router();
  const origin = deps.config.PUBLIC_URL.replace(/\/$/, '');

  router.get('/feeds/episodes.atom', async (_req, res) => {
    const rows = await latestForFeed(deps.db, { publicOnly: true });
    const feed = new Feed({
      title: 'Rivet & Reel — latest episodes',
      description: 'New episodes from restoration builds on Rivet & Reel.',
      id: origin + '/',
      link: origin + '/',
      language: 'en',
      updated: rows[0]?.updated_at ?? new Date(0),
      generator: false,
      feedLinks: { atom: origin + feedPaths.site() },
      copyright: 'Each episode belongs to its creator.',
    });
    await addItems(deps.db, feed, origin, rows, true);
    send(res, feed);
  });

  router.get('/feeds/builds/:file', async (req, res) => {
    const match = /^([1-9]\d{0,15})\.atom$/.exec(req.params.file);
    const build = match
      ? await deps.db
          .selectFrom('builds as b')
          .innerJoin('users as u', 'u.id', 'b.owner_id')
          .select(['b.id', 'b.slug', 'b.title', 'b.summary', 'u.handle', 'u.display_name'])
          .where('b.id', '=', Number(match[1]))
          .where('b.visibility', 'in', ['public', 'unlisted'])
          .where('b.deleted_at', 'is', null)
          .where(sql<boolean>`u.deleted_at is null`)
          .executeTakeFirst()
      : undefined;
    if (!build) {
      res.status(404).type('text/plain').send('No such feed');
      return;
    }
    const rows = await latestForFeed(deps.db, { buildId: build.id });
    const link = origin + paths.build(build.handle, build.slug);
    const feed = new Feed({
      title: `${build.title} — Rivet & Reel`,
      description: build.summary ?? `Episodes of ${build.title}, by ${build.display_name}.`,
      id: link,
      link,
      language: 'en',
      updated: rows[0]?.updated_at ?? new Date(0),
      generator: false,
      feedLinks: { atom: origin + feedPaths.build(build.id) },
      author: { name: build.display_name, link: origin + paths.creator(build.handle) },
      copyright: `© ${build.display_name}`,
    });
    await addItems(deps.db, feed, origin, rows, false);
    send(res, feed);
  });
  return router;
}
