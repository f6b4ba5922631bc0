import type { Insertable, Transaction } from 'kysely';
import type { Database } from '../../db/database';
import type { PostStateColumn, PostsTable } from '../../db/followers-tables';
import type { SeedSection } from '../section';

// Followers on the demo builds: questions and suggestions in every state, replies from the build
// team, one adopted suggestion with its note, one reported post, follows and a few notices.
type Trx = Transaction<Database>;

interface DemoPost {
  key: string;
  episode: string;
  author: string;
  kind: 'question' | 'suggestion';
  state: PostStateColumn;
  chapter: number;
  at?: number;
  body: string;
  note?: string;
  replies?: Array<{ author: string; body: string }>;
  reportedBy?: { author: string; reason: string };
}

const BUILD = 'marlowe-pipit-1976';
const POSTS: DemoPost[] = [
  {
    key: 'piston-seal',
    episode: 'front-brakes-apart',
    author: 'pria-castellane',
    kind: 'question',
    state: 'answered',
    chapter: 640,
    at: 702,
    body: 'What did you use to push the piston back without nicking the seal? Mine keeps tearing.',
    replies: [
      {
        author: 'jun-halloway',
        body: 'A wide clamp over the old pad, slowly, with the bleed nipple cracked open so the old fluid goes out, not back up.',
      },
    ],
  },
  {
    key: 'bag-the-bolts',
    episode: 'front-brakes-apart',
    author: 'ossie-brandt',
    kind: 'suggestion',
    state: 'adopted',
    chapter: 120,
    at: 151,
    body: 'Bag and label the caliper bolts per side as they come out; left and right are not always the same length on these.',
    note: 'Caliper bolts now go into labelled bags per side before anything else comes off.',
    replies: [{ author: 'marta-kettleby', body: 'Good call, they were different. Doing it from now on.' }],
  },
  {
    key: 'winch-instead',
    episode: 'dragging-it-home',
    author: 'pria-castellane',
    kind: 'suggestion',
    state: 'set-aside',
    chapter: 410,
    body: 'A hand winch on the trailer would have saved the rope burns with the seized brake.',
    replies: [{ author: 'marta-kettleby', body: 'Fair, but the hire trailer had no anchor point for one. Setting this aside for now.' }],
  },
  {
    key: 'walk-round-rust',
    episode: 'dragging-it-home',
    author: 'dov-achterberg',
    kind: 'question',
    state: 'open',
    chapter: 95,
    at: 131,
    body: 'Is that rust on the sill structural or just the outer skin? Hard to tell from the video.',
  },
  {
    key: 'thermostat-temp',
    episode: 'cooling-system-flush',
    author: 'ossie-brandt',
    kind: 'question',
    state: 'open',
    chapter: 820,
    body: 'Which opening temperature did you pick for the new thermostat, and why?',
  },
  {
    key: 'hub-caps',
    episode: 'dragging-it-home',
    author: 'dov-achterberg',
    kind: 'suggestion',
    state: 'open',
    chapter: 780,
    body: 'Anyone here selling a set of hub caps? Message me.',
    reportedBy: { author: 'pria-castellane', reason: 'A sales request, not about this step.' },
  },
];

async function ids(trx: Trx) {
  const users = new Map((await trx.selectFrom('users').select(['id', 'handle']).execute()).map((u) => [u.handle, u.id]));
  const build = await trx.selectFrom('builds').select(['id', 'owner_id']).where('slug', '=', BUILD).executeTakeFirst();
  const episodes = build
    ? new Map(
        (await trx.selectFrom('episodes').select(['id', 'slug']).where('build_id', '=', build.id).execute()).map((e) => [e.slug, e.id]),
      )
    : new Map<string, number>();
  const team = build
    ? new Set((await trx.selectFrom('build_members').select('user_id').where('build_id', '=', build.id).execute()).map((m) => m.user_id))
    : new Set<number>();
  return { users, build, episodes, team };
}

/** Inserts a post unless the same author already wrote the same text there (stable key for re-runs). */
async function upsertPost(trx: Trx, values: Insertable<PostsTable>) {
  const found = await trx
    .selectFrom('posts')
    .select('id')
    .where('episode_id', '=', values.episode_id)
    .where('author_id', '=', values.author_id)
    .where('body', '=', values.body)
    .executeTakeFirst();
  if (found) return found.id;
  return (await trx.insertInto('posts').values(values).returning('id').executeTakeFirstOrThrow()).id;
}

export const demoFollowersSection: SeedSection = {
  key: 'demo-followers',
  version: 1,
  async run(trx) {
    const { users, build, episodes, team } = await ids(trx);
    if (!build) return;
    const user = (h: string) => users.get(h)!;
    for (const p of POSTS) {
      const episodeId = episodes.get(p.episode);
      if (!episodeId) continue;
      const postId = await upsertPost(trx, {
        episode_id: episodeId,
        build_id: build.id,
        author_id: user(p.author),
        kind: p.kind,
        state: p.state,
        chapter_start_seconds: p.chapter,
        at_seconds: p.at ?? null,
        body: p.body,
        adopted_note: p.note ?? null,
        by_team: team.has(user(p.author)),
      });
      for (const r of p.replies ?? [])
        await upsertPost(trx, {
          episode_id: episodeId,
          build_id: build.id,
          author_id: user(r.author),
          parent_id: postId,
          kind: 'reply',
          body: r.body,
          by_team: team.has(user(r.author)),
        });
      if (p.reportedBy)
        await trx
          .insertInto('post_reports')
          .values({ post_id: postId, reporter_id: user(p.reportedBy.author), reason: p.reportedBy.reason })
          .onConflict((oc) => oc.columns(['post_id', 'reporter_id']).doNothing())
          .execute();
      if (p.replies?.length || p.state !== 'open') {
        const exists = await trx.selectFrom('notifications').select('id').where('post_id', '=', postId).executeTakeFirst();
        if (!exists)
          await trx
            .insertInto('notifications')
            .values({
              user_id: user(p.author),
              kind: p.replies?.length ? 'reply' : 'state-change',
              episode_id: episodeId,
              post_id: postId,
              email: 'sent',
            })
            .execute();
      }
    }
    const follows = [
      { user_id: user('pria-castellane'), build_id: build.id, creator_id: null },
      { user_id: user('ossie-brandt'), build_id: null, creator_id: build.owner_id },
      { user_id: user('dov-achterberg'), build_id: build.id, creator_id: null },
    ];
    for (const f of follows) {
      const q = trx.selectFrom('follows').select('id').where('user_id', '=', f.user_id);
      const found = await (
        f.build_id ? q.where('build_id', '=', f.build_id) : q.where('creator_id', '=', f.creator_id!)
      ).executeTakeFirst();
      if (!found) await trx.insertInto('follows').values(f).execute();
    }
    // A few notices as the outbox would hold them; the delivery sweep sends them to the local inbox.
    const notices = [
      {
        to: 'pria@demo.rivet-reel.test',
        subject: 'Jun Halloway replied to your question on the 1976 Marlowe Pipit hatchback',
        kind: 'notice-reply',
      },
      {
        to: 'ossie@demo.rivet-reel.test',
        subject: 'Your suggestion on the 1976 Marlowe Pipit hatchback was adopted',
        kind: 'notice-state-change',
      },
      { to: 'marta@demo.rivet-reel.test', subject: 'New question on the 1976 Marlowe Pipit hatchback, episode 1', kind: 'notice-new-post' },
    ];
    for (const [i, n] of notices.entries())
      await trx
        .insertInto('outbox_messages')
        .values({
          message_id: `<demo-notice-${i + 1}@rivet-reel.test>`,
          to_address: n.to,
          subject: n.subject,
          text_body: `${n.subject}.\n\n(Demo notice.)`,
          kind: n.kind,
        })
        .onConflict((oc) => oc.column('message_id').doNothing())
        .execute();
  },
};
