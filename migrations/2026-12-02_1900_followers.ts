import { sql, type Kysely } from 'kysely';

// Followers: follows of builds and creators, notice preferences, posts (questions, suggestions and
// their replies) anchored to an episode and a moment, reports and moderation, in-app notifications,
// the once-per-episode announcement guard, outbox headers and permanently failing addresses.
export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create table follows (
      id bigint generated always as identity primary key,
      user_id bigint not null references users(id) on delete cascade,
      build_id bigint references builds(id) on delete cascade,
      creator_id bigint references users(id) on delete cascade,
      created_at timestamptz not null default now(),
      constraint follows_one_target check ((build_id is null) <> (creator_id is null))
    )`.execute(db);
  await sql`create unique index follows_user_build_key on follows (user_id, build_id) where build_id is not null`.execute(db);
  await sql`create unique index follows_user_creator_key on follows (user_id, creator_id) where creator_id is not null`.execute(db);
  await sql`create index follows_build_id_idx on follows (build_id)`.execute(db);
  await sql`create index follows_creator_id_idx on follows (creator_id)`.execute(db);

  // No row means the defaults: every notice, each one as it happens.
  await sql`
    create table notice_preferences (
      user_id bigint primary key references users(id) on delete cascade,
      new_episodes text not null default 'each' check (new_episodes in ('each', 'weekly', 'none')),
      replies boolean not null default true,
      state_changes boolean not null default true,
      new_posts text not null default 'each' check (new_posts in ('each', 'daily', 'none')),
      updated_at timestamptz not null default now()
    )`.execute(db);

  // A post is anchored to its episode and a moment of the video, never to a chapter row: chapters
  // are re-inserted (new ids) on every editor save. The chapter is derived when reading.
  await sql`
    create table posts (
      id bigint generated always as identity primary key,
      episode_id bigint not null references episodes(id) on delete cascade,
      build_id bigint not null references builds(id) on delete cascade,
      author_id bigint not null references users(id),
      parent_id bigint references posts(id) on delete cascade,
      kind text not null check (kind in ('question', 'suggestion', 'reply')),
      state text check (state in ('open', 'answered', 'adopted', 'set-aside')),
      chapter_start_seconds integer check (chapter_start_seconds >= 0),
      at_seconds integer check (at_seconds >= 0),
      body text not null check (length(body) between 1 and 4000),
      adopted_note text,
      by_team boolean not null default false,
      edited_at timestamptz,
      state_changed_at timestamptz,
      hidden_at timestamptz,
      hidden_reason text,
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now(),
      constraint posts_shape check (
        (kind = 'reply' and parent_id is not null and state is null)
        or (kind = 'question' and parent_id is null and state in ('open', 'answered') and chapter_start_seconds is not null)
        or (kind = 'suggestion' and parent_id is null and state in ('open', 'adopted', 'set-aside') and chapter_start_seconds is not null)
      )
    )`.execute(db);
  await sql`create index posts_episode_id_idx on posts (episode_id)`.execute(db);
  await sql`create index posts_build_id_idx on posts (build_id, state)`.execute(db);
  await sql`create index posts_author_id_idx on posts (author_id)`.execute(db);
  await sql`create index posts_parent_id_idx on posts (parent_id)`.execute(db);

  await sql`
    create table post_reports (
      id bigint generated always as identity primary key,
      post_id bigint not null references posts(id) on delete cascade,
      reporter_id bigint not null references users(id) on delete cascade,
      reason text not null check (length(reason) between 1 and 500),
      resolved_at timestamptz,
      created_at timestamptz not null default now(),
      unique (post_id, reporter_id)
    )`.execute(db);
  await sql`create index post_reports_reporter_id_idx on post_reports (reporter_id)`.execute(db);

  await sql`
    create table moderation_actions (
      id bigint generated always as identity primary key,
      post_id bigint not null references posts(id) on delete cascade,
      actor_id bigint references users(id) on delete set null,
      action text not null check (action in ('hide', 'restore')),
      reason text not null check (length(reason) between 1 and 500),
      created_at timestamptz not null default now()
    )`.execute(db);
  await sql`create index moderation_actions_post_id_idx on moderation_actions (post_id)`.execute(db);
  await sql`create index moderation_actions_actor_id_idx on moderation_actions (actor_id)`.execute(db);

  // email: none (not wanted), sent (queued in the outbox), digest (waits for a digest), digested.
  await sql`
    create table notifications (
      id bigint generated always as identity primary key,
      user_id bigint not null references users(id) on delete cascade,
      kind text not null check (kind in ('new-episode', 'reply', 'state-change', 'new-post')),
      episode_id bigint references episodes(id) on delete cascade,
      post_id bigint references posts(id) on delete cascade,
      email text not null default 'none' check (email in ('none', 'sent', 'digest', 'digested')),
      read_at timestamptz,
      created_at timestamptz not null default now()
    )`.execute(db);
  await sql`create index notifications_user_idx on notifications (user_id, created_at desc)`.execute(db);
  await sql`create index notifications_digest_idx on notifications (user_id) where email = 'digest'`.execute(db);
  await sql`create index notifications_episode_id_idx on notifications (episode_id)`.execute(db);
  await sql`create index notifications_post_id_idx on notifications (post_id)`.execute(db);
  // Once per person per episode, whichever path announced it.
  await sql`create unique index notifications_new_episode_key on notifications (user_id, episode_id) where kind = 'new-episode'`.execute(db);

  // An episode is announced once, ever: publishing now, the scheduled job, or a re-publish after unpublishing.
  await sql`
    create table episode_announcements (
      episode_id bigint primary key references episodes(id) on delete cascade,
      announced_at timestamptz not null default now()
    )`.execute(db);
  // Episodes already out were announced by the world before notices existed: never again.
  await sql`insert into episode_announcements (episode_id) select id from episodes where status = 'published'`.execute(db);

  await sql`alter table outbox_messages add column headers jsonb not null default '{}'::jsonb`.execute(db);
  await sql`
    create table mail_suppressions (
      address text primary key,
      reason text not null,
      created_at timestamptz not null default now()
    )`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop table mail_suppressions`.execute(db);
  await sql`alter table outbox_messages drop column headers`.execute(db);
  for (const t of ['episode_announcements', 'notifications', 'moderation_actions', 'post_reports', 'posts', 'notice_preferences', 'follows']) {
    await sql`drop table ${sql.table(t)}`.execute(db);
  }
}
