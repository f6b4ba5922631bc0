import { DRAFT_FIELDS, type DraftChanges } from './draft';

/**
 * Unsaved changes kept on this device, one entry per episode, rewritten on every change, so a lost
 * connection, a closed tab or a crash loses nothing. `setAside` holds changes found on opening the
 * editor that were made on an older version: they wait for the creator's decision.
 */
export interface StoredDraft {
  /** The episode version the changes were made on. */
  baseVersion: number;
  /** When the last change was made (ms since the epoch). */
  changedAt: number;
  changes: DraftChanges;
  setAside?: { baseVersion: number; changedAt: number; changes: DraftChanges } | null;
}

export function draftStorageKey(episodeId: number): string {
  return `rivet-reel:episode-draft:${episodeId}`;
}

/** localStorage when the browser lets us use it (private modes and SSR may not). */
function storage(): Storage | null {
  try {
    return typeof window === 'undefined' ? null : window.localStorage;
  } catch {
    return null;
  }
}

function onlyKnownFields(value: unknown): DraftChanges {
  if (typeof value !== 'object' || value === null) return {};
  const picked: Record<string, unknown> = {};
  for (const field of DRAFT_FIELDS) if (field in value) picked[field] = (value as Record<string, unknown>)[field];
  return picked as DraftChanges;
}

export function readStoredDraft(episodeId: number): StoredDraft | null {
  const raw = storage()?.getItem(draftStorageKey(episodeId));
  if (!raw) return null;
  try {
    const parsed = JSON.parse(raw) as Partial<StoredDraft>;
    if (typeof parsed.baseVersion !== 'number' || typeof parsed.changedAt !== 'number') return null;
    const setAside = parsed.setAside;
    return {
      baseVersion: parsed.baseVersion,
      changedAt: parsed.changedAt,
      changes: onlyKnownFields(parsed.changes),
      setAside:
        setAside && typeof setAside.baseVersion === 'number' && typeof setAside.changedAt === 'number'
          ? { baseVersion: setAside.baseVersion, changedAt: setAside.changedAt, changes: onlyKnownFields(setAside.changes) }
          : null,
    };
  } catch {
    return null;
  }
}

/** Writes the entry, or removes it when nothing is left to keep. A full storage is not fatal: the server copy remains. */
export function writeStoredDraft(episodeId: number, draft: StoredDraft): void {
  const store = storage();
  if (!store) return;
  const empty = Object.keys(draft.changes).length === 0 && !draft.setAside;
  try {
    if (empty) store.removeItem(draftStorageKey(episodeId));
    else store.setItem(draftStorageKey(episodeId), JSON.stringify(draft));
  } catch {
    // Quota exceeded: keep editing; the status still says what is unsaved.
  }
}

export function clearStoredDraft(episodeId: number): void {
  try {
    storage()?.removeItem(draftStorageKey(episodeId));
  } catch {
    // Nothing to clear when storage is unavailable.
  }
}
