/**
 * Reads in progress, by key: a caller asking for a key whose read is already running waits for that
 * read instead of starting its own. Two hundred visitors opening one page, or searching one phrase,
 * at the same moment cost one database read, not two hundred. Nothing is kept once the read ends
 * (keeping is the caches' job).
 */
export class SingleFlight {
  private readonly running = new Map<string, Promise<unknown>>();

  run<T>(key: string, work: () => Promise<T>): Promise<T> {
    let p = this.running.get(key) as Promise<T> | undefined;
    if (!p) {
      p = work().finally(() => this.running.delete(key));
      this.running.set(key, p);
    }
    return p;
  }
}
