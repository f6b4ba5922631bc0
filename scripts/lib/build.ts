// Builds the client and the server-rendering bundle when their inputs changed since last time.
import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import path from 'node:path';

const INPUTS = ['src', 'public', 'index.html', 'vite.config.ts', 'tailwind.config.ts', 'package-lock.json'];

function newestMtime(p: string): number {
  if (!existsSync(p)) return 0;
  const st = statSync(p);
  if (!st.isDirectory()) return st.mtimeMs;
  let newest = st.mtimeMs;
  for (const entry of readdirSync(p)) newest = Math.max(newest, newestMtime(path.join(p, entry)));
  return newest;
}

/** Runs `vite build` for the client and the SSR entry into `outDir` unless it is up to date. */
export function ensureBuilt(root: string, outDir: string, log: (msg: string) => void): void {
  const stampFile = path.join(root, outDir, '.build-stamp');
  const inputs = Math.max(...INPUTS.map((i) => newestMtime(path.join(root, i))));
  const stamp = existsSync(stampFile) ? Number(readFileSync(stampFile, 'utf8')) : 0;
  if (stamp >= inputs && existsSync(path.join(root, outDir, 'server', 'entry-server.js'))) {
    log(`client bundle in ${outDir}/ is up to date`);
    return;
  }
  log(`building the client into ${outDir}/ …`);
  const vite = path.join(root, 'node_modules', '.bin', 'vite');
  for (const args of [
    ['build', '--outDir', `${outDir}/client`, '--emptyOutDir', '--logLevel', 'warn'],
    ['build', '--ssr', 'src/entry-server.tsx', '--outDir', `${outDir}/server`, '--emptyOutDir', '--logLevel', 'warn'],
  ]) {
    const r = spawnSync(vite, args, { cwd: root, stdio: 'inherit' });
    if (r.status !== 0) throw new Error(`vite ${args.join(' ')} failed`);
  }
  writeFileSync(stampFile, String(inputs));
}
