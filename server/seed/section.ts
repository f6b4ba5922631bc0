import type { Transaction } from 'kysely';
import type { Database } from '../db/database';

/**
 * One idempotent part of the demo data, keyed by a stable name. `run` must upsert on stable
 * identifiers so running it again changes nothing; bump `version` when its content changes.
 */
export interface SeedSection {
  key: string;
  version: number;
  run(trx: Transaction<Database>): Promise<void>;
}
