// `npm start`: PostgreSQL, the fakes, migrations, demo data, the client bundle, then the server
// on 127.0.0.1:3000. Ctrl-C stops all of it.
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureBuilt } from './lib/build';
import { startLocalServices, type LocalServices } from './lib/services';
import { watchParent } from './lib/watch-parent';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const log = (msg: string) => console.log(`[rivet-reel] ${msg}`);
const APP_PORT = Number(process.env.PORT ?? 3000);

let services: LocalServices | undefined;
let server: ChildProcess | undefined;
let stopping = false;

async function stopAll(code: number): Promise<void> {
  if (stopping) return;
  stopping = true;
  log('stopping…');
  if (server && server.exitCode === null) {
    const exited = new Promise((r) => server?.once('exit', r));
    server.kill('SIGTERM');
    await Promise.race([exited, new Promise((r) => setTimeout(r, 25_000))]);
  }
  await services?.stop();
  process.exit(code);
}

async function main() {
  for (const sig of ['SIGINT', 'SIGTERM', 'SIGHUP'] as const) process.on(sig, () => void stopAll(0));
  watchParent(() => void stopAll(1));

  services = await startLocalServices(root, log, APP_PORT);
  ensureBuilt(root, 'dist', log);
  server = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: root,
    stdio: 'inherit',
    env: {
      NODE_ENV: 'production',
      LOG_LEVEL: 'info',
      ...services.serverEnv,
      ...process.env,
      HOST: '127.0.0.1',
      PORT: String(APP_PORT),
      DATABASE_URL: services.serverEnv.DATABASE_URL,
      DIST_DIR: 'dist',
    },
  });
  server.once('exit', (code) => {
    if (!stopping) {
      log(`server exited (${code}); stopping`);
      void stopAll(code ?? 1);
    }
  });
  log('');
  log(`app:          http://127.0.0.1:${APP_PORT}`);
  log(`mail inbox:   ${services.urls.inbox}`);
  log(
    `sign in:      http://127.0.0.1:${APP_PORT}/sign-in ("Continue with GitHub" opens the stand-in at ${services.urls.github}; pick a demo account)`,
  );
  log('Ctrl-C stops the server, the fakes and PostgreSQL.');
}

main().catch((err: unknown) => {
  console.error(err);
  void stopAll(1);
});
