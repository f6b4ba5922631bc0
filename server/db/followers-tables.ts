import type { ColumnType, Generated } from 'kysely';

type NullableTimestamp = ColumnType<Date | null, Date | string | null | undefined, Date | string | null>;

export type PostKind = 'question' | 'suggestion' | 'reply';
export type PostStateColumn = 'open' | 'answered' | 'adopted' | 'set-aside';
export type NoticeKind = 'new-episode' | 'reply' | 'state-change' | 'new-post' | 'sponsor-episode';
export type NoticeEmail = 'none' | 'sent' | 'digest' | 'digested';

/** A follow of one build or of one creator (all their public builds); exactly one is set. */
export interface FollowsTable {
  id: Generated<number>;
  user_id: number;
  build_id: number | null;
  creator_id: number | null;
  created_at: Generated<Date>;
}

export interface NoticePreferencesTable {
  user_id: number;
  new_episodes: Generated<'each' | 'weekly' | 'none'>;
  replies: Generated<boolean>;
  state_changes: Generated<boolean>;
  new_posts: Generated<'each' | 'daily' | 'none'>;
  updated_at: Generated<Date>;
}

/** A question, suggestion or reply; anchored to its episode and a moment, never a chapter row. */
export interface PostsTable {
  id: Generated<number>;
  episode_id: number;
  build_id: number;
  author_id: number;
  parent_id: number | null;
  kind: PostKind;
  state: PostStateColumn | null;
  chapter_start_seconds: number | null;
  at_seconds: number | null;
  body: string;
  adopted_note: string | null;
  by_team: Generated<boolean>;
  edited_at: NullableTimestamp;
  state_changed_at: NullableTimestamp;
  hidden_at: NullableTimestamp;
  hidden_reason: string | null;
  created_at: Generated<Date>;
  updated_at: Generated<Date>;
}

export interface PostReportsTable {
  id: Generated<number>;
  post_id: number;
  reporter_id: number;
  reason: string;
  resolved_at: NullableTimestamp;
  created_at: Generated<Date>;
}

export interface ModerationActionsTable {
  id: Generated<number>;
  post_id: number;
  actor_id: number | null;
  action: 'hide' | 'restore';
  reason: string;
  created_at: Generated<Date>;
}

export interface NotificationsTable {
  id: Generated<number>;
  user_id: number;
  kind: NoticeKind;
  episode_id: number | null;
  post_id: number | null;
  email: Generated<NoticeEmail>;
  read_at: NullableTimestamp;
  created_at: Generated<Date>;
}

export interface EpisodeAnnouncementsTable {
  episode_id: number;
  announced_at: Generated<Date>;
}

export interface MailSuppressionsTable {
  address: string;
  reason: string;
  created_at: Generated<Date>;
}

/** The followers issue's tables, merged into `Database`. */
export interface FollowersTables {
  follows: FollowsTable;
  notice_preferences: NoticePreferencesTable;
  posts: PostsTable;
  post_reports: PostReportsTable;
  moderation_actions: ModerationActionsTable;
  notifications: NotificationsTable;
  episode_announcements: EpisodeAnnouncementsTable;
  mail_suppressions: MailSuppressionsTable;
}
