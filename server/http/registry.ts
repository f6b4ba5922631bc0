import { Router, type Request, type Response } from 'express';
import type { z } from 'zod';
import type { AppDeps } from '../app-deps';
import { authorize, type Actor, type PolicyAction, type Resource } from '../auth/policy';
import { QUERY_TIMEOUT_MS } from '../db/kysely';
import { requestDb } from '../db/request-gate';
import { HttpError } from './http-error';
import { parse } from './parse';
import type { RateLimitName } from './rate-limit';

export type HttpMethod = 'get' | 'post' | 'put' | 'patch' | 'delete';

type Infer<S> = S extends z.ZodType ? z.infer<S> : undefined;

export interface RouteContext<P, Q, B> {
  req: Request;
  res: Response;
  deps: AppDeps;
  actor: Actor;
  params: P;
  query: Q;
  body: B;
  /** The resource the policy decided on, when the route loads one. */
  resource: Resource | undefined;
}

/** One API route as the registry records it: the policy action and input schemas are data. */
export interface RouteSpec<
  P extends z.ZodType | undefined = z.ZodType | undefined,
  Q extends z.ZodType | undefined = z.ZodType | undefined,
  B extends z.ZodType | undefined = z.ZodType | undefined,
> {
  method: HttpMethod;
  /** Path below /api, in Express syntax: `/builds/:buildId/episodes`. */
  path: string;
  summary: string;
  action: PolicyAction;
  params?: P;
  query?: Q;
  body?: B;
  /** Loads what the action is about from the parsed params; null means 404. */
  resource?: (deps: AppDeps, params: Infer<P>) => Promise<Resource | null>;
  /** Spends one point of each named limit per request, keyed as returned (after validation). */
  rateLimit?: (ctx: { req: Request; body: Infer<B>; actor: Actor }) => Array<[RateLimitName, string]>;
  /**
   * GET only, for answers that are the same whoever asks: identical requests (same address) that
   * arrive while one runs wait for its answer instead of running again (server/services/single-flight.ts).
   */
  shareWhileRunning?: boolean;
  /** Returns the JSON body to send (status 200 unless the handler set another), or sends itself. */
  handler: (ctx: RouteContext<Infer<P>, Infer<Q>, Infer<B>>) => unknown;
}

/** Declares a route; the only way to add an API endpoint. Export it in a `routes/<resource>.ts` list. */
export function defineRoute<
  P extends z.ZodType | undefined = undefined,
  Q extends z.ZodType | undefined = undefined,
  B extends z.ZodType | undefined = undefined,
>(spec: RouteSpec<P, Q, B>): RouteSpec {
  return spec as unknown as RouteSpec;
}

/** The actor for this request, set by the session middleware (`req.actor`). */
export function actorOf(req: Request): Actor {
  return (req as Request & { actor?: Actor }).actor ?? null;
}

/**
 * Builds the /api router from the registry, one order for every route:
 * params → resource (404) → policy (401/403/404) → query and body (400) → rate limit (429) → handler.
 */
export function buildApiRouter(routes: readonly RouteSpec[], deps: AppDeps): Router {
  // Routes are grouped by their first path segment, one sub-router each (registry order kept
  // within a group): a request is matched against its group's few routes instead of trying every
  // route's pattern in turn, which was a noticeable share of a cheap read's CPU (profile, 105 routes).
  const router = Router();
  const groups = new Map<string, Router>();
  for (const spec of routes) {
    const prefix = /^\/[^/:]+/.exec(spec.path)?.[0] ?? '';
    let group = groups.get(prefix);
    if (!group) {
      group = Router();
      groups.set(prefix, group);
      if (prefix) router.use(prefix, group);
      else router.use(group);
    }
    group[spec.method](spec.path.slice(prefix.length) || '/', async (req, res) => {
      const actor = actorOf(req);
      const params = spec.params ? parse(spec.params, req.params, 'params') : undefined;
      let resource: Resource | undefined;
      if (spec.resource) {
        resource = (await spec.resource(deps, params)) ?? undefined;
        if (!resource) throw new HttpError(404, 'not_found', 'Not found');
      }
      authorize(actor, spec.action, resource);
      const query = spec.query ? parse(spec.query, req.query, 'query') : undefined;
      const body = spec.body ? parse(spec.body, req.body ?? {}, 'body') : undefined;
      for (const [name, key] of spec.rateLimit?.({ req, body, actor }) ?? []) await deps.rateLimits.consume(name, key);
      const ctx = { req, res, actor, params, query, body, resource };
      // A read's parallel queries take turns on one pooled connection (db/request-gate.ts), so the
      // pool's queue counts waiting requests and its bound (loadShed) means what it says.
      const run = async () =>
        spec.method === 'get' ? spec.handler({ ...ctx, deps: withRequestDb(deps) }) : spec.handler({ ...ctx, deps });
      const result =
        spec.shareWhileRunning && spec.method === 'get' ? await deps.sharedReads.run(`route:${req.originalUrl}`, run) : await run();
      if (!res.headersSent) {
        if (result === undefined) res.status(res.statusCode === 200 ? 204 : res.statusCode).end();
        else res.json(result);
      }
    });
  }
  return router;
}

/** `deps` whose `db` is the request's own (db/request-gate.ts), made on first use: an answer from a cache needs none. */
function withRequestDb(deps: AppDeps): AppDeps {
  let db: AppDeps['db'] | undefined;
  return Object.defineProperty({ ...deps }, 'db', {
    get: () => (db ??= requestDb(deps.pool, QUERY_TIMEOUT_MS)),
    enumerable: true,
    configurable: true,
  });
}
