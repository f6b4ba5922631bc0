import { sql, type Kysely } from 'kysely';
import { DEFAULT_SYSTEMS, type Build, type BuildCreate, type BuildSystem, type BuildUpdate } from '../../src/shared/schemas/builds';
import { slugify } from '../../src/shared/slug';
import type { Database } from '../db/database';
import type { Db } from '../db/kysely';
import { HttpError } from '../http/http-error';

type Trx = Kysely<Database>;
export const TRASH_DAYS = 30;

/** A slug free among this owner's builds (current and former slugs alike). */
export async function freeBuildSlug(trx: Trx, ownerId: number, title: string, exceptBuildId?: number): Promise<string> {
  const base = slugify(title);
  for (let n = 1; n < 500; n += 1) {
    const candidate = n === 1 ? base : `${base}-${n}`;
    const current = await trx
      .selectFrom('builds')
      .select('id')
      .where('owner_id', '=', ownerId)
      .where('slug', '=', candidate)
      .executeTakeFirst();
    const former = await trx
      .selectFrom('build_slugs')
      .select('build_id')
      .where('owner_id', '=', ownerId)
      .where('slug', '=', candidate)
      .executeTakeFirst();
    if ((!current || current.id === exceptBuildId) && (!former || former.build_id === exceptBuildId)) return candidate;
  }
  throw new HttpError(409, 'conflict', 'No free address for that title');
}

async function saveSystems(trx: Trx, buildId: number, systems: readonly BuildSystem[]) {
  await trx.deleteFrom('build_systems').where('build_id', '=', buildId).execute();
  if (!systems.length) return;
  await trx
    .insertInto('build_systems')
    .values(systems.map((s, i) => ({ build_id: buildId, key: s.key, name: s.name, safety_critical: s.safetyCritical, position: i })))
    .execute();
}

/** Starts a build: the creator becomes its owner; systems default to DESIGN.md's list. */
export async function createBuild(db: Db, ownerId: number, input: BuildCreate): Promise<number> {
  return db.transaction().execute(async (trx) => {
    const row = await trx
      .insertInto('builds')
      .values({
        owner_id: ownerId,
        slug: await freeBuildSlug(trx, ownerId, input.title),
        title: input.title,
        visibility: input.visibility,
        vehicle_kind: input.vehicleKind,
        vehicle_make: input.vehicleMake,
        vehicle_model: input.vehicleModel,
        vehicle_year: input.vehicleYear,
        summary: input.summary,
        currency: input.currency,
        budget_minor: input.budgetMinor,
        video_link_pattern: input.videoLinkPattern,
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    await trx.insertInto('build_members').values({ build_id: row.id, user_id: ownerId, role: 'owner' }).execute();
    await saveSystems(trx, row.id, input.systems ?? DEFAULT_SYSTEMS);
    return row.id;
  });
}

/** Edits a build; a new title moves the slug and keeps the old one as a redirect. */
export async function updateBuild(db: Db, buildId: number, input: BuildUpdate): Promise<void> {
  await db.transaction().execute(async (trx) => {
    const b = await trx
      .selectFrom('builds')
      .select(['owner_id', 'slug', 'title'])
      .where('id', '=', buildId)
      .forUpdate()
      .executeTakeFirstOrThrow();
    let slug = b.slug;
    if (input.title !== undefined && input.title !== b.title) {
      slug = await freeBuildSlug(trx, b.owner_id, input.title, buildId);
      if (slug !== b.slug) {
        await trx
          .insertInto('build_slugs')
          .values({ build_id: buildId, owner_id: b.owner_id, slug: b.slug })
          .onConflict((oc) => oc.columns(['owner_id', 'slug']).doNothing())
          .execute();
        await trx.deleteFrom('build_slugs').where('owner_id', '=', b.owner_id).where('slug', '=', slug).execute();
      }
    }
    await trx
      .updateTable('builds')
      .set({
        slug,
        ...(input.title !== undefined ? { title: input.title } : {}),
        ...(input.visibility !== undefined ? { visibility: input.visibility } : {}),
        ...(input.vehicleKind !== undefined ? { vehicle_kind: input.vehicleKind } : {}),
        ...(input.vehicleMake !== undefined ? { vehicle_make: input.vehicleMake } : {}),
        ...(input.vehicleModel !== undefined ? { vehicle_model: input.vehicleModel } : {}),
        ...(input.vehicleYear !== undefined ? { vehicle_year: input.vehicleYear } : {}),
        ...(input.summary !== undefined ? { summary: input.summary } : {}),
        ...(input.currency !== undefined ? { currency: input.currency } : {}),
        ...(input.budgetMinor !== undefined ? { budget_minor: input.budgetMinor } : {}),
        ...(input.videoLinkPattern !== undefined ? { video_link_pattern: input.videoLinkPattern } : {}),
        updated_at: sql<Date>`now()`,
      })
      .where('id', '=', buildId)
      .execute();
    if (input.systems) await saveSystems(trx, buildId, input.systems);
  });
}

/** The build as the API shows it to someone who may see it. */
export async function getBuild(db: Db, buildId: number, viewerId: number | null): Promise<Build | null> {
  const b = await db
    .selectFrom('builds as b')
    .innerJoin('users as u', 'u.id', 'b.owner_id')
    .leftJoin('users as t', 't.id', 'b.pending_transfer_to')
    .selectAll('b')
    .select(['u.handle as owner_handle', 'u.display_name as owner_name', 't.display_name as transfer_name'])
    .where('b.id', '=', buildId)
    .executeTakeFirst();
  if (!b) return null;
  const [systems, stats, member] = await Promise.all([
    db.selectFrom('build_systems').select(['key', 'name', 'safety_critical']).where('build_id', '=', buildId).orderBy('position').execute(),
    db
      .selectFrom('episodes')
      .select((eb) => [eb.fn.countAll<number>().as('n'), eb.fn.coalesce(eb.fn.sum<number>('minutes_worked'), sql<number>`0`).as('minutes')])
      .where('build_id', '=', buildId)
      .where('deleted_at', 'is', null)
      .executeTakeFirstOrThrow(),
    viewerId
      ? db.selectFrom('build_members').select('role').where('build_id', '=', buildId).where('user_id', '=', viewerId).executeTakeFirst()
      : undefined,
  ]);
  return {
    id: b.id,
    slug: b.slug,
    owner: { id: b.owner_id, handle: b.owner_handle, displayName: b.owner_name },
    title: b.title,
    vehicleKind: b.vehicle_kind,
    vehicleMake: b.vehicle_make,
    vehicleModel: b.vehicle_model,
    vehicleYear: b.vehicle_year,
    summary: b.summary,
    currency: b.currency,
    budgetMinor: b.budget_minor,
    visibility: b.visibility,
    videoLinkPattern: b.video_link_pattern,
    systems: systems.map((s) => ({ key: s.key, name: s.name, safetyCritical: s.safety_critical })),
    role: member?.role ?? null,
    hoursWorked: Number(stats.minutes) / 60,
    episodeCount: stats.n,
    // A hand-over in progress is the team's business and the recipient's, nobody else's.
    pendingTransferTo:
      b.pending_transfer_to && (member || viewerId === b.pending_transfer_to)
        ? { userId: b.pending_transfer_to, displayName: b.transfer_name ?? '' }
        : null,
    deletedAt: b.deleted_at?.toISOString() ?? null,
    createdAt: b.created_at.toISOString(),
    updatedAt: b.updated_at.toISOString(),
  };
}

/** Moves a build to the trash; a job removes it for good after TRASH_DAYS. */
export async function trashBuild(db: Db, buildId: number): Promise<void> {
  await db
    .updateTable('builds')
    .set({ deleted_at: sql<Date>`now()` })
    .where('id', '=', buildId)
    .where('deleted_at', 'is', null)
    .execute();
}

export async function restoreBuild(db: Db, buildId: number): Promise<void> {
  const r = await db
    .updateTable('builds')
    .set({ deleted_at: null })
    .where('id', '=', buildId)
    .where('deleted_at', '>', sql<Date>`now() - make_interval(days => ${TRASH_DAYS})`)
    .executeTakeFirst();
  if (!r.numUpdatedRows) throw new HttpError(409, 'not_in_trash', 'This build is not in the trash (or was removed for good)');
}

/** Offers the build to one of its editors; it moves when they accept. */
export async function offerTransfer(db: Db, buildId: number, toUserId: number): Promise<void> {
  const m = await db
    .selectFrom('build_members')
    .select('role')
    .where('build_id', '=', buildId)
    .where('user_id', '=', toUserId)
    .executeTakeFirst();
  if (m?.role !== 'editor')
    throw new HttpError(400, 'invalid_request', 'A build can only be handed to one of its editors', {
      toUserId: ['not an editor of this build'],
    });
  await db.updateTable('builds').set({ pending_transfer_to: toUserId }).where('id', '=', buildId).execute();
}

export async function cancelTransfer(db: Db, buildId: number): Promise<void> {
  await db.updateTable('builds').set({ pending_transfer_to: null }).where('id', '=', buildId).execute();
}

/** The editor takes the build: they become its owner, the old owner an editor. */
export async function acceptTransfer(db: Db, buildId: number, userId: number): Promise<void> {
  await db.transaction().execute(async (trx) => {
    const b = await trx
      .selectFrom('builds')
      .select(['owner_id', 'pending_transfer_to', 'slug', 'title'])
      .where('id', '=', buildId)
      .forUpdate()
      .executeTakeFirstOrThrow();
    if (b.pending_transfer_to !== userId) throw new HttpError(409, 'no_transfer', 'This build is not being handed to you');
    await trx
      .updateTable('build_members')
      .set({ role: 'editor' })
      .where('build_id', '=', buildId)
      .where('user_id', '=', b.owner_id)
      .execute();
    await trx.updateTable('build_members').set({ role: 'owner' }).where('build_id', '=', buildId).where('user_id', '=', userId).execute();
    // The address moves to the new owner; the old one keeps redirecting.
    await trx
      .insertInto('build_slugs')
      .values({ build_id: buildId, owner_id: b.owner_id, slug: b.slug })
      .onConflict((oc) => oc.columns(['owner_id', 'slug']).doNothing())
      .execute();
    const slug = await freeBuildSlug(trx, userId, b.title, buildId);
    await trx
      .updateTable('builds')
      .set({ owner_id: userId, pending_transfer_to: null, slug, updated_at: sql<Date>`now()` })
      .where('id', '=', buildId)
      .execute();
  });
}
