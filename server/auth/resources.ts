import type { Db } from '../db/kysely';
import { compiledById } from '../db/prepared';
import type { AppDeps } from '../app-deps';
import type { Resource } from './policy';

/** The build named by `:buildId`, as the policy sees it. */
export async function buildResource(deps: AppDeps, params: { buildId: number }): Promise<Resource | null> {
  const b = await deps.db
    .selectFrom('builds')
    .select(['id', 'visibility', 'deleted_at', 'pending_transfer_to', 'content_revision'])
    .where('id', '=', params.buildId)
    .executeTakeFirst();
  return b
    ? {
        kind: 'build',
        id: b.id,
        visibility: b.visibility,
        deleted: b.deleted_at !== null,
        pendingTransferTo: b.pending_transfer_to,
        contentRevision: Number(b.content_revision),
      }
    : null;
}

/** The build an invitation (`:invitationId`) belongs to. */
export async function invitationBuildResource(deps: AppDeps, params: { invitationId: number }): Promise<Resource | null> {
  const b = await deps.db
    .selectFrom('invitations as i')
    .innerJoin('builds as b', 'b.id', 'i.build_id')
    .select(['b.id', 'b.visibility', 'b.deleted_at', 'b.pending_transfer_to'])
    .where('i.id', '=', params.invitationId)
    .executeTakeFirst();
  return b
    ? { kind: 'build', id: b.id, visibility: b.visibility, deleted: b.deleted_at !== null, pendingTransferTo: b.pending_transfer_to }
    : null;
}

/** The episode named by `:episodeId` with what the policy needs of its build. */
// Looked up on every episode request: compiled once, run as a prepared statement.
const episodeRow = compiledById((db: Db, id: number) =>
  db
    .selectFrom('episodes as e')
    .innerJoin('builds as b', 'b.id', 'e.build_id')
    .select(['e.id', 'e.build_id', 'e.status', 'e.deleted_at', 'b.visibility', 'b.deleted_at as build_deleted_at', 'b.content_revision'])
    .where('e.id', '=', id),
);

export async function episodeResource(deps: AppDeps, params: { episodeId: number }): Promise<Resource | null> {
  const e = (await episodeRow(deps.db, params.episodeId)).rows[0];
  return e
    ? {
        kind: 'episode',
        id: e.id,
        buildId: e.build_id,
        visibility: e.visibility,
        status: e.status,
        deleted: e.deleted_at !== null || e.build_deleted_at !== null,
        contentRevision: e.content_revision,
      }
    : null;
}

/** The episode an open item (`:openItemId`) was opened in. */
export async function openItemResource(deps: AppDeps, params: { openItemId: number }): Promise<Resource | null> {
  const o = await deps.db.selectFrom('open_items').select('opened_in_episode_id').where('id', '=', params.openItemId).executeTakeFirst();
  return o ? episodeResource(deps, { episodeId: o.opened_in_episode_id }) : null;
}

/** The episode a part line (`:partLineId`) belongs to. */
export async function partLineResource(deps: AppDeps, params: { partLineId: number }): Promise<Resource | null> {
  const l = await deps.db.selectFrom('part_lines').select('episode_id').where('id', '=', params.partLineId).executeTakeFirst();
  return l ? episodeResource(deps, { episodeId: l.episode_id }) : null;
}

/** The episode a figure (`:figureId`) belongs to. */
export async function figureResource(deps: AppDeps, params: { figureId: number }): Promise<Resource | null> {
  const f = await deps.db.selectFrom('figures').select('episode_id').where('id', '=', params.figureId).executeTakeFirst();
  return f ? episodeResource(deps, { episodeId: f.episode_id }) : null;
}

/** The build a stored file (`:mediaId`) belongs to; files of sponsor organisations come with the sponsors issue. */
export async function mediaResource(deps: AppDeps, params: { mediaId: number }): Promise<Resource | null> {
  const m = await deps.db.selectFrom('media').select(['build_id', 'kind']).where('id', '=', params.mediaId).executeTakeFirst();
  const build = m?.build_id ? await buildResource(deps, { buildId: m.build_id }) : null;
  // A receipt is the build team's alone, whatever the build's visibility: to anyone else it does not exist (404).
  return build && m?.kind === 'receipt' && build.kind === 'build' ? { ...build, visibility: 'private' } : build;
}

/** The post named by `:postId` with its episode's and build's visibility. */
export async function postResource(deps: AppDeps, params: { postId: number }): Promise<Resource | null> {
  const p = await deps.db
    .selectFrom('posts as p')
    .innerJoin('episodes as e', 'e.id', 'p.episode_id')
    .innerJoin('builds as b', 'b.id', 'p.build_id')
    .select([
      'p.id',
      'p.episode_id',
      'p.build_id',
      'p.author_id',
      'p.hidden_at',
      'e.status',
      'e.deleted_at',
      'b.visibility',
      'b.deleted_at as build_deleted_at',
    ])
    .where('p.id', '=', params.postId)
    .executeTakeFirst();
  return p
    ? {
        kind: 'post',
        id: p.id,
        episodeId: p.episode_id,
        buildId: p.build_id,
        visibility: p.visibility,
        status: p.status,
        deleted: p.deleted_at !== null || p.build_deleted_at !== null,
        authorId: p.author_id,
        hidden: p.hidden_at !== null,
      }
    : null;
}

/** The sponsor organisation named by `:slug`, for its summary (the policy hides it from non-members). */
export async function sponsorBySlugResource(deps: AppDeps, params: { slug: string }): Promise<Resource | null> {
  const s = await deps.db.selectFrom('sponsors').select('id').where('slug', '=', params.slug).executeTakeFirst();
  return s ? { kind: 'sponsor', id: s.id } : null;
}

/** The build a sponsorship (`:sponsorshipId`) belongs to. */
export async function sponsorshipBuildResource(deps: AppDeps, params: { sponsorshipId: number }): Promise<Resource | null> {
  const s = await deps.db.selectFrom('sponsorships').select('build_id').where('id', '=', params.sponsorshipId).executeTakeFirst();
  return s ? buildResource(deps, { buildId: s.build_id }) : null;
}
