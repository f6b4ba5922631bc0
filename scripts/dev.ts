// `npm run dev`: the local services, the API server restarted on change (tsx watch, port 3001)
// and Vite's dev server on 5173 with /api proxied to it. Pages render in the browser only here;
// `npm start` serves the server-rendered build.
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { startLocalServices, type LocalServices } from './lib/services';
import { watchParent } from './lib/watch-parent';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const log = (msg: string) => console.log(`[rivet-reel dev] ${msg}`);
const API_PORT = 3001;
const children: ChildProcess[] = [];
let services: LocalServices | undefined;
let stopping = false;

async function stopAll(code: number) {
  if (stopping) return;
  stopping = true;
  await Promise.all(children.map((c) => new Promise((r) => (c.exitCode !== null ? r(null) : (c.once('exit', r), c.kill('SIGTERM'))))));
  await services?.stop();
  process.exit(code);
}

async function main() {
  for (const sig of ['SIGINT', 'SIGTERM', 'SIGHUP'] as const) process.on(sig, () => void stopAll(0));
  watchParent(() => void stopAll(1));
  services = await startLocalServices(root, log, 5173);
  const bin = (n: string) => path.join(root, 'node_modules', '.bin', n);
  children.push(
    spawn(bin('tsx'), ['watch', '--clear-screen=false', 'server/index.ts'], {
      cwd: root,
      stdio: 'inherit',
      env: {
        NODE_ENV: 'development',
        LOG_LEVEL: 'info',
        ...services.serverEnv,
        ...process.env,
        HOST: '127.0.0.1',
        PORT: String(API_PORT),
        DATABASE_URL: services.serverEnv.DATABASE_URL,
      },
    }),
    spawn(bin('vite'), [], { cwd: root, stdio: 'inherit', env: { ...process.env, DEV_API_URL: `http://127.0.0.1:${API_PORT}` } }),
  );
  for (const c of children) c.once('exit', (code) => void (stopping ? null : stopAll(code ?? 1)));
  log(`app (Vite, hot reload): http://127.0.0.1:5173   API: http://127.0.0.1:${API_PORT}   inbox: ${services.urls.inbox}`);
}

main().catch((err: unknown) => {
  console.error(err);
  void stopAll(1);
});
