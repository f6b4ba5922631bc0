import { fileURLToPath } from 'node:url';
import tailwindcss from '@tailwindcss/vite';
import react from '@vitejs/plugin-react';
import { defineConfig, type Rolldown } from 'vite';

const apiTarget = process.env.DEV_API_URL ?? 'http://127.0.0.1:3001';

const MAIN = fileURLToPath(new URL('./src/main.tsx', import.meta.url));
const EPISODE_ROUTE = fileURLToPath(new URL('./src/routes/episode-page.tsx', import.meta.url));
const SRC = fileURLToPath(new URL('./src/', import.meta.url));

/** React, the router and TanStack Query: every page needs them, so they travel as one chunk. */
const FRAMEWORK = /[\\/]node_modules[\\/](react|react-dom|scheduler|react-router|@tanstack[\\/](query-core|react-query))[\\/]/;

type GetModuleInfo = (id: string) => Rolldown.ModuleInfo | null;

function staticClosure(getInfo: GetModuleInfo, root: string, into = new Set<string>()): Set<string> {
  const stack = [root];
  while (stack.length) {
    const id = stack.pop()!;
    if (into.has(id)) continue;
    into.add(id);
    stack.push(...(getInfo(id)?.importedIds ?? []));
  }
  return into;
}

/**
 * The app modules every page loads (the entry's static imports), and those of the public episode
 * page that another page uses too. Left to itself the bundler gives each set of pages sharing
 * modules a chunk of its own: a few dozen files of a few hundred bytes on the episode's first load.
 */
function sharedFirstLoadModules(getInfo: GetModuleInfo): Set<string> {
  // Every page module (the target of a dynamic import), found from the entry.
  const pages = new Set<string>();
  const seen = new Set<string>();
  const stack = [MAIN];
  while (stack.length) {
    const info = getInfo(stack.pop()!);
    if (!info || seen.has(info.id)) continue;
    seen.add(info.id);
    for (const id of info.dynamicallyImportedIds) pages.add(id);
    stack.push(...info.importedIds, ...info.dynamicallyImportedIds);
  }
  const entry = staticClosure(getInfo, MAIN);
  const episode = staticClosure(getInfo, EPISODE_ROUTE);
  const elsewhere = new Set(entry);
  for (const page of pages) if (page !== EPISODE_ROUTE) staticClosure(getInfo, page, elsewhere);
  // The entry's own modules load on every page anyway; the episode route's go along when another page shares them.
  const wanted = [...entry, ...[...episode].filter((id) => elsewhere.has(id))];
  return new Set(wanted.filter((id) => id !== MAIN && id !== EPISODE_ROUTE && id.startsWith(SRC)));
}

/** Worked out once per build (the first time the bundler asks), from that build's module graph. */
let shared: { getInfo: GetModuleInfo; ids: Set<string> } | undefined;

export default defineConfig({
  plugins: [react(), tailwindcss()],
  build: {
    // Fonts are small enough as files; never inline them as data URLs (CSP and caching).
    assetsInlineLimit: 0,
    sourcemap: false,
    // `.vite/manifest.json`: `npm run bench` reads the episode route's first-load JavaScript from it.
    manifest: true,
    rolldownOptions: {
      output: {
        // Fewer, larger files on the first load (DEVELOPERS.md, "Keep the public first load small").
        codeSplitting: {
          groups: [
            { name: 'framework', test: FRAMEWORK, priority: 2 },
            {
              name: (id, ctx) => {
                const getInfo = (m: string) => ctx.getModuleInfo(m);
                if (shared?.getInfo !== ctx.getModuleInfo) shared = { getInfo: ctx.getModuleInfo, ids: sharedFirstLoadModules(getInfo) };
                return shared.ids.has(id) ? 'reading' : null;
              },
              priority: 1,
            },
          ],
        },
      },
    },
  },
  server: {
    host: '127.0.0.1',
    port: 5173,
    strictPort: true,
    proxy: { '/api': { target: apiTarget, changeOrigin: false }, '/auth': { target: apiTarget } },
  },
});
