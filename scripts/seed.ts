// `npm run db:seed`: the demo data, idempotent, against DATABASE_URL (and the S3 bucket named by the
// S3_* variables, for the demo photos; without S3_ENDPOINT or S3_BUCKET the photos are left out).
import { createS3Storage, type Storage } from '../server/adapters/storage';
import { createDb } from '../server/db/kysely';
import { runSeed } from '../server/seed';

/** Object storage for the demo photos from S3_* variables, or null when none is configured. */
export function seedStorageFromEnv(env: Record<string, string | undefined> = process.env): Storage | null {
  if (!env.S3_ENDPOINT && !env.S3_BUCKET) return null;
  return createS3Storage({
    S3_ENDPOINT: env.S3_ENDPOINT,
    S3_REGION: env.S3_REGION ?? 'us-east-1',
    S3_BUCKET: env.S3_BUCKET ?? 'rivet-reel-media',
    S3_ACCESS_KEY_ID: env.S3_ACCESS_KEY_ID ?? 'S3RVER',
    S3_SECRET_ACCESS_KEY: env.S3_SECRET_ACCESS_KEY ?? 'S3RVER',
    s3ForcePathStyle: env.S3_ENDPOINT !== undefined,
  });
}

/** Runs every demo seed section against the database at `url`; photos go to `storage` when given. */
export async function seedDatabase(url: string, storage: Storage | null = seedStorageFromEnv()): Promise<string[]> {
  const { db, destroy } = createDb(url, { max: 2 });
  try {
    return await runSeed(db, undefined, { storage });
  } finally {
    await destroy();
    storage?.close();
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
