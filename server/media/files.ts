import { GetObjectCommand } from '@aws-sdk/client-s3';
import { Router, type RequestHandler } from 'express';
import { type Readable } from 'node:stream';
import type { AppDeps } from '../app-deps';
import { actorOf } from '../http/registry';
import { canSee } from '../auth/policy';
import { buildResource } from '../auth/resources';
import { keysOf } from '../services/media/store';

/**
 * Serves photos through the app as a streaming proxy from S3 (DEVELOPERS.md, "Decisions"): same origin
 * for the Content-Security-Policy, one authorisation path (private builds' photos stay with their team),
 * and immutable caching because every address carries the content's SHA-256. Receipts are never here.
 */
export function filesRouter(deps: AppDeps, sessionAndActor: RequestHandler[]): Router {
  const router = Router();
  router.get('/files/:mediaId/:sha/:name', ...sessionAndActor, async (req, res) => {
    const id = Number(req.params.mediaId);
    const sha = String(req.params.sha);
    const name = String(req.params.name);
    const row =
      Number.isSafeInteger(id) && id > 0 && /^[0-9a-f]{64}$/.test(sha) && /^[a-z0-9.]{1,40}$/.test(name)
        ? await deps.db
            .selectFrom('media')
            .selectAll()
            .where('id', '=', id)
            .where('sha256', '=', sha)
            .where('kind', '<>', 'receipt')
            .executeTakeFirst()
        : undefined;
    // A sponsor organisation's logo credits it publicly (build pages, disclosures): anyone may fetch it.
    const isLogo = row?.sponsor_id != null && row.kind === 'logo';
    const resource = row?.build_id ? await buildResource(deps, { buildId: row.build_id }) : null;
    if (!row || (!isLogo && (!resource || !canSee(actorOf(req), resource)))) {
      res.status(404).type('text/plain').send('Not found');
      return;
    }
    const base = row.object_key.replace(/\/[^/]+$/, '');
    const wanted = `${base}/${name}`;
    // A size still being made falls back to the cleaned original, so a fresh picture never breaks.
    const key = keysOf(row).includes(wanted) ? wanted : row.object_key;
    let body: Readable;
    let type: string | undefined;
    try {
      const out = await deps.storage.client.send(new GetObjectCommand({ Bucket: deps.storage.bucket, Key: key }));
      body = out.Body as Readable;
      type = out.ContentType;
    } catch (err) {
      req.log?.warn({ err, key }, 'media object unavailable');
      res.status(503).setHeader('retry-after', '5').type('text/plain').send('Storage unavailable');
      return;
    }
    const isPublic = isLogo || (resource?.kind === 'build' && resource.visibility !== 'private');
    res.status(200);
    res.type(key === wanted && name.endsWith('.webp') ? 'image/webp' : (type ?? row.content_type));
    res.setHeader('x-content-type-options', 'nosniff');
    res.setHeader('cache-control', isPublic && key === wanted ? 'public, max-age=31536000, immutable' : 'private, max-age=300');
    body.on('error', (err) => {
      req.log?.warn({ err, key }, 'media stream failed');
      res.destroy(err);
    });
    body.pipe(res);
  });
  return router;
}
