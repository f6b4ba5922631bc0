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
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;

/**
 * The median time of `runs` sequential requests to `url`, and the same SQL replayed through pg.
 * `headers` carries a session cookie for endpoints that are not public (the sponsor summary).
 */
export async function timeAggregate(
  name: string,
  baseUrl: string,
  databaseUrl: string,
  path: string,
  runs = 15,
  headers: Record<string, string> = {},
): Promise<AggregateResult> {
  const url = `${baseUrl}${path}`;
  const get = () => fetch(url, { headers });
  const warm = await get();
  if (!warm.ok) throw new Error(`${path} answered ${warm.status}`);
  await warm.arrayBuffer();
  await quiet(baseUrl);
  const before = (await queryLog(baseUrl)).queries;
  await (await get()).arrayBuffer();
  // Reads only: anything else in the window (a late write of an earlier case) is not this endpoint's.
  const statements = (await queryLog(baseUrl, before)).log.filter((s) => /^\s*(select|with)\b/i.test(s.text));

  const endpoint: number[] = [];
  for (let i = 0; i < runs; i += 1) {
    const t0 = performance.now();
    await (await get()).arrayBuffer();
    endpoint.push(performance.now() - t0);
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
    return { name, ms: round(ms), raw_sql_ms: round(rawMs), ratio: round(ms / rawMs), statements: statements.length, index_use };
  } finally {
    await pool.end();
  }
}

const round = (x: number) => Math.round(x * 100) / 100;
