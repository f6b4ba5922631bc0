// An orchestrator whose parent (npm, a terminal, CI) died must not leave PostgreSQL running.
const initialParent = process.ppid;

/** Calls `onOrphaned` once if this process is re-parented (its parent exited without signalling). */
export function watchParent(onOrphaned: () => void): void {
  const timer = setInterval(() => {
    if (process.ppid !== initialParent) {
      clearInterval(timer);
      onOrphaned();
    }
  }, 1_000);
  timer.unref();
}
