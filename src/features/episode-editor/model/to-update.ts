import type { z } from 'zod';
import { parseTime } from '../../../shared/chapters';
import { episodeUpdate, type ChapterInput, type EpisodeUpdate } from '../../../shared/schemas/episodes';
import { isBlankRow, type ChapterRow, type DraftChanges, type DraftField } from './draft';

/** The fields an autosave may carry (everything of `episodeUpdate` but the version). */
export type EpisodeFields = Omit<EpisodeUpdate, 'version'>;

export type Converted<T> = { ok: true; value: T } | { ok: false; message: string };

const shape = episodeUpdate.shape;

function check<T>(schema: z.ZodType<T | undefined>, value: T): Converted<T> {
  const parsed = schema.safeParse(value);
  // The schema's own output (trimmed text), as the server will store it.
  if (parsed.success) return { ok: true, value: parsed.data as T };
  return { ok: false, message: parsed.error.issues[0]?.message ?? 'not a valid value' };
}

const orNull = (text: string) => (text.trim() === '' ? null : text.trim());

/** Whole numbers only; "3" but not "3.0" or "three". */
function parseWholeNumber(text: string): number | null {
  return /^\d{1,6}$/.test(text.trim()) ? Number(text.trim()) : null;
}

/** Decimal hours, with a point or a comma: "3.5", "3,5", "0.25". */
export function parseHours(text: string): number | null {
  const t = text.trim().replace(',', '.');
  return /^\d{1,4}(\.\d{1,3})?$/.test(t) || /^\.\d{1,3}$/.test(t) ? Number(t) : null;
}

/** Sends rows in screen order, leaving out rows nobody has typed into; `rowKeys[i]` names sent row i. */
export function rowsToChapters(rows: readonly ChapterRow[]): Converted<{ chapters: ChapterInput[]; rowKeys: string[] }> {
  const chapters: ChapterInput[] = [];
  const rowKeys: string[] = [];
  for (const row of rows) {
    if (isBlankRow(row)) continue;
    const startSeconds = parseTime(row.start);
    if (startSeconds === null || row.title.trim() === '') {
      return { ok: false, message: 'chapters are saved once every row has a start time and a title' };
    }
    chapters.push({ startSeconds, title: row.title.trim(), systemKey: row.systemKey || null, notes: orNull(row.notes) });
    rowKeys.push(row.key);
  }
  return { ok: true, value: { chapters, rowKeys } };
}

/** One form field as the API wants it, or the reason it cannot be sent yet. */
export function convertField(field: Exclude<DraftField, 'chapters'>, draft: DraftChanges): Converted<unknown> {
  switch (field) {
    case 'title':
      return check(shape.title, draft.title ?? '');
    case 'number': {
      const n = parseWholeNumber(draft.number ?? '');
      return n === null ? { ok: false, message: 'a whole number such as 5' } : check(shape.number, n);
    }
    case 'summary':
      return check(shape.summary, orNull(draft.summary ?? ''));
    case 'writeUp':
      return check(shape.writeUp, draft.writeUp);
    case 'videoUrl':
      return check(shape.videoUrl, orNull(draft.videoUrl ?? ''));
    case 'duration': {
      const text = draft.duration ?? '';
      if (text.trim() === '') return { ok: true, value: null };
      const seconds = parseTime(text);
      return seconds === null ? { ok: false, message: 'a length such as 14:20 or 1:02:05' } : check(shape.durationSeconds, seconds);
    }
    case 'hoursWorked': {
      const text = draft.hoursWorked ?? '';
      if (text.trim() === '') return { ok: true, value: null };
      const hours = parseHours(text);
      return hours === null ? { ok: false, message: 'hours as a number such as 3.5' } : check(shape.hoursWorked, hours);
    }
    case 'raisedVehicle':
      return { ok: true, value: draft.raisedVehicle ?? false };
    case 'videoDisclosureConfirmed':
      return { ok: true, value: draft.videoDisclosureConfirmed ?? false };
    default:
      return { ok: false, message: 'unknown field' };
  }
}

const apiName: Record<DraftField, keyof EpisodeFields> = {
  title: 'title',
  number: 'number',
  summary: 'summary',
  writeUp: 'writeUp',
  videoUrl: 'videoUrl',
  duration: 'durationSeconds',
  hoursWorked: 'hoursWorked',
  raisedVehicle: 'raisedVehicle',
  videoDisclosureConfirmed: 'videoDisclosureConfirmed',
  chapters: 'chapters',
};

/** Which form field an API field name (as in a 400's `fields`, e.g. `chapters.2.title`) is about. */
export function draftFieldOf(apiField: string): DraftField | undefined {
  const top = apiField.split('.')[0];
  return (Object.keys(apiName) as DraftField[]).find((f) => apiName[f] === top);
}

export interface UpdatePlan {
  /** What can be sent now, in the API's names. */
  body: EpisodeFields;
  /** The changed fields that went into `body`. */
  sent: DraftField[];
  /** Changed fields that cannot be sent yet, with the reason; they stay on this device. */
  held: Partial<Record<DraftField, string>>;
  /** For mapping a 400's `chapters.N.…` back to its row. */
  chapterRowKeys: string[];
}

/** Turns the unsaved change set into an autosave body, holding back what does not convert yet. */
export function planUpdate(changes: DraftChanges): UpdatePlan {
  const body: Record<string, unknown> = {};
  const sent: DraftField[] = [];
  const held: Partial<Record<DraftField, string>> = {};
  let chapterRowKeys: string[] = [];
  for (const field of Object.keys(changes) as DraftField[]) {
    let result: Converted<unknown>;
    if (field === 'chapters') {
      const rows = rowsToChapters(changes.chapters ?? []);
      result = rows.ok ? { ok: true, value: rows.value.chapters } : rows;
      if (rows.ok) chapterRowKeys = rows.value.rowKeys;
    } else {
      result = convertField(field, changes);
    }
    if (result.ok) {
      body[apiName[field]] = result.value;
      sent.push(field);
    } else {
      held[field] = result.message;
    }
  }
  return { body: body as EpisodeFields, sent, held, chapterRowKeys };
}
