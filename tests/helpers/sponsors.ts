import type { Insertable } from 'kysely';
import type { PartLinesTable } from '../../server/db/database';
import type { Db } from '../../server/db/kysely';

let seq = 0;

/** Inserts a sponsor organisation (a unique slug unless given). */
export async function createSponsor(db: Db, overrides: { slug?: string; name?: string; website?: string | null } = {}) {
  seq += 1;
  const slug = overrides.slug ?? `sponsor-${Date.now().toString(36)}-${seq}`;
  return db
    .insertInto('sponsors')
    .values({ slug, name: overrides.name ?? `Invented Sponsor ${seq}`, website: overrides.website ?? null })
    .returningAll()
    .executeTakeFirstOrThrow();
}

/** Adds a sponsor_members row. */
export async function addSponsorMember(db: Db, sponsorId: number, userId: number): Promise<void> {
  await db.insertInto('sponsor_members').values({ sponsor_id: sponsorId, user_id: userId }).execute();
}

/**
 * Inserts a part line straight into the database (not through the parts API), supported by a
 * sponsor when `sponsor_id` and `support_kind` are given. Defaults: one EUR part, arrived.
 */
export async function createPartLine(db: Db, values: { build_id: number; episode_id: number } & Partial<Insertable<PartLinesTable>>) {
  const position =
    values.position ??
    Number(
      (
        await db
          .selectFrom('part_lines')
          .select((eb) => eb.fn.countAll<number>().as('n'))
          .where('episode_id', '=', values.episode_id)
          .executeTakeFirstOrThrow()
      ).n,
    );
  return db
    .insertInto('part_lines')
    .values({
      kind: 'part',
      description: 'Supported part',
      source: 'new',
      status: 'arrived',
      quantity: '1',
      unit_price_minor: 0,
      currency: 'EUR',
      ...values,
      position,
    })
    .returningAll()
    .executeTakeFirstOrThrow();
}
