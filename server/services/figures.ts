import { sql, type Selectable } from 'kysely';
import { FIGURE_CAUTION, figureChecks } from '../../src/shared/figure-checks';
import type { Figure, FigureInput } from '../../src/shared/schemas/figures';
import { findThread } from '../../src/shared/threads';
import type { FiguresTable } from '../db/database';
import type { Db } from '../db/kysely';
import { HttpError } from '../http/http-error';

type Row = Selectable<FiguresTable>;
type System = { key: string; name: string; safety_critical: boolean };

/** numeric arrives as a string (see Decisions); figures are small decimals, safe as numbers. */
const num = (v: string | null): number | null => (v === null ? null : Number(v));

/** Row → the response readers and the editor get, with its checks and caution worked out. */
export function presentFigure(r: Row, systems: readonly System[]): Figure {
  const value = num(r.value);
  const wrenchRange =
    r.wrench_min !== null && r.wrench_max !== null && r.wrench_unit
      ? { min: num(r.wrench_min)!, max: num(r.wrench_max)!, unit: r.wrench_unit }
      : null;
  const system = r.system_key ? systems.find((s) => s.key === r.system_key) : undefined;
  return {
    id: r.id,
    episodeId: r.episode_id,
    position: r.position,
    fastener: r.fastener,
    thread: r.thread,
    threadLabel: findThread(r.thread)?.label ?? r.thread,
    gradeFitted: r.grade_fitted,
    gradeSpecified: r.grade_specified,
    method: r.method,
    value,
    unit: r.unit,
    angleStages: r.angle_stages,
    source: r.source,
    wrenchRange,
    system: system ? { key: system.key, name: system.name, safetyCritical: system.safety_critical } : null,
    note: r.note,
    checks: figureChecks({
      thread: r.thread,
      gradeFitted: r.grade_fitted,
      gradeSpecified: r.grade_specified,
      value,
      unit: r.unit,
      wrenchRange,
    }),
    caution: FIGURE_CAUTION,
  };
}

async function systemsOfEpisode(db: Db, episodeId: number): Promise<System[]> {
  return db
    .selectFrom('build_systems as s')
    .innerJoin('episodes as e', 'e.build_id', 's.build_id')
    .select(['s.key', 's.name', 's.safety_critical'])
    .where('e.id', '=', episodeId)
    .orderBy('s.position')
    .execute();
}

/** The episode's figures in their order, each with its checks. */
export async function listFigures(db: Db, episodeId: number): Promise<Figure[]> {
  const [rows, systems] = await Promise.all([
    db.selectFrom('figures').selectAll().where('episode_id', '=', episodeId).orderBy('position').execute(),
    systemsOfEpisode(db, episodeId),
  ]);
  return rows.map((r) => presentFigure(r, systems));
}

export async function getFigure(db: Db, figureId: number): Promise<Figure | null> {
  const r = await db.selectFrom('figures').selectAll().where('id', '=', figureId).executeTakeFirst();
  return r ? presentFigure(r, await systemsOfEpisode(db, r.episode_id)) : null;
}

function columns(input: FigureInput) {
  return {
    fastener: input.fastener,
    thread: input.thread,
    grade_fitted: input.gradeFitted,
    grade_specified: input.gradeSpecified,
    method: input.method,
    value: input.value,
    unit: input.unit,
    angle_stages: JSON.stringify(input.angleStages),
    source: input.source,
    wrench_min: input.wrenchRange?.min ?? null,
    wrench_max: input.wrenchRange?.max ?? null,
    wrench_unit: input.wrenchRange?.unit ?? null,
    system_key: input.systemKey,
    note: input.note,
  };
}

/** A figure names one of its build's systems, or none. */
async function checkSystem(db: Db, episodeId: number, key: string | null): Promise<void> {
  if (key === null) return;
  const systems = await systemsOfEpisode(db, episodeId);
  if (!systems.some((s) => s.key === key))
    throw new HttpError(400, 'invalid_request', 'Unknown vehicle system', { systemKey: ['not one of this build’s systems'] });
}

/** Adds a figure at the end of the episode's list. */
export async function createFigure(db: Db, episodeId: number, input: FigureInput): Promise<number> {
  await checkSystem(db, episodeId, input.systemKey);
  return db.transaction().execute(async (trx) => {
    // The episode row serialises concurrent additions, so positions never collide.
    await trx.selectFrom('episodes').select('id').where('id', '=', episodeId).forUpdate().executeTakeFirstOrThrow();
    const max = await trx
      .selectFrom('figures')
      .select((eb) => eb.fn.max('position').as('p'))
      .where('episode_id', '=', episodeId)
      .executeTakeFirst();
    const row = await trx
      .insertInto('figures')
      .values({ episode_id: episodeId, position: (max?.p ?? -1) + 1, ...columns(input) })
      .returning('id')
      .executeTakeFirstOrThrow();
    return row.id;
  });
}

/** Replaces what was recorded for a figure. */
export async function replaceFigure(db: Db, figureId: number, episodeId: number, input: FigureInput): Promise<void> {
  await checkSystem(db, episodeId, input.systemKey);
  await db
    .updateTable('figures')
    .set({ ...columns(input), updated_at: sql<Date>`now()` })
    .where('id', '=', figureId)
    .execute();
}

export async function deleteFigure(db: Db, figureId: number): Promise<void> {
  await db.deleteFrom('figures').where('id', '=', figureId).execute();
}

/** The system keys an episode's figures name, for the episode's caution (needsCaution). */
export async function figureSystemKeys(db: Db, episodeId: number): Promise<string[]> {
  const rows = await db
    .selectFrom('figures')
    .select('system_key')
    .distinct()
    .where('episode_id', '=', episodeId)
    .where('system_key', 'is not', null)
    .execute();
  return rows.flatMap((r) => (r.system_key ? [r.system_key] : []));
}
