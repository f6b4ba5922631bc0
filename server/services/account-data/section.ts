import type { Kysely } from 'kysely';
import type { Database } from '../../db/database';

/**
 * One kind of an account's data, for "download my data" and "delete my account". Each feature
 * adds a section (builds and episodes, media, posts) to the list in ./index.ts.
 */
export interface AccountDataSection {
  key: string;
  /** Everything of this kind the account wrote or owns, as plain JSON. */
  export(db: Kysely<Database>, userId: number): Promise<unknown>;
  /** Removes or detaches this kind of data inside the deletion transaction. */
  erase(trx: Kysely<Database>, userId: number): Promise<void>;
}
