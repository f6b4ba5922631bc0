import { sql } from 'kysely';
import type { Db } from '../db/kysely';
import type { SeedContext, SeedSection } from './section';
import { demoAccountsSection } from './sections/demo-accounts';
import { demoBuildsSection } from './sections/demo-builds';
import { demoFiguresSection } from './sections/demo-figures';
import { demoFollowersSection } from './sections/demo-followers';
import { demoPartsSection } from './sections/demo-parts';
import { demoPhotosSection } from './sections/demo-photos';
import { demoSponsorsSection } from './sections/demo-sponsors';

/** Every demo-seed section, in the order they run (later sections may use earlier ones' rows). */
export const seedSections: readonly SeedSection[] = [
  demoAccountsSection,
  demoBuildsSection,
  demoPartsSection,
  demoFiguresSection,
  demoFollowersSection,
  demoSponsorsSection,
  demoPhotosSection,
];

/**
 * Runs every section in its own transaction; safe to run on every start. Without storage, sections
 * that store files (demo photos) are left out.
 */
export async function runSeed(
  db: Db,
  sections: readonly SeedSection[] = seedSections,
  ctx: SeedContext = { storage: null },
): Promise<string[]> {
  const ran: string[] = [];
  for (const section of sections) {
    if (section.needsStorage && !ctx.storage) continue;
    await db.transaction().execute(async (trx) => {
      await section.run(trx, ctx);
      await trx
        .insertInto('seed_runs')
        .values({ section: section.key, version: section.version })
        .onConflict((oc) => oc.column('section').doUpdateSet({ version: section.version, ran_at: sql`now()` }))
        .execute();
    });
    ran.push(section.key);
  }
  return ran;
}
