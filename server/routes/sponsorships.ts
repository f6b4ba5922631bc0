import { z } from 'zod';
import { idParam } from '../../src/shared/schemas/accounts';
import { sponsorshipInput, type Sponsorship, type SponsorList, type SponsorshipList } from '../../src/shared/schemas/sponsors';
import { buildResource, sponsorshipBuildResource } from '../auth/resources';
import { defineRoute } from '../http/registry';
import { createSponsorship, deleteSponsorship, listSponsorRefs, listSponsorships, updateSponsorship } from '../services/sponsorships';

const buildParams = z.object({ buildId: idParam });
const sponsorshipParams = z.object({ sponsorshipId: idParam });

export const sponsorshipRoutes = [
  defineRoute({
    method: 'get',
    path: '/sponsors',
    summary: 'Sponsor organisations (name, website, logo) for pickers; they are credited publicly anyway',
    action: 'site.read',
    handler: async ({ deps }): Promise<SponsorList> => ({ items: await listSponsorRefs(deps.db) }),
  }),
  defineRoute({
    method: 'get',
    path: '/builds/:buildId/sponsorships',
    summary: "The build's sponsorships (the owner's build settings)",
    action: 'build.manage',
    params: buildParams,
    resource: buildResource,
    handler: async ({ deps, params }): Promise<SponsorshipList> => ({ items: await listSponsorships(deps.db, params.buildId) }),
  }),
  defineRoute({
    method: 'post',
    path: '/builds/:buildId/sponsorships',
    summary: 'Add a sponsorship: sponsor, kind of support, start and optional end date',
    action: 'build.manage',
    params: buildParams,
    body: sponsorshipInput,
    resource: buildResource,
    handler: async ({ deps, params, body, res }): Promise<Sponsorship> => {
      const created = await createSponsorship(deps.db, params.buildId, body);
      res.status(201);
      return created;
    },
  }),
  defineRoute({
    method: 'put',
    path: '/sponsorships/:sponsorshipId',
    summary: "Change a sponsorship's sponsor, kind or dates",
    action: 'build.manage',
    params: sponsorshipParams,
    body: sponsorshipInput,
    resource: sponsorshipBuildResource,
    handler: ({ deps, params, body }): Promise<Sponsorship> => updateSponsorship(deps.db, params.sponsorshipId, body),
  }),
  defineRoute({
    method: 'delete',
    path: '/sponsorships/:sponsorshipId',
    summary: 'Remove a sponsorship',
    action: 'build.manage',
    params: sponsorshipParams,
    resource: sponsorshipBuildResource,
    handler: async ({ deps, params, res }) => {
      await deleteSponsorship(deps.db, params.sponsorshipId);
      res.status(204);
    },
  }),
];
