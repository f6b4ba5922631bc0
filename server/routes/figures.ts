import { z } from 'zod';
import { idParam } from '../../src/shared/schemas/accounts';
import { figureInput, type Figure, type FigureList } from '../../src/shared/schemas/figures';
import { episodeResource, figureResource } from '../auth/resources';
import { notFound } from '../http/http-error';
import { defineRoute } from '../http/registry';
import { createFigure, deleteFigure, getFigure, listFigures, replaceFigure } from '../services/figures';

const episodeParams = z.object({ episodeId: idParam });
const figureParams = z.object({ figureId: idParam });

export const figureRoutes = [
  defineRoute({
    method: 'get',
    path: '/episodes/:episodeId/figures',
    summary: "An episode's workshop figures with their checks and cautions (drafts only for its build team)",
    action: 'episode.read',
    params: episodeParams,
    resource: episodeResource,
    handler: async ({ deps, params }): Promise<FigureList> => ({ items: await listFigures(deps.db, params.episodeId) }),
  }),
  defineRoute({
    method: 'post',
    path: '/episodes/:episodeId/figures',
    summary: 'Record a figure in an episode (added at the end of its list)',
    action: 'episode.write',
    params: episodeParams,
    body: figureInput,
    resource: episodeResource,
    handler: async ({ deps, params, body, res }): Promise<Figure> => {
      const id = await createFigure(deps.db, params.episodeId, body);
      res.status(201);
      return (await getFigure(deps.db, id))!;
    },
  }),
  defineRoute({
    method: 'put',
    path: '/figures/:figureId',
    summary: 'Replace what was recorded for a figure',
    action: 'episode.write',
    params: figureParams,
    body: figureInput,
    resource: figureResource,
    handler: async ({ deps, params, body, resource }): Promise<Figure> => {
      if (resource?.kind !== 'episode') throw notFound();
      await replaceFigure(deps.db, params.figureId, resource.id, body);
      return (await getFigure(deps.db, params.figureId))!;
    },
  }),
  defineRoute({
    method: 'delete',
    path: '/figures/:figureId',
    summary: 'Remove a figure recorded by mistake',
    action: 'episode.write',
    params: figureParams,
    resource: figureResource,
    handler: async ({ deps, params, res }) => {
      await deleteFigure(deps.db, params.figureId);
      res.status(204);
    },
  }),
];
