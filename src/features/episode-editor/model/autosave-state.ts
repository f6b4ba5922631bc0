import { ApiError } from '../../../lib/api-client';
import type { Episode } from '../../../shared/schemas/episodes';
import { draftFromEpisode, type DraftChanges, type DraftField, type EditorDraft } from './draft';
import type { StoredDraft } from './draft-storage';
import { draftFieldOf, planUpdate } from './to-update';

export type SaveStatus =
  /** Nothing unsaved. */
  | 'saved'
  /** Changes typed; the save follows once typing pauses. */
  | 'waiting'
  | 'saving'
  | 'offline'
  | 'retrying'
  /** Changes that cannot be sent yet (a half-typed time, an empty title). */
  | 'held'
  /** The server refused a field (400). */
  | 'invalid'
  /** Saved elsewhere since this editor last saw it (409): the creator chooses. */
  | 'conflict'
  /** Refused for a reason retrying will not fix (signed out, no longer on the team). */
  | 'failed';

export interface SetAside {
  baseVersion: number;
  changedAt: number;
  changes: DraftChanges;
}

export interface AutosaveSnapshot {
  /** The last saved values, as they were typed. */
  base: EditorDraft;
  /** Changed since the last save; kept on this device until the server has them. */
  pending: DraftChanges;
  changedAt: number;
  version: number;
  /** The server's latest answer (status, publish time, caution). */
  server: Episode;
  status: SaveStatus;
  conflict: Episode | null;
  /** 400 messages by form field; those fields wait until they are changed again. */
  rejected: Partial<Record<DraftField, string>>;
  /** 400 messages about one chapter row, by row key. */
  rejectedRows: Record<string, string[]>;
  /** Why saving stopped, for 'failed'. */
  failure: string | null;
  /** Changes found on this device that were made on an older version. */
  setAside: SetAside | null;
  /** Changes from this device that were put back on opening. */
  restoredFields: DraftField[];
}

export function initialSnapshot(ep: Episode): AutosaveSnapshot {
  return {
    base: draftFromEpisode(ep),
    pending: {},
    changedAt: 0,
    version: ep.version,
    server: ep,
    status: 'saved',
    conflict: null,
    rejected: {},
    rejectedRows: {},
    failure: null,
    setAside: null,
    restoredFields: [],
  };
}

/** Drops changes that are back to the saved value (only cheap comparisons: text and flags). */
export function prune(pending: DraftChanges, base: EditorDraft): DraftChanges {
  const out: Record<string, unknown> = {};
  for (const field of Object.keys(pending) as DraftField[]) {
    const value = pending[field];
    const same = typeof value !== 'object' && value === base[field];
    if (!same) out[field] = value;
  }
  return out as DraftChanges;
}

export function withoutFields<T>(record: Partial<Record<DraftField, T>>, fields: readonly DraftField[]): Partial<Record<DraftField, T>> {
  const out = { ...record };
  for (const field of fields) delete out[field];
  return out;
}

export function hasChanges(changes: DraftChanges): boolean {
  return Object.keys(changes).length > 0;
}

/** What may go out now: the pending changes minus those the server refused and nobody has touched since. */
export function sendable(s: AutosaveSnapshot): DraftChanges {
  const out: Record<string, unknown> = {};
  for (const field of Object.keys(s.pending) as DraftField[]) if (!(field in s.rejected)) out[field] = s.pending[field];
  return out as DraftChanges;
}

/** The status when nothing is in flight and the connection is fine. */
export function restingStatus(s: AutosaveSnapshot): SaveStatus {
  if (s.conflict) return 'conflict';
  if (!hasChanges(s.pending)) return 'saved';
  if (Object.keys(s.rejected).length > 0) return 'invalid';
  return planUpdate(sendable(s)).sent.length > 0 ? 'waiting' : 'held';
}

/** After a save: the sent values become the saved ones; changes typed meanwhile stay pending. */
export function applySaved(s: AutosaveSnapshot, sent: DraftChanges, ep: Episode): AutosaveSnapshot {
  const pending: Record<string, unknown> = { ...s.pending };
  for (const field of Object.keys(sent) as DraftField[]) if (pending[field] === sent[field]) delete pending[field];
  const next: AutosaveSnapshot = {
    ...s,
    base: { ...s.base, ...sent },
    pending: pending as DraftChanges,
    version: ep.version,
    server: ep,
    // A refused field that was held back this time keeps its message until it is changed.
    rejected: withoutFields(s.rejected, Object.keys(sent) as DraftField[]),
    rejectedRows: 'chapters' in sent ? {} : s.rejectedRows,
    failure: null,
  };
  return { ...next, status: restingStatus(next) };
}

/** A 400: field messages on their fields (and rows), general messages as the failure. */
export function applyRejected(s: AutosaveSnapshot, err: ApiError, chapterRowKeys: readonly string[]): AutosaveSnapshot {
  const rejected: Partial<Record<DraftField, string>> = {};
  const rejectedRows: Record<string, string[]> = {};
  for (const [key, messages] of Object.entries(err.fields ?? {})) {
    const field = draftFieldOf(key);
    const message = messages[0] ?? 'not accepted';
    if (!field || !(field in s.pending)) continue;
    rejected[field] = rejected[field] ?? message;
    const row = /^chapters\.(\d+)\./.exec(key);
    const rowKey = row ? chapterRowKeys[Number(row[1])] : undefined;
    if (rowKey) rejectedRows[rowKey] = [...(rejectedRows[rowKey] ?? []), message];
  }
  const known = Object.keys(rejected).length > 0;
  return { ...s, rejected, rejectedRows, status: known ? 'invalid' : 'failed', failure: known ? null : err.message };
}

export type SaveFailure = 'conflict' | 'rejected' | 'refused' | 'transient';

/** Which kind of failure an error is: what the editor does next depends on it. */
export function classifySaveError(err: unknown): SaveFailure {
  if (!(err instanceof ApiError)) return 'transient';
  if (err.status === 409) return 'conflict';
  if (err.status === 400) return 'rejected';
  if (err.status === 401 || err.status === 403 || err.status === 404) return 'refused';
  return 'transient';
}

export function refusalText(err: unknown): string {
  if (err instanceof ApiError && err.status === 401) return 'you are signed out; sign in again in another tab and it will be saved';
  if (err instanceof ApiError) return 'you may no longer edit this episode';
  return 'the server did not answer';
}

/** 2 s, 4 s, 8 s … up to a minute between attempts. */
export function retryDelay(attempt: number): number {
  return Math.min(2000 * 2 ** attempt, 60_000);
}

/**
 * Changes left on this device by an earlier visit: those made on the version the server still has
 * are put back (and then saved); those made on an older version are set aside for the creator's
 * decision, since they could undo work saved since.
 */
export function withStoredDraft(s: AutosaveSnapshot, stored: StoredDraft): AutosaveSnapshot {
  let setAside = stored.setAside ?? null;
  let restore: DraftChanges = {};
  if (hasChanges(stored.changes)) {
    if (stored.baseVersion === s.version) restore = stored.changes;
    else
      setAside = {
        baseVersion: stored.baseVersion,
        changedAt: Math.max(stored.changedAt, setAside?.changedAt ?? 0),
        changes: { ...setAside?.changes, ...stored.changes },
      };
  }
  const next = { ...s, pending: prune({ ...restore, ...s.pending }, s.base), changedAt: stored.changedAt, setAside };
  return { ...next, restoredFields: Object.keys(restore) as DraftField[], status: restingStatus(next) };
}
