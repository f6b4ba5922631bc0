import { sql } from 'kysely';
import type { z } from 'zod';
import type { supplierCreate } from '../../src/shared/schemas/parts';
import type { Db } from '../db/kysely';
import { HttpError } from '../http/http-error';

/** Live suppliers matching a prefix or word, the ones this build already uses first. */
export async function listSuppliers(db: Db, q: string, buildId?: number) {
  const pattern = `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
  const used = buildId
    ? sql<boolean>`exists (select 1 from part_lines pl where pl.supplier_id = s.id and pl.build_id = ${buildId})`
    : sql<boolean>`false`;
  const rows = await db
    .selectFrom('suppliers as s')
    .leftJoin('sponsor_suppliers as ss', 'ss.supplier_id', 's.id')
    .leftJoin('sponsors as sp', 'sp.id', 'ss.sponsor_id')
    .select([
      's.id',
      's.name',
      's.website',
      used.as('used_in_build'),
      'sp.id as sponsor_id',
      'sp.slug as sponsor_slug',
      'sp.name as sponsor_name',
    ])
    .where('s.merged_into_id', 'is', null)
    .where(sql<boolean>`s.name ilike ${pattern}`)
    .orderBy(sql`used_in_build`, 'desc')
    .orderBy(sql`lower(s.name)`)
    .limit(20)
    .execute();
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    website: r.website,
    usedInBuild: r.used_in_build,
    sponsor: r.sponsor_id !== null ? { id: r.sponsor_id, slug: r.sponsor_slug ?? '', name: r.sponsor_name ?? '' } : null,
  }));
}

/** The sponsor organisation standing behind a supplier (sponsor_suppliers), if any. */
async function backingSponsor(db: Db, supplierId: number) {
  const r = await db
    .selectFrom('sponsor_suppliers as ss')
    .innerJoin('sponsors as sp', 'sp.id', 'ss.sponsor_id')
    .select(['sp.id', 'sp.slug', 'sp.name'])
    .where('ss.supplier_id', '=', supplierId)
    .executeTakeFirst();
  return r ?? null;
}

/** Creates a supplier, or returns the live one with the same name (case and spacing ignored). */
export async function createSupplier(db: Db, userId: number, input: z.infer<typeof supplierCreate>) {
  const name = input.name.replace(/\s+/g, ' ').trim();
  const existing = await db
    .selectFrom('suppliers')
    .select(['id', 'name', 'website'])
    .where(sql`lower(btrim(name))`, '=', name.toLowerCase())
    .where('merged_into_id', 'is', null)
    .executeTakeFirst();
  if (existing) return { supplier: { ...existing, usedInBuild: false, sponsor: await backingSponsor(db, existing.id) }, created: false };
  const row = await db
    .insertInto('suppliers')
    .values({ name, website: input.website, created_by: userId })
    .onConflict((oc) =>
      oc
        .expression(sql`lower(btrim(name))`)
        .where('merged_into_id', 'is', null)
        .doNothing(),
    )
    .returning(['id', 'name', 'website'])
    .executeTakeFirst();
  if (!row) return createSupplier(db, userId, input);
  return { supplier: { ...row, usedInBuild: false, sponsor: null }, created: true };
}

/** Moves every line of `fromId` to `intoId` and leaves `fromId` pointing at it. */
export async function mergeSuppliers(db: Db, fromId: number, intoId: number): Promise<void> {
  if (fromId === intoId)
    throw new HttpError(400, 'invalid_request', 'A supplier cannot be merged into itself', { intoId: ['must be another supplier'] });
  await db.transaction().execute(async (trx) => {
    const both = await trx
      .selectFrom('suppliers')
      .select(['id', 'merged_into_id'])
      .where('id', 'in', [fromId, intoId])
      .forUpdate()
      .execute();
    const from = both.find((s) => s.id === fromId);
    const into = both.find((s) => s.id === intoId);
    if (!from) throw new HttpError(404, 'not_found', 'Not found');
    if (!into || into.merged_into_id !== null)
      throw new HttpError(400, 'invalid_request', 'Merge into a live supplier', { intoId: ['not a live supplier'] });
    await trx.updateTable('part_lines').set({ supplier_id: intoId }).where('supplier_id', '=', fromId).execute();
    await trx.updateTable('suppliers').set({ merged_into_id: intoId }).where('merged_into_id', '=', fromId).execute();
    await trx.updateTable('suppliers').set({ merged_into_id: intoId }).where('id', '=', fromId).execute();
  });
}
