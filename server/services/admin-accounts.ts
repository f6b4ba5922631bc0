import { sql } from 'kysely';
import type { AdminAccount, AdminAccountAction } from '../../src/shared/schemas/accounts';
import type { Db } from '../db/kysely';
import { HttpError } from '../http/http-error';
import { endSessionsOf } from './accounts';

const columns = ['id', 'handle', 'display_name', 'email', 'is_admin', 'suspended_at', 'created_at'] as const;
type Row = {
  id: number;
  handle: string;
  display_name: string;
  email: string | null;
  is_admin: boolean;
  suspended_at: Date | null;
  created_at: Date;
};

function present(r: Row): AdminAccount {
  return {
    id: r.id,
    handle: r.handle,
    displayName: r.display_name,
    email: r.email,
    isAdmin: r.is_admin,
    suspendedAt: r.suspended_at?.toISOString() ?? null,
    createdAt: r.created_at.toISOString(),
  };
}

/** Accounts for the admin list, searched by handle, name or e-mail. */
export async function listAccounts(db: Db, q: { q?: string; page: number; perPage: number }) {
  let base = db.selectFrom('users').where('deleted_at', 'is', null);
  if (q.q) {
    const like = `%${q.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    base = base.where((eb) => eb.or([eb('handle', 'ilike', like), eb('display_name', 'ilike', like), eb('email', 'ilike', like)]));
  }
  const [rows, count] = await Promise.all([
    base
      .select(columns)
      .orderBy('created_at', 'desc')
      .orderBy('id', 'desc')
      .limit(q.perPage)
      .offset((q.page - 1) * q.perPage)
      .execute(),
    base.select((eb) => eb.fn.countAll<number>().as('n')).executeTakeFirstOrThrow(),
  ]);
  return { items: rows.map(present), page: q.page, perPage: q.perPage, total: count.n };
}

const changes: Record<AdminAccountAction, { set: Record<string, unknown>; audit: string }> = {
  suspend: { set: { suspended_at: sql`now()` }, audit: 'account.suspended' },
  restore: { set: { suspended_at: null }, audit: 'account.restored' },
  'grant-admin': { set: { is_admin: true }, audit: 'admin.granted' },
  'revoke-admin': { set: { is_admin: false }, audit: 'admin.revoked' },
};

/** Suspends, restores, grants or revokes admin; recorded in audit_events with who and when. */
export async function applyAccountAction(
  db: Db,
  actorId: number | null,
  userId: number,
  action: AdminAccountAction,
): Promise<AdminAccount> {
  if (actorId === userId && (action === 'suspend' || action === 'revoke-admin')) {
    throw new HttpError(409, 'cannot_change_self', 'Ask another admin to do this to your own account');
  }
  return db.transaction().execute(async (trx) => {
    const row = await trx
      .updateTable('users')
      .set({ ...changes[action].set, updated_at: sql`now()` })
      .where('id', '=', userId)
      .where('deleted_at', 'is', null)
      .returning(columns)
      .executeTakeFirst();
    if (!row) throw new HttpError(404, 'not_found', 'No such account');
    if (action === 'suspend') await endSessionsOf(trx, userId);
    await trx
      .insertInto('audit_events')
      .values({
        actor_id: actorId,
        action: changes[action].audit,
        subject_user_id: userId,
        details: JSON.stringify({ via: actorId ? 'admin screen' : 'operator command' }),
      })
      .execute();
    return present(row);
  });
}
