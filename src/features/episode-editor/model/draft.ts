import { formatTime } from '../../../shared/chapters';
import type { Episode } from '../../../shared/schemas/episodes';
import type { WriteUpDoc } from '../../../shared/write-up';

/** One row of the chapters panel as typed: the start time stays text until it parses. */
export interface ChapterRow {
  /** Stable across re-ordering, for React keys, focus and messages; never sent. */
  key: string;
  start: string;
  title: string;
  /** '' for "no system". */
  systemKey: string;
  notes: string;
}

/**
 * The editor's form as the creator sees it. Inputs that can be half-typed (times, numbers) are
 * kept as text, so a change set stored on this device holds exactly what was on screen.
 */
export interface EditorDraft {
  title: string;
  number: string;
  summary: string;
  writeUp: WriteUpDoc;
  videoUrl: string;
  duration: string;
  hoursWorked: string;
  raisedVehicle: boolean;
  videoDisclosureConfirmed: boolean;
  chapters: ChapterRow[];
}

export type DraftField = keyof EditorDraft;
export type DraftChanges = Partial<EditorDraft>;

export const DRAFT_FIELDS: readonly DraftField[] = [
  'title',
  'number',
  'summary',
  'writeUp',
  'videoUrl',
  'duration',
  'hoursWorked',
  'raisedVehicle',
  'videoDisclosureConfirmed',
  'chapters',
];

let rowCounter = 0;

/** A key unique in this page's life; rows restored from this device keep theirs. */
export function newRowKey(): string {
  rowCounter += 1;
  return `row-${Date.now().toString(36)}-${rowCounter}`;
}

export function emptyChapterRow(): ChapterRow {
  return { key: newRowKey(), start: '', title: '', systemKey: '', notes: '' };
}

/** Hours as the creator would write them: 3.5, 0.25; no trailing zeros. */
export function formatHours(hours: number | null): string {
  return hours === null ? '' : String(Math.round(hours * 100) / 100);
}

export function draftFromEpisode(ep: Episode): EditorDraft {
  return {
    title: ep.title,
    number: String(ep.number),
    summary: ep.summary ?? '',
    writeUp: ep.writeUp,
    videoUrl: ep.videoUrl ?? '',
    duration: ep.durationSeconds === null ? '' : formatTime(ep.durationSeconds),
    hoursWorked: formatHours(ep.hoursWorked),
    raisedVehicle: ep.raisedVehicle,
    videoDisclosureConfirmed: ep.videoDisclosureConfirmed,
    chapters: ep.chapters.map((c) => ({
      key: `chapter-${c.id}`,
      start: formatTime(c.startSeconds),
      title: c.title,
      systemKey: c.systemKey ?? '',
      notes: c.notes ?? '',
    })),
  };
}

/** A row nobody has typed into yet (e.g. just added with Enter); it is not sent. */
export function isBlankRow(row: ChapterRow): boolean {
  return row.start.trim() === '' && row.title.trim() === '' && row.notes.trim() === '' && row.systemKey === '';
}
