import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { ApiError } from '../../../lib/api-client';
import { useApi } from '../../../lib/api-context';
import { episode as episodeSchema, type Episode } from '../../../shared/schemas/episodes';
import { episodePath } from '../api/get-episode';
import { editorKeys } from '../api/keys';
import {
  applyRejected,
  applySaved,
  classifySaveError,
  hasChanges,
  initialSnapshot,
  prune,
  refusalText,
  restingStatus,
  retryDelay,
  sendable,
  withoutFields,
  withStoredDraft,
  type AutosaveSnapshot,
} from '../model/autosave-state';
import { draftFromEpisode, type DraftChanges, type DraftField, type EditorDraft } from '../model/draft';
import { readStoredDraft, writeStoredDraft } from '../model/draft-storage';
import { planUpdate } from '../model/to-update';

export const AUTOSAVE_DELAY_MS = 1500;

/** Thrown by `commit` when the unsaved changes could not be saved first. */
export class NotSavedError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'NotSavedError';
  }
}

function isOnline(): boolean {
  return typeof navigator === 'undefined' || navigator.onLine !== false;
}

export interface Autosave {
  /** The form as shown: the saved values with the unsaved changes on top. */
  draft: EditorDraft;
  change: (changes: DraftChanges) => void;
  snapshot: AutosaveSnapshot;
  hasUnsaved: boolean;
  /** 409: throw my changes away and show what was saved elsewhere. */
  loadSaved: () => void;
  /** 409: send my changed fields again on top of the version saved elsewhere. */
  keepMine: () => void;
  restoreSetAside: () => void;
  discardSetAside: () => void;
  dismissRestored: () => void;
  /** Saves what is unsaved, then runs a versioned action (publish…) with no autosave in between. */
  commit: (action: (version: number) => Promise<Episode>) => Promise<Episode>;
  /** Saves now; whether nothing is left unsaved afterwards. */
  saveNow: () => Promise<boolean>;
  /** A fresh copy from the server (refetch); adopted when nothing here is unsaved. */
  observe: (ep: Episode) => void;
}

/**
 * Autosave for one episode: debounced PATCHes of the changed fields with the last known version,
 * a copy of every unsaved change in localStorage, retries with backoff, a flush when the browser
 * comes back online, and the 409 choice when the episode was saved elsewhere.
 */
export function useAutosave(initial: Episode, { delayMs = AUTOSAVE_DELAY_MS }: { delayMs?: number } = {}): Autosave {
  const api = useApi();
  const queryClient = useQueryClient();
  const episodeId = initial.id;
  const [snapshot, setSnapshot] = useState(() => initialSnapshot(initial));
  const ref = useRef(snapshot);
  const timers = useRef<{ debounce?: ReturnType<typeof setTimeout>; retry?: ReturnType<typeof setTimeout> }>({});
  const flight = useRef<Promise<void> | null>(null);
  const locked = useRef(false);
  const attempt = useRef(0);
  // The latest `run`, so timers and listeners never call a stale one.
  const runRef = useRef<() => Promise<void>>(() => Promise.resolve());

  const update = useCallback(
    (fn: (s: AutosaveSnapshot) => AutosaveSnapshot, { changed = false }: { changed?: boolean } = {}) => {
      const computed = fn(ref.current);
      const next = changed ? { ...computed, changedAt: Date.now() } : computed;
      ref.current = next;
      setSnapshot(next);
      // Written on every change, so closing the tab or losing the connection loses nothing.
      writeStoredDraft(episodeId, { baseVersion: next.version, changedAt: next.changedAt, changes: next.pending, setAside: next.setAside });
    },
    [episodeId],
  );

  const schedule = useCallback((delay: number) => {
    clearTimeout(timers.current.debounce);
    timers.current.debounce = setTimeout(() => void runRef.current(), delay);
  }, []);

  const adopt = useCallback(
    (ep: Episode) => {
      queryClient.setQueryData(editorKeys.episode(episodeId), ep);
    },
    [queryClient, episodeId],
  );

  const enterConflict = useCallback(async () => {
    clearTimeout(timers.current.retry);
    try {
      const current = await api.get(episodePath(episodeId), episodeSchema);
      update((s) => ({ ...s, conflict: current, status: 'conflict' }));
    } catch {
      // Cannot even read the current version: try the save again later, which answers 409 again.
      update((s) => ({ ...s, status: isOnline() ? 'retrying' : 'offline' }));
      timers.current.retry = setTimeout(() => void runRef.current(), retryDelay(attempt.current++));
    }
  }, [api, episodeId, update]);

  const saveOnce = useCallback(async () => {
    const s = ref.current;
    if (s.conflict || !hasChanges(s.pending)) return;
    if (!isOnline()) {
      update((x) => ({ ...x, status: 'offline' }));
      return;
    }
    const plan = planUpdate(sendable(s));
    if (plan.sent.length === 0) {
      update((x) => ({ ...x, status: restingStatus(x) }));
      return;
    }
    const sent: DraftChanges = {};
    for (const field of plan.sent) Object.assign(sent, { [field]: s.pending[field] });
    update((x) => ({ ...x, status: 'saving' }));
    try {
      const ep = await api.patch(episodePath(episodeId), { version: s.version, ...plan.body }, episodeSchema);
      attempt.current = 0;
      update((x) => applySaved(x, sent, ep));
      adopt(ep);
      if (restingStatus(ref.current) === 'waiting') schedule(delayMs);
    } catch (err) {
      const kind = classifySaveError(err);
      if (kind === 'conflict') return enterConflict();
      if (kind === 'rejected' && err instanceof ApiError) return update((x) => applyRejected(x, err, plan.chapterRowKeys));
      if (kind === 'refused') return update((x) => ({ ...x, status: 'failed', failure: refusalText(err) }));
      update((x) => ({ ...x, status: isOnline() ? 'retrying' : 'offline' }));
      // Offline, the `online` event brings the next attempt; online, back off.
      if (isOnline()) {
        clearTimeout(timers.current.retry);
        timers.current.retry = setTimeout(() => void runRef.current(), retryDelay(attempt.current++));
      }
    }
  }, [api, episodeId, update, adopt, schedule, enterConflict, delayMs]);

  const run = useCallback(async () => {
    clearTimeout(timers.current.debounce);
    if (locked.current) return;
    while (flight.current) await flight.current;
    const current = saveOnce().finally(() => {
      flight.current = null;
    });
    flight.current = current;
    await current;
  }, [saveOnce]);

  useEffect(() => {
    runRef.current = run;
  }, [run]);

  const change = useCallback(
    (changes: DraftChanges) => {
      update(
        (s) => {
          const touched = Object.keys(changes) as DraftField[];
          const next: AutosaveSnapshot = {
            ...s,
            pending: prune({ ...s.pending, ...changes }, s.base),
            rejected: withoutFields(s.rejected, touched),
            rejectedRows: 'chapters' in changes ? {} : s.rejectedRows,
          };
          const keep = s.status === 'offline' || s.status === 'retrying' || s.status === 'failed' || s.status === 'saving';
          return { ...next, status: keep && hasChanges(next.pending) ? s.status : restingStatus(next) };
        },
        { changed: true },
      );
      if (!ref.current.conflict) schedule(delayMs);
    },
    [update, schedule, delayMs],
  );

  // Changes left on this device by an earlier visit: the same version's are put back and saved;
  // those made on an older version wait for the creator's decision (they may undo work saved since).
  useEffect(() => {
    const stored = readStoredDraft(episodeId);
    if (!stored) return;
    update((s) => withStoredDraft(s, stored));
    if (ref.current.restoredFields.length) schedule(0);
  }, [episodeId, update, schedule]);

  useEffect(() => {
    const onOnline = () => {
      attempt.current = 0;
      clearTimeout(timers.current.retry);
      update((s) => ({ ...s, status: restingStatus(s) }));
      void runRef.current();
    };
    const onOffline = () => update((s) => ({ ...s, status: s.status === 'conflict' ? 'conflict' : 'offline' }));
    window.addEventListener('online', onOnline);
    window.addEventListener('offline', onOffline);
    if (!isOnline()) onOffline();
    const pending = timers.current;
    return () => {
      window.removeEventListener('online', onOnline);
      window.removeEventListener('offline', onOffline);
      clearTimeout(pending.debounce);
      clearTimeout(pending.retry);
    };
  }, [update]);

  const loadSaved = useCallback(() => {
    const current = ref.current.conflict;
    if (!current) return;
    update((s) => ({ ...initialSnapshot(current), setAside: s.setAside }));
    adopt(current);
  }, [update, adopt]);

  const keepMine = useCallback(() => {
    const current = ref.current.conflict;
    if (!current) return;
    update((s) => {
      const next = { ...s, base: draftFromEpisode(current), version: current.version, server: current, conflict: null };
      return { ...next, pending: prune(s.pending, next.base), status: restingStatus(next) };
    });
    adopt(current);
    void run();
  }, [update, adopt, run]);

  const restoreSetAside = useCallback(() => {
    update(
      (s) => {
        const next = { ...s, pending: prune({ ...s.setAside?.changes, ...s.pending }, s.base), setAside: null };
        return { ...next, status: restingStatus(next) };
      },
      { changed: true },
    );
    schedule(0);
  }, [update, schedule]);

  const discardSetAside = useCallback(() => update((s) => ({ ...s, setAside: null })), [update]);
  const dismissRestored = useCallback(() => update((s) => ({ ...s, restoredFields: [] })), [update]);

  const commit = useCallback(
    async (action: (version: number) => Promise<Episode>) => {
      await run();
      const s = ref.current;
      if (s.conflict) throw new NotSavedError('This episode was changed elsewhere. Choose which version to keep first.');
      if (hasChanges(s.pending))
        throw new NotSavedError('Some changes are not saved yet. Fix the marked fields, or wait until you are back online.');
      locked.current = true;
      try {
        const ep = await action(s.version);
        update((x) => ({ ...x, version: ep.version, server: ep }));
        adopt(ep);
        return ep;
      } catch (err) {
        if (err instanceof ApiError && err.status === 409) await enterConflict();
        throw err;
      } finally {
        locked.current = false;
        if (hasChanges(ref.current.pending)) schedule(delayMs);
      }
    },
    [run, update, adopt, enterConflict, schedule, delayMs],
  );

  const saveNow = useCallback(async () => {
    await run();
    return !hasChanges(ref.current.pending) && !ref.current.conflict;
  }, [run]);

  const observe = useCallback(
    (ep: Episode) => {
      const s = ref.current;
      if (ep.version <= s.version || flight.current || locked.current || s.conflict) return;
      // Saved in another tab: take it when nothing here is unsaved; otherwise the creator chooses now.
      if (!hasChanges(s.pending)) update(() => ({ ...initialSnapshot(ep), setAside: s.setAside }));
      else {
        clearTimeout(timers.current.debounce);
        update((x) => ({ ...x, conflict: ep, status: 'conflict' }));
      }
    },
    [update],
  );

  const draft = useMemo(() => ({ ...snapshot.base, ...snapshot.pending }), [snapshot.base, snapshot.pending]);
  const hasUnsaved = hasChanges(snapshot.pending) || snapshot.status === 'saving';

  return {
    draft,
    change,
    snapshot,
    hasUnsaved,
    loadSaved,
    keepMine,
    restoreSetAside,
    discardSetAside,
    dismissRestored,
    commit,
    saveNow,
    observe,
  };
}
