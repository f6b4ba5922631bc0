import { sql } from 'kysely';
import { SEARCH_PAGE_SIZE, SNIPPET_MARK_END, SNIPPET_MARK_START, type SearchResponse } from '../../src/shared/schemas/reading';
import type { Db } from '../db/kysely';

interface HitRow {
  kind: 'episode' | 'build' | 'part';
  id: number;
  title: string;
  build_slug: string;
  build_title: string;
  handle: string;
  display_name: string;
  number: number | null;
  episode_slug: string | null;
  published_at: Date | null;
  snippet: string;
  total: number;
}

// Matched words come back between two control characters, never as markup (see SNIPPET_MARK_START).
const HEADLINE_OPTIONS = `StartSel=${SNIPPET_MARK_START}, StopSel=${SNIPPET_MARK_END}, MaxWords=30, MinWords=12, MaxFragments=2, FragmentDelimiter=" … "`;

/**
 * Full-text search over published episodes and builds of public builds, ranked. The reader's words
 * go through websearch_to_tsquery, which accepts any string (quotes, `&`, `|`, `!`, `:*`) without
 * a syntax error. Snippets are made only for the rows of the page asked for.
 */
export async function search(db: Db, q: string, page: number): Promise<SearchResponse> {
  const empty = { items: [], page, perPage: SEARCH_PAGE_SIZE, total: 0, q };
  if (!q.trim()) return empty;
  const { rows } = await sql<HitRow>`
    with query as (select websearch_to_tsquery('english', ${q}) as tsq),
    hits as (
      select 'episode' as kind, e.id, e.title, b.slug as build_slug, b.title as build_title, u.handle, u.display_name,
             e.number, e.slug as episode_slug, e.published_at,
             ts_rank_cd(e.search_vector, query.tsq) as rank
        from episodes e
        join builds b on b.id = e.build_id
        join users u on u.id = b.owner_id
        cross join query
       where e.search_vector @@ query.tsq
         and e.status = 'published' and e.published_at <= now() and e.deleted_at is null
         and b.visibility = 'public' and b.deleted_at is null and u.deleted_at is null
      union all
      select 'part', pl.id, pl.description, b.slug, b.title, u.handle, u.display_name,
             e.number, e.slug, e.published_at,
             ts_rank_cd(pl.search_vector, query.tsq) * 0.5
        from part_lines pl
        join episodes e on e.id = pl.episode_id
        join builds b on b.id = e.build_id
        join users u on u.id = b.owner_id
        cross join query
       where pl.search_vector @@ query.tsq
         and e.status = 'published' and e.published_at <= now() and e.deleted_at is null
         and b.visibility = 'public' and b.deleted_at is null and u.deleted_at is null
      union all
      select 'build', b.id, b.title, b.slug, b.title, u.handle, u.display_name,
             null, null, null,
             ts_rank_cd(b.search_vector, query.tsq)
        from builds b
        join users u on u.id = b.owner_id
        cross join query
       where b.search_vector @@ query.tsq
         and b.visibility = 'public' and b.deleted_at is null and u.deleted_at is null
    ),
    page as (
      select hits.*, count(*) over () as total
        from hits
       order by rank desc, published_at desc nulls last, kind, id desc
       limit ${SEARCH_PAGE_SIZE} offset ${(page - 1) * SEARCH_PAGE_SIZE}
    )
    select page.kind, page.id, page.title, page.build_slug, page.build_title, page.handle, page.display_name,
           page.number, page.episode_slug, page.published_at, page.total::int as total,
           ts_headline('english', body.text, query.tsq, ${HEADLINE_OPTIONS}) as snippet
      from page cross join query
      -- The text to quote is read for the page's rows only, not for every hit (write-ups are long).
      cross join lateral (
        select case page.kind
          when 'episode' then (select concat_ws(' ', e.summary, e.chapter_titles, e.write_up_text) from episodes e where e.id = page.id)
          when 'part' then (select concat_ws(' ', pl.description, pl.part_number) from part_lines pl where pl.id = page.id)
          else (select concat_ws(' ', b.vehicle_year, b.vehicle_make, b.vehicle_model, '—', b.summary) from builds b where b.id = page.id)
        end as text) body
     order by page.rank desc, page.published_at desc nulls last, page.kind, page.id desc`.execute(db);
  // Past the last page there are no rows to carry the count: ask the first page for it (rare), so the
  // page can say how many there are and link back.
  if (!rows.length) return page > 1 ? { ...empty, total: (await search(db, q, 1)).total } : empty;
  return {
    q,
    page,
    perPage: SEARCH_PAGE_SIZE,
    total: rows[0]!.total,
    items: rows.map((r) => ({
      kind: r.kind,
      id: r.id,
      title: r.title,
      snippet: r.snippet,
      build: { slug: r.build_slug, title: r.build_title },
      creator: { handle: r.handle, displayName: r.display_name },
      episode: r.kind !== 'build' ? { number: r.number!, slug: r.episode_slug! } : null,
      publishedAt: r.published_at ? new Date(r.published_at).toISOString() : null,
    })),
  };
}
