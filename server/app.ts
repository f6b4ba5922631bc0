import path from 'node:path';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import type { AppDeps } from './app-deps';
import { actorMiddleware } from './auth/actor';
import { githubAuthRouter } from './auth/github';
import { sessionMiddleware, sessionsWhereNeeded } from './auth/session';
import { csrf } from './http/csrf';
import { loadShed } from './http/load-shed';
import { QueryCounter } from './db/query-count';
import { apiNotFound, errorHandler } from './http/error-handler';
import { buildApiRouter } from './http/registry';
import { routeRegistry } from './routes';
import { feedRouter } from './feeds/atom';
import { filesRouter } from './media/files';
import { createPageRenderer, distPaths } from './ssr/page-renderer';

/** Express's trust-proxy value from config: a hop count, true/false, or names/addresses. */
function trustProxy(value: string): boolean | number | string {
  if (/^\d+$/.test(value)) return Number(value);
  if (value === 'true' || value === 'false') return value === 'true';
  return value;
}

function avatarOrigin(config: AppDeps['config']): string {
  return config.GITHUB_USER_PROFILE_URL ? new URL(config.GITHUB_USER_PROFILE_URL).origin : 'https://avatars.githubusercontent.com';
}

/** Hides the value of any `token=` (plain or percent-encoded) in a logged URL. */
export function redactTokens(url: string | undefined): string | undefined {
  return url?.replace(/(token(?:=|%3D))[^&#\s]*/gi, '$1[redacted]');
}

/** Builds the Express app from its dependencies; listening is the caller's business. */
export function createApp(deps: AppDeps): Express {
  const { config } = deps;
  const app = express();
  app.disable('x-powered-by');

  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          'default-src': ["'self'"],
          // No inline script anywhere: hydration data travels as JSON in a non-executable tag.
          'script-src': ["'self'"],
          'style-src': ["'self'"],
          // Avatars come from the sign-in provider (GitHub's avatar host, or the local stand-in).
          'img-src': ["'self'", 'data:', 'blob:', avatarOrigin(config)],
          'font-src': ["'self'"],
          'connect-src': ["'self'"],
          'form-action': ["'self'"],
          'frame-ancestors': ["'none'"],
          'object-src': ["'none'"],
          // Local HTTP on loopback must not be upgraded to HTTPS.
          'upgrade-insecure-requests': config.NODE_ENV === 'production' && config.PUBLIC_URL.startsWith('https:') ? [] : null,
        },
      },
      strictTransportSecurity: config.PUBLIC_URL.startsWith('https:'),
    }),
  );
  // The request log costs a child logger and serialisers per request (7 % of an anonymous read's
  // CPU): when the level would drop it anyway, requests just carry the app's logger.
  if (deps.logger.isLevelEnabled('info')) {
    app.use(
      pinoHttp({
        logger: deps.logger,
        autoLogging: { ignore: (req) => req.url === '/api/health' },
        // Link tokens can ride in a return path (`?returnTo=/invitations/accept%23token%3D…`).
        serializers: { req: (req: { url?: string }) => ({ ...req, url: redactTokens(req.url), query: undefined }) },
      }),
    );
  } else {
    app.use((req, _res, next) => {
      req.log = deps.logger;
      next();
    });
  }

  app.set('trust proxy', trustProxy(config.TRUST_PROXY));
  if (config.BENCH_QUERY_COUNT) app.use(new QueryCounter(deps.pool).router());
  app.use(loadShed(deps.pool, config.DATABASE_QUEUE_MAX));
  const sessions = sessionMiddleware(deps.pool, config);
  const actor = actorMiddleware(deps.db);

  const api = express.Router();
  api.use(express.json({ limit: '1mb' }));
  api.use(
    sessionsWhereNeeded(sessions, (req) => req.path === '/csrf-token'),
    actor,
    csrf.csrfSynchronisedProtection,
  );
  api.use(buildApiRouter(routeRegistry, deps));
  api.use(apiNotFound);
  app.use('/api', api);
  app.use('/auth', sessions, githubAuthRouter(deps));

  app.use(feedRouter(deps));
  app.use(filesRouter(deps, [sessions, actor]));

  const { client } = distPaths(config.DIST_DIR);
  // Hashed assets never change under their name: cache them for a year.
  app.use('/assets', express.static(path.join(client, 'assets'), { immutable: true, maxAge: '365d', index: false, fallthrough: false }));
  app.use(express.static(client, { index: false, maxAge: config.NODE_ENV === 'production' ? '1h' : 0 }));
  app.get('/{*splat}', createPageRenderer(config.DIST_DIR, config.PUBLIC_URL, deps.pageCache));

  app.use(errorHandler);
  return app;
}
