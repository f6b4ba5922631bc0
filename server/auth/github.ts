import { Router, type Request } from 'express';
import passport from 'passport';
import { Strategy as GitHubStrategy, type Profile } from 'passport-github2';
import { returnTo as returnToSchema } from '../../src/shared/schemas/accounts';
import type { AppDeps } from '../app-deps';
import { HttpError } from '../http/http-error';
import { signInWithGithub } from '../services/accounts';
import { signInSession } from './session';

declare module 'express-session' {
  interface SessionData {
    returnTo?: string;
  }
}

/** Provider URLs from config; unset means GitHub itself (passport-github2's defaults). */
function providerUrls(c: AppDeps['config']) {
  return {
    ...(c.GITHUB_AUTHORIZATION_URL ? { authorizationURL: c.GITHUB_AUTHORIZATION_URL } : {}),
    ...(c.GITHUB_TOKEN_URL ? { tokenURL: c.GITHUB_TOKEN_URL } : {}),
    ...(c.GITHUB_USER_PROFILE_URL ? { userProfileURL: c.GITHUB_USER_PROFILE_URL } : {}),
    ...(c.GITHUB_USER_EMAIL_URL ? { userEmailURL: c.GITHUB_USER_EMAIL_URL } : {}),
  };
}

function safeReturnTo(value: unknown): string {
  const parsed = returnToSchema.safeParse(value);
  return parsed.success ? parsed.data : '/';
}

/** `/auth/github` and its callback: passport-github2's real OAuth flow (state checked in the session). */
export function githubAuthRouter(deps: AppDeps): Router {
  const pass = new passport.Passport();
  pass.use(
    'github',
    new GitHubStrategy(
      {
        clientID: deps.config.GITHUB_CLIENT_ID,
        clientSecret: deps.config.GITHUB_CLIENT_SECRET,
        callbackURL: `${deps.config.PUBLIC_URL}/auth/github/callback`,
        scope: ['user:email'],
        ...providerUrls(deps.config),
        // passport-oauth2 keeps a per-flow nonce in the session and checks it on the callback.
        ...({ state: true } as Record<string, unknown>),
      },
      (_access: string, _refresh: string, profile: Profile, done: (err: unknown, user?: Profile) => void) => done(null, profile),
    ),
  );
  const router = Router();
  router.use(pass.initialize());

  router.get('/github', async (req, res, next) => {
    await deps.rateLimits.consume('sign-in', req.ip ?? 'unknown');
    req.session.returnTo = safeReturnTo(req.query.returnTo);
    pass.authenticate('github', { session: false })(req, res, next);
  });

  router.get('/github/callback', (req: Request, res, next) => {
    pass.authenticate('github', { session: false }, async (err: unknown, profile: Profile | false) => {
      if (err || !profile) {
        req.log?.warn({ err }, 'GitHub sign-in failed');
        return res.redirect(303, '/sign-in?error=github');
      }
      const returnTo = safeReturnTo(req.session.returnTo);
      try {
        const userId = await signInWithGithub(deps.db, {
          githubId: String(profile.id),
          login: profile.username ?? `github-${profile.id}`,
          displayName: profile.displayName || profile.username || '',
          email: profile.emails?.[0]?.value ?? null,
          avatarUrl: profile.photos?.[0]?.value ?? null,
        });
        await signInSession(req, userId);
        res.redirect(303, returnTo);
      } catch (e) {
        if (e instanceof HttpError && e.code === 'account_suspended') return res.redirect(303, '/sign-in?error=suspended');
        next(e);
      }
    })(req, res, next);
  });
  return router;
}
