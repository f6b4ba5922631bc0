import type { NextFunction, Request, Response } from 'express';
import type {} from 'express-session';
import type { BuildRole } from '../db/database';
import type { Db } from '../db/kysely';

/** A signed-in account with its memberships, loaded once per request. */
export interface SignedIn {
  userId: number;
  isAdmin: boolean;
  builds: ReadonlyMap<number, BuildRole>;
  sponsors: ReadonlySet<number>;
}

/** Who is making a request: a signed-in account, or null for a visitor. */
export type Actor = SignedIn | null;

declare module 'express-session' {
  interface SessionData {
    userId?: number;
  }
}

/** Loads the actor for a user id; null when the account is missing, suspended or deleted. */
export async function loadActor(db: Db, userId: number): Promise<Actor> {
  const user = await db
    .selectFrom('users')
    .select(['id', 'is_admin'])
    .where('id', '=', userId)
    .where('suspended_at', 'is', null)
    .where('deleted_at', 'is', null)
    .executeTakeFirst();
  if (!user) return null;
  const [builds, sponsors] = await Promise.all([
    db.selectFrom('build_members').select(['build_id', 'role']).where('user_id', '=', userId).execute(),
    db.selectFrom('sponsor_members').select(['sponsor_id']).where('user_id', '=', userId).execute(),
  ]);
  return {
    userId: user.id,
    isAdmin: user.is_admin,
    builds: new Map(builds.map((b) => [b.build_id, b.role])),
    sponsors: new Set(sponsors.map((s) => s.sponsor_id)),
  };
}

/** Sets `req.actor` from the session; a suspended or deleted account's session ends here. */
export function actorMiddleware(db: Db) {
  return async (req: Request, _res: Response, next: NextFunction) => {
    const userId = req.session?.userId;
    let actor: Actor = null;
    if (userId) {
      actor = await loadActor(db, userId);
      // Regenerate rather than destroy: the old row goes, and later middleware (CSRF) still has a session.
      if (!actor) await new Promise<void>((resolve, reject) => req.session.regenerate((err) => (err ? reject(err) : resolve())));
    }
    (req as Request & { actor?: Actor }).actor = actor;
    next();
  };
}
