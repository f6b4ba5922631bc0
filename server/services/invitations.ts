import { sql, type Selectable } from 'kysely';
import type { Invitation, InvitationLookup } from '../../src/shared/schemas/accounts';
import type { AppDeps } from '../app-deps';
import type { InvitationsTable } from '../db/database';
import { HttpError } from '../http/http-error';
import { hashToken, newToken } from './tokens';

export const INVITATION_DAYS = 7;
type Row = Selectable<InvitationsTable>;

function status(r: Pick<Row, 'accepted_at' | 'revoked_at' | 'expires_at'>): Invitation['status'] {
  if (r.accepted_at) return 'accepted';
  if (r.revoked_at) return 'revoked';
  return new Date(r.expires_at) <= new Date() ? 'expired' : 'pending';
}

/** Maps an invitation row to the API shape. */
export function presentInvitation(r: Row): Invitation {
  return {
    id: r.id,
    kind: r.kind,
    email: r.email,
    status: status(r),
    expiresAt: new Date(r.expires_at).toISOString(),
    lastSentAt: new Date(r.last_sent_at).toISOString(),
    createdAt: new Date(r.created_at).toISOString(),
  };
}

/** What an invitation is to: a build's team, or a sponsor organisation. */
type InvitationTarget = { kind: 'build-editor'; title: string } | { kind: 'sponsor-member'; title: string };

async function sendInvitationEmail(
  deps: AppDeps,
  trx: AppDeps['db'],
  to: string,
  token: string,
  target: InvitationTarget,
  inviter: string,
) {
  const link = `${deps.config.PUBLIC_URL}/invitations/accept#token=${token}`;
  const sponsor = target.kind === 'sponsor-member';
  await deps.outbox.enqueue(trx, {
    to,
    kind: 'invitation',
    subject: sponsor
      ? `${inviter} invites you to join ${target.title} on Rivet & Reel`
      : `${inviter} invites you to help edit "${target.title}" on Rivet & Reel`,
    text: [
      sponsor
        ? `${inviter} would like you to join the sponsor organisation ${target.title} on Rivet & Reel. Members see where the organisation's support appeared in published episodes, and get a notice when a new one goes out.`
        : `${inviter} would like you to help edit the build "${target.title}" on Rivet & Reel.`,
      '',
      `Open this link to accept: ${link}`,
      '',
      `It works once and expires in ${INVITATION_DAYS} days.`,
    ].join('\n'),
  });
}

async function invitationTarget(trx: AppDeps['db'], inv: Pick<Row, 'kind' | 'build_id' | 'sponsor_id'>): Promise<InvitationTarget> {
  if (inv.kind === 'sponsor-member') {
    const s = await trx.selectFrom('sponsors').select('name').where('id', '=', inv.sponsor_id!).executeTakeFirstOrThrow();
    return { kind: 'sponsor-member', title: s.name };
  }
  const b = await trx.selectFrom('builds').select('title').where('id', '=', inv.build_id!).executeTakeFirstOrThrow();
  return { kind: 'build-editor', title: b.title };
}

/**
 * Replaces any pending invitation of this address to the same build or organisation with a new one,
 * and queues its e-mail in the same transaction. Both kinds of invitation go through here.
 */
async function issueInvitation(
  deps: AppDeps,
  trx: AppDeps['db'],
  target: { kind: 'build-editor'; build_id: number } | { kind: 'sponsor-member'; sponsor_id: number },
  email: string,
  inviterId: number,
  title: string,
  inviterName: string,
): Promise<Invitation> {
  const pending = trx
    .updateTable('invitations')
    .set({ revoked_at: sql<Date>`now()` })
    .where('email', '=', email)
    .where('accepted_at', 'is', null)
    .where('revoked_at', 'is', null);
  await (
    'build_id' in target ? pending.where('build_id', '=', target.build_id) : pending.where('sponsor_id', '=', target.sponsor_id)
  ).execute();
  const { token, hash } = newToken();
  const row = await trx
    .insertInto('invitations')
    .values({
      ...target,
      email,
      token_hash: hash,
      invited_by: inviterId,
      expires_at: sql<Date>`now() + make_interval(days => ${INVITATION_DAYS})`,
    })
    .returningAll()
    .executeTakeFirstOrThrow();
  await sendInvitationEmail(deps, trx, email, token, { kind: target.kind, title }, inviterName);
  return presentInvitation(row);
}

/** Invites an address to edit a build; a pending invitation to the same address is replaced. */
export async function inviteEditor(deps: AppDeps, inviterId: number, buildId: number, email: string): Promise<Invitation> {
  return deps.db.transaction().execute(async (trx) => {
    const build = await trx.selectFrom('builds').select(['title']).where('id', '=', buildId).executeTakeFirstOrThrow();
    const inviter = await trx.selectFrom('users').select('display_name').where('id', '=', inviterId).executeTakeFirstOrThrow();
    const already = await trx
      .selectFrom('build_members as m')
      .innerJoin('users as u', 'u.id', 'm.user_id')
      .select('m.id')
      .where('m.build_id', '=', buildId)
      .where(sql`lower(u.email)`, '=', email)
      .executeTakeFirst();
    if (already)
      throw new HttpError(409, 'already_member', 'That address already belongs to someone on this build', {
        email: ['already on the build team'],
      });
    return issueInvitation(deps, trx, { kind: 'build-editor', build_id: buildId }, email, inviterId, build.title, inviter.display_name);
  });
}

export async function listInvitations(deps: AppDeps, buildId: number): Promise<Invitation[]> {
  const rows = await deps.db
    .selectFrom('invitations')
    .selectAll()
    .where('build_id', '=', buildId)
    .orderBy('created_at', 'desc')
    .limit(200)
    .execute();
  return rows.map(presentInvitation);
}

/** Sends a pending invitation again with a fresh link (the old one stops working) and a new expiry. */
export async function resendInvitation(deps: AppDeps, invitationId: number): Promise<Invitation> {
  return deps.db.transaction().execute(async (trx) => {
    const inv = await trx.selectFrom('invitations').selectAll().where('id', '=', invitationId).forUpdate().executeTakeFirstOrThrow();
    if (inv.accepted_at || inv.revoked_at) throw new HttpError(409, 'invitation_closed', 'This invitation was already accepted or revoked');
    const target = await invitationTarget(trx, inv);
    const inviter = inv.invited_by
      ? await trx.selectFrom('users').select('display_name').where('id', '=', inv.invited_by).executeTakeFirst()
      : undefined;
    const { token, hash } = newToken();
    const row = await trx
      .updateTable('invitations')
      .set({ token_hash: hash, last_sent_at: sql<Date>`now()`, expires_at: sql<Date>`now() + make_interval(days => ${INVITATION_DAYS})` })
      .where('id', '=', invitationId)
      .returningAll()
      .executeTakeFirstOrThrow();
    await sendInvitationEmail(
      deps,
      trx,
      inv.email,
      token,
      target,
      inviter?.display_name ?? (target.kind === 'sponsor-member' ? 'Rivet & Reel' : 'The build owner'),
    );
    return presentInvitation(row);
  });
}

export async function revokeInvitation(deps: AppDeps, invitationId: number): Promise<void> {
  const r = await deps.db
    .updateTable('invitations')
    .set({ revoked_at: sql<Date>`now()` })
    .where('id', '=', invitationId)
    .where('accepted_at', 'is', null)
    .where('revoked_at', 'is', null)
    .executeTakeFirst();
  if (!r.numUpdatedRows) throw new HttpError(409, 'invitation_closed', 'This invitation was already accepted or revoked');
}

/** What an invitation link is for, without using it up. */
export async function lookupInvitation(deps: AppDeps, token: string): Promise<InvitationLookup> {
  const row = await deps.db
    .selectFrom('invitations as i')
    .leftJoin('builds as b', 'b.id', 'i.build_id')
    .leftJoin('sponsors as s', 's.id', 'i.sponsor_id')
    .leftJoin('users as u', 'u.id', 'i.invited_by')
    .select([
      'i.kind',
      'i.email',
      'i.accepted_at',
      'i.revoked_at',
      'i.expires_at',
      sql<number>`coalesce(b.id, s.id)`.as('target_id'),
      sql<string>`coalesce(b.title, s.name)`.as('target_title'),
      'u.display_name as inviter',
    ])
    .where('i.token_hash', '=', hashToken(token))
    .executeTakeFirst();
  if (!row) throw new HttpError(404, 'not_found', 'This invitation link is not valid');
  return {
    kind: row.kind,
    email: row.email,
    status: status(row),
    target: { id: row.target_id, title: row.target_title },
    invitedBy: row.inviter,
  };
}

/** Accepts an invitation for the signed-in account: it joins the build team as an editor, or the sponsor organisation. */
export async function acceptInvitation(
  deps: AppDeps,
  userId: number,
  token: string,
): Promise<{ kind: Invitation['kind']; targetId: number }> {
  return deps.db.transaction().execute(async (trx) => {
    const inv = await trx.selectFrom('invitations').selectAll().where('token_hash', '=', hashToken(token)).forUpdate().executeTakeFirst();
    if (!inv) throw new HttpError(404, 'not_found', 'This invitation link is not valid');
    if (status(inv) !== 'pending') throw new HttpError(409, 'invitation_closed', `This invitation was ${status(inv)}`);
    if (inv.kind === 'sponsor-member')
      await trx
        .insertInto('sponsor_members')
        .values({ sponsor_id: inv.sponsor_id!, user_id: userId })
        .onConflict((oc) => oc.columns(['sponsor_id', 'user_id']).doNothing())
        .execute();
    else
      await trx
        .insertInto('build_members')
        .values({ build_id: inv.build_id!, user_id: userId, role: 'editor' })
        .onConflict((oc) => oc.columns(['build_id', 'user_id']).doNothing())
        .execute();
    await trx
      .updateTable('invitations')
      .set({ accepted_at: sql<Date>`now()`, accepted_by: userId })
      .where('id', '=', inv.id)
      .execute();
    return { kind: inv.kind, targetId: (inv.kind === 'sponsor-member' ? inv.sponsor_id : inv.build_id)! };
  });
}

/** Invites an address to join a sponsor organisation (admins); a pending invitation to the same address is replaced. */
export async function inviteSponsorMember(deps: AppDeps, inviterId: number, sponsorId: number, email: string): Promise<Invitation> {
  return deps.db.transaction().execute(async (trx) => {
    const sponsor = await trx.selectFrom('sponsors').select('name').where('id', '=', sponsorId).executeTakeFirst();
    if (!sponsor) throw new HttpError(404, 'not_found', 'No such sponsor organisation');
    const inviter = await trx.selectFrom('users').select('display_name').where('id', '=', inviterId).executeTakeFirstOrThrow();
    const already = await trx
      .selectFrom('sponsor_members as m')
      .innerJoin('users as u', 'u.id', 'm.user_id')
      .select('m.id')
      .where('m.sponsor_id', '=', sponsorId)
      .where(sql`lower(u.email)`, '=', email)
      .executeTakeFirst();
    if (already)
      throw new HttpError(409, 'already_member', 'That address already belongs to a member of this organisation', {
        email: ['already a member'],
      });
    return issueInvitation(
      deps,
      trx,
      { kind: 'sponsor-member', sponsor_id: sponsorId },
      email,
      inviterId,
      sponsor.name,
      inviter.display_name,
    );
  });
}

/** A sponsor organisation's invitations, newest first. */
export async function listSponsorInvitations(db: AppDeps['db'], sponsorId: number): Promise<Invitation[]> {
  const rows = await db
    .selectFrom('invitations')
    .selectAll()
    .where('sponsor_id', '=', sponsorId)
    .orderBy('created_at', 'desc')
    .limit(200)
    .execute();
  return rows.map(presentInvitation);
}
