import { DEFAULT_VIDEO_LINK_PATTERN } from './constants/builds';

// Chapters of an episode: start times as a person writes them (m:ss, h:mm:ss), the rules video
// hosts apply to chapter lists, the description block creators paste to and from a host, and
// links to a moment of the video. Pure: used by the editor and by the server's checks.

export type ChapterTimes = { startSeconds: number; title: string };
export type ChapterProblem = { index: number; field: 'startSeconds' | 'title'; message: string };
export type TimeResult = { ok: true; seconds: number } | { ok: false; message: string };

/** Common practice of video hosts: shorter chapters are not shown as chapters. */
export const MIN_CHAPTER_SECONDS = 10;
/** Common practice of video hosts: fewer chapters are not shown as chapters. */
export const MIN_EXPORT_CHAPTERS = 3;

const TIME = /^(?:(\d{1,2}):([0-5]\d)|(\d{1,2}):(\d{2}):(\d{2}))$/;

/** Reads `m:ss`, `mm:ss` or `h:mm:ss` (hours may be zero-padded); says in words what is wrong otherwise. */
export function checkTime(text: string): TimeResult {
  const t = text.trim();
  if (t === '') return { ok: false, message: 'needs a time such as 1:05' };
  const m = TIME.exec(t);
  if (m) {
    // Minutes past 59 are refused rather than guessed at: from an hour on, the hour is written.
    if (m[1] !== undefined) {
      if (Number(m[1]) < 60) return { ok: true, seconds: Number(m[1]) * 60 + Number(m[2]) };
    } else {
      const [h, min, s] = [Number(m[3]), Number(m[4]), Number(m[5])];
      if (min < 60 && s < 60) return { ok: true, seconds: h * 3600 + min * 60 + s };
    }
  }
  const parts = t.split(':');
  if (!/^[\d:]+$/.test(t) || parts.length < 2 || parts.length > 3 || parts.some((p) => p === '')) {
    return { ok: false, message: `“${t.slice(0, 20)}” is not a time such as 1:05 or 1:02:05` };
  }
  const last = parts[parts.length - 1] ?? '';
  if (last.length !== 2) return { ok: false, message: `“${t}”: seconds need two digits, as in 1:05` };
  if (Number(last) >= 60) return { ok: false, message: `“${t}”: seconds go up to 59` };
  if (parts.length === 2) return { ok: false, message: `“${t}”: from an hour on, write h:mm:ss, as in 1:02:05` };
  return { ok: false, message: `“${t}”: minutes need two digits up to 59, as in 1:02:05` };
}

/** Seconds for a time the way `checkTime` reads it, or null when it is not one (ask `checkTime` why). */
export function parseTime(text: string): number | null {
  const r = checkTime(text);
  return r.ok ? r.seconds : null;
}

/**
 * `m:ss` under an hour, `h:mm:ss` from an hour (3725 → 1:02:05). `withHours` forces h:mm:ss so a
 * list can use one width throughout. Fractions are dropped; negative or non-finite input throws.
 */
export function formatTime(seconds: number, opts: { withHours?: boolean } = {}): string {
  if (!Number.isFinite(seconds) || seconds < 0) throw new RangeError(`not a time: ${seconds}`);
  const total = Math.floor(seconds);
  const h = Math.floor(total / 3600);
  const m = Math.floor((total % 3600) / 60);
  const ss = String(total % 60).padStart(2, '0');
  return h > 0 || opts.withHours ? `${h}:${String(m).padStart(2, '0')}:${ss}` : `${m}:${ss}`;
}

/**
 * Problems with a chapter list, each pointing at a row. A chapter that is too short is reported
 * on itself. The list-wide "at least three" problem (export only) points at the last row, or row 0.
 */
export function validateChapters(
  chapters: ReadonlyArray<ChapterTimes>,
  opts: { durationSeconds?: number | null; forExport?: boolean } = {},
): ChapterProblem[] {
  const problems: ChapterProblem[] = [];
  const duration = opts.durationSeconds ?? null;
  const add = (index: number, field: ChapterProblem['field'], message: string) => problems.push({ index, field, message });
  const valid = (s: number) => Number.isInteger(s) && s >= 0;

  chapters.forEach((c, i) => {
    if (c.title.trim() === '') add(i, 'title', 'Needs a title');
    if (!valid(c.startSeconds)) return add(i, 'startSeconds', 'Needs a start time such as 1:05');
    const start = formatTime(c.startSeconds);
    if (duration !== null && c.startSeconds >= duration) {
      add(i, 'startSeconds', `Starts at ${start}, at or after the end of the video (${formatTime(duration)})`);
    }
    const prev = chapters[i - 1];
    if (prev && valid(prev.startSeconds)) {
      if (c.startSeconds === prev.startSeconds) {
        add(i, 'startSeconds', `Starts at ${start}, the same time as the chapter above: each chapter needs its own start`);
      } else if (c.startSeconds < prev.startSeconds) {
        add(
          i,
          'startSeconds',
          `Starts at ${start}, before the chapter above (${formatTime(prev.startSeconds)}): chapters must go in time order`,
        );
      }
    }
    const next = chapters[i + 1];
    const end = next ? (valid(next.startSeconds) ? next.startSeconds : null) : duration;
    const length = end === null ? null : end - c.startSeconds;
    if (length !== null && length > 0 && length < MIN_CHAPTER_SECONDS) {
      const until = next ? `the next chapter starts at ${formatTime(end ?? 0)}` : `the video ends at ${formatTime(end ?? 0)}`;
      add(i, 'startSeconds', `Only ${length} seconds long (${until}): each chapter must be at least ${MIN_CHAPTER_SECONDS} seconds`);
    }
  });

  if (opts.forExport) {
    const first = chapters[0];
    if (first && valid(first.startSeconds) && first.startSeconds !== 0) {
      add(0, 'startSeconds', `Starts at ${formatTime(first.startSeconds)}: for the video host the first chapter must start at 0:00`);
    }
    if (chapters.length < MIN_EXPORT_CHAPTERS) {
      add(
        Math.max(0, chapters.length - 1),
        'startSeconds',
        `Video hosts show chapters only from ${MIN_EXPORT_CHAPTERS} on: add ${MIN_EXPORT_CHAPTERS - chapters.length} more`,
      );
    }
  }
  return problems;
}

/** End of each chapter: the next one's start, the video's duration for the last one, or null. */
export function chapterEnds(chapters: ReadonlyArray<{ startSeconds: number }>, durationSeconds?: number | null): Array<number | null> {
  return chapters.map((_, i) => chapters[i + 1]?.startSeconds ?? durationSeconds ?? null);
}

// A time at the start of the line, optionally in brackets, then an optional separator.
const LINE = /^[([]?\s*(\d+(?::\d+)*)\s*[)\]]?\s*(?:[-–—:|]\s*)?(.*)$/;

/**
 * Reads a pasted block of `0:00 Title` lines (also `(0:00) Title`, `0:00 - Title`, `0:00 – Title`,
 * `0:00: Title`, `1:02:03 Title`). Blank lines are skipped; every other line without a good time
 * or title is reported by its 1-based line number and left out. Order is kept as pasted.
 */
export function importChapterBlock(text: string): { chapters: ChapterTimes[]; problems: Array<{ line: number; message: string }> } {
  const chapters: ChapterTimes[] = [];
  const problems: Array<{ line: number; message: string }> = [];
  text.split(/\r\n|\r|\n/).forEach((raw, i) => {
    const line = raw.trim();
    if (line === '') return;
    const m = LINE.exec(line);
    if (!m) return problems.push({ line: i + 1, message: `Line ${i + 1} has no start time at the beginning, as in “0:00 Intro”` });
    const time = checkTime(m[1] ?? '');
    const title = (m[2] ?? '').trim();
    if (!time.ok) return problems.push({ line: i + 1, message: `Line ${i + 1}: ${time.message}` });
    if (title === '') return problems.push({ line: i + 1, message: `Line ${i + 1} has a time but no title` });
    chapters.push({ startSeconds: time.seconds, title });
  });
  return { chapters, problems };
}

/**
 * The description block for a video host: one `m:ss Title` line per chapter, all lines as
 * h:mm:ss when any chapter starts from an hour on (one width throughout). A disclosure comes
 * first, followed by a blank line; importing the block back reports that line and keeps the chapters.
 */
export function exportChapterBlock(chapters: ReadonlyArray<ChapterTimes>, opts: { disclosure?: string | null } = {}): string {
  const withHours = chapters.some((c) => c.startSeconds >= 3600);
  // A line break in a title would split the chapter in two on the host.
  const lines = chapters.map((c) => `${formatTime(c.startSeconds, { withHours })} ${c.title.replace(/\s+/g, ' ').trim()}`);
  const disclosure = opts.disclosure?.replace(/\s+/g, ' ').trim();
  return (disclosure ? [disclosure, '', ...lines] : lines).join('\n');
}

const DIRECT_VIDEO = /\.(mp4|webm|ogv|mov|m4v)$/i;

/**
 * A link to the moment a chapter starts. A direct video file gets the W3C Media Fragments time
 * `#t=SECONDS`; a hosted video gets the build's pattern (`{seconds}` filled in): `#…` sets the
 * fragment, otherwise its parameters replace same-named ones in the query. Throws on a bad URL.
 */
export function chapterLink(videoUrl: string, startSeconds: number, pattern: string = DEFAULT_VIDEO_LINK_PATTERN): string {
  const url = new URL(videoUrl);
  const seconds = String(Math.max(0, Math.floor(startSeconds)));
  if (DIRECT_VIDEO.test(url.pathname)) {
    url.hash = `t=${seconds}`;
    return url.toString();
  }
  const filled = pattern.trim().replaceAll('{seconds}', seconds);
  if (filled.startsWith('#')) {
    url.hash = filled.slice(1);
    return url.toString();
  }
  const added = filled.split('&').filter((p) => p !== '');
  const names = new Set(added.map((p) => safeDecode(p.split('=')[0] ?? '')));
  // Other parameters are kept byte for byte (URLSearchParams would re-encode them).
  const kept = url.search
    .slice(1)
    .split('&')
    .filter((p) => p !== '' && !names.has(safeDecode(p.split('=')[0] ?? '')));
  url.search = [...kept, ...added].join('&');
  return url.toString();
}

function safeDecode(s: string): string {
  try {
    return decodeURIComponent(s.replace(/\+/g, ' '));
  } catch {
    return s;
  }
}
