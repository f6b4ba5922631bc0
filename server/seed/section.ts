import type { Transaction } from 'kysely';
import type { Storage } from '../adapters/storage';
import type { Database } from '../db/database';

/** What a section may use besides the transaction: object storage when the caller has one. */
export interface SeedContext {
  storage: Storage | null;
}

/**
 * One idempotent part of the demo data, keyed by a stable name. `run` must upsert on stable
 * identifiers so running it again changes nothing; bump `version` when its content changes.
 * A section with `needsStorage` (demo photos) is skipped, and not recorded, when there is no storage.
 */
export interface SeedSection {
  key: string;
  version: number;
  needsStorage?: boolean;
  run(trx: Transaction<Database>, ctx: SeedContext): Promise<void>;
}
