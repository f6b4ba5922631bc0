// `npm test`: a fresh test database in a cluster of its own, then typecheck, lint, unit, API,
// two-process, fault and browser suites. Prints one summary whose last line is `N passed, N failed[, N skipped]`.
import { spawn } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { startCluster } from './lib/postgres';
import { watchParent } from './lib/watch-parent';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const resultsDir = path.join(root, '.data', 'test-results');
const bin = (name: string) => path.join(root, 'node_modules', '.bin', name);
const log = (msg: string) => console.log(`[rivet-reel test] ${msg}`);

interface StepResult {
  name: string;
  passed: number;
  failed: number;
  skipped: number;
  seconds: number;
  /** Names and first message lines of failed tests, repeated in the summary (CI often shows only the tail). */
  failures?: string[];
}

function run(cmd: string, args: string[], env: NodeJS.ProcessEnv): Promise<number> {
  return new Promise((resolve) => {
    const child = spawn(cmd, args, { cwd: root, stdio: 'inherit', env });
    child.on('exit', (code, signal) => resolve(code ?? (signal ? 1 : 0)));
    child.on('error', () => resolve(1));
  });
}

/** A check (typecheck, lint) counts as one test: it passed or it failed. */
async function check(name: string, cmd: string, args: string[], env: NodeJS.ProcessEnv): Promise<StepResult> {
  const started = Date.now();
  log(`${name}…`);
  const code = await run(cmd, args, env);
  return { name, passed: code === 0 ? 1 : 0, failed: code === 0 ? 0 : 1, skipped: 0, seconds: (Date.now() - started) / 1000 };
}

interface VitestJson {
  numPassedTests: number;
  numFailedTests: number;
  numPendingTests: number;
  numTodoTests: number;
  numFailedTestSuites: number;
  success: boolean;
  testResults?: {
    name: string;
    message?: string;
    assertionResults?: { fullName: string; status: string; failureMessages?: string[] }[];
  }[];
}

function failuresOf(r: VitestJson): string[] {
  const out: string[] = [];
  for (const file of r.testResults ?? []) {
    const rel = path.relative(root, file.name);
    const failed = (file.assertionResults ?? []).filter((a) => a.status === 'failed');
    for (const a of failed) out.push(`${rel} › ${a.fullName}: ${(a.failureMessages?.[0] ?? '').split('\n')[0]!.slice(0, 300)}`);
    if (!failed.length && file.message) out.push(`${rel}: ${file.message.split('\n')[0]!.slice(0, 300)}`);
  }
  return out;
}

/** Runs one Vitest project and reads its counts from the JSON reporter. */
async function vitest(project: string, env: NodeJS.ProcessEnv, filters: string[] = []): Promise<StepResult> {
  const started = Date.now();
  const out = path.join(resultsDir, `${project}.json`);
  rmSync(out, { force: true });
  log(`${project} tests…`);
  const code = await run(
    bin('vitest'),
    ['run', '--project', project, '--reporter=default', '--reporter=json', `--outputFile.json=${out}`, ...filters],
    env,
  );
  const seconds = (Date.now() - started) / 1000;
  if (!existsSync(out)) return { name: `${project} tests`, passed: 0, failed: 1, skipped: 0, seconds };
  const r = JSON.parse(readFileSync(out, 'utf8')) as VitestJson;
  // A suite that failed to load has no failed test of its own, and a failed global setup (or "no test
  // files") fails the run with none at all: count those, so a step can never pass silently.
  let failed = r.numFailedTests + (r.numFailedTestSuites > 0 && r.numFailedTests === 0 ? r.numFailedTestSuites : 0);
  if (code !== 0 && failed === 0) failed = 1;
  return {
    name: `${project} tests`,
    passed: r.numPassedTests,
    failed,
    skipped: r.numPendingTests + r.numTodoTests,
    seconds,
    failures: failuresOf(r),
  };
}

async function main() {
  mkdirSync(resultsDir, { recursive: true });
  const cluster = await startCluster(root, 'test', Number(process.env.RR_TEST_PG_PORT ?? 54330), { durable: false });
  let exitCode = 1;
  const stop = () => cluster.stop();
  watchParent(() => {
    stop();
    process.exit(1);
  });
  for (const sig of ['SIGINT', 'SIGTERM', 'SIGHUP'] as const) {
    process.on(sig, () => {
      stop();
      process.exit(130);
    });
  }
  try {
    log(`PostgreSQL for tests on 127.0.0.1:${cluster.port}`);
    const env = {
      ...process.env,
      TEST_PG_ADMIN_URL: cluster.url('postgres'),
      AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: 'true',
      FORCE_COLOR: process.env.CI ? '0' : process.env.FORCE_COLOR,
    };
    const results: StepResult[] = [];
    // `faults` starts and restarts a PostgreSQL cluster of its own, so it runs alone, between the others.
    // `npm test -- faults e2e` runs only the named projects (no typecheck or lint), and any other
    // argument is a file filter for Vitest (`npm test -- e2e media`): for a developer chasing one
    // suite. CI and the README's command run everything.
    const all = ['unit', 'api', 'two-processes', 'faults', 'e2e'];
    const args = process.argv.slice(2);
    const only = args.filter((a) => all.includes(a));
    const filters = args.filter((a) => !all.includes(a));
    if (!only.length) {
      results.push(await check('typecheck', bin('tsc'), ['--noEmit'], env));
      results.push(await check('lint', bin('eslint'), ['.', '--max-warnings=0'], env));
    }
    for (const project of only.length ? only : all) results.push(await vitest(project, env, filters));

    const total = results.reduce((a, r) => ({ passed: a.passed + r.passed, failed: a.failed + r.failed, skipped: a.skipped + r.skipped }), {
      passed: 0,
      failed: 0,
      skipped: 0,
    });
    console.log('\nSummary');
    for (const r of results) {
      console.log(
        `  ${r.failed ? 'FAIL' : 'ok  '}  ${r.name.padEnd(12)} ${String(r.passed).padStart(4)} passed  ${String(r.failed).padStart(3)} failed  ${String(r.skipped).padStart(3)} skipped  ${r.seconds.toFixed(1)} s`,
      );
    }
    const failures = results.flatMap((r) => r.failures ?? []);
    if (failures.length) {
      console.log('\nFailed');
      for (const f of failures) console.log(`  ${f}`);
    }
    console.log(`${total.passed} passed, ${total.failed} failed${total.skipped ? `, ${total.skipped} skipped` : ''}`);
    exitCode = total.failed === 0 ? 0 : 1;
  } finally {
    stop();
  }
  process.exit(exitCode);
}

main().catch((err: unknown) => {
  console.error(err);
  console.log('0 passed, 1 failed');
  process.exit(1);
});
