import type { RouteSpec } from '../http/registry';
import { episodeRoutes } from './episodes';
import { healthRoutes } from './health';

/** The route registry: every API route, in one list that the authorisation matrix and fuzzers read. */
export const routeRegistry: readonly RouteSpec[] = [...healthRoutes, ...episodeRoutes];
