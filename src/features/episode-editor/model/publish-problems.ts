import { ApiError } from '../../../lib/api-client';
import { FIELD_LABELS } from './field-labels';
import { draftFieldOf } from './to-update';

/** A 422's `fields` as lines a person can act on: "Chapter 2: …", "Video link: …". */
export function publishProblemLines(err: unknown): string[] {
  if (!(err instanceof ApiError)) return [];
  const lines: string[] = [];
  for (const [key, messages] of Object.entries(err.fields ?? {})) {
    const row = /^chapters\.(\d+)/.exec(key);
    const field = draftFieldOf(key);
    const where = row ? `Chapter ${Number(row[1]) + 1}` : key.startsWith('partLines.') ? 'Parts' : field ? FIELD_LABELS[field] : key;
    for (const m of messages) lines.push(`${where.charAt(0).toUpperCase()}${where.slice(1)}: ${m}`);
  }
  return lines;
}
