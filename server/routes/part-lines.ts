import { z } from 'zod';
import { idParam } from '../../src/shared/schemas/accounts';
import {
  ledgerQuery,
  partLineInput,
  partLineUpdate,
  supplierCreate,
  supplierMerge,
  type BuildTotals,
  type LedgerResponse,
} from '../../src/shared/schemas/parts';
import { signedIn } from '../auth/policy';
import { buildResource, episodeResource, partLineResource } from '../auth/resources';
import { ledgerFilter, listLines, partTotals } from '../db/part-lines.queries';
import { HttpError } from '../http/http-error';
import { defineRoute } from '../http/registry';
import { presentPartLine } from '../presenters/part-lines';
import type { AppDeps } from '../app-deps';
import { createPartLine, deletePartLine, getPartLine, updatePartLine } from '../services/part-lines';
import { getBuildTotals, getEpisodeParts } from '../services/part-totals';
import { sendCachedBody } from '../services/reading-cache';
import { createSupplier, listSuppliers, mergeSuppliers } from '../services/suppliers';
import { exportLedgerCsv, importLedgerCsv, parseLedgerCsv } from '../services/ledger-csv';
import { sql } from 'kysely';

const episodeParams = z.object({ episodeId: idParam });
const lineParams = z.object({ partLineId: idParam });
const buildParams = z.object({ buildId: idParam });

async function buildCurrency(deps: AppDeps, buildId: number): Promise<string> {
  return (await deps.db.selectFrom('builds').select('currency').where('id', '=', buildId).executeTakeFirstOrThrow()).currency;
}

async function presentLine(deps: AppDeps, id: number) {
  const line = await getPartLine(deps.db, id);
  if (!line) throw new HttpError(404, 'not_found', 'Not found');
  return line;
}

export const partLineRoutes = [
  defineRoute({
    method: 'get',
    path: '/episodes/:episodeId/part-lines',
    summary: "An episode's parts list with its totals (drafts' lines only for the build team)",
    action: 'episode.read',
    params: episodeParams,
    resource: episodeResource,
    handler: async ({ deps, actor, params, resource }) => {
      const parts = await getEpisodeParts(deps.db, params.episodeId);
      // Receipts are the build team's: readers do not even learn that one exists.
      const team = resource?.kind === 'episode' && actor?.builds.has(resource.buildId) === true;
      return team ? parts : { ...parts, items: parts.items.map((l) => ({ ...l, receipt: null })) };
    },
  }),
  defineRoute({
    method: 'post',
    path: '/episodes/:episodeId/part-lines',
    summary: 'Add a line to the parts list (a position puts it back where an undone delete took it from)',
    action: 'episode.write',
    params: episodeParams,
    body: partLineInput.extend({ position: z.number().int().min(0).max(100_000).optional() }),
    resource: episodeResource,
    handler: async ({ deps, params, body, res }) => {
      const { position, ...line } = body;
      const id = await createPartLine(deps.db, params.episodeId, line, position);
      res.status(201);
      return presentLine(deps, id);
    },
  }),
  defineRoute({
    method: 'patch',
    path: '/part-lines/:partLineId',
    summary: 'Change fields of a part line',
    action: 'episode.write',
    params: lineParams,
    body: partLineUpdate,
    resource: partLineResource,
    handler: async ({ deps, params, body }) => {
      await updatePartLine(deps.db, params.partLineId, body);
      return presentLine(deps, params.partLineId);
    },
  }),
  defineRoute({
    method: 'delete',
    path: '/part-lines/:partLineId',
    summary: 'Remove a part line (the editor keeps it for undo)',
    action: 'episode.write',
    params: lineParams,
    resource: partLineResource,
    handler: async ({ deps, params, res }) => {
      await deletePartLine(deps.db, params.partLineId);
      res.status(204);
    },
  }),
  defineRoute({
    method: 'get',
    path: '/builds/:buildId/totals',
    summary: "The build's spend: spent, committed, planned, by system against budgets, supplier, kind and episode",
    action: 'build.read',
    params: buildParams,
    query: z.object({ scope: z.enum(['published', 'all']).default('published') }),
    resource: buildResource,
    handler: async ({ deps, actor, params, query, req, res, resource }): Promise<BuildTotals | void> => {
      // Lines of drafts stay with the build team; anyone else asking for them gets the published view.
      const includeUnpublished = query.scope === 'all' && actor?.builds.has(params.buildId) === true;
      if (includeUnpublished) return getBuildTotals(deps.db, params.buildId, true);
      // The published view is the same for everyone: kept per build content revision.
      const revision = resource?.kind === 'build' ? resource.contentRevision : undefined;
      if (revision === undefined) return getBuildTotals(deps.db, params.buildId, false);
      const body = await deps.readingCache.get(`totals:${params.buildId}`, revision, () => getBuildTotals(deps.db, params.buildId, false));
      if (!body) throw new HttpError(404, 'not_found', 'Not found');
      sendCachedBody(req, res, body);
    },
  }),
  defineRoute({
    method: 'get',
    path: '/builds/:buildId/ledger',
    summary: 'Every part line of the build, filtered, sorted and paged on the server, with the totals of the filter',
    action: 'build.team.read',
    params: buildParams,
    query: ledgerQuery,
    resource: buildResource,
    handler: async ({ deps, params, query }): Promise<LedgerResponse> => {
      const scope = { buildId: params.buildId, includeUnpublished: true };
      const currency = await buildCurrency(deps, params.buildId);
      const [page, totals] = await Promise.all([
        listLines(deps.db, scope, { ...query, limit: query.perPage, offset: (query.page - 1) * query.perPage }),
        partTotals(deps.db, scope, currency, ledgerFilter(query)),
      ]);
      return { items: page.rows.map(presentPartLine), page: query.page, perPage: query.perPage, total: totals.lines, totals };
    },
  }),
  defineRoute({
    method: 'get',
    path: '/builds/:buildId/ledger.csv',
    summary: 'The build\'s ledger as CSV (columns in README, "Ledger CSV")',
    action: 'build.team.read',
    params: buildParams,
    resource: buildResource,
    handler: async ({ deps, params, res }) => {
      const b = await deps.db.selectFrom('builds').select('slug').where('id', '=', params.buildId).executeTakeFirstOrThrow();
      res
        .status(200)
        .type('text/csv; charset=utf-8')
        .setHeader('content-disposition', `attachment; filename="${b.slug}-ledger.csv"`)
        .send(await exportLedgerCsv(deps.db, params.buildId));
    },
  }),
  defineRoute({
    method: 'post',
    path: '/builds/:buildId/ledger/import',
    summary: 'Preview (dryRun) or import part lines from CSV: every row checked, all saved or none',
    action: 'episode.write',
    params: buildParams,
    body: z.object({ csv: z.string().min(1, 'choose a CSV file').max(900_000, 'at most 900 kB'), dryRun: z.boolean().default(true) }),
    resource: buildResource,
    rateLimit: ({ actor }) => [['ledger-import', String(actor?.userId)]],
    handler: async ({ deps, actor, params, body, res }) => {
      if (body.dryRun) {
        const { rows } = await parseLedgerCsv(deps.db, params.buildId, body.csv);
        return { saved: false, imported: 0, rows };
      }
      const result = await importLedgerCsv(deps.db, params.buildId, signedIn(actor).userId, body.csv);
      if (!result.saved) {
        res.status(422).json({ error: { code: 'csv_rows_invalid', message: 'Some rows have problems; nothing was saved' }, ...result });
        return undefined;
      }
      res.status(201);
      return result;
    },
  }),
  defineRoute({
    method: 'get',
    path: '/suppliers',
    summary: "Suppliers for the parts table's autocomplete: the build's own first",
    action: 'account.self',
    query: z.object({ q: z.string().trim().max(120).default(''), buildId: idParam.optional() }),
    handler: async ({ deps, query }) => ({ items: await listSuppliers(deps.db, query.q, query.buildId) }),
  }),
  defineRoute({
    method: 'post',
    path: '/suppliers',
    summary: 'Create a supplier record on the fly (an existing one of the same name is returned instead)',
    action: 'account.self',
    body: supplierCreate,
    rateLimit: ({ actor }) => [['supplier-create', String(actor?.userId)]],
    handler: async ({ deps, actor, body, res }) => {
      const { supplier, created } = await createSupplier(deps.db, signedIn(actor).userId, body);
      res.status(created ? 201 : 200);
      return supplier;
    },
  }),
  defineRoute({
    method: 'post',
    path: '/admin/suppliers/:supplierId/merge',
    summary: 'Merge a duplicate supplier into another: its lines move, the record stays as a pointer',
    action: 'admin.suppliers',
    params: z.object({ supplierId: idParam }),
    body: supplierMerge,
    handler: async ({ deps, params, body }) => {
      await mergeSuppliers(deps.db, params.supplierId, body.intoId);
      const lines = await deps.db
        .selectFrom('part_lines')
        .select(sql<number>`count(*)::int`.as('n'))
        .where('supplier_id', '=', body.intoId)
        .executeTakeFirstOrThrow();
      return { intoId: body.intoId, lines: lines.n };
    },
  }),
];
