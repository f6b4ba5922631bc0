import { createBuild, createEpisode, createUser } from './factories';
import { signInByEmail, TestClient } from './http-client';
import type { TestApp } from './test-app';

export const doc = (text: string) => JSON.stringify({ type: 'doc', content: [{ type: 'paragraph', content: [{ type: 'text', text }] }] });

/** Chapters of the followers' test episode: [start, title]; the video runs 900 s. */
export const CHAPTERS: Array<[number, string]> = [
  [0, 'On the stands'],
  [120, 'Caliper off'],
  [400, 'Bleeding'],
];

/** A signed-in client for a new account. */
export async function person(app: TestApp, overrides: { is_admin?: boolean } = {}) {
  const user = await createUser(app.deps.db, overrides);
  const client = new TestClient(app.baseUrl);
  await signInByEmail(client, app.deps.db, user.email!);
  return { user, client };
}

/** A public build with an owner and an editor, and an episode (published unless said) with three chapters. */
export async function buildWithEpisode(
  app: TestApp,
  opts: { status?: 'draft' | 'published'; visibility?: 'public' | 'unlisted' | 'private' } = {},
) {
  const db = app.deps.db;
  const owner = await person(app);
  const editor = await person(app);
  const build = await createBuild(db, { owner_id: owner.user.id, visibility: opts.visibility ?? 'public' });
  await db
    .insertInto('build_members')
    .values([
      { build_id: build.id, user_id: owner.user.id, role: 'owner' },
      { build_id: build.id, user_id: editor.user.id, role: 'editor' },
    ])
    .execute();
  const episode = await addEpisode(app, build.id, opts.status ?? 'published');
  return { owner, editor, build, episode };
}

export async function addEpisode(app: TestApp, buildId: number, status: 'draft' | 'published' = 'published') {
  const db = app.deps.db;
  const episode = await createEpisode(db, {
    build_id: buildId,
    status,
    published_at: status === 'published' ? new Date() : null,
    duration_seconds: 900,
    write_up: doc('Calipers off, pistons freed, fluid changed.'),
  });
  await db
    .insertInto('chapters')
    .values(CHAPTERS.map(([start, title], i) => ({ episode_id: episode.id, position: i, start_seconds: start, title })))
    .execute();
  // Episodes made here as published were "announced" when they came out: only publishing via the app announces.
  if (status === 'published') await db.insertInto('episode_announcements').values({ episode_id: episode.id }).execute();
  return episode;
}
