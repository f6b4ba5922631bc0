import { z } from 'zod';
import { writeUpDoc } from '../write-up';
import { pagedList, pageQuery } from './common';

/** One published episode as listed on the front page. */
export const episodeListItem = z.object({
  id: z.number().int(),
  number: z.number().int(),
  slug: z.string(),
  title: z.string(),
  summary: z.string().nullable(),
  publishedAt: z.string(),
  coverUrl: z.string().nullable(),
  /** `vehicle` is the vehicle in words ("1976 Marlowe Pipit"). */
  build: z.object({ id: z.number().int(), slug: z.string(), title: z.string(), vehicle: z.string() }),
  creator: z.object({ handle: z.string(), displayName: z.string() }),
});
export type EpisodeListItem = z.infer<typeof episodeListItem>;

export const latestEpisodesQuery = pageQuery;
export type LatestEpisodesQuery = z.infer<typeof latestEpisodesQuery>;

export const latestEpisodesResponse = pagedList(episodeListItem);
export type LatestEpisodesResponse = z.infer<typeof latestEpisodesResponse>;

// ——— Writing episodes (the editor) ———

export const EPISODE_STATUSES = ['draft', 'scheduled', 'published'] as const;

export const chapterInput = z.object({
  startSeconds: z
    .number()
    .int()
    .min(0)
    .max(48 * 3600),
  title: z.string().trim().min(1, 'needs a title').max(120),
  systemKey: z.string().max(40).nullable(),
  notes: z.string().trim().max(2000).nullable(),
});
export type ChapterInput = z.infer<typeof chapterInput>;
export const chapter = chapterInput.extend({ id: z.number().int(), endSeconds: z.number().int().nullable() });
export type Chapter = z.infer<typeof chapter>;

const episodeFields = {
  title: z.string().trim().min(1, 'needs a title').max(160),
  number: z.number().int().min(1).max(100_000),
  summary: z.string().trim().max(1000).nullable(),
  writeUp: writeUpDoc,
  videoUrl: z
    .url({ protocol: /^https?$/, message: 'an http(s) link to the video' })
    .max(500)
    .nullable(),
  durationSeconds: z
    .number()
    .int()
    .min(1)
    .max(48 * 3600)
    .nullable(),
  /** Hours worked in the session, to the quarter hour or finer (stored as minutes). */
  hoursWorked: z.number().min(0).max(1000).nullable(),
  raisedVehicle: z.boolean(),
  chapters: z.array(chapterInput).max(200),
};

export const episodeCreate = z.object({
  title: episodeFields.title,
  number: episodeFields.number.optional(),
  summary: episodeFields.summary.optional(),
});
export type EpisodeCreate = z.infer<typeof episodeCreate>;

/** An autosave: any fields, with the version the editor last saw (409 when it is stale). */
export const episodeUpdate = z
  .object({ version: z.number().int().min(1), ...episodeFields })
  .partial()
  .required({ version: true });
export type EpisodeUpdate = z.infer<typeof episodeUpdate>;

export const episodeVersionBody = z.object({ version: z.number().int().min(1) });
export const episodeSchedule = z.object({ version: z.number().int().min(1), publishAt: z.iso.datetime({ offset: true }) });

export const episode = z.object({
  id: z.number().int(),
  buildId: z.number().int(),
  slug: z.string(),
  ...episodeFields,
  /** The write-up as sanitised HTML: what readers get. */
  writeUpHtml: z.string(),
  chapters: z.array(chapter),
  status: z.enum(EPISODE_STATUSES),
  publishAt: z.string().nullable(),
  publishedAt: z.string().nullable(),
  version: z.number().int(),
  needsCaution: z.boolean(),
  deletedAt: z.string().nullable(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type Episode = z.infer<typeof episode>;

export const episodeSummary = z.object({
  id: z.number().int(),
  buildId: z.number().int(),
  number: z.number().int(),
  slug: z.string(),
  title: z.string(),
  status: z.enum(EPISODE_STATUSES),
  publishAt: z.string().nullable(),
  publishedAt: z.string().nullable(),
  hoursWorked: z.number().nullable(),
  updatedAt: z.string(),
});
export type EpisodeSummary = z.infer<typeof episodeSummary>;
export const episodeSummaryList = z.object({ items: z.array(episodeSummary) });

/** 422 body when publish checks fail: each problem names the field it is about. */
export const publishProblem = z.object({ field: z.string(), message: z.string() });

export const openItemCreate = z.object({
  title: z.string().trim().min(1, 'needs a title').max(160),
  note: z.string().trim().max(2000).nullable().optional(),
  openedInEpisodeId: z.number().int().positive(),
});
export const openItemUpdate = z
  .object({
    title: openItemCreate.shape.title,
    note: z.string().trim().max(2000).nullable(),
    closedInEpisodeId: z.number().int().positive().nullable(),
  })
  .partial()
  .refine((v) => Object.keys(v).length > 0, { message: 'nothing to change', path: ['title'] });
export const openItem = z.object({
  id: z.number().int(),
  buildId: z.number().int(),
  title: z.string(),
  note: z.string().nullable(),
  openedIn: z.object({ episodeId: z.number().int(), number: z.number().int(), title: z.string() }),
  closedIn: z.object({ episodeId: z.number().int(), number: z.number().int(), title: z.string() }).nullable(),
});
export type OpenItem = z.infer<typeof openItem>;
export const openItemList = z.object({ items: z.array(openItem) });

export const workbench = z.object({
  builds: z.array(
    z.object({
      id: z.number().int(),
      slug: z.string(),
      title: z.string(),
      visibility: z.enum(['public', 'unlisted', 'private']),
      role: z.enum(['owner', 'editor']),
      episodeCount: z.number().int(),
      publishedCount: z.number().int(),
      lastPublishedAt: z.string().nullable(),
      hoursWorked: z.number(),
    }),
  ),
  drafts: z.array(episodeSummary.extend({ buildTitle: z.string() })),
  scheduled: z.array(episodeSummary.extend({ buildTitle: z.string() })),
  deleted: z.array(
    z.object({
      kind: z.enum(['build', 'episode']),
      id: z.number().int(),
      title: z.string(),
      /** For an episode: the build it belongs to, so two "Episode 3"s can be told apart. */
      buildTitle: z.string().nullable(),
      deletedAt: z.string(),
      purgeAfter: z.string(),
    }),
  ),
  pendingTransfers: z.array(z.object({ buildId: z.number().int(), buildTitle: z.string(), fromDisplayName: z.string() })),
  /** Part lines on order across the creator's builds, oldest first, with the open item each holds up. */
  onOrder: z
    .array(
      z.object({
        id: z.number().int(),
        description: z.string(),
        grossMinor: z.number().int(),
        currency: z.string(),
        buildId: z.number().int(),
        buildTitle: z.string(),
        episodeId: z.number().int(),
        episodeNumber: z.number().int(),
        openItemTitle: z.string().nullable(),
      }),
    )
    .default([]),
  /** Posts on the creator's builds that no one of the build team has replied to yet, newest first. */
  unansweredPosts: z
    .array(
      z.object({
        id: z.number().int(),
        kind: z.enum(['question', 'suggestion']),
        excerpt: z.string(),
        authorName: z.string(),
        createdAt: z.string(),
        buildTitle: z.string(),
        episodeNumber: z.number().int(),
      }),
    )
    .default([]),
  /** Open questions and suggestions across the creator's builds. */
  openPostCount: z.number().int().default(0),
});
export type Workbench = z.infer<typeof workbench>;
