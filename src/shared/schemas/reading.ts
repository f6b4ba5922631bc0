import { z } from 'zod';
import { VEHICLE_KINDS, VISIBILITIES } from './builds';
import { pagedList, pageQuery } from './common';
import { episodeListItem } from './episodes';
import { imageRef } from './media';
import { sponsorRef } from './sponsors';

// The public side: what readers get on the builds directory, build, episode, creator and search pages.

const person = z.object({ handle: z.string(), displayName: z.string() });
const vehicle = {
  vehicleKind: z.enum(VEHICLE_KINDS),
  vehicleMake: z.string().nullable(),
  vehicleModel: z.string().nullable(),
  vehicleYear: z.string().nullable(),
};

/** One public build in a list (directory, creator page). */
export const buildCard = z.object({
  id: z.number().int(),
  slug: z.string(),
  title: z.string(),
  ...vehicle,
  summary: z.string().nullable(),
  owner: person,
  episodeCount: z.number().int(),
  lastPublishedAt: z.string().nullable(),
});
export type BuildCard = z.infer<typeof buildCard>;

/** An empty string in a filter means "any" (a form's blank option). */
const blankToUndefined = (v: unknown) => (v === '' ? undefined : v);

export const buildDirectoryQuery = pageQuery.extend({
  kind: z.preprocess(blankToUndefined, z.enum(VEHICLE_KINDS).optional()),
  make: z.preprocess(blankToUndefined, z.string().trim().min(1).max(60).optional()),
  /** The first year of a decade: 1970 means 1970–1979. */
  decade: z.preprocess(blankToUndefined, z.coerce.number().int().min(1850).max(2100).multipleOf(10).optional()),
});
export type BuildDirectoryQuery = z.infer<typeof buildDirectoryQuery>;

export const buildDirectoryResponse = pagedList(buildCard).extend({
  /** Every make and decade among public builds, for the filter lists. */
  makes: z.array(z.string()),
  decades: z.array(z.number().int()),
});
export type BuildDirectoryResponse = z.infer<typeof buildDirectoryResponse>;

const episodeRef = z.object({ id: z.number().int(), number: z.number().int(), slug: z.string(), title: z.string() });
export type EpisodeRef = z.infer<typeof episodeRef>;

/** The build page: vehicle, team, episodes in order, what is still open, hours worked. */
export const buildOverview = z.object({
  id: z.number().int(),
  slug: z.string(),
  title: z.string(),
  visibility: z.enum(VISIBILITIES),
  ...vehicle,
  summary: z.string().nullable(),
  currency: z.string(),
  budgetMinor: z.number().int().nullable(),
  owner: person,
  /** The build's chosen cover photo, with its sizes; null when none is chosen. */
  cover: imageRef.nullable(),
  editors: z.array(person),
  systems: z.array(z.object({ key: z.string(), name: z.string(), safetyCritical: z.boolean() })),
  /** Published episodes only. */
  hoursWorked: z.number(),
  episodes: z.array(
    episodeRef.extend({
      summary: z.string().nullable(),
      publishedAt: z.string(),
      hoursWorked: z.number().nullable(),
      chapterCount: z.number().int(),
    }),
  ),
  openItems: z.array(z.object({ id: z.number().int(), title: z.string(), note: z.string().nullable(), openedIn: episodeRef })),
  /** Sponsors credited on the build page: its sponsorships and the sponsors of published supported lines. */
  sponsors: z.array(sponsorRef),
});
export type BuildOverview = z.infer<typeof buildOverview>;

/** The episode page: everything a reader needs, with the caution worked out on the server. */
export const episodeReading = z.object({
  id: z.number().int(),
  number: z.number().int(),
  slug: z.string(),
  title: z.string(),
  summary: z.string().nullable(),
  status: z.enum(['draft', 'scheduled', 'published']),
  publishedAt: z.string().nullable(),
  updatedAt: z.string(),
  videoUrl: z.string().nullable(),
  durationSeconds: z.number().int().nullable(),
  hoursWorked: z.number().nullable(),
  writeUpHtml: z.string(),
  /** The episode's chosen cover photo, shown above the write-up; null when none is chosen. */
  cover: imageRef.nullable(),
  /** The episode's gallery, in the creator's order (photos whose sizes are ready). */
  gallery: z.array(imageRef),
  chapters: z.array(
    z.object({
      id: z.number().int(),
      startSeconds: z.number().int(),
      endSeconds: z.number().int().nullable(),
      title: z.string(),
      system: z.object({ key: z.string(), name: z.string(), safetyCritical: z.boolean() }).nullable(),
      notes: z.string().nullable(),
      /** The video at this chapter's moment, from the build's link pattern; null without a video. */
      videoLink: z.string().nullable(),
    }),
  ),
  caution: z.array(z.string()),
  /** The build's vehicle systems, in its order. */
  systems: z.array(z.object({ key: z.string(), name: z.string(), safetyCritical: z.boolean() })),
  build: z.object({
    id: z.number().int(),
    slug: z.string(),
    title: z.string(),
    visibility: z.enum(VISIBILITIES),
    ...vehicle,
    owner: person,
  }),
  previous: episodeRef.nullable(),
  next: episodeRef.nullable(),
  openItems: z.object({
    opened: z.array(z.object({ id: z.number().int(), title: z.string(), note: z.string().nullable(), closed: z.boolean() })),
    closed: z.array(z.object({ id: z.number().int(), title: z.string(), openedIn: episodeRef })),
  }),
});
export type EpisodeReading = z.infer<typeof episodeReading>;

export const creatorPage = z.object({
  handle: z.string(),
  displayName: z.string(),
  avatarUrl: z.string().nullable(),
  builds: z.array(buildCard),
  latestEpisodes: z.array(episodeListItem),
});
export type CreatorPage = z.infer<typeof creatorPage>;

export const SEARCH_PAGE_SIZE = 10;
export const searchQuery = z.object({
  q: z.string().trim().max(200).default(''),
  page: pageQuery.shape.page,
});
export type SearchQuery = z.infer<typeof searchQuery>;

/**
 * A snippet arrives as plain text with matched words between these two characters (never HTML),
 * so the client can mark them without injecting markup.
 */
export const SNIPPET_MARK_START = '\u0002';
export const SNIPPET_MARK_END = '\u0003';

export const searchHit = z.object({
  /** A part hit is a line of an episode's parts list (its description or part number matched). */
  kind: z.enum(['episode', 'build', 'part']),
  id: z.number().int(),
  title: z.string(),
  snippet: z.string(),
  build: z.object({ slug: z.string(), title: z.string() }),
  creator: person,
  episode: z.object({ number: z.number().int(), slug: z.string() }).nullable(),
  publishedAt: z.string().nullable(),
});
export type SearchHit = z.infer<typeof searchHit>;
export const searchResponse = pagedList(searchHit).extend({ q: z.string() });
export type SearchResponse = z.infer<typeof searchResponse>;
