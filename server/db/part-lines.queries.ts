import { sql, type RawBuilder } from 'kysely';
import type { LedgerQuery, PartKind, PartTotals } from '../../src/shared/schemas/parts';
import type { Db } from './kysely';

/**
 * Which lines a query covers: one episode, or a build (only published episodes' lines unless the
 * build team asks). Lines of trashed episodes never count.
 */
export type LineScope = { episodeId: number } | { buildId: number; includeUnpublished: boolean };

function scopeWhere(scope: LineScope): RawBuilder<unknown> {
  const live = sql`e.deleted_at is null`;
  if ('episodeId' in scope) return sql`pl.episode_id = ${scope.episodeId} and ${live}`;
  const published = scope.includeUnpublished ? sql`true` : sql`e.status = 'published' and e.published_at <= now()`;
  return sql`pl.build_id = ${scope.buildId} and ${live} and ${published}`;
}

/** A line amount in the build's currency: as is, or × its rate across the two exponents, rounded once. */
const conv = (col: string) =>
  sql.raw(`case when pl.currency = b.currency then pl.${col}
      when pl.fx_rate is null then null
      else round(pl.${col} * pl.fx_rate * ('1e' || (tc.exponent - fc.exponent))::numeric)::bigint end`);

/** Part lines with their amounts converted to the build's currency, as a subquery to group over. */
export function convertedLines(scope: LineScope): RawBuilder<unknown> {
  return sql`
    select pl.*, e.number as episode_number, e.title as episode_title, e.slug as episode_slug,
           ${conv('net_minor')} as b_net, ${conv('tax_minor')} as b_tax, ${conv('gross_minor')} as b_gross,
           ${conv('avoided_cost_minor')} as b_avoided
      from part_lines pl
      join episodes e on e.id = pl.episode_id
      join builds b on b.id = pl.build_id
      join currencies fc on fc.code = pl.currency
      join currencies tc on tc.code = b.currency
     where ${scopeWhere(scope)}`;
}

/** The DESIGN.md totals as sums of filtered columns (see computeTotals for the same rules in TypeScript). */
const TOTALS_COLUMNS = sql`
  count(*)::int as lines,
  count(*) filter (where b_gross is null)::int as unconverted,
  coalesce(sum(b_net) filter (where kind <> 'sale' and status in ('arrived', 'fitted')), 0)::bigint as spent_net,
  coalesce(sum(b_tax) filter (where kind <> 'sale' and status in ('arrived', 'fitted')), 0)::bigint as spent_tax,
  coalesce(sum(b_gross) filter (where kind <> 'sale' and status in ('arrived', 'fitted')), 0)::bigint as spent_gross,
  coalesce(sum(b_gross) filter (where kind <> 'sale' and status = 'on-order'), 0)::bigint as committed,
  coalesce(sum(b_gross) filter (where kind <> 'sale' and status = 'needed'), 0)::bigint as planned,
  coalesce(sum(b_avoided) filter (where source in ('reused', 'made') and status <> 'returned' and b_gross is not null), 0)::bigint as saved,
  coalesce(sum(b_gross) filter (where kind = 'sale' and status <> 'returned'), 0)::bigint as sales`;

interface TotalsRow {
  lines: number;
  unconverted: number;
  spent_net: number;
  spent_tax: number;
  spent_gross: number;
  committed: number;
  planned: number;
  saved: number;
  sales: number;
}

function presentTotals(r: TotalsRow | undefined, currency: string): PartTotals {
  return {
    currency,
    spent: { netMinor: r?.spent_net ?? 0, taxMinor: r?.spent_tax ?? 0, grossMinor: r?.spent_gross ?? 0 },
    committedMinor: r?.committed ?? 0,
    plannedMinor: r?.planned ?? 0,
    savedByReuseMinor: r?.saved ?? 0,
    salesMinor: r?.sales ?? 0,
    unconverted: r?.unconverted ?? 0,
    lines: r?.lines ?? 0,
  };
}

/** Totals of the lines in scope, in the build's currency, by one grouped query. */
export async function partTotals(db: Db, scope: LineScope, currency: string, extra?: RawBuilder<unknown>): Promise<PartTotals> {
  const { rows } = await sql<TotalsRow>`select ${TOTALS_COLUMNS} from (${convertedLines(scope)}) x where ${extra ?? sql`true`}`.execute(db);
  return presentTotals(rows[0], currency);
}

const SPENT = sql`coalesce(sum(b_gross) filter (where kind <> 'sale' and status in ('arrived', 'fitted')), 0)::bigint`;

/** The build's breakdowns: by system (with budgets), supplier, kind, and spend by episode with its running total. */
export async function buildBreakdowns(db: Db, scope: Extract<LineScope, { buildId: number }>) {
  const lines = convertedLines(scope);
  const [bySystem, bySupplier, byKind, byEpisode] = await Promise.all([
    sql<{ key: string | null; name: string; budget_minor: number | null; spent: number; committed: number; planned: number }>`
      with g as (
        select system_key, ${SPENT} as spent,
               coalesce(sum(b_gross) filter (where kind <> 'sale' and status = 'on-order'), 0)::bigint as committed,
               coalesce(sum(b_gross) filter (where kind <> 'sale' and status = 'needed'), 0)::bigint as planned
          from (${lines}) x group by system_key)
      select s.key, s.name, s.budget_minor, coalesce(g.spent, 0)::bigint as spent, coalesce(g.committed, 0)::bigint as committed,
             coalesce(g.planned, 0)::bigint as planned, s.position
        from build_systems s left join g on g.system_key = s.key
       where s.build_id = ${scope.buildId}
      union all
      select null, 'No system', null, sum(g.spent)::bigint, sum(g.committed)::bigint, sum(g.planned)::bigint, 1000000 from g
       where g.system_key is null or not exists (select 1 from build_systems s where s.build_id = ${scope.buildId} and s.key = g.system_key)
      having count(*) > 0
      order by position`.execute(db),
    sql<{ supplier_id: number | null; name: string | null; spent: number; lines: number }>`
      select x.supplier_id, s.name, ${SPENT} as spent, count(*)::int as lines
        from (${lines}) x left join suppliers s on s.id = x.supplier_id
       group by x.supplier_id, s.name order by spent desc, s.name nulls last`.execute(db),
    sql<{ kind: PartKind; spent: number; lines: number }>`
      select kind, coalesce(sum(b_gross) filter (where status in ('arrived', 'fitted')), 0)::bigint as spent, count(*)::int as lines
        from (${lines}) x group by kind order by kind`.execute(db),
    sql<{ episode_id: number; number: number; title: string; spent: number; cumulative: number }>`
      select e.id as episode_id, e.number, e.title, coalesce(g.spent, 0)::bigint as spent,
             sum(coalesce(g.spent, 0)) over (order by e.number)::bigint as cumulative
        from episodes e
        left join (select episode_id, ${SPENT} as spent from (${lines}) x group by episode_id) g on g.episode_id = e.id
       where e.build_id = ${scope.buildId} and e.deleted_at is null
         and ${scope.includeUnpublished ? sql`true` : sql`e.status = 'published' and e.published_at <= now()`}
       order by e.number`.execute(db),
  ]);
  return { bySystem: bySystem.rows, bySupplier: bySupplier.rows, byKind: byKind.rows, byEpisode: byEpisode.rows };
}

const SORT_COLUMNS: Record<LedgerQuery['sort'], string> = {
  episode: 'x.episode_number',
  description: 'lower(x.description)',
  supplier: 'lower(s.name)',
  system: 'x.system_key',
  kind: 'x.kind',
  status: 'x.status',
  gross: 'x.b_gross',
};

/** Filters of the ledger as SQL over the converted lines. */
export function ledgerFilter(q: Partial<LedgerQuery>): RawBuilder<unknown> {
  const parts: RawBuilder<unknown>[] = [sql`true`];
  if (q.episodeId) parts.push(sql`x.episode_id = ${q.episodeId}`);
  if (q.systemKey) parts.push(q.systemKey === 'none' ? sql`x.system_key is null` : sql`x.system_key = ${q.systemKey}`);
  if (q.supplierId) parts.push(sql`x.supplier_id = ${q.supplierId}`);
  if (q.kind) parts.push(sql`x.kind = ${q.kind}`);
  if (q.status) parts.push(sql`x.status = ${q.status}`);
  if (q.receipt) parts.push(q.receipt === 'missing' ? sql`x.receipt_media_id is null` : sql`x.receipt_media_id is not null`);
  return sql.join(parts, sql` and `);
}

export interface LineRow {
  id: number;
  build_id: number;
  episode_id: number;
  position: number;
  kind: 'part' | 'consumable' | 'tool' | 'service' | 'sale';
  description: string;
  part_number: string | null;
  supplier_id: number | null;
  supplier_name: string | null;
  system_key: string | null;
  at_seconds: number | null;
  source: 'new' | 'used' | 'reconditioned' | 'reused' | 'made';
  status: 'needed' | 'on-order' | 'arrived' | 'fitted' | 'returned';
  quantity: string;
  unit: string;
  unit_price_minor: number;
  currency: string;
  tax_rate_bp: number;
  tax_included: boolean;
  fx_rate: string | null;
  avoided_cost_minor: number | null;
  buy_url: string | null;
  affiliate: boolean;
  open_item_id: number | null;
  open_item_title: string | null;
  receipt_media_id: number | null;
  receipt_content_type: string | null;
  support_kind: 'gifted' | 'discounted' | 'paid' | null;
  sponsor_id: number | null;
  sponsor_slug: string | null;
  sponsor_name: string | null;
  list_price_minor: number | null;
  value_given_minor: number;
  suggested_sponsor_id: number | null;
  suggested_sponsor_slug: string | null;
  suggested_sponsor_name: string | null;
  net_minor: number;
  tax_minor: number;
  gross_minor: number;
  b_net: number | null;
  b_tax: number | null;
  b_gross: number | null;
  b_avoided: number | null;
  episode_number: number;
  episode_title: string;
  episode_slug: string;
  total?: number;
}

/** Lines in scope with their supplier and open item, filtered, sorted and paged on the server. */
export async function listLines(
  db: Db,
  scope: LineScope,
  q: Partial<LedgerQuery> & { limit?: number; offset?: number },
): Promise<{ rows: LineRow[]; total: number }> {
  const sort = SORT_COLUMNS[q.sort ?? 'episode'];
  const dir = q.dir === 'desc' ? 'desc' : 'asc';
  const { rows } = await sql<LineRow>`
    select x.*, s.name as supplier_name, o.title as open_item_title, rm.content_type as receipt_content_type,
           sp.slug as sponsor_slug, sp.name as sponsor_name, ss.sponsor_id as suggested_sponsor_id,
           ssp.slug as suggested_sponsor_slug, ssp.name as suggested_sponsor_name, count(*) over ()::int as total
      from (${convertedLines(scope)}) x
      left join suppliers s on s.id = x.supplier_id
      left join sponsors sp on sp.id = x.sponsor_id
      left join sponsor_suppliers ss on ss.supplier_id = x.supplier_id
      left join sponsors ssp on ssp.id = ss.sponsor_id
      left join open_items o on o.id = x.open_item_id
      left join media rm on rm.id = x.receipt_media_id
     where ${ledgerFilter(q)}
     order by ${sql.raw(`${sort} ${dir} nulls last`)}, x.episode_number, x.position, x.id
     limit ${q.limit ?? 10_000} offset ${q.offset ?? 0}`.execute(db);
  return { rows, total: rows[0]?.total ?? 0 };
}
