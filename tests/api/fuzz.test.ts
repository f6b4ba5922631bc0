// Hostile and malformed input against every route in the registry, as an actor the authorisation
// matrix allows (signed in, CSRF token sent), so requests get past the policy and reach validation.
// Every request is invalid by construction — a params value, query value or body field that its
// own schema refuses or that holds text PostgreSQL cannot store, an oversize or malformed body — so
// every answer must be 4xx JSON in the standard error shape, never 5xx or a stack trace, and a
// rejected write must change no row (table counts and checksums compared around each route).
// A new route needs only its row in tests/helpers/route-world.ts (the matrix reads it too).
// FUZZ_RUNS sets the random cases per route and input (default 10); FUZZ_SEED replays a run.
import fc from 'fast-check';
import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { z } from 'zod';
import type { RouteSpec } from '../../server/http/registry';
import { unstorableTextPaths } from '../../server/http/parse';
import { routeRegistry } from '../../server/routes';
import { apiErrorBody } from '../../src/shared/schemas/common';
import { ACTORS, makeWorld, routeMatrix, type ActorName, type World } from '../helpers/route-world';
import { startTestApp, type TestApp } from '../helpers/test-app';

const RUNS = Number(process.env.FUZZ_RUNS ?? 10);
const SEED = Number(process.env.FUZZ_SEED ?? Date.now() % 2 ** 31);
/** Tables that change on any request (sessions, rate-limit counters) are left out of the checksums. */
const VOLATILE_TABLES = new Set(['sessions', 'rate_limits']);
const STACK_TRACE = /\bat [\w.<>]+ \(|node_modules|\.tsx?:\d+:\d+|Error: .*\n\s+at /;

type Part = 'params' | 'query' | 'body';
interface FuzzCase {
  part: Part | 'raw';
  label: string;
  path: string;
  /** JSON body (serialised), or a raw string sent as application/json. */
  body?: unknown;
  raw?: string;
}
interface Finding {
  route: string;
  case: FuzzCase;
  status: number;
  why: string;
  text: string;
}

// ---- arbitraries ---------------------------------------------------------------------------

const nul = fc.tuple(fc.string({ maxLength: 8 }), fc.string({ maxLength: 8 })).map(([a, b]) => `${a}\u0000${b}`);
const loneSurrogate = fc
  .tuple(fc.string({ maxLength: 8 }), fc.constantFrom('\uD800', '\uDBFF', '\uDC00', '\uDFFF'))
  .map(([a, s]) => `${a}${s}x`);
/** Text no column can store: every string field given one of these must answer 400 naming it. */
const poison = fc.oneof(nul, loneSurrogate);
const shortEdgeText = fc.oneof(
  fc.string({ unit: 'grapheme', maxLength: 40 }),
  fc.string({ unit: 'binary', maxLength: 40 }),
  fc.string({ maxLength: 20 }).map((s) => `\u202E${s}\u200F\u200E`), // right-to-left override and marks
  fc.constantFrom(
    '',
    ' ',
    '\uFEFF',
    '\u0085',
    '\u2028',
    'NaN',
    'null',
    '-1',
    "'; drop table users; --",
    '../../etc/passwd',
    '%00',
    '{{7*7}}',
  ),
  fc.integer({ min: 300, max: 2_000 }).map((n) => 'ä'.repeat(n)), // long, yet within Node's 16 KB for the request line
);
/** In bodies, strings may be huge (up to 200,000 characters, under the 1 MB body limit). */
const edgeText = fc.oneof(
  shortEdgeText,
  fc.integer({ min: 2_000, max: 200_000 }).map((n) => 'ä'.repeat(n)),
);
const deep = fc.integer({ min: 50, max: 3_000 }).map((depth) => {
  let v: unknown = 'bottom';
  for (let i = 0; i < depth; i += 1) v = i % 2 ? [v] : { a: v };
  return v;
});
const anyValue: fc.Arbitrary<unknown> = fc.oneof(
  { weight: 3, arbitrary: fc.anything({ maxDepth: 3, maxKeys: 4 }) },
  { weight: 3, arbitrary: edgeText },
  { weight: 1, arbitrary: fc.constantFrom(-1, 0, 1.5, 2 ** 53 + 2, -(2 ** 63), 1e308, true, false, null, [], {}) },
  { weight: 1, arbitrary: deep },
);
const badIdText = fc.oneof(
  fc.constantFrom('0', '-1', '1.5', 'abc', '9007199254740993', '99999999999999999999999', '1e400', ' 1', '0x10', 'Infinity', '%', '%%'),
  // Not '', '.' or '..': those make another path, not a bad value.
  fc.string({ unit: 'grapheme', minLength: 1, maxLength: 30 }).filter((v) => v !== '.' && v !== '..'),
  fc.integer({ min: 2 ** 40, max: 2 ** 50 }).map(String), // an id that does not exist
  poison,
  fc.integer({ min: 300, max: 3_000 }).map((n) => 'x'.repeat(n)),
);

/** Zod 4 object schemas expose their fields; refinements keep the shape. */
function shapeOf(schema: z.ZodType | undefined): Record<string, z.ZodType> {
  const s = schema as unknown as { shape?: Record<string, z.ZodType>; _zod?: { def?: { in?: z.ZodType; innerType?: z.ZodType } } };
  if (!s) return {};
  if (s.shape) return s.shape;
  const inner = s._zod?.def?.in ?? s._zod?.def?.innerType;
  return inner ? shapeOf(inner) : {};
}

const accepts = (field: z.ZodType | undefined, v: unknown) => !!field && field.safeParse(v).success;

/**
 * Encodes a path segment or query value. Lone surrogates cannot be percent-encoded, so they go as
 * bytes that are not UTF-8 (which arrive as U+FFFD or a decoding error): in a URL only NUL (%00) is
 * text no column can store.
 */
function segment(value: string): string {
  try {
    return encodeURIComponent(value);
  } catch {
    return value.replace(/[\uD800-\uDFFF]/g, '%ED%A0%80').replace(/[^%A-Za-z0-9]/g, (c) => encodeURIComponent(c));
  }
}

function query(pairs: Array<[string, string]>): string {
  return pairs.map(([k, v]) => `${segment(k)}=${segment(v)}`).join('&');
}

/** Builds the random cases for one route: bad params, bad query values, bad bodies. */
function casesFor(spec: RouteSpec, basePath: string, seed: number): FuzzCase[] {
  const [pathOnly, baseQuery = ''] = basePath.split('?');
  const template = spec.path.split('/');
  const concrete = pathOnly!.replace(/^\/api/, '').split('/');
  const paramIdx = template.map((seg, i) => (seg.startsWith(':') ? i : -1)).filter((i) => i >= 0);
  const withParam = (i: number, v: string) => `/api${concrete.map((seg, j) => (j === i ? segment(v) : seg)).join('/')}`;
  const cases: FuzzCase[] = [];
  const sample = <T>(arb: fc.Arbitrary<T>, n = RUNS) => fc.sample(arb, { numRuns: n, seed: seed + cases.length });

  if (paramIdx.length) {
    const paramShape = shapeOf(spec.params);
    const arb = fc.tuple(fc.constantFrom(...paramIdx), badIdText).filter(([i, v]) => {
      const name = template[i]!.slice(1);
      // A value its schema accepts must name nothing that exists: a huge id, or a random handle or slug.
      return !accepts(paramShape[name], v) || /^\d{13,}$/.test(v.trim()) || Number.isNaN(Number(v));
    });
    for (const [i, v] of sample(arb))
      cases.push({
        part: 'params',
        label: `${template[i]} = ${JSON.stringify(v.slice(0, 40))}`,
        path: withParam(i, v),
        body: bodyFor(spec),
      });
  }

  const qShape = shapeOf(spec.query);
  const qKeys = Object.keys(qShape);
  if (qKeys.length) {
    const refused = fc
      .tuple(fc.constantFrom(...qKeys), fc.oneof(shortEdgeText, badIdText, poison))
      .filter(([k, v]) => !accepts(qShape[k], v) || v.includes('\u0000'));
    const extras = fc.array(fc.tuple(fc.string({ maxLength: 10 }), fc.oneof(shortEdgeText, badIdText)), { maxLength: 3 });
    for (const [[k, v], more] of sample(fc.tuple(refused, extras))) {
      const pairs: Array<[string, string]> = [...more.filter(([mk]) => !qKeys.includes(mk)), [k, v]];
      const qs = [baseQuery, query(pairs)].filter(Boolean).join('&');
      cases.push({ part: 'query', label: `?${k} = ${JSON.stringify(v.slice(0, 40))}`, path: `${pathOnly}?${qs}`, body: bodyFor(spec) });
    }
  }

  if (spec.body) {
    const bShape = shapeOf(spec.body);
    const bKeys = Object.keys(bShape);
    // One field gets a value its own schema refuses (or text no column can store); the others
    // random values or nothing; plus keys the schema does not know.
    const bad = bKeys.length
      ? fc
          .tuple(fc.constantFrom(...bKeys), fc.oneof(anyValue, poison))
          .filter(([k, v]) => !accepts(bShape[k], v) || unstorableTextPaths(v).length > 0)
      : fc.constant(['junk', 1] as [string, unknown]);
    const others = fc.dictionary(fc.constantFrom(...(bKeys.length ? bKeys : ['x'])), anyValue, { maxKeys: bKeys.length });
    const extra = fc.dictionary(
      fc.string({ maxLength: 12 }).filter((k) => !bKeys.includes(k) && k !== '__proto__'),
      anyValue,
      { maxKeys: 3 },
    );
    const objectBody = fc.tuple(bad, others, extra).map(([[k, v], o, e]) => ({ label: `body.${k} bad`, body: { ...e, ...o, [k]: v } }));
    const notObject = fc
      .oneof(fc.array(anyValue, { maxLength: 3 }), fc.constant(null), fc.integer(), fc.string())
      .map((body) => ({ label: `body is ${Array.isArray(body) ? 'an array' : typeof body}`, body }));
    for (const c of sample(fc.oneof({ weight: 5, arbitrary: objectBody }, { weight: 1, arbitrary: notObject })))
      cases.push({ part: 'body', label: c.label, path: basePath, body: c.body });
    // Fixed hostile bodies: malformed JSON, deep nesting, over the 1 MB limit.
    cases.push({ part: 'raw', label: 'malformed JSON', path: basePath, raw: '{"title": "unterminated' });
    cases.push({
      part: 'raw',
      label: 'deeply nested JSON (20,000 levels)',
      path: basePath,
      raw: `${'['.repeat(20_000)}${']'.repeat(20_000)}`,
    });
    cases.push({ part: 'raw', label: 'body over 1 MB', path: basePath, raw: JSON.stringify({ title: 'x'.repeat(1_200_000) }) });
  }
  return cases;
}

/** A body the route's schema refuses (the matrix row's), for params and query cases of write routes. */
function bodyFor(spec: RouteSpec): unknown {
  return spec.body ? { junk: '\u0000' } : undefined;
}

/** The actor the matrix lets through the policy: the first whose expected status is not 401–404. */
function allowedActor(route: string): ActorName {
  const row = routeMatrix[route]!.expect;
  const actor = ACTORS.find((a) => row[a] < 401 || row[a] > 404);
  if (!actor) throw new Error(`${route}: its matrix row allows no actor, so the fuzz suite cannot reach its validation`);
  return actor;
}

let app: TestApp;
let world: World;
let tables: string[];
beforeAll(async () => {
  app = await startTestApp({ env: { RATE_LIMIT_MULTIPLIER: '1000' } });
  world = await makeWorld(app);
  const rows = await sql<{ name: string }>`select table_name as name from information_schema.tables
    where table_schema = 'public' and table_type = 'BASE TABLE' order by 1`.execute(app.deps.db);
  tables = rows.rows.map((r) => r.name).filter((t) => !VOLATILE_TABLES.has(t));
});
afterAll(async () => {
  await app?.stop();
});

/** Row count and an md5 over every row's text, per table. */
async function checksums(): Promise<Record<string, string>> {
  const q = tables
    .map(
      (t) => `select '${t}' as t, count(*)::text || ':' || coalesce(md5(string_agg(x::text, '|' order by x::text)), '') as c from "${t}" x`,
    )
    .join(' union all ');
  const { rows } = await sql<{ t: string; c: string }>`${sql.raw(q)}`.execute(app.deps.db);
  return Object.fromEntries(rows.map((r) => [r.t, r.c]));
}

describe('fuzz: every route refuses hostile and malformed input', () => {
  it('has a fuzz declaration (a matrix row with an allowed actor) for every route in the registry', () => {
    const missing = routeRegistry.map((r) => `${r.method.toUpperCase()} ${r.path}`).filter((k) => !routeMatrix[k]);
    expect(
      missing,
      `routes without a row in routeMatrix (tests/helpers/route-world.ts); add one naming the request and the status per actor: ${missing.join(', ')}`,
    ).toEqual([]);
    for (const r of routeRegistry) allowedActor(`${r.method.toUpperCase()} ${r.path}`);
  });

  it('refuses text PostgreSQL cannot store with 400 naming the field (found by this suite: NUL in a string was a 500)', async () => {
    const owner = world.clients.owner;
    const before = await checksums();
    const nulTitle = await owner.post('/api/builds', { title: 'Hatch\u0000back', vehicleKind: 'car' });
    expect(nulTitle.status).toBe(400);
    expect(nulTitle.body.error.fields).toHaveProperty('title');
    const surrogate = await owner.post('/api/suppliers', { name: 'Salvage \uD800yard' });
    expect(surrogate.status).toBe(400);
    expect(surrogate.body.error.fields).toHaveProperty('name');
    const handle = await owner.delete(`/api/creators/${encodeURIComponent('a\u0000b')}/follow`);
    expect(handle.status).toBe(400);
    expect(handle.body.error.fields).toHaveProperty('handle');
    expect(await checksums()).toEqual(before);
  });

  it(
    'answers every fuzzed request with a 4xx JSON error, mostly 400, and rejected writes change nothing',
    { timeout: 240_000 },
    async () => {
      const started = Date.now();
      const findings: Finding[] = [];
      const statusCounts = new Map<number, number>();
      const skipped: string[] = [];
      let sent = 0;
      for (const [n, spec] of routeRegistry.entries()) {
        const route = `${spec.method.toUpperCase()} ${spec.path}`;
        const entry = routeMatrix[route]!;
        const actor = allowedActor(route);
        const client = world.clients[actor];
        const cases = casesFor(spec, entry.request(world).path, SEED + n * 1000);
        if (!cases.length) {
          skipped.push(route);
          continue;
        }
        const before = await checksums();
        for (const c of cases) {
          const res = await client.rawRequest(
            spec.method.toUpperCase(),
            c.path,
            c.raw ?? (c.body === undefined ? undefined : JSON.stringify(c.body)),
          );
          sent += 1;
          statusCounts.set(res.status, (statusCounts.get(res.status) ?? 0) + 1);
          const why = problem(res, c, spec);
          if (why) findings.push({ route, case: c, status: res.status, why, text: res.text.slice(0, 300) });
        }
        const after = await checksums();
        const changed = tables.filter((t) => before[t] !== after[t]);
        if (changed.length)
          findings.push({ route, case: cases[0]!, status: 0, why: `rejected requests changed rows in ${changed.join(', ')}`, text: '' });
      }
      const count400 = statusCounts.get(400) ?? 0;
      const byStatus = [...statusCounts.entries()]
        .sort(([a], [b]) => a - b)
        .map(([s, c]) => `${s}×${c}`)
        .join(', ');
      console.log(
        `[fuzz] seed ${SEED}, ${RUNS} runs per input: ${sent} requests over ${routeRegistry.length - skipped.length} routes in ${((Date.now() - started) / 1000).toFixed(1)} s; statuses ${byStatus}; ${findings.length} findings`,
      );
      if (skipped.length) console.log(`[fuzz] routes that take no input (nothing to fuzz): ${skipped.join(', ')}`);
      for (const f of findings.slice(0, 20)) console.log(`[fuzz] FINDING ${f.route} [${f.case.label}] → ${f.status}: ${f.why} ${f.text}`);
      expect(findings.map((f) => `${f.route} [${f.case.label}] → ${f.status}: ${f.why}`)).toEqual([]);
      // Most refusals come from validation (400); the rest are 404 (ids that name nothing) and 413.
      expect(count400 / sent).toBeGreaterThan(0.75);
    },
  );
});

function problem(res: { status: number; text: string; contentType: string }, c: FuzzCase, spec: RouteSpec): string | null {
  if (res.status >= 500) return 'server error';
  if (res.status < 400) return 'accepted an invalid request';
  if (STACK_TRACE.test(res.text)) return 'stack trace in the response';
  if (!res.contentType.includes('application/json')) return `not JSON (${res.contentType})`;
  let body: unknown;
  try {
    body = JSON.parse(res.text);
  } catch {
    return 'body is not JSON';
  }
  if (!apiErrorBody.safeParse(body).success) return 'not the standard error shape';
  // Text no column can store is named as the field it was in.
  if (c.part === 'body' && res.status === 400 && spec.body && typeof c.body === 'object' && c.body && !Array.isArray(c.body)) {
    const fields = (body as { error: { fields?: Record<string, string[]> } }).error.fields;
    if (!fields || Object.keys(fields).length === 0) return '400 without naming a field';
  }
  return null;
}
