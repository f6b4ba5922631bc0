import { sql } from 'kysely';
import type { AccountDataSection } from './section';

export const accountSection: AccountDataSection = {
  key: 'account',
  async export(db, userId) {
    const user = await db
      .selectFrom('users')
      .select(['id', 'handle', 'display_name', 'email', 'notice_email', 'avatar_url', 'is_admin', 'created_at', 'updated_at'])
      .where('id', '=', userId)
      .executeTakeFirstOrThrow();
    const identities = await db
      .selectFrom('identities')
      .select(['provider', 'provider_uid', 'created_at', 'last_used_at'])
      .where('user_id', '=', userId)
      .execute();
    return { ...user, signInMethods: identities };
  },
  async erase(trx, userId) {
    await trx.deleteFrom('identities').where('user_id', '=', userId).execute();
    await sql`delete from sessions where (sess->>'userId')::bigint = ${userId}`.execute(trx);
    // The row stays so what the person wrote keeps an author: shown as "former member".
    await trx
      .updateTable('users')
      .set({
        handle: `former-member-${userId}`,
        display_name: 'Former member',
        email: null,
        notice_email: null,
        avatar_url: null,
        is_admin: false,
        deleted_at: sql<Date>`now()`,
        updated_at: sql<Date>`now()`,
      })
      .where('id', '=', userId)
      .execute();
  },
};

export const membershipsSection: AccountDataSection = {
  key: 'memberships',
  async export(db, userId) {
    const builds = await db
      .selectFrom('build_members as m')
      .innerJoin('builds as b', 'b.id', 'm.build_id')
      .select(['b.id as buildId', 'b.title as buildTitle', 'm.role', 'm.created_at as since'])
      .where('m.user_id', '=', userId)
      .execute();
    const sponsors = await db
      .selectFrom('sponsor_members as m')
      .innerJoin('sponsors as s', 's.id', 'm.sponsor_id')
      .select(['s.id as sponsorId', 's.name as sponsorName', 'm.created_at as since'])
      .where('m.user_id', '=', userId)
      .execute();
    const invitationsSent = await db
      .selectFrom('invitations')
      .select(['id', 'kind', 'build_id', 'email', 'created_at', 'accepted_at', 'revoked_at'])
      .where('invited_by', '=', userId)
      .execute();
    return { builds, sponsors, invitationsSent };
  },
  async erase(trx, userId) {
    await trx.deleteFrom('build_members').where('user_id', '=', userId).where('role', '=', 'editor').execute();
    await trx.deleteFrom('sponsor_members').where('user_id', '=', userId).execute();
  },
};
