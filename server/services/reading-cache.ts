import { createHash } from 'node:crypto';
import { gzipSync } from 'node:zlib';
import type { Request, Response } from 'express';
import { LRUCache } from 'lru-cache';
import { SingleFlight } from './single-flight';

/** A response body ready to send: the JSON, its gzip form and its validator. */
export interface CachedBody {
  json: Buffer;
  gzip: Buffer;
  etag: string;
}

/**
 * Public reads of a build's content, kept per (what, build content revision) in this process: the
 * episode read, the episode page's answer for visitors, the build's totals.
 *
 * The build's `content_revision` goes up in the same transaction as any change a reader would see
 * (the triggers of migration 2026-12-03_1130), and the read's policy lookup loads it anyway: so a
 * cached body is served only while it is still what the database holds, and every process caches on
 * its own without telling the others. Entries also expire after a minute, for what changes with the
 * clock alone (a neighbour whose publication time arrives). Concurrent misses for one key share one
 * database read; the body is gzipped once, not per request.
 */
export class ReadingCache {
  private readonly cache: LRUCache<string, CachedBody>;
  private readonly loading = new SingleFlight();
  hits = 0;
  misses = 0;

  constructor(opts: { maxBytes?: number; ttlMs?: number } = {}) {
    this.cache = new LRUCache<string, CachedBody>({
      maxSize: opts.maxBytes ?? 32 * 1024 * 1024,
      sizeCalculation: (b) => b.json.length + b.gzip.length,
      ttl: opts.ttlMs ?? 60_000,
    });
  }

  /**
   * The cached body for `what` (e.g. `reading:12`) at `revision`, or `load()`'s result serialised
   * and kept (null is not kept).
   */
  async get(what: string, revision: number, load: () => Promise<unknown>): Promise<CachedBody | null> {
    const key = `${what}@${revision}`;
    const hit = this.cache.get(key);
    if (hit) {
      this.hits += 1;
      return hit;
    }
    this.misses += 1;
    return this.loading.run(key, async () => {
      const value = await load();
      if (value === null || value === undefined) return null;
      const body = toCachedBody(value);
      this.cache.set(key, body);
      return body;
    });
  }
}

export function toCachedBody(value: unknown): CachedBody {
  const json = Buffer.from(JSON.stringify(value));
  const hash = createHash('sha1').update(json).digest('base64url').slice(0, 27);
  return { json, gzip: gzipSync(json), etag: `W/"${json.length.toString(16)}-${hash}"` };
}

/** Sends a cached body: 304 when the client's copy is current, gzip when the client accepts it. */
export function sendCachedBody(req: Request, res: Response, body: CachedBody): void {
  res.setHeader('ETag', body.etag);
  res.setHeader('Vary', 'Accept-Encoding');
  res.type('application/json; charset=utf-8');
  if (req.fresh) {
    res.status(304).end();
    return;
  }
  if (req.acceptsEncodings('gzip', 'identity') === 'gzip') {
    res.setHeader('Content-Encoding', 'gzip');
    res.setHeader('Content-Length', body.gzip.length);
    res.end(body.gzip);
  } else {
    res.setHeader('Content-Length', body.json.length);
    res.end(body.json);
  }
}
