import { sql, type Kysely } from 'kysely';
import type { Account } from '../../src/shared/schemas/accounts';
import type { Database } from '../db/database';
import type { Db } from '../db/kysely';
import { HttpError } from '../http/http-error';

type Trx = Kysely<Database>;

export interface GithubProfile {
  githubId: string;
  login: string;
  displayName: string;
  email: string | null;
  avatarUrl: string | null;
}

/** Turns a login or an e-mail's local part into a free handle (`jun-halloway`, `jun-halloway-2`). */
async function freeHandle(db: Trx, wanted: string): Promise<string> {
  let base = wanted
    .toLowerCase()
    .replace(/[^a-z0-9-]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 32);
  if (base.length < 2) base = `member-${base}`.replace(/-+$/, '');
  for (let n = 1; n < 1000; n += 1) {
    const candidate = n === 1 ? base : `${base}-${n}`;
    const taken = await db
      .selectFrom('users')
      .select('id')
      .where(sql`lower(handle)`, '=', candidate)
      .executeTakeFirst();
    if (!taken) return candidate;
  }
  throw new Error(`no free handle for ${wanted}`);
}

function refuseSuspended(user: { suspended_at: Date | null; deleted_at: Date | null }) {
  if (user.suspended_at || user.deleted_at) throw new HttpError(403, 'account_suspended', 'This account is suspended');
}

/** First GitHub sign-in creates the account (or links one with the same verified e-mail); later ones update its display fields. */
export async function signInWithGithub(db: Db, p: GithubProfile): Promise<number> {
  return db.transaction().execute(async (trx) => {
    const identity = await trx
      .selectFrom('identities')
      .select('user_id')
      .where('provider', '=', 'github')
      .where('provider_uid', '=', p.githubId)
      .executeTakeFirst();
    let userId = identity?.user_id;
    if (!userId && p.email) {
      userId = (
        await trx
          .selectFrom('users')
          .select('id')
          .where(sql`lower(email)`, '=', p.email.toLowerCase())
          .executeTakeFirst()
      )?.id;
    }
    if (!userId) {
      const created = await trx
        .insertInto('users')
        .values({
          handle: await freeHandle(trx, p.login),
          display_name: p.displayName || p.login,
          email: p.email?.toLowerCase() ?? null,
          avatar_url: p.avatarUrl,
        })
        .returning('id')
        .executeTakeFirstOrThrow();
      userId = created.id;
    }
    const user = await trx
      .selectFrom('users')
      .select(['suspended_at', 'deleted_at'])
      .where('id', '=', userId)
      .forUpdate()
      .executeTakeFirstOrThrow();
    refuseSuspended(user);
    await trx
      .updateTable('users')
      .set({ display_name: p.displayName || p.login, avatar_url: p.avatarUrl, updated_at: sql`now()` })
      .where('id', '=', userId)
      .execute();
    await linkIdentity(trx, userId, 'github', p.githubId);
    return userId;
  });
}

/** The account behind an e-mail address proven by a sign-in link, created on first use. */
export async function signInWithEmail(trx: Trx, email: string): Promise<number> {
  const address = email.toLowerCase();
  const identity = await trx
    .selectFrom('identities')
    .select('user_id')
    .where('provider', '=', 'email')
    .where('provider_uid', '=', address)
    .executeTakeFirst();
  let userId =
    identity?.user_id ??
    (
      await trx
        .selectFrom('users')
        .select('id')
        .where(sql`lower(email)`, '=', address)
        .executeTakeFirst()
    )?.id;
  if (!userId) {
    const local = address.split('@')[0] ?? 'member';
    userId = (
      await trx
        .insertInto('users')
        .values({ handle: await freeHandle(trx, local), display_name: local, email: address })
        .returning('id')
        .executeTakeFirstOrThrow()
    ).id;
  }
  refuseSuspended(await trx.selectFrom('users').select(['suspended_at', 'deleted_at']).where('id', '=', userId).executeTakeFirstOrThrow());
  await linkIdentity(trx, userId, 'email', address);
  return userId;
}

async function linkIdentity(trx: Trx, userId: number, provider: 'github' | 'email', uid: string) {
  await trx
    .insertInto('identities')
    .values({ user_id: userId, provider, provider_uid: uid, last_used_at: sql<Date>`now()` })
    .onConflict((oc) => oc.columns(['provider', 'provider_uid']).doUpdateSet({ last_used_at: sql`now()` }))
    .execute();
}

/** The signed-in account as the API shows it to its owner, with memberships. */
export async function getAccount(db: Db, userId: number): Promise<Account | null> {
  const user = await db
    .selectFrom('users')
    .select(['id', 'handle', 'display_name', 'avatar_url', 'email', 'notice_email', 'is_admin'])
    .where('id', '=', userId)
    .where('deleted_at', 'is', null)
    .executeTakeFirst();
  if (!user) return null;
  const [identities, builds, sponsors] = await Promise.all([
    db.selectFrom('identities').select('provider').where('user_id', '=', userId).execute(),
    db
      .selectFrom('build_members as m')
      .innerJoin('builds as b', 'b.id', 'm.build_id')
      .select(['b.id', 'b.title', 'b.slug', 'm.role'])
      .where('m.user_id', '=', userId)
      .orderBy('b.title')
      .execute(),
    db
      .selectFrom('sponsor_members as m')
      .innerJoin('sponsors as s', 's.id', 'm.sponsor_id')
      .select(['s.id', 's.name', 's.slug'])
      .where('m.user_id', '=', userId)
      .orderBy('s.name')
      .execute(),
  ]);
  return {
    id: user.id,
    handle: user.handle,
    displayName: user.display_name,
    avatarUrl: user.avatar_url,
    email: user.email,
    noticeEmail: user.notice_email,
    isAdmin: user.is_admin,
    signInMethods: [...new Set(identities.map((i) => i.provider))].sort(),
    builds: builds.map((b) => ({ buildId: b.id, buildTitle: b.title, buildSlug: b.slug, role: b.role })),
    sponsors: sponsors.map((s) => ({ sponsorId: s.id, sponsorName: s.name, sponsorSlug: s.slug })),
  };
}

/** Ends every session of an account (suspension, deletion). */
export async function endSessionsOf(db: Trx, userId: number): Promise<void> {
  await sql`delete from sessions where (sess->>'userId')::bigint = ${userId}`.execute(db);
}
