import { checkTime, formatTime, importChapterBlock, parseTime, validateChapters, type ChapterTimes } from '../../../shared/chapters';
import { emptyChapterRow, isBlankRow, type ChapterRow } from './draft';

export interface RowMessages {
  start: string[];
  title: string[];
}

const sentence = (m: string) => m.charAt(0).toUpperCase() + m.slice(1);

/**
 * Messages for each row, by row key: times that do not parse (with the parser's own words), then
 * the shared rules (order, length, duration; the video host's rules only when `forExport`).
 */
export function chapterRowMessages(
  rows: readonly ChapterRow[],
  opts: { durationSeconds: number | null; forExport: boolean },
): Record<string, RowMessages> {
  const out: Record<string, RowMessages> = {};
  const at = (key: string) => (out[key] ??= { start: [], title: [] });
  const timed: ChapterTimes[] = [];
  const timedKeys: string[] = [];
  for (const row of rows) {
    if (isBlankRow(row)) continue;
    const time = checkTime(row.start);
    if (time.ok) {
      timed.push({ startSeconds: time.seconds, title: row.title });
      timedKeys.push(row.key);
    } else {
      at(row.key).start.push(sentence(time.message));
      if (row.title.trim() === '') at(row.key).title.push('Needs a title');
    }
  }
  for (const p of validateChapters(timed, { durationSeconds: opts.durationSeconds, forExport: opts.forExport })) {
    const key = timedKeys[p.index];
    if (key) at(key)[p.field === 'title' ? 'title' : 'start'].push(p.message);
  }
  return out;
}

/** Rows in time order when every time parses; otherwise left as they are (a half-typed row stays put). Blank rows go last. */
export function sortRows(rows: readonly ChapterRow[]): ChapterRow[] {
  const keyed = rows.map((row, i) => ({ row, i, s: isBlankRow(row) ? Number.POSITIVE_INFINITY : parseTime(row.start) }));
  if (keyed.some((k) => k.s === null)) return [...rows];
  // Two blank rows compare as NaN, which is falsy: the original order decides.
  return keyed.sort((a, b) => (a.s ?? 0) - (b.s ?? 0) || a.i - b.i).map((k) => k.row);
}

export function isSorted(a: readonly ChapterRow[], b: readonly ChapterRow[]): boolean {
  return a.length === b.length && a.every((row, i) => row.key === b[i]?.key);
}

/** A pasted block as rows, plus the lines that were left out. */
export function rowsFromBlock(text: string): { rows: ChapterRow[]; problems: Array<{ line: number; message: string }> } {
  const { chapters, problems } = importChapterBlock(text);
  return { rows: chapters.map((c) => ({ ...emptyChapterRow(), start: formatTime(c.startSeconds), title: c.title })), problems };
}
