import type { AppDeps } from '../app-deps';
import type { Resource } from './policy';

/** The build named by `:buildId`, as the policy sees it. */
export async function buildResource(deps: AppDeps, params: { buildId: number }): Promise<Resource | null> {
  const b = await deps.db.selectFrom('builds').select(['id', 'visibility']).where('id', '=', params.buildId).executeTakeFirst();
  return b ? { kind: 'build', id: b.id, visibility: b.visibility } : null;
}

/** The build an invitation (`:invitationId`) belongs to. */
export async function invitationBuildResource(deps: AppDeps, params: { invitationId: number }): Promise<Resource | null> {
  const b = await deps.db
    .selectFrom('invitations as i')
    .innerJoin('builds as b', 'b.id', 'i.build_id')
    .select(['b.id', 'b.visibility'])
    .where('i.id', '=', params.invitationId)
    .executeTakeFirst();
  return b ? { kind: 'build', id: b.id, visibility: b.visibility } : null;
}
