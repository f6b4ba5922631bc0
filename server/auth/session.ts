import connectPgSimple from 'connect-pg-simple';
import type { Request, RequestHandler } from 'express';
import session from 'express-session';
import type pg from 'pg';
import type { Config } from '../config';
import { SESSION_COOKIE } from '../../src/shared/http';

export { SESSION_COOKIE };

/**
 * Sessions live in PostgreSQL so any server process can serve any request. No row is written
 * until something is stored in the session (sign-in, a CSRF token, OAuth state).
 */
export function sessionMiddleware(pool: pg.Pool, config: Config) {
  const PgStore = connectPgSimple(session);
  return session({
    // No touch: the cookie's expiry is fixed when the session starts (not rolling), so moving the
    // row's expiry on every request bought nothing and cost a write per signed-in request — and a
    // touch that failed (database restarting) reached the error handler after the response.
    store: new PgStore({ pool, tableName: 'sessions', createTableIfMissing: false, pruneSessionInterval: false, disableTouch: true }),
    name: SESSION_COOKIE,
    secret: config.SESSION_SECRET,
    resave: false,
    saveUninitialized: false,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: config.PUBLIC_URL.startsWith('https:'),
      maxAge: config.SESSION_MAX_AGE_DAYS * 24 * 3600 * 1000,
    },
  });
}

/** Starts a fresh session for a signed-in account (a new id, so a planted one is useless). */
export function signInSession(req: Request, userId: number): Promise<void> {
  return new Promise((resolve, reject) => {
    req.session.regenerate((err) => {
      if (err) return reject(err);
      req.session.userId = userId;
      req.session.save((saveErr) => (saveErr ? reject(saveErr) : resolve()));
    });
  });
}

/** Ends the session and its row. */
export function endSession(req: Request): Promise<void> {
  return new Promise((resolve, reject) => req.session.destroy((err) => (err ? reject(err) : resolve())));
}

/**
 * The session middleware, skipped for a visitor's read: a GET or HEAD without our cookie can have no
 * session, and starting one in memory (a random id, a hash of it at the end) only to throw it away
 * was a tenth of an anonymous episode read's CPU. `starts` names the reads that do start one (the
 * CSRF token). Everything downstream already treats a missing session as a visitor.
 */
export function sessionsWhereNeeded(sessions: RequestHandler, starts: (req: Request) => boolean): RequestHandler {
  const marker = `${SESSION_COOKIE}=`;
  return (req, res, next) => {
    const safe = req.method === 'GET' || req.method === 'HEAD';
    if (safe && !req.headers.cookie?.includes(marker) && !starts(req)) return next();
    return sessions(req, res, next);
  };
}
