// `npm run db:seed`: the demo data, idempotent, against DATABASE_URL.
import { createDb } from '../server/db/kysely';
import { runSeed } from '../server/seed';

/** Runs every demo seed section against the database at `url`. */
export async function seedDatabase(url: string): Promise<string[]> {
  const { db, destroy } = createDb(url, { max: 2 });
  try {
    return await runSeed(db);
  } finally {
    await destroy();
  }
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const url = process.env.DATABASE_URL;
  if (!url) {
    console.error('Set DATABASE_URL (see .env.example); npm start sets it for you.');
    process.exit(1);
  }
  seedDatabase(url)
    .then((sections) => console.log(`Seeded: ${sections.join(', ')}`))
    .catch((err: unknown) => {
      console.error(err);
      process.exit(1);
    });
}
