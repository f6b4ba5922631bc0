import http from 'node:http';
import { gzipSync } from 'node:zlib';
import { LRUCache } from 'lru-cache';
import { SingleFlight } from '../services/single-flight';

/** One API answer a page was built from: where it was read, and its validator. */
export interface PageSource {
  url: string;
  etag: string;
}

export interface CachedPage {
  html: Buffer;
  gzip: Buffer;
  sources: PageSource[];
}

/** What a render read through `recorder().fetch`: its sources, and whether the page may be kept. */
export interface RenderRecord {
  fetch: typeof fetch;
  sources: PageSource[];
  readonly cacheable: boolean;
}

/**
 * Server-rendered pages for visitors without a session, kept per address and served again only
 * while every API answer they were built from is unchanged.
 *
 * A render reads its data from the API over loopback; the recorder notes each answer's ETag. For the
 * next visitor the cache asks each of those addresses again with `If-None-Match`: when all answer
 * 304 the stored HTML (and its gzip) is sent instead of rendering again. The API's own caches make
 * those checks cheap (the episode page's answer is kept per build content revision), so a page that
 * changed is never served stale: whatever would change the answer changes its ETag. Rendering the
 * largest episode page cost ~180 ms of CPU; a check costs two small requests.
 *
 * Entries live 20 s at most, under the client's 30 s staleTime, so hydrated data is never taken for
 * stale on arrival. Signed-in visitors always get a fresh render (their header, their posts' actions).
 */
export class PageCache {
  private readonly cache: LRUCache<string, CachedPage>;
  private readonly renders = new SingleFlight();
  hits = 0;
  misses = 0;

  constructor(opts: { maxBytes?: number; ttlMs?: number } = {}) {
    this.cache = new LRUCache<string, CachedPage>({
      maxSize: opts.maxBytes ?? 64 * 1024 * 1024,
      sizeCalculation: (p) => p.html.length + p.gzip.length,
      ttl: opts.ttlMs ?? 20_000,
    });
  }

  /**
   * A fetch for one render that records the validators of the answers it reads. A page is kept only
   * if every read was a GET answered 200 with an ETag, without a redirect.
   */
  recorder(base: typeof fetch): RenderRecord {
    const sources: PageSource[] = [];
    let cacheable = true;
    const recording: typeof fetch = async (input, init) => {
      const res = await base(input, init);
      const etag = res.headers.get('etag');
      const method = (init?.method ?? 'GET').toUpperCase();
      if (method !== 'GET' || res.status !== 200 || res.redirected || !etag) cacheable = false;
      else sources.push({ url: typeof input === 'string' ? input : input instanceof URL ? input.href : input.url, etag });
      return res;
    };
    return {
      fetch: recording,
      sources,
      get cacheable() {
        return cacheable;
      },
    };
  }

  /** The page kept for `key`, if each of its sources still answers 304 (asked one after another). */
  async fresh(key: string): Promise<CachedPage | null> {
    const page = this.cache.get(key);
    if (page) {
      let current = true;
      for (const s of page.sources) {
        if ((await conditionalGet(s.url, s.etag)) !== 304) {
          current = false;
          break;
        }
      }
      if (current) {
        this.hits += 1;
        return page;
      }
      this.cache.delete(key);
    }
    this.misses += 1;
    return null;
  }

  /**
   * `work()` for `key`, shared with every caller that asks while it runs: a popular page that is not
   * kept yet (or has just changed) is rendered once, not once per visitor waiting for it.
   */
  shared<T>(key: string, work: () => Promise<T>): Promise<T> {
    return this.renders.run(key, work);
  }

  keep(key: string, html: string, sources: PageSource[]): CachedPage {
    const body = Buffer.from(html);
    const page = { html: body, gzip: gzipSync(body), sources: [...sources] };
    this.cache.set(key, page);
    return page;
  }
}

// Kept-alive connections for the checks (the server asking itself on loopback).
const agent = new http.Agent({ keepAlive: true, maxSockets: 64 });

/**
 * The status of a GET with `If-None-Match`. Not through fetch: the fetch standard turns a request
 * with a validator into one with `Cache-Control: no-cache`, which obliges the server to answer 200.
 */
function conditionalGet(url: string, etag: string): Promise<number> {
  return new Promise((resolve) => {
    const req = http.get(url, { agent, headers: { accept: 'application/json', 'if-none-match': etag } }, (res) => {
      res.resume();
      res.on('end', () => resolve(res.statusCode ?? 0));
      res.on('error', () => resolve(0));
    });
    req.on('error', () => resolve(0));
    req.setTimeout(10_000, () => req.destroy());
  });
}
