import { Router, type Request, type Response } from 'express';
import type { z } from 'zod';
import type { AppDeps } from '../app-deps';
import { authorize, type Actor, type PolicyAction } from '../auth/policy';
import { parse } from './parse';

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

/** The actor for this request; the accounts feature sets `req.actor` from the session. */
export function actorOf(req: Request): Actor {
  return (req as Request & { actor?: Actor }).actor ?? null;
}

/** Builds the /api router from the registry: authorise → validate → handle → present. */
export function buildApiRouter(routes: readonly RouteSpec[], deps: AppDeps): Router {
  const router = Router();
  for (const spec of routes) {
    router[spec.method](spec.path, async (req, res) => {
      const actor = actorOf(req);
      authorize(actor, spec.action);
      const params = spec.params ? parse(spec.params, req.params, 'params') : undefined;
      const query = spec.query ? parse(spec.query, req.query, 'query') : undefined;
      const body = spec.body ? parse(spec.body, req.body ?? {}, 'body') : undefined;
      const result = await spec.handler({ req, res, deps, actor, params, query, body });
      if (!res.headersSent) {
        if (result === undefined) res.status(res.statusCode === 200 ? 204 : res.statusCode).end();
        else res.json(result);
      }
    });
  }
  return router;
}
