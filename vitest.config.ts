import { defineConfig, mergeConfig } from 'vitest/config';
import viteConfig from './vite.config.ts';

export default mergeConfig(
  viteConfig,
  defineConfig({
    test: {
      setupFiles: ['tests/setup/console-guard.ts'],
      env: { AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: 'true' },
      projects: [
        {
          extends: true,
          test: { name: 'unit', include: ['src/**/*.test.{ts,tsx}', 'tests/unit/**/*.test.{ts,tsx}'], environment: 'node' },
        },
        {
          extends: true,
          test: {
            name: 'api',
            include: ['tests/api/**/*.test.ts'],
            // Some API suites also request pages, which the server renders from dist-test/.
            globalSetup: ['tests/setup/db-global.ts', 'tests/setup/build-global.ts'],
            testTimeout: 20_000,
            hookTimeout: 60_000,
            // Two cores: one worker per core, one database per test file.
            maxWorkers: 2,
          },
        },
        {
          extends: true,
          test: {
            // The API suites for sessions, rate limits, jobs and e-mail once more, with every request
            // alternating between two spawned server processes on one database (tests/helpers/test-app.ts).
            name: 'two-processes',
            include: ['tests/api/sessions.test.ts', 'tests/api/sign-in-email.test.ts', 'tests/api/notices.test.ts'],
            env: { RR_TWO_PROCESSES: '1' },
            globalSetup: ['tests/setup/db-global.ts', 'tests/setup/build-global.ts'],
            testTimeout: 30_000,
            hookTimeout: 120_000,
            fileParallelism: false,
          },
        },
        {
          extends: true,
          test: {
            // Fault injection (PostgreSQL restarts, fakes stopped, SIGTERM): a cluster of their own,
            // one file at a time, run by `npm test` as a step of its own (never beside other suites).
            name: 'faults',
            include: ['tests/faults/**/*.test.ts'],
            globalSetup: ['tests/setup/faults-global.ts'],
            testTimeout: 90_000,
            hookTimeout: 90_000,
            fileParallelism: false,
          },
        },
        {
          extends: true,
          test: {
            name: 'e2e',
            include: ['tests/e2e/**/*.test.ts'],
            globalSetup: ['tests/setup/db-global.ts', 'tests/setup/build-global.ts'],
            testTimeout: 60_000,
            hookTimeout: 120_000,
            fileParallelism: false,
          },
        },
      ],
    },
  }),
);
