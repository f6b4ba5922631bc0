import { z } from 'zod';
import { idParam, invitationCreate, invitationTokenBody } from '../../src/shared/schemas/accounts';
import { signedIn } from '../auth/policy';
import { buildResource, invitationBuildResource } from '../auth/resources';
import { HttpError } from '../http/http-error';
import { defineRoute } from '../http/registry';
import {
  acceptInvitation,
  inviteEditor,
  listInvitations,
  lookupInvitation,
  resendInvitation,
  revokeInvitation,
} from '../services/invitations';

const buildParams = z.object({ buildId: idParam });
const invitationParams = z.object({ invitationId: idParam });
const memberParams = z.object({ buildId: idParam, userId: idParam });

export const invitationRoutes = [
  defineRoute({
    method: 'get',
    path: '/builds/:buildId/members',
    summary: 'The build team: owner and editors',
    action: 'build.team.read',
    params: buildParams,
    resource: buildResource,
    handler: async ({ deps, params }) => {
      const rows = await deps.db
        .selectFrom('build_members as m')
        .innerJoin('users as u', 'u.id', 'm.user_id')
        .select(['u.id', 'u.handle', 'u.display_name', 'u.avatar_url', 'm.role'])
        .where('m.build_id', '=', params.buildId)
        .orderBy('m.role', 'desc')
        .orderBy('u.display_name')
        .execute();
      return {
        items: rows.map((r) => ({ userId: r.id, handle: r.handle, displayName: r.display_name, avatarUrl: r.avatar_url, role: r.role })),
      };
    },
  }),
  defineRoute({
    method: 'delete',
    path: '/builds/:buildId/members/:userId',
    summary: 'Remove an editor from the build team',
    action: 'build.team.manage',
    params: memberParams,
    resource: buildResource,
    handler: async ({ deps, params, res }) => {
      const m = await deps.db
        .selectFrom('build_members')
        .select(['id', 'role'])
        .where('build_id', '=', params.buildId)
        .where('user_id', '=', params.userId)
        .executeTakeFirst();
      if (!m) throw new HttpError(404, 'not_found', 'Not on this build team');
      if (m.role === 'owner') throw new HttpError(409, 'owner_cannot_leave', 'The owner cannot be removed; transfer the build first');
      await deps.db.deleteFrom('build_members').where('id', '=', m.id).execute();
      res.status(204);
    },
  }),
  defineRoute({
    method: 'get',
    path: '/builds/:buildId/invitations',
    summary: "The build's editor invitations with their state",
    action: 'build.team.manage',
    params: buildParams,
    resource: buildResource,
    handler: async ({ deps, params }) => ({ items: await listInvitations(deps, params.buildId) }),
  }),
  defineRoute({
    method: 'post',
    path: '/builds/:buildId/invitations',
    summary: 'Invite an editor by e-mail address',
    action: 'build.team.manage',
    params: buildParams,
    body: invitationCreate,
    resource: buildResource,
    rateLimit: ({ actor }) => [['invitation', String(actor?.userId)]],
    handler: async ({ deps, actor, params, body, res }) => {
      res.status(201);
      return inviteEditor(deps, signedIn(actor).userId, params.buildId, body.email);
    },
  }),
  defineRoute({
    method: 'post',
    path: '/invitations/:invitationId/resend',
    summary: 'Send an invitation again with a fresh link',
    action: 'build.team.manage',
    params: invitationParams,
    body: z.object({}).strict(),
    resource: invitationBuildResource,
    rateLimit: ({ actor }) => [['invitation', String(actor?.userId)]],
    handler: ({ deps, params }) => resendInvitation(deps, params.invitationId),
  }),
  defineRoute({
    method: 'delete',
    path: '/invitations/:invitationId',
    summary: 'Revoke a pending invitation',
    action: 'build.team.manage',
    params: invitationParams,
    resource: invitationBuildResource,
    handler: async ({ deps, params, res }) => {
      await revokeInvitation(deps, params.invitationId);
      res.status(204);
    },
  }),
  defineRoute({
    method: 'post',
    path: '/invitations/lookup',
    summary: 'What an invitation link is for (does not use it up)',
    action: 'site.read',
    body: invitationTokenBody,
    rateLimit: ({ req }) => [['sign-in', req.ip ?? 'unknown']],
    handler: ({ deps, body }) => lookupInvitation(deps, body.token),
  }),
  defineRoute({
    method: 'post',
    path: '/invitations/accept',
    summary: 'Accept an invitation as the signed-in account',
    action: 'account.self',
    body: invitationTokenBody,
    handler: ({ deps, actor, body }) => acceptInvitation(deps, signedIn(actor).userId, body.token),
  }),
];
