#!/usr/bin/env node
// The entry of `npm start`, `npm test` and `npm run dev`. Plain Node with nothing installed:
// it installs what is missing (npm packages, Debian's PostgreSQL, Chromium for tests), then
// hands over to the TypeScript orchestration in scripts/<command>.ts.
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readdirSync, statSync, writeFileSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const command = process.argv[2];
const commands = { start: 'scripts/start.ts', test: 'scripts/test.ts', dev: 'scripts/dev.ts' };
if (!(command in commands)) {
  console.error(`usage: node scripts/bootstrap.mjs <${Object.keys(commands).join('|')}>`);
  process.exit(2);
}

const isRoot = typeof process.getuid === 'function' && process.getuid() === 0;
const say = (msg) => console.log(`[rivet-reel] ${msg}`);

function run(cmd, args, opts = {}) {
  const result = spawnSync(cmd, args, { stdio: 'inherit', cwd: root, ...opts });
  if (result.status !== 0) {
    console.error(`[rivet-reel] failed: ${cmd} ${args.join(' ')}`);
    process.exit(result.status ?? 1);
  }
}

function ensureNodeModules() {
  const lock = path.join(root, 'package-lock.json');
  const marker = path.join(root, 'node_modules', '.package-lock.json');
  if (existsSync(marker) && statSync(marker).mtimeMs >= statSync(lock).mtimeMs) return;
  say('installing npm packages (npm ci)…');
  run('npm', ['ci', '--no-audit', '--no-fund']);
}

let aptUpdated = false;
function aptInstall(packages) {
  if (!isRoot) {
    console.error(
      `[rivet-reel] missing system packages: ${packages.join(' ')}. Install them (apt-get install -y ${packages.join(' ')}) or run as root.`,
    );
    process.exit(1);
  }
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  if (!aptUpdated) {
    say('apt-get update…');
    run('apt-get', ['update', '-q'], { env });
    aptUpdated = true;
  }
  say(`apt-get install ${packages.join(' ')}…`);
  run('apt-get', ['install', '-y', '-q', '--no-install-recommends', ...packages], { env });
}

function postgresBinDir() {
  const base = '/usr/lib/postgresql';
  if (!existsSync(base)) return null;
  const versions = readdirSync(base)
    .filter((v) => existsSync(path.join(base, v, 'bin', 'postgres')) && existsSync(path.join(base, v, 'bin', 'initdb')))
    .sort((a, b) => Number(b) - Number(a));
  return versions.length ? path.join(base, versions[0], 'bin') : null;
}

function ensurePostgres() {
  if (postgresBinDir()) return;
  // Debian's package would otherwise create and start a cluster of its own on port 5432.
  const conf = '/etc/postgresql-common/createcluster.conf';
  mkdirSync(path.dirname(conf), { recursive: true });
  const current = existsSync(conf) ? readFileSync(conf, 'utf8') : '';
  if (!/^\s*create_main_cluster\s*=\s*false/m.test(current)) {
    writeFileSync(conf, `${current.replace(/^\s*create_main_cluster\s*=.*$/m, '')}\ncreate_main_cluster = false\n`);
  }
  aptInstall(['postgresql-15']);
  if (!postgresBinDir()) {
    console.error('[rivet-reel] PostgreSQL was installed but no server binary was found under /usr/lib/postgresql');
    process.exit(1);
  }
}

function ensureChromium() {
  const candidate = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
  if (existsSync(candidate)) return;
  aptInstall(['chromium']);
}

ensureNodeModules();
ensurePostgres();
if (command === 'test') ensureChromium();

const child = spawn(process.execPath, ['--import', 'tsx', commands[command], ...process.argv.slice(3)], {
  cwd: root,
  stdio: 'inherit',
  env: { ...process.env, RR_PG_BIN: postgresBinDir(), AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: 'true' },
});
// The orchestrator handles Ctrl-C itself (it receives the signal from the terminal too).
for (const sig of ['SIGINT', 'SIGTERM', 'SIGHUP']) process.on(sig, () => child.kill(sig));
child.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
