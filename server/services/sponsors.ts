import { sql } from 'kysely';
import type { AdminSponsor, AdminSponsorDetail } from '../../src/shared/schemas/sponsor-admin';
import type { SponsorInput, SponsorRef } from '../../src/shared/schemas/sponsors';
import type { AppDeps } from '../app-deps';
import type { Db } from '../db/kysely';
import { HttpError } from '../http/http-error';
import { presentSponsorRef } from '../presenters/sponsors';
import { listSponsorInvitations } from './invitations';
import { deleteMedia, storeUpload } from './media/store';

/** Sponsors with their logo's media fields joined, ready for `presentSponsorRef`. */
export function selectSponsors(db: Db) {
  return db
    .selectFrom('sponsors as s')
    .leftJoin('media as lm', 'lm.id', 's.logo_media_id')
    .select([
      's.id',
      's.slug',
      's.name',
      's.website',
      'lm.id as logo_id',
      'lm.sha256 as logo_sha256',
      'lm.object_key as logo_object_key',
      'lm.variants as logo_variants',
    ]);
}

/** One organisation as `sponsorRef`, or null. */
export async function getSponsorRef(db: Db, sponsorId: number): Promise<SponsorRef | null> {
  const row = await selectSponsors(db).where('s.id', '=', sponsorId).executeTakeFirst();
  return row ? presentSponsorRef(row) : null;
}

async function requireSponsor(db: Db, sponsorId: number): Promise<SponsorRef> {
  const ref = await getSponsorRef(db, sponsorId);
  if (!ref) throw new HttpError(404, 'not_found', 'No such sponsor organisation');
  return ref;
}

const slugTaken = () =>
  new HttpError(409, 'slug_taken', 'Another organisation already has that address', { slug: ['already used by another organisation'] });

/** Every organisation with its counts, by name (admins). */
export async function listSponsorsForAdmin(db: Db): Promise<AdminSponsor[]> {
  const rows = await selectSponsors(db)
    .select([
      sql<number>`(select count(*) from sponsor_members m where m.sponsor_id = s.id)::int`.as('members'),
      sql<number>`(select count(*) from sponsor_suppliers l where l.sponsor_id = s.id)::int`.as('suppliers'),
      sql<number>`(select count(*) from invitations i where i.sponsor_id = s.id and i.accepted_at is null and i.revoked_at is null and i.expires_at > now())::int`.as(
        'pending',
      ),
    ])
    .orderBy(sql`lower(s.name)`)
    .orderBy('s.id')
    .execute();
  return rows.map((r) => ({ ...presentSponsorRef(r), members: r.members, suppliers: r.suppliers, pendingInvitations: r.pending }));
}

/** One organisation with its suppliers, members and invitations (admins). */
export async function getSponsorForAdmin(db: Db, sponsorId: number): Promise<AdminSponsorDetail> {
  const sponsor = await requireSponsor(db, sponsorId);
  const [suppliers, members, invitations] = await Promise.all([
    db
      .selectFrom('sponsor_suppliers as l')
      .innerJoin('suppliers as p', 'p.id', 'l.supplier_id')
      .select(['p.id', 'p.name', 'p.website'])
      .where('l.sponsor_id', '=', sponsorId)
      .orderBy(sql`lower(p.name)`)
      .execute(),
    db
      .selectFrom('sponsor_members as m')
      .innerJoin('users as u', 'u.id', 'm.user_id')
      .select(['u.id', 'u.handle', 'u.display_name', 'u.email', 'm.created_at'])
      .where('m.sponsor_id', '=', sponsorId)
      .orderBy(sql`lower(u.display_name)`)
      .execute(),
    listSponsorInvitations(db, sponsorId),
  ]);
  return {
    sponsor,
    suppliers,
    members: members.map((m) => ({
      userId: m.id,
      handle: m.handle,
      displayName: m.display_name,
      email: m.email,
      since: m.created_at.toISOString(),
    })),
    invitations,
  };
}

/** Creates an organisation; a slug already in use answers 409 naming the field. */
export async function createSponsor(db: Db, input: SponsorInput): Promise<SponsorRef> {
  const row = await db
    .insertInto('sponsors')
    .values({ name: input.name, slug: input.slug, website: input.website })
    .onConflict((oc) => oc.column('slug').doNothing())
    .returning('id')
    .executeTakeFirst();
  if (!row) throw slugTaken();
  return requireSponsor(db, row.id);
}

/** Replaces an organisation's name, slug and website. */
export async function updateSponsor(db: Db, sponsorId: number, input: SponsorInput): Promise<SponsorRef> {
  await requireSponsor(db, sponsorId);
  const clash = await db.selectFrom('sponsors').select('id').where('slug', '=', input.slug).where('id', '<>', sponsorId).executeTakeFirst();
  if (clash) throw slugTaken();
  await db
    .updateTable('sponsors')
    .set({ name: input.name, slug: input.slug, website: input.website, updated_at: sql<Date>`now()` })
    .where('id', '=', sponsorId)
    .execute();
  return requireSponsor(db, sponsorId);
}

/**
 * Stores a logo through the media pipeline under `sponsors/<id>/logo/…` and makes it the
 * organisation's logo; the previous logo (if another file) is deleted.
 */
export async function setSponsorLogo(
  deps: AppDeps,
  sponsorId: number,
  file: { bytes: Buffer; originalName: string; altText: string | null; userId: number },
): Promise<SponsorRef> {
  const before = await deps.db.selectFrom('sponsors').select('logo_media_id').where('id', '=', sponsorId).executeTakeFirst();
  if (!before) throw new HttpError(404, 'not_found', 'No such sponsor organisation');
  const mediaId = await storeUpload(deps, {
    owner: { sponsorId },
    kind: 'logo',
    bytes: file.bytes,
    originalName: file.originalName,
    altText: file.altText,
    userId: file.userId,
  });
  await deps.db
    .updateTable('sponsors')
    .set({ logo_media_id: mediaId, updated_at: sql<Date>`now()` })
    .where('id', '=', sponsorId)
    .execute();
  if (before.logo_media_id !== null && before.logo_media_id !== mediaId) await deleteMedia(deps, before.logo_media_id);
  return requireSponsor(deps.db, sponsorId);
}

/** Removes the organisation's logo and its stored file. */
export async function clearSponsorLogo(deps: AppDeps, sponsorId: number): Promise<SponsorRef> {
  const before = await deps.db.selectFrom('sponsors').select('logo_media_id').where('id', '=', sponsorId).executeTakeFirst();
  if (!before) throw new HttpError(404, 'not_found', 'No such sponsor organisation');
  if (before.logo_media_id !== null) await deleteMedia(deps, before.logo_media_id);
  return requireSponsor(deps.db, sponsorId);
}

/**
 * Links a supplier the organisation stands behind. A supplier is backed by at most one
 * organisation (409 naming the other); a merged-away record is refused (400, link the one it became).
 */
export async function linkSupplier(db: Db, sponsorId: number, supplierId: number): Promise<void> {
  await requireSponsor(db, sponsorId);
  const supplier = await db.selectFrom('suppliers').select(['id', 'merged_into_id']).where('id', '=', supplierId).executeTakeFirst();
  if (!supplier) throw new HttpError(404, 'not_found', 'No such supplier');
  if (supplier.merged_into_id !== null)
    throw new HttpError(400, 'supplier_merged', 'That supplier was merged into another record; link that one', {
      supplierId: ['merged into another supplier'],
    });
  await db.transaction().execute(async (trx) => {
    const current = await trx
      .selectFrom('sponsor_suppliers as l')
      .innerJoin('sponsors as s', 's.id', 'l.sponsor_id')
      .select(['l.sponsor_id', 's.name'])
      .where('l.supplier_id', '=', supplierId)
      .forUpdate()
      .executeTakeFirst();
    if (current && current.sponsor_id !== sponsorId)
      throw new HttpError(409, 'supplier_backed', `That supplier is already backed by ${current.name}`, {
        supplierId: [`already backed by ${current.name}`],
      });
    if (!current)
      await trx
        .insertInto('sponsor_suppliers')
        .values({ sponsor_id: sponsorId, supplier_id: supplierId })
        // Two admins at once: the unique supplier key decides; the loser is told below.
        .onConflict((oc) => oc.doNothing())
        .execute();
  });
  const after = await db.selectFrom('sponsor_suppliers').select('sponsor_id').where('supplier_id', '=', supplierId).executeTakeFirst();
  if (after?.sponsor_id !== sponsorId)
    throw new HttpError(409, 'supplier_backed', 'That supplier is already backed by another organisation', {
      supplierId: ['already backed by another organisation'],
    });
}

/** Unlinks a supplier; part lines keep the support already recorded on them. */
export async function unlinkSupplier(db: Db, sponsorId: number, supplierId: number): Promise<void> {
  const r = await db
    .deleteFrom('sponsor_suppliers')
    .where('sponsor_id', '=', sponsorId)
    .where('supplier_id', '=', supplierId)
    .executeTakeFirst();
  if (!r.numDeletedRows) throw new HttpError(404, 'not_found', 'That supplier is not linked to this organisation');
}

/** Removes a member; they stop seeing the summary at their next request. */
export async function removeSponsorMember(db: Db, sponsorId: number, userId: number): Promise<void> {
  const r = await db.deleteFrom('sponsor_members').where('sponsor_id', '=', sponsorId).where('user_id', '=', userId).executeTakeFirst();
  if (!r.numDeletedRows) throw new HttpError(404, 'not_found', 'Not a member of this organisation');
}

/** Revokes a pending invitation of this organisation. */
export async function revokeSponsorInvitation(db: Db, sponsorId: number, invitationId: number): Promise<void> {
  const inv = await db
    .selectFrom('invitations')
    .select('id')
    .where('id', '=', invitationId)
    .where('sponsor_id', '=', sponsorId)
    .executeTakeFirst();
  if (!inv) throw new HttpError(404, 'not_found', 'No such invitation for this organisation');
  const r = await db
    .updateTable('invitations')
    .set({ revoked_at: sql<Date>`now()` })
    .where('id', '=', invitationId)
    .where('accepted_at', 'is', null)
    .where('revoked_at', 'is', null)
    .executeTakeFirst();
  if (!r.numUpdatedRows) throw new HttpError(409, 'invitation_closed', 'This invitation was already accepted or revoked');
}
