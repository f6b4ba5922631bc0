// An aggregate endpoint against the same SQL run directly through `pg`: the statements the endpoint
// sent are read from the bench-mode query log, then replayed on a pool of their own, all at once
// (the fastest the database can answer them: the strict comparison).
import pg from 'pg';
import { queryLog, quiet } from './load';

export interface AggregateResult {
  name: string;
  ms: number;
  raw_sql_ms: number;
  ratio: number;
  statements: number;
  /** Each statement's plan uses an index somewhere (EXPLAIN). */
  index_use: boolean[];
  /** For an endpoint with a cache: the median time of a request answered from it. */
  cached_ms?: number;
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;

/**
 * The median time of `runs` sequential requests to `url`, and the same SQL replayed through pg.
 * `headers` carries a session cookie for endpoints that are not public (the sponsor summary).
 * `invalidate`, for an endpoint that keeps its answer (the build's totals, per content revision),
 * runs before each timed request and before the one whose statements are read: the comparison is
 * of the endpoint computing its answer; the cached answer's time is reported beside it.
 */
export async function timeAggregate(
  name: string,
  baseUrl: string,
  databaseUrl: string,
  path: string,
  runs = 15,
  headers: Record<string, string> = {},
  invalidate?: () => Promise<void>,
): Promise<AggregateResult> {
  const url = `${baseUrl}${path}`;
  const get = () => fetch(url, { headers });
  const warm = await get();
  if (!warm.ok) throw new Error(`${path} answered ${warm.status}`);
  await warm.arrayBuffer();
  await quiet(baseUrl);
  await invalidate?.();
  const before = (await queryLog(baseUrl)).queries;
  await (await get()).arrayBuffer();
  // Reads only: anything else in the window (a late write of an earlier case) is not this endpoint's.
  const statements = (await queryLog(baseUrl, before)).log.filter((s) => /^\s*(select|with)\b/i.test(s.text));

  const endpoint: number[] = [];
  const cached: number[] = [];
  for (let i = 0; i < runs; i += 1) {
    await invalidate?.();
    const t0 = performance.now();
    await (await get()).arrayBuffer();
    endpoint.push(performance.now() - t0);
    if (invalidate) {
      const t1 = performance.now();
      await (await get()).arrayBuffer();
      cached.push(performance.now() - t1);
    }
  }

  const pool = new pg.Pool({ connectionString: databaseUrl, max: Math.max(1, statements.length) });
  try {
    const replay = () => Promise.all(statements.map((s) => pool.query(s.text, s.values)));
    await replay();
    const raw: number[] = [];
    for (let i = 0; i < runs; i += 1) {
      const t0 = performance.now();
      await replay();
      raw.push(performance.now() - t0);
    }
    const index_use: boolean[] = [];
    for (const s of statements) {
      const plan = await pool.query<{ 'QUERY PLAN': string }>(`explain ${s.text}`, s.values);
      index_use.push(plan.rows.some((r) => /Index (Only )?Scan|Bitmap Index Scan/.test(r['QUERY PLAN'])));
    }
    const ms = median(endpoint);
    const rawMs = median(raw);
    return {
      name,
      ms: round(ms),
      raw_sql_ms: round(rawMs),
      ratio: round(ms / rawMs),
      statements: statements.length,
      index_use,
      ...(cached.length ? { cached_ms: round(median(cached)) } : {}),
    };
  } finally {
    await pool.end();
  }
}

const round = (x: number) => Math.round(x * 100) / 100;
