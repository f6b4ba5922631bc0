import Papa from 'papaparse';
import { sql, type RawBuilder } from 'kysely';
import { formatTime } from '../../src/shared/chapters';
import { formatScaled, minorToDecimal, parseScaled, QUANTITY_SCALE } from '../../src/shared/money';
import { paths } from '../../src/shared/paths';
import type { SponsorRef, SponsorSummary, SponsorSummaryLine, SponsorSummaryQuery, SupportKind } from '../../src/shared/schemas/sponsors';
import type { Db } from '../db/kysely';

/**
 * Whose view: the sponsor's own (published lines on public and unlisted builds only), or one
 * build team's (its own build, unpublished lines included and marked).
 */
export type SummaryScope = { kind: 'sponsor' } | { kind: 'team'; buildId: number };

export type SummaryFilter = Omit<SponsorSummaryQuery, 'page' | 'perPage'>;

// A line counts as published when its episode is published and its time has come (as the ledger's
// totals count it). Its day is the UTC calendar day of the episode's publication; a scheduled
// episode's planned day in the team's view; none for a draft.
const PUBLISHED = sql`(e.status = 'published' and e.published_at <= now())`;
const DAY = sql`(e.published_at at time zone 'UTC')::date`;

/**
 * The lines a summary covers, before its filters: supported by this sponsor (sponsor and kind set),
 * not returned (a returned part gave nothing), in a live episode of a live build. Receipts are never
 * read. The sponsor's view adds: published, on a public or unlisted build.
 */
function baseWhere(sponsorId: number, scope: SummaryScope): RawBuilder<unknown> {
  const common = sql`pl.sponsor_id = ${sponsorId} and pl.support_kind is not null and pl.status <> 'returned'
    and e.deleted_at is null and b.deleted_at is null`;
  return scope.kind === 'sponsor'
    ? sql`${common} and ${PUBLISHED} and b.visibility in ('public', 'unlisted')`
    : sql`${common} and pl.build_id = ${scope.buildId}`;
}

function filterWhere(f: SummaryFilter): RawBuilder<unknown> {
  const parts: RawBuilder<unknown>[] = [sql`true`];
  if (f.from) parts.push(sql`${DAY} >= ${f.from}::date`);
  if (f.to) parts.push(sql`${DAY} <= ${f.to}::date`);
  if (f.build) parts.push(sql`pl.build_id = ${f.build}`);
  if (f.kind) parts.push(sql`pl.support_kind = ${f.kind}`);
  return sql.join(parts, sql` and `);
}

const FROM = sql`part_lines pl join episodes e on e.id = pl.episode_id join builds b on b.id = pl.build_id`;

interface TotalRow {
  currency: string;
  value_given: number;
  lines: number;
  episodes: number;
  builds: number;
  first_on: string | null;
  last_on: string | null;
}

interface LineRow {
  id: number;
  build_id: number;
  build_title: string;
  build_slug: string;
  owner_handle: string;
  episode_id: number;
  episode_number: number;
  episode_title: string;
  episode_slug: string;
  chapter_title: string | null;
  chapter_start: number | null;
  at_seconds: number | null;
  description: string;
  quantity: string;
  currency: string;
  list_price_minor: number | null;
  unit_price_minor: number;
  value_given_minor: number;
  support_kind: SupportKind;
  published_on: string | null;
  unpublished: boolean;
}

/** Totals per currency (never added across currencies), grouped in SQL. */
async function totals(db: Db, where: RawBuilder<unknown>) {
  const { rows } = await sql<TotalRow>`
    select pl.currency,
           coalesce(sum(pl.value_given_minor), 0)::bigint as value_given,
           count(*)::int as lines,
           count(distinct pl.episode_id)::int as episodes,
           count(distinct pl.build_id)::int as builds,
           to_char(min(${DAY}), 'YYYY-MM-DD') as first_on,
           to_char(max(${DAY}), 'YYYY-MM-DD') as last_on
      from ${FROM}
     where ${where}
     group by pl.currency
     order by pl.currency`.execute(db);
  return rows;
}

/** Value given per calendar month (UTC) and currency; undated lines (drafts) are left out. */
async function series(db: Db, where: RawBuilder<unknown>) {
  const { rows } = await sql<{ month: string; currency: string; value_given: number }>`
    select to_char(date_trunc('month', ${DAY}), 'YYYY-MM') as month, pl.currency,
           coalesce(sum(pl.value_given_minor), 0)::bigint as value_given
      from ${FROM}
     where ${where} and e.published_at is not null
     group by 1, 2
     order by 1, 2`.execute(db);
  return rows;
}

/** The lines themselves, newest first (unpublished ones first in the team's view), with the chapter that holds each. */
async function lineRows(db: Db, where: RawBuilder<unknown>, page: { limit: number; offset: number } | null) {
  const { rows } = await sql<LineRow>`
    select pl.id, pl.build_id, b.title as build_title, b.slug as build_slug, o.handle as owner_handle,
           pl.episode_id, e.number as episode_number, e.title as episode_title, e.slug as episode_slug,
           c.title as chapter_title, c.start_seconds as chapter_start,
           pl.at_seconds, pl.description, pl.quantity::text as quantity, pl.currency,
           pl.list_price_minor, pl.unit_price_minor, pl.value_given_minor, pl.support_kind,
           case when ${PUBLISHED} then to_char(${DAY}, 'YYYY-MM-DD') end as published_on,
           not ${PUBLISHED} as unpublished
      from ${FROM}
      join users o on o.id = b.owner_id
      left join lateral (
        select ch.title, ch.start_seconds from chapters ch
         where ch.episode_id = pl.episode_id and pl.at_seconds is not null and ch.start_seconds <= pl.at_seconds
         order by ch.start_seconds desc limit 1) c on true
     where ${where}
     order by not ${PUBLISHED} desc, e.published_at desc nulls first, e.id desc, pl.position, pl.id
     ${page ? sql`limit ${page.limit} offset ${page.offset}` : sql``}`.execute(db);
  return rows;
}

function presentLine(r: LineRow): SponsorSummaryLine {
  const episodePath = paths.episode(r.owner_handle, r.build_slug, r.episode_slug);
  return {
    lineId: r.id,
    build: { id: r.build_id, title: r.build_title, path: paths.build(r.owner_handle, r.build_slug) },
    episode: { id: r.episode_id, number: r.episode_number, title: r.episode_title, path: episodePath },
    chapter: r.chapter_title !== null && r.chapter_start !== null ? { title: r.chapter_title, startSeconds: r.chapter_start } : null,
    atSeconds: r.at_seconds,
    // The reading pages' moment address (`#at-312`): the episode opens at the chapter holding it.
    momentPath: r.at_seconds === null ? episodePath : paths.episodeAt(r.owner_handle, r.build_slug, r.episode_slug, r.at_seconds),
    description: r.description,
    // numeric arrives as "2.500"; sent as the parts table shows it ("2.5").
    quantity: formatScaled(parseScaled(r.quantity, QUANTITY_SCALE) ?? 0n, QUANTITY_SCALE),
    currency: r.currency,
    listPriceMinor: r.list_price_minor,
    unitPriceMinor: r.unit_price_minor,
    valueGivenMinor: r.value_given_minor,
    kind: r.support_kind,
    publishedOn: r.published_on,
    unpublished: r.unpublished,
  };
}

/** The sponsor summary for one sponsor, in one scope, filtered and paged; every figure grouped in SQL. */
export async function sponsorSummary(db: Db, sponsor: SponsorRef, scope: SummaryScope, q: SponsorSummaryQuery): Promise<SponsorSummary> {
  const base = baseWhere(sponsor.id, scope);
  const where = sql`${base} and ${filterWhere(q)}`;
  const [totalRows, points, builds, rows] = await Promise.all([
    totals(db, where),
    series(db, where),
    sql<{ id: number; title: string }>`
      select distinct b.id, b.title from ${FROM} where ${base} order by b.title, b.id`.execute(db),
    lineRows(db, where, { limit: q.perPage, offset: (q.page - 1) * q.perPage }),
  ]);
  return {
    sponsor,
    totals: totalRows.map((t) => ({
      currency: t.currency,
      valueGivenMinor: t.value_given,
      lines: t.lines,
      episodes: t.episodes,
      builds: t.builds,
      firstOn: t.first_on,
      lastOn: t.last_on,
    })),
    series: points.map((p) => ({ month: p.month, currency: p.currency, valueGivenMinor: p.value_given })),
    builds: builds.rows,
    lines: { items: rows.map(presentLine), page: q.page, perPage: q.perPage, total: totalRows.reduce((n, t) => n + t.lines, 0) },
  };
}

/** The CSV's columns, in order (DEVELOPERS.md "Sponsors"): the screen's table, money as decimals in the line's currency. */
export const SUMMARY_CSV_COLUMNS = [
  'published_on',
  'build',
  'episode_number',
  'episode',
  'chapter',
  'at',
  'moment_url',
  'description',
  'quantity',
  'currency',
  'list_price',
  'price_paid',
  'value_given',
  'support',
  'status',
] as const;

/** Every line of the filtered summary (no paging) as CSV, the same rows and order as the screen. */
export async function sponsorSummaryCsv(db: Db, sponsorId: number, scope: SummaryScope, f: SummaryFilter, publicUrl: string) {
  const rows = (await lineRows(db, sql`${baseWhere(sponsorId, scope)} and ${filterWhere(f)}`, null)).map(presentLine);
  const base = publicUrl.replace(/\/$/, '');
  const data = rows.map((l) => [
    l.publishedOn ?? '',
    l.build.title,
    String(l.episode.number),
    l.episode.title,
    l.chapter?.title ?? '',
    l.atSeconds === null ? '' : formatTime(l.atSeconds),
    `${base}${l.momentPath}`,
    l.description,
    l.quantity,
    l.currency,
    l.listPriceMinor === null ? '' : minorToDecimal(l.listPriceMinor, l.currency),
    minorToDecimal(l.unitPriceMinor, l.currency),
    minorToDecimal(l.valueGivenMinor, l.currency),
    l.kind,
    l.unpublished ? 'not yet published' : 'published',
  ]);
  // A leading =, +, - or @ would run as a formula in a spreadsheet: such text cells get a quote mark.
  return Papa.unparse({ fields: [...SUMMARY_CSV_COLUMNS], data }, { escapeFormulae: true, newline: '\r\n' });
}
