import { promises as fs } from 'node:fs';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { Migrator, type Kysely, type Migration, type MigrationProvider, type MigrationResultSet } from 'kysely';

export const MIGRATIONS_DIR = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../migrations');

/** Imports migration files itself, so the TypeScript files load under tsx and Vitest alike. */
class TsMigrationProvider implements MigrationProvider {
  async getMigrations(): Promise<Record<string, Migration>> {
    const files = (await fs.readdir(MIGRATIONS_DIR)).filter((f) => /^\d{4}-\d{2}-\d{2}_\d{4}_[\w-]+\.ts$/.test(f)).sort();
    const out: Record<string, Migration> = {};
    for (const file of files) {
      const mod = (await import(pathToFileURL(path.join(MIGRATIONS_DIR, file)).href)) as Migration;
      out[file.replace(/\.ts$/, '')] = { up: mod.up, down: mod.down };
    }
    return out;
  }
}

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- migrations are frozen in time and untyped
export function createMigrator(db: Kysely<any>): Migrator {
  return new Migrator({ db, provider: new TsMigrationProvider() });
}

function check(result: MigrationResultSet): MigrationResultSet {
  if (result.error) throw result.error instanceof Error ? result.error : new Error(String(result.error));
  return result;
}

/** Runs every pending migration; throws on the first failure. */
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function migrateToLatest(db: Kysely<any>): Promise<MigrationResultSet> {
  return check(await createMigrator(db).migrateToLatest());
}

/** Rolls back the most recent migration. */
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export async function migrateDown(db: Kysely<any>): Promise<MigrationResultSet> {
  return check(await createMigrator(db).migrateDown());
}
