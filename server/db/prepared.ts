import { createHash } from 'node:crypto';
import type { CompiledQuery, Kysely, QueryResult } from 'kysely';
import type pg from 'pg';

/**
 * Hot statements that PostgreSQL should plan once per connection instead of on every run.
 *
 * Kysely sends every statement unnamed, so PostgreSQL parses and plans it each time. For a large
 * statement that is most of its cost: the episode read (a dozen JSON subqueries) spent 5.4 ms
 * planning and 1–2 ms executing (EXPLAIN ANALYZE on the bench dataset). A statement whose SQL text
 * is registered here is sent as a named prepared statement instead; after a few runs PostgreSQL
 * keeps a generic plan for it and skips planning (see PostgreSQL's PREPARE, "plan_cache_mode").
 * Only fixed texts belong here (one per code path), so each connection holds a handful of plans.
 */
const names = new Map<string, string>();

/** Registers a statement's exact SQL text; returns the name it is prepared under. */
export function preparedStatement(sqlText: string): string {
  let name = names.get(sqlText);
  if (!name) {
    name = `rr_${createHash('sha1').update(sqlText).digest('hex').slice(0, 24)}`;
    names.set(sqlText, name);
  }
  return name;
}

type QueryFn = (...args: unknown[]) => unknown;

/** Wraps a pooled client's `query` so registered texts go out as named statements (pool 'connect'). */
export function nameRegisteredStatements(client: pg.PoolClient): void {
  const query = client.query.bind(client) as QueryFn;
  (client as unknown as { query: QueryFn }).query = (...args: unknown[]) => {
    const [text, values, ...rest] = args;
    const name = typeof text === 'string' ? names.get(text) : undefined;
    if (name && (values === undefined || Array.isArray(values))) return query({ name, text, values }, ...rest);
    return query(...args);
  };
}

// A stand-in id no real row has, swapped for the real one at run time.
const STAND_IN_ID = -7_357_001;

/**
 * A hot single-id query, built and compiled by Kysely once (with a stand-in id) and then run as a
 * named prepared statement with the real id: building and compiling a query of many nodes on every
 * request cost more CPU than PostgreSQL spent answering it (CPU profile of the episode read).
 */
export function compiledById<D, R>(build: (db: Kysely<D>, id: number) => { compile(): CompiledQuery<R> }) {
  let compiled: CompiledQuery<R> | undefined;
  return (db: Kysely<D>, id: number): Promise<QueryResult<R>> => {
    if (!compiled) {
      compiled = build(db, STAND_IN_ID).compile();
      preparedStatement(compiled.sql);
    }
    const c = compiled;
    return db.executeQuery<R>({ ...c, parameters: c.parameters.map((p) => (p === STAND_IN_ID ? id : p)) });
  };
}
