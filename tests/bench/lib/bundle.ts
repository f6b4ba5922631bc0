// Client bundle sizes from the Vite build's manifest (`dist/client/.vite/manifest.json`): what the
// public episode route loads first (the entry, its static imports, and the route's own chunk with
// its imports), the editor's chunk (with what only it imports), and the CSS of the episode route.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { gzipSync } from 'node:zlib';

interface Chunk {
  file: string;
  isEntry?: boolean;
  imports?: string[];
  dynamicImports?: string[];
  css?: string[];
}
type Manifest = Record<string, Chunk>;

export interface BundleFigures {
  episode_initial_js_gzip_kb: number;
  editor_chunk_gzip_kb: number;
  css_gzip_kb: number;
  episode_initial_files: string[];
}

export const EPISODE_ROUTE = 'src/routes/episode-page.tsx';
const EDITOR_ROUTE = 'src/routes/episode-editor.tsx';

/** The chunk keys reachable from `key` through static imports. */
function staticClosure(m: Manifest, key: string, into = new Set<string>()): Set<string> {
  if (into.has(key) || !m[key]) return into;
  into.add(key);
  for (const k of m[key].imports ?? []) staticClosure(m, k, into);
  return into;
}

export function bundleFigures(clientDir: string): BundleFigures {
  const manifest = JSON.parse(readFileSync(path.join(clientDir, '.vite', 'manifest.json'), 'utf8')) as Manifest;
  const gz = (file: string) => gzipSync(readFileSync(path.join(clientDir, file))).length / 1024;
  const entry = Object.keys(manifest).find((k) => manifest[k]!.isEntry);
  if (!entry) throw new Error('no entry chunk in the Vite manifest');
  const initial = staticClosure(manifest, entry);
  // A lazy route loads its chunk before it renders; an eager one is already in the entry's closure.
  if (manifest[EPISODE_ROUTE]) staticClosure(manifest, EPISODE_ROUTE, initial);
  const editor = manifest[EDITOR_ROUTE] ? [...staticClosure(manifest, EDITOR_ROUTE)].filter((k) => !initial.has(k)) : [];
  const css = new Set([...initial].flatMap((k) => manifest[k]!.css ?? []));
  const kb = (xs: number[]) => Math.round(xs.reduce((a, b) => a + b, 0) * 10) / 10;
  return {
    episode_initial_js_gzip_kb: kb([...initial].map((k) => gz(manifest[k]!.file))),
    editor_chunk_gzip_kb: kb(editor.map((k) => gz(manifest[k]!.file))),
    css_gzip_kb: kb([...css].map(gz)),
    episode_initial_files: [...initial].map((k) => manifest[k]!.file),
  };
}
