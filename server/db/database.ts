import type { ColumnType, Generated } from 'kysely';
import type { FollowersTables } from './followers-tables';

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
  notice_email: string | null;
  suspended_at: NullableTimestamp;
  deleted_at: NullableTimestamp;
  created_at: Generated<Date>;
  updated_at: Generated<Date>;
}

export type IdentityProvider = 'github' | 'email';
export type BuildRole = 'owner' | 'editor';
export type InvitationKind = 'build-editor' | 'sponsor-member';

export interface IdentitiesTable {
  id: Generated<number>;
  user_id: number;
  provider: IdentityProvider;
  provider_uid: string;
  created_at: Generated<Date>;
  last_used_at: NullableTimestamp;
}

export interface SessionsTable {
  sid: string;
  sess: unknown;
  expire: Timestamp;
}

export interface BuildMembersTable {
  id: Generated<number>;
  build_id: number;
  user_id: number;
  role: BuildRole;
  created_at: Generated<Date>;
}

export interface SponsorMembersTable {
  id: Generated<number>;
  sponsor_id: number;
  user_id: number;
  created_at: Generated<Date>;
}

export interface SignInTokensTable {
  id: Generated<number>;
  token_hash: string;
  email: string;
  return_to: string | null;
  expires_at: Timestamp;
  used_at: NullableTimestamp;
  created_at: Generated<Date>;
}

export interface InvitationsTable {
  id: Generated<number>;
  kind: InvitationKind;
  build_id: number | null;
  sponsor_id: number | null;
  email: string;
  token_hash: string;
  invited_by: number | null;
  expires_at: Timestamp;
  last_sent_at: Generated<Date>;
  accepted_at: NullableTimestamp;
  accepted_by: number | null;
  revoked_at: NullableTimestamp;
  created_at: Generated<Date>;
}

export interface AuditEventsTable {
  id: Generated<number>;
  actor_id: number | null;
  action: string;
  subject_user_id: number | null;
  details: ColumnType<Record<string, unknown>, string | undefined, string>;
  created_at: Generated<Date>;
}

export interface RateLimitsTable {
  key: string;
  points: number;
  expire: number | null;
}

export interface BuildsTable {
  id: Generated<number>;
  owner_id: number;
  slug: string;
  title: string;
  visibility: Generated<BuildVisibility>;
  vehicle_kind: Generated<VehicleKind>;
  vehicle_make: string | null;
  vehicle_model: string | null;
  vehicle_year: string | null;
  summary: string | null;
  currency: Generated<string>;
  budget_minor: number | null;
  video_link_pattern: Generated<string>;
  pending_transfer_to: number | null;
  cover_media_id: Generated<number | null>;
  /** Goes up with any change a reader of the build's episodes would see (migration 2026-12-03_1130). */
  content_revision: Generated<number>;
  deleted_at: NullableTimestamp;
  created_at: Generated<Date>;
  updated_at: Generated<Date>;
}

export type VehicleKind = 'car' | 'motorcycle' | 'tractor' | 'boat' | 'other';

export interface BuildSystemsTable {
  id: Generated<number>;
  build_id: number;
  key: string;
  name: string;
  safety_critical: Generated<boolean>;
  position: number;
  /** The system's own budget in the build's currency (minor units); null when it has none. */
  budget_minor: Generated<number | null>;
}

export interface BuildSlugsTable {
  id: Generated<number>;
  build_id: number;
  owner_id: number;
  slug: string;
  created_at: Generated<Date>;
}

export interface EpisodeSlugsTable {
  id: Generated<number>;
  episode_id: number;
  build_id: number;
  slug: string;
  created_at: Generated<Date>;
}

export interface ChaptersTable {
  id: Generated<number>;
  episode_id: number;
  position: number;
  start_seconds: number;
  title: string;
  system_key: string | null;
  notes: string | null;
}

export interface OpenItemsTable {
  id: Generated<number>;
  build_id: number;
  title: string;
  note: string | null;
  opened_in_episode_id: number;
  closed_in_episode_id: number | null;
  created_at: Generated<Date>;
  updated_at: Generated<Date>;
}

export type FigureMethod = 'torque' | 'torque-angle' | 'snug';
export type FigureUnit = 'N-m' | 'lbf-ft' | 'lbf-in' | 'kgf-m';
export type FigureSource = 'workshop-manual' | 'common-practice' | 'measured' | 'estimate';

/** A workshop figure in an episode; `value` and the wrench range are `numeric` (strings from pg). */
export interface FiguresTable {
  id: Generated<number>;
  episode_id: number;
  position: number;
  fastener: string;
  thread: string;
  grade_fitted: string | null;
  grade_specified: string | null;
  method: FigureMethod;
  value: ColumnType<string | null, number | null, number | null>;
  unit: FigureUnit;
  angle_stages: ColumnType<number[], string | undefined, string>;
  source: FigureSource;
  wrench_min: ColumnType<string | null, number | null, number | null>;
  wrench_max: ColumnType<string | null, number | null, number | null>;
  wrench_unit: FigureUnit | null;
  system_key: string | null;
  note: string | null;
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
  write_up: ColumnType<unknown, string | undefined, string>;
  write_up_html: Generated<string>;
  /** Kept by triggers for search (migration 2026-12-02_1600): the write-up's text, the chapter titles. */
  write_up_text: Generated<string>;
  chapter_titles: Generated<string>;
  video_url: string | null;
  duration_seconds: number | null;
  minutes_worked: number | null;
  raised_vehicle: Generated<boolean>;
  publish_at: NullableTimestamp;
  publish_error: string | null;
  version: Generated<number>;
  deleted_at: NullableTimestamp;
  cover_media_id: Generated<number | null>;
  /** The creator confirmed that the video itself discloses the support too (sponsors issue). */
  video_disclosure_confirmed: Generated<boolean>;
  created_at: Generated<Date>;
  updated_at: Generated<Date>;
}

export interface SponsorsTable {
  id: Generated<number>;
  slug: string;
  name: string;
  website: string | null;
  logo_media_id: number | null;
  created_at: Generated<Date>;
  updated_at: Generated<Date>;
}

export type SupportKindColumn = 'gifted' | 'discounted' | 'paid';

/** The suppliers an organisation stands behind (migration 2026-12-03_0700); a supplier has at most one. */
export interface SponsorSuppliersTable {
  sponsor_id: number;
  supplier_id: number;
  created_at: Generated<Date>;
}

/** A sponsor's support of a build for a time (DESIGN.md "sponsorship"). Dates are `date` columns, as YYYY-MM-DD strings. */
export interface SponsorshipsTable {
  id: Generated<number>;
  build_id: number;
  sponsor_id: number;
  kind: SupportKindColumn;
  starts_on: ColumnType<string, string, string>;
  ends_on: ColumnType<string | null, string | null | undefined, string | null>;
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
  /** Extra headers (List-Unsubscribe and friends), migration 2026-12-02_1900. */
  headers: ColumnType<Record<string, string>, string | undefined, string>;
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
export interface CurrenciesTable {
  code: string;
  exponent: number;
}

export interface SuppliersTable {
  id: Generated<number>;
  name: string;
  website: string | null;
  merged_into_id: number | null;
  created_by: number | null;
  created_at: Generated<Date>;
}

export type PartKindColumn = 'part' | 'consumable' | 'tool' | 'service' | 'sale';
export type PartSourceColumn = 'new' | 'used' | 'reconditioned' | 'reused' | 'made';
export type PartStatusColumn = 'needed' | 'on-order' | 'arrived' | 'fitted' | 'returned';

/** One row of an episode's parts list; net/tax/gross are generated by PostgreSQL (migration 2026-12-02_1800). */
export interface PartLinesTable {
  id: Generated<number>;
  build_id: number;
  episode_id: number;
  position: number;
  kind: PartKindColumn;
  description: string;
  part_number: string | null;
  supplier_id: number | null;
  system_key: string | null;
  at_seconds: number | null;
  source: PartSourceColumn;
  status: PartStatusColumn;
  /** numeric(12,3), as a decimal string. */
  quantity: string;
  unit: Generated<string>;
  unit_price_minor: number;
  currency: string;
  tax_rate_bp: Generated<number>;
  tax_included: Generated<boolean>;
  /** numeric(18,8), as a decimal string. */
  fx_rate: string | null;
  avoided_cost_minor: number | null;
  buy_url: string | null;
  affiliate: Generated<boolean>;
  open_item_id: number | null;
  receipt_media_id: Generated<number | null>;
  /** Support on the line: sponsor and kind (both, or neither, before publishing) and the unit list price. */
  support_kind: Generated<SupportKindColumn | null>;
  sponsor_id: Generated<number | null>;
  list_price_minor: Generated<number | null>;
  /** round(quantity × list price) − round(quantity × unit price), at least 0; 0 without support. */
  value_given_minor: ColumnType<number, never, never>;
  created_at: Generated<Date>;
  updated_at: Generated<Date>;
  net_minor: ColumnType<number, never, never>;
  tax_minor: ColumnType<number, never, never>;
  gross_minor: ColumnType<number, never, never>;
}

export type MediaKindColumn = 'photo' | 'receipt' | 'logo';

/** A stored file (migration 2026-12-02_1830): its object key in S3, its variants and its owner. */
export interface MediaTable {
  id: Generated<number>;
  build_id: number | null;
  sponsor_id: number | null;
  kind: MediaKindColumn;
  sha256: string;
  object_key: string;
  content_type: string;
  size_bytes: number;
  width: number | null;
  height: number | null;
  alt_text: string | null;
  placeholder: string | null;
  status: Generated<'processing' | 'ready' | 'failed'>;
  variants: ColumnType<unknown, string | undefined, string>;
  created_by: number | null;
  created_at: Generated<Date>;
}

export interface EpisodeGalleryTable {
  id: Generated<number>;
  episode_id: number;
  media_id: number;
  position: number;
}

export interface Database extends FollowersTables {
  users: UsersTable;
  builds: BuildsTable;
  episodes: EpisodesTable;
  sponsors: SponsorsTable;
  sponsor_suppliers: SponsorSuppliersTable;
  sponsorships: SponsorshipsTable;
  outbox_messages: OutboxMessagesTable;
  seed_runs: SeedRunsTable;
  identities: IdentitiesTable;
  sessions: SessionsTable;
  build_members: BuildMembersTable;
  sponsor_members: SponsorMembersTable;
  sign_in_tokens: SignInTokensTable;
  invitations: InvitationsTable;
  audit_events: AuditEventsTable;
  rate_limits: RateLimitsTable;
  build_systems: BuildSystemsTable;
  build_slugs: BuildSlugsTable;
  episode_slugs: EpisodeSlugsTable;
  chapters: ChaptersTable;
  open_items: OpenItemsTable;
  currencies: CurrenciesTable;
  suppliers: SuppliersTable;
  part_lines: PartLinesTable;
  media: MediaTable;
  episode_gallery: EpisodeGalleryTable;
  figures: FiguresTable;
}
