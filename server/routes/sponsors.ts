import type { Response } from 'express';
import { sql } from 'kysely';
import { z } from 'zod';
import { idParam, invitationCreate } from '../../src/shared/schemas/accounts';
import { emptyBody, sponsorLogoFields } from '../../src/shared/schemas/sponsor-admin';
import { sponsorInput, sponsorSummaryQuery, type SponsorSummaryQuery } from '../../src/shared/schemas/sponsors';
import type { AppDeps } from '../app-deps';
import { signedIn } from '../auth/policy';
import { buildResource, sponsorBySlugResource } from '../auth/resources';
import { HttpError } from '../http/http-error';
import { parse } from '../http/parse';
import { defineRoute } from '../http/registry';
import { presentSponsorRef } from '../presenters/sponsors';
import { inviteSponsorMember, resendInvitation } from '../services/invitations';
import { sponsorSummary, sponsorSummaryCsv, type SummaryScope } from '../services/sponsor-summary';
import {
  clearSponsorLogo,
  createSponsor,
  getSponsorForAdmin,
  getSponsorRef,
  linkSupplier,
  listSponsorsForAdmin,
  removeSponsorMember,
  selectSponsors,
  revokeSponsorInvitation,
  setSponsorLogo,
  unlinkSupplier,
  updateSponsor,
} from '../services/sponsors';
import { receiveFile } from './media';

const sponsorParams = z.object({ sponsorId: idParam });
const slugParams = z.object({ slug: z.string().min(1).max(60) });
const teamParams = z.object({ buildId: idParam, sponsorId: idParam });

async function sponsorOr404(deps: AppDeps, sponsorId: number) {
  const ref = await getSponsorRef(deps.db, sponsorId);
  if (!ref) throw new HttpError(404, 'not_found', 'No such sponsor organisation');
  return ref;
}

async function sendCsv(deps: AppDeps, res: Response, sponsorId: number, scope: SummaryScope, q: SponsorSummaryQuery, name: string) {
  const csv = await sponsorSummaryCsv(deps.db, sponsorId, scope, q, deps.config.PUBLIC_URL);
  res
    .status(200)
    .type('text/csv; charset=utf-8')
    .setHeader('content-disposition', `attachment; filename="${name}"`)
    .setHeader('cache-control', 'private, no-store')
    .send(csv);
}

/** Admins keep the organisations: details, logo, linked suppliers, members and invitations. */
export const sponsorAdminRoutes = [
  defineRoute({
    method: 'get',
    path: '/admin/sponsors',
    summary: 'Sponsor organisations with their member and supplier counts (admins)',
    action: 'admin.sponsors',
    handler: async ({ deps }) => ({ items: await listSponsorsForAdmin(deps.db) }),
  }),
  defineRoute({
    method: 'post',
    path: '/admin/sponsors',
    summary: 'Create a sponsor organisation (admins)',
    action: 'admin.sponsors',
    body: sponsorInput,
    handler: async ({ deps, body, res }) => {
      res.status(201);
      return createSponsor(deps.db, body);
    },
  }),
  defineRoute({
    method: 'get',
    path: '/admin/sponsors/:sponsorId',
    summary: 'One sponsor organisation with its suppliers, members and invitations (admins)',
    action: 'admin.sponsors',
    params: sponsorParams,
    handler: ({ deps, params }) => getSponsorForAdmin(deps.db, params.sponsorId),
  }),
  defineRoute({
    method: 'put',
    path: '/admin/sponsors/:sponsorId',
    summary: "Change a sponsor organisation's name, address slug and website (admins)",
    action: 'admin.sponsors',
    params: sponsorParams,
    body: sponsorInput,
    handler: ({ deps, params, body }) => updateSponsor(deps.db, params.sponsorId, body),
  }),
  defineRoute({
    method: 'post',
    path: '/admin/sponsors/:sponsorId/logo',
    summary: 'Upload the organisation\'s logo (multipart, field "file"; stored under the organisation\'s prefix, served publicly)',
    action: 'admin.sponsors',
    params: sponsorParams,
    // The multipart fields are read after the file, by multer; JSON bodies reach here empty.
    body: z.object({}).passthrough(),
    handler: async ({ deps, req, res, actor, params }) => {
      await sponsorOr404(deps, params.sponsorId);
      const file = await receiveFile(req, res);
      const fields = parse(sponsorLogoFields, req.body ?? {}, 'body');
      if (!file) throw new HttpError(400, 'invalid_request', 'Choose a logo to upload', { file: ['choose a file'] });
      const ref = await setSponsorLogo(deps, params.sponsorId, {
        bytes: file.buffer,
        originalName: file.originalname,
        altText: fields.altText,
        userId: signedIn(actor).userId,
      });
      res.status(201);
      return ref;
    },
  }),
  defineRoute({
    method: 'delete',
    path: '/admin/sponsors/:sponsorId/logo',
    summary: "Remove the organisation's logo (admins)",
    action: 'admin.sponsors',
    params: sponsorParams,
    handler: async ({ deps, params }) => void (await clearSponsorLogo(deps, params.sponsorId)),
  }),
  defineRoute({
    method: 'put',
    path: '/admin/sponsors/:sponsorId/suppliers/:supplierId',
    summary: 'Link a supplier the organisation stands behind (409 when another organisation backs it)',
    action: 'admin.sponsors',
    params: z.object({ sponsorId: idParam, supplierId: idParam }),
    body: emptyBody,
    handler: async ({ deps, params }) => void (await linkSupplier(deps.db, params.sponsorId, params.supplierId)),
  }),
  defineRoute({
    method: 'delete',
    path: '/admin/sponsors/:sponsorId/suppliers/:supplierId',
    summary: 'Unlink a supplier from the organisation (support already on part lines stays)',
    action: 'admin.sponsors',
    params: z.object({ sponsorId: idParam, supplierId: idParam }),
    handler: async ({ deps, params }) => void (await unlinkSupplier(deps.db, params.sponsorId, params.supplierId)),
  }),
  defineRoute({
    method: 'post',
    path: '/admin/sponsors/:sponsorId/invitations',
    summary: 'Invite a member of the organisation by e-mail address (the sponsor-member invitation)',
    action: 'admin.sponsors',
    params: sponsorParams,
    body: invitationCreate,
    rateLimit: ({ actor }) => [['invitation', String(actor?.userId)]],
    handler: async ({ deps, actor, params, body, res }) => {
      const invitation = await inviteSponsorMember(deps, signedIn(actor).userId, params.sponsorId, body.email);
      res.status(201);
      return invitation;
    },
  }),
  defineRoute({
    method: 'post',
    path: '/admin/sponsors/:sponsorId/invitations/:invitationId/resend',
    summary: 'Send a pending member invitation again with a fresh link (admins)',
    action: 'admin.sponsors',
    params: z.object({ sponsorId: idParam, invitationId: idParam }),
    body: emptyBody,
    rateLimit: ({ actor }) => [['invitation', String(actor?.userId)]],
    handler: async ({ deps, params }) => {
      const inv = await deps.db
        .selectFrom('invitations')
        .select('id')
        .where('id', '=', params.invitationId)
        .where('sponsor_id', '=', params.sponsorId)
        .executeTakeFirst();
      if (!inv) throw new HttpError(404, 'not_found', 'No such invitation for this organisation');
      return resendInvitation(deps, inv.id);
    },
  }),
  defineRoute({
    method: 'delete',
    path: '/admin/sponsors/:sponsorId/invitations/:invitationId',
    summary: 'Revoke a pending member invitation (admins)',
    action: 'admin.sponsors',
    params: z.object({ sponsorId: idParam, invitationId: idParam }),
    handler: async ({ deps, params }) => void (await revokeSponsorInvitation(deps.db, params.sponsorId, params.invitationId)),
  }),
  defineRoute({
    method: 'delete',
    path: '/admin/sponsors/:sponsorId/members/:userId',
    summary: 'Remove a member from the organisation (admins)',
    action: 'admin.sponsors',
    params: z.object({ sponsorId: idParam, userId: idParam }),
    handler: async ({ deps, params }) => void (await removeSponsorMember(deps.db, params.sponsorId, params.userId)),
  }),
];

/** The sponsor summary: the organisation's members, and each build team for its own build. */
export const sponsorSummaryRoutes = [
  defineRoute({
    method: 'get',
    path: '/sponsors/:slug/summary',
    summary: "The organisation's summary: its published support on public and unlisted builds (its members only)",
    action: 'sponsor.summary.read',
    params: slugParams,
    query: sponsorSummaryQuery,
    resource: sponsorBySlugResource,
    handler: async ({ deps, query, resource }) => {
      const sponsor = await sponsorOr404(deps, resource!.kind === 'sponsor' ? resource!.id : 0);
      return sponsorSummary(deps.db, sponsor, { kind: 'sponsor' }, query);
    },
  }),
  defineRoute({
    method: 'get',
    path: '/sponsors/:slug/summary.csv',
    summary: "The organisation's summary lines as CSV, with the same filters (its members only)",
    action: 'sponsor.summary.read',
    params: slugParams,
    query: sponsorSummaryQuery,
    resource: sponsorBySlugResource,
    handler: async ({ deps, params, query, res, resource }) => {
      const id = resource!.kind === 'sponsor' ? resource!.id : 0;
      await sendCsv(deps, res, id, { kind: 'sponsor' }, query, `${params.slug}-summary.csv`);
    },
  }),
  defineRoute({
    method: 'get',
    path: '/builds/:buildId/sponsor-summaries',
    summary: "The sponsors whose support is on this build's part lines, to open their summaries (the build team)",
    action: 'build.team.read',
    params: z.object({ buildId: idParam }),
    resource: buildResource,
    handler: async ({ deps, params }) => {
      const rows = await selectSponsors(deps.db)
        .where('s.id', 'in', (eb) =>
          eb
            .selectFrom('part_lines')
            .select('sponsor_id')
            .where('build_id', '=', params.buildId)
            .where('sponsor_id', 'is not', null)
            .where('support_kind', 'is not', null),
        )
        .orderBy(sql`lower(s.name)`)
        .orderBy('s.id')
        .execute();
      return { items: rows.map(presentSponsorRef) };
    },
  }),
  defineRoute({
    method: 'get',
    path: '/builds/:buildId/sponsors/:sponsorId/summary',
    summary: "One sponsor's summary on this build, unpublished lines included and marked (the build team)",
    action: 'build.team.read',
    params: teamParams,
    query: sponsorSummaryQuery,
    resource: buildResource,
    handler: async ({ deps, params, query }) => {
      const sponsor = await sponsorOr404(deps, params.sponsorId);
      return sponsorSummary(deps.db, sponsor, { kind: 'team', buildId: params.buildId }, query);
    },
  }),
  defineRoute({
    method: 'get',
    path: '/builds/:buildId/sponsors/:sponsorId/summary.csv',
    summary: "One sponsor's summary on this build as CSV, unpublished lines included and marked (the build team)",
    action: 'build.team.read',
    params: teamParams,
    query: sponsorSummaryQuery,
    resource: buildResource,
    handler: async ({ deps, params, query, res }) => {
      const sponsor = await sponsorOr404(deps, params.sponsorId);
      await sendCsv(
        deps,
        res,
        sponsor.id,
        { kind: 'team', buildId: params.buildId },
        query,
        `${sponsor.slug}-build-${params.buildId}-summary.csv`,
      );
    },
  }),
];
