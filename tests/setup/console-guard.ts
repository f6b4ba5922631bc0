// A test that logs console.error unexpectedly fails: errors should be asserted, not printed.
import { afterEach, beforeEach, vi, type MockInstance } from 'vitest';

let logged: unknown[][] = [];
let allowed = false;
let spy: MockInstance<typeof console.error> | undefined;

/** Lets the current test log errors on purpose (e.g. React's report of a thrown render error). */
export function allowConsoleErrors(): void {
  allowed = true;
}

beforeEach(() => {
  logged = [];
  allowed = false;
  spy = vi.spyOn(console, 'error').mockImplementation((...args: unknown[]) => {
    logged.push(args);
  });
});

afterEach(() => {
  spy?.mockRestore();
  if (logged.length && !allowed) {
    throw new Error(`console.error was called during the test:\n${logged.map((a) => a.map(String).join(' ')).join('\n')}`);
  }
});
