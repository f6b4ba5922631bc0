import type { Sponsorship, SponsorshipInput, SponsorRef } from '../../src/shared/schemas/sponsors';
import type { Db } from '../db/kysely';
import { HttpError } from '../http/http-error';
import { presentSponsorRef } from '../presenters/sponsors';

/** Sponsors with their logo columns, ready for `presentSponsorRef`. */
export function sponsorRefQuery(db: Db) {
  return db
    .selectFrom('sponsors as sp')
    .leftJoin('media as lm', 'lm.id', 'sp.logo_media_id')
    .select([
      'sp.id',
      'sp.slug',
      'sp.name',
      'sp.website',
      'lm.id as logo_id',
      'lm.sha256 as logo_sha256',
      'lm.object_key as logo_object_key',
      'lm.variants as logo_variants',
    ]);
}

/** Every sponsor organisation by name, for pickers. */
export async function listSponsorRefs(db: Db): Promise<SponsorRef[]> {
  const rows = await sponsorRefQuery(db).orderBy('sp.name').orderBy('sp.id').execute();
  return rows.map(presentSponsorRef);
}

/** A build's sponsorships, earliest first. */
export async function listSponsorships(db: Db, buildId: number, id?: number): Promise<Sponsorship[]> {
  const rows = await db
    .selectFrom('sponsorships as s')
    .select(['s.id', 's.build_id', 's.sponsor_id', 's.kind', 's.starts_on', 's.ends_on'])
    .where('s.build_id', '=', buildId)
    .$if(id !== undefined, (q) => q.where('s.id', '=', id!))
    .orderBy('s.starts_on')
    .orderBy('s.id')
    .execute();
  const refs = new Map((await listSponsorRefs(db)).map((r) => [r.id, r]));
  return rows.flatMap((r) => {
    const sponsor = refs.get(r.sponsor_id);
    return sponsor ? [{ id: r.id, buildId: r.build_id, sponsor, kind: r.kind, startsOn: r.starts_on, endsOn: r.ends_on }] : [];
  });
}

async function knownSponsor(db: Db, sponsorId: number): Promise<void> {
  const s = await db.selectFrom('sponsors').select('id').where('id', '=', sponsorId).executeTakeFirst();
  if (!s) throw new HttpError(400, 'invalid_request', 'Check sponsorId', { sponsorId: ['no such sponsor'] });
}

/** Adds a sponsorship to a build; an unknown sponsor answers 400 naming `sponsorId`. */
export async function createSponsorship(db: Db, buildId: number, input: SponsorshipInput): Promise<Sponsorship> {
  await knownSponsor(db, input.sponsorId);
  const row = await db
    .insertInto('sponsorships')
    .values({ build_id: buildId, sponsor_id: input.sponsorId, kind: input.kind, starts_on: input.startsOn, ends_on: input.endsOn })
    .returning('id')
    .executeTakeFirstOrThrow();
  return (await listSponsorships(db, buildId, row.id))[0]!;
}

/** Replaces a sponsorship's sponsor, kind and dates. */
export async function updateSponsorship(db: Db, id: number, input: SponsorshipInput): Promise<Sponsorship> {
  await knownSponsor(db, input.sponsorId);
  const row = await db
    .updateTable('sponsorships')
    .set({ sponsor_id: input.sponsorId, kind: input.kind, starts_on: input.startsOn, ends_on: input.endsOn, updated_at: new Date() })
    .where('id', '=', id)
    .returning('build_id')
    .executeTakeFirstOrThrow();
  return (await listSponsorships(db, row.build_id, id))[0]!;
}

export async function deleteSponsorship(db: Db, id: number): Promise<void> {
  await db.deleteFrom('sponsorships').where('id', '=', id).execute();
}

/**
 * The sponsors a build credits on its page: every sponsorship's sponsor, and the sponsors of
 * supported lines in episodes readers can see.
 */
export async function buildSponsorCredits(db: Db, buildId: number): Promise<SponsorRef[]> {
  const rows = await sponsorRefQuery(db)
    .where((eb) =>
      eb.or([
        eb('sp.id', 'in', eb.selectFrom('sponsorships').select('sponsor_id').where('build_id', '=', buildId)),
        eb(
          'sp.id',
          'in',
          eb
            .selectFrom('part_lines as pl')
            .innerJoin('episodes as e', 'e.id', 'pl.episode_id')
            .select('pl.sponsor_id')
            .where('pl.build_id', '=', buildId)
            .where('pl.sponsor_id', 'is not', null)
            .where('pl.support_kind', 'is not', null)
            .where('e.status', '=', 'published')
            .where('e.deleted_at', 'is', null)
            .where('e.published_at', '<=', new Date()),
        ),
      ]),
    )
    .orderBy('sp.name')
    .execute();
  return rows.map(presentSponsorRef);
}
