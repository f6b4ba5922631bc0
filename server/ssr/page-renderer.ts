import { promises as fs } from 'node:fs';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import type { Request as ExpressRequest, RequestHandler, Response } from 'express';
import type { RenderInput, RenderResult } from '../../src/entry-server';
import { HYDRATION_SCRIPT_ID } from '../../src/app/hydration-data';
import { hasSessionCookie } from '../../src/shared/http';
import type { CachedPage, PageCache, RenderRecord } from './page-cache';

interface Bundle {
  template: string;
  render: (input: RenderInput) => Promise<RenderResult>;
}

/** Where the built client (index.html, assets) and the server-rendering entry live. */
export function distPaths(distDir: string) {
  const root = path.resolve(distDir);
  return { client: path.join(root, 'client'), entry: path.join(root, 'server', 'entry-server.js') };
}

/** The loopback address of the socket this request came in on: the server reaching itself. */
function selfBaseUrl(req: ExpressRequest): string {
  const { localAddress, localPort } = req.socket;
  const host = !localAddress || localAddress === '::' ? '127.0.0.1' : localAddress.replace(/^::ffff:/, '');
  return `http://${host.includes(':') ? `[${host}]` : host}:${localPort}`;
}

function toWebRequest(req: ExpressRequest): Request {
  const url = new URL(req.originalUrl, `http://${req.headers.host ?? 'localhost'}`);
  const headers = new Headers();
  for (const [k, v] of Object.entries(req.headers)) if (typeof v === 'string') headers.set(k, v);
  return new Request(url, { method: 'GET', headers });
}

/**
 * Server rendering for every page route: runs the route's loaders, renders React to HTML and
 * embeds hydration data as JSON (no inline script, so the CSP forbids all inline scripts).
 */
export function createPageRenderer(distDir: string, publicUrl: string, pageCache?: PageCache): RequestHandler {
  const paths = distPaths(distDir);
  let bundle: Promise<Bundle> | undefined;
  const load = (): Promise<Bundle> =>
    (bundle ??= (async () => {
      const template = await fs.readFile(path.join(paths.client, 'index.html'), 'utf8');
      const mod = (await import(pathToFileURL(paths.entry).href)) as { render: Bundle['render'] };
      return { template, render: mod.render };
    })().catch((err: unknown) => {
      bundle = undefined;
      throw err;
    }));

  return async (req, res) => {
    let loaded: Bundle;
    try {
      loaded = await load();
    } catch (err) {
      req.log?.error({ err }, 'client bundle missing; run `npm run build`');
      res.status(503).type('text/plain').send('The client has not been built yet. Run `npm run build` (npm start does it for you).');
      return;
    }
    /** Runs the loaders and renders; what to answer, the same for every request it is shared with. */
    const renderOnce = async (record?: RenderRecord): Promise<Outcome> => {
      const result = await loaded.render({
        request: toWebRequest(req),
        apiBaseUrl: selfBaseUrl(req),
        cookie: req.headers.cookie,
        publicUrl,
        fetch: record?.fetch,
      });
      if (result.type === 'response') {
        const location = result.response.headers.get('location');
        if (location && result.response.status >= 300 && result.response.status < 400)
          return { kind: 'redirect', status: result.response.status, location };
        return { kind: 'text', status: result.response.status, text: await result.response.text() };
      }
      const html = loaded.template
        .replace('<!--app-head-->', result.head)
        .replace('<!--app-html-->', () => result.html)
        .replace('<!--app-data-->', () => `<script type="application/json" id="${HYDRATION_SCRIPT_ID}">${result.data}</script>`);
      return { kind: 'page', status: result.status, html };
    };

    let outcome: Outcome;
    // A visitor without a session sees what every such visitor sees: the page may come from the
    // cache, and visitors asking for the same address at once share one render.
    if (pageCache && !hasSessionCookie(req.headers.cookie)) {
      const cache = pageCache;
      const key = req.originalUrl;
      const kept = await cache.fresh(key);
      if (kept) return sendPage(req, res, kept);
      outcome = await cache.shared(key, async () => {
        const record = cache.recorder(globalThis.fetch);
        const o = await renderOnce(record);
        return o.kind === 'page' && o.status === 200 && record.cacheable ? { ...o, kept: cache.keep(key, o.html, record.sources) } : o;
      });
    } else outcome = await renderOnce();

    if (outcome.kind === 'redirect') return res.redirect(outcome.status, outcome.location);
    if (outcome.kind === 'text') {
      res.status(outcome.status).type('text/plain').send(outcome.text);
      return;
    }
    if (outcome.kept) return sendPage(req, res, outcome.kept);
    // A page whose data was refused as overloaded or unavailable asks the client to come back later.
    if (outcome.status === 503) res.setHeader('retry-after', '5');
    res.status(outcome.status).setHeader('cache-control', 'no-store').type('html').send(outcome.html);
  };
}

type Outcome =
  | { kind: 'redirect'; status: number; location: string }
  | { kind: 'text'; status: number; text: string }
  | { kind: 'page'; status: number; html: string; kept?: CachedPage };

/** A kept page (status 200), gzipped when the client takes it. */
function sendPage(req: ExpressRequest, res: Response, { html, gzip }: CachedPage): void {
  res.status(200).setHeader('cache-control', 'no-store').setHeader('vary', 'Accept-Encoding').type('html');
  if (req.acceptsEncodings('gzip', 'identity') === 'gzip') {
    res.setHeader('content-encoding', 'gzip');
    res.end(gzip);
  } else res.end(html);
}
