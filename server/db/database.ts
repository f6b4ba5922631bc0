import type { ColumnType, Generated } from 'kysely';

type Timestamp = ColumnType<Date, Date | string | undefined, Date | string>;
type NullableTimestamp = ColumnType<Date | null, Date | string | null | undefined, Date | string | null>;

export type BuildVisibility = 'public' | 'unlisted' | 'private';
export type EpisodeStatus = 'draft' | 'scheduled' | 'published';
export type OutboxStatus = 'pending' | 'sent' | 'failed';

export interface UsersTable {
  id: Generated<number>;
  handle: string;
  display_name: string;
  email: string | null;
  avatar_url: string | null;
  is_admin: Generated<boolean>;
  created_at: Generated<Date>;
  updated_at: Generated<Date>;
}

export interface BuildsTable {
  id: Generated<number>;
  owner_id: number;
  slug: string;
  title: string;
  visibility: Generated<BuildVisibility>;
  created_at: Generated<Date>;
  updated_at: Generated<Date>;
}

export interface EpisodesTable {
  id: Generated<number>;
  build_id: number;
  number: number;
  slug: string;
  title: string;
  summary: string | null;
  status: Generated<EpisodeStatus>;
  published_at: NullableTimestamp;
  created_at: Generated<Date>;
  updated_at: Generated<Date>;
}

export interface SponsorsTable {
  id: Generated<number>;
  slug: string;
  name: string;
  created_at: Generated<Date>;
  updated_at: Generated<Date>;
}

export interface OutboxMessagesTable {
  id: Generated<number>;
  message_id: string;
  to_address: string;
  subject: string;
  text_body: string;
  html_body: string | null;
  /** What caused it (e.g. `sign-in-link`), for the logs and the inbox's own tests. */
  kind: string;
  status: Generated<OutboxStatus>;
  attempts: Generated<number>;
  next_attempt_at: Generated<Date>;
  lease_until: NullableTimestamp;
  last_error: string | null;
  sent_at: NullableTimestamp;
  created_at: Generated<Date>;
  updated_at: Generated<Date>;
}

export interface SeedRunsTable {
  section: string;
  version: number;
  ran_at: Timestamp;
}

/** The typed schema Kysely checks every query against; extend it with each migration. */
export interface Database {
  users: UsersTable;
  builds: BuildsTable;
  episodes: EpisodesTable;
  sponsors: SponsorsTable;
  outbox_messages: OutboxMessagesTable;
  seed_runs: SeedRunsTable;
}
