// @vitest-environment happy-dom
import { act, cleanup, renderHook } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { draftStorageKey, readStoredDraft, writeStoredDraft } from '../model/draft-storage';
import { createFakeServer, makeEpisode, makeWrapper } from '../testing/fake-api';
import { AUTOSAVE_DELAY_MS, useAutosave } from './use-autosave';

let online = true;

function setOnline(value: boolean) {
  online = value;
  window.dispatchEvent(new Event(value ? 'online' : 'offline'));
}

async function advance(ms: number) {
  await act(async () => {
    await vi.advanceTimersByTimeAsync(ms);
  });
}

function setup(episode = makeEpisode()) {
  const server = createFakeServer(episode);
  const hook = renderHook(() => useAutosave(episode), { wrapper: makeWrapper(server.fetch) });
  return { server, hook, episode };
}

beforeEach(() => {
  vi.useFakeTimers();
  online = true;
  vi.spyOn(navigator, 'onLine', 'get').mockImplementation(() => online);
  localStorage.clear();
});

afterEach(() => {
  cleanup();
  vi.useRealTimers();
  vi.restoreAllMocks();
});

describe('useAutosave', () => {
  it('waits for typing to pause, then sends only the changed fields with the version it knows', async () => {
    const { server, hook } = setup();
    act(() => hook.result.current.change({ title: 'A seized' }));
    await advance(1000);
    act(() => hook.result.current.change({ title: 'A seized caliper piston' }));
    await advance(AUTOSAVE_DELAY_MS - 1);
    expect(server.patches()).toHaveLength(0);
    expect(hook.result.current.snapshot.status).toBe('waiting');

    await advance(1);
    expect(server.patches()).toHaveLength(1);
    expect(server.patches()[0]?.body).toEqual({ version: 1, title: 'A seized caliper piston' });
    expect(hook.result.current.snapshot.status).toBe('saved');
    expect(hook.result.current.snapshot.version).toBe(2);
    expect(hook.result.current.hasUnsaved).toBe(false);

    // The next save carries the version from the answer.
    act(() => hook.result.current.change({ hoursWorked: '3,5' }));
    await advance(AUTOSAVE_DELAY_MS);
    expect(server.patches()[1]?.body).toEqual({ version: 2, hoursWorked: 3.5 });
    expect(hook.result.current.snapshot.version).toBe(3);
  });

  it('holds back a half-typed time but saves the rest', async () => {
    const { server, hook } = setup();
    act(() => hook.result.current.change({ duration: '14:2', summary: 'Front brake' }));
    await advance(AUTOSAVE_DELAY_MS);
    expect(server.patches()[0]?.body).toEqual({ version: 1, summary: 'Front brake' });
    expect(hook.result.current.snapshot.status).toBe('held');
    expect(readStoredDraft(41)?.changes).toEqual({ duration: '14:2' });

    act(() => hook.result.current.change({ duration: '14:20' }));
    await advance(AUTOSAVE_DELAY_MS);
    expect(server.patches()[1]?.body).toEqual({ version: 2, durationSeconds: 860 });
    expect(hook.result.current.snapshot.status).toBe('saved');
  });

  it('keeps the changes on this device while saving fails or the browser is offline, and flushes them on `online`', async () => {
    const { server, hook } = setup();
    server.state.mode = 'network-error';
    act(() => hook.result.current.change({ title: 'Typed on the train' }));
    await advance(AUTOSAVE_DELAY_MS);
    expect(hook.result.current.snapshot.status).toBe('retrying');
    expect(JSON.parse(localStorage.getItem(draftStorageKey(41)) ?? '{}')).toMatchObject({
      baseVersion: 1,
      changes: { title: 'Typed on the train' },
    });

    act(() => setOnline(false));
    expect(hook.result.current.snapshot.status).toBe('offline');
    act(() => hook.result.current.change({ raisedVehicle: true }));
    await advance(60_000);
    const attemptsWhileOffline = server.patches().length;
    expect(readStoredDraft(41)?.changes).toEqual({ title: 'Typed on the train', raisedVehicle: true });
    expect(hook.result.current.snapshot.status).toBe('offline');
    expect(hook.result.current.hasUnsaved).toBe(true);

    server.state.mode = 'ok';
    await act(async () => {
      setOnline(true);
      await vi.advanceTimersByTimeAsync(0);
    });
    const sent = server.patches().slice(attemptsWhileOffline);
    expect(sent).toHaveLength(1);
    expect(sent[0]?.body).toEqual({ version: 1, title: 'Typed on the train', raisedVehicle: true });
    expect(hook.result.current.snapshot.status).toBe('saved');
    expect(localStorage.getItem(draftStorageKey(41))).toBeNull();
  });

  it('backs off between attempts while the server keeps failing', async () => {
    const { server, hook } = setup();
    server.state.mode = 'server-error';
    act(() => hook.result.current.change({ title: 'Again' }));
    await advance(AUTOSAVE_DELAY_MS);
    expect(server.patches()).toHaveLength(1);
    await advance(2000);
    expect(server.patches()).toHaveLength(2);
    await advance(3999);
    expect(server.patches()).toHaveLength(2);
    server.state.mode = 'ok';
    await advance(1);
    expect(server.patches()).toHaveLength(3);
    expect(hook.result.current.snapshot.status).toBe('saved');
  });

  it('surfaces a 409 with both choices: keep mine re-sends my fields on the current version', async () => {
    const { server, hook } = setup();
    // Another tab saved twice meanwhile.
    server.state.episode = { ...server.state.episode, version: 3, summary: 'From the other tab' };
    act(() => hook.result.current.change({ title: 'Mine' }));
    await advance(AUTOSAVE_DELAY_MS);
    expect(hook.result.current.snapshot.status).toBe('conflict');
    expect(hook.result.current.snapshot.conflict?.version).toBe(3);
    // Nothing more is sent until the creator chooses.
    await advance(60_000);
    expect(server.patches()).toHaveLength(1);

    await act(async () => {
      hook.result.current.keepMine();
      await vi.advanceTimersByTimeAsync(0);
    });
    expect(server.patches()[1]?.body).toEqual({ version: 3, title: 'Mine' });
    expect(hook.result.current.snapshot.status).toBe('saved');
    // The other tab's field is kept.
    expect(hook.result.current.draft.summary).toBe('From the other tab');
    expect(hook.result.current.draft.title).toBe('Mine');
  });

  it('surfaces a 409 with both choices: load the saved version drops mine', async () => {
    const { server, hook } = setup();
    server.state.episode = { ...server.state.episode, version: 2, title: 'Their title' };
    act(() => hook.result.current.change({ title: 'Mine' }));
    await advance(AUTOSAVE_DELAY_MS);
    expect(hook.result.current.snapshot.conflict).not.toBeNull();

    act(() => hook.result.current.loadSaved());
    expect(hook.result.current.draft.title).toBe('Their title');
    expect(hook.result.current.snapshot.version).toBe(2);
    expect(hook.result.current.hasUnsaved).toBe(false);
    expect(localStorage.getItem(draftStorageKey(41))).toBeNull();
  });

  it('puts back changes left on this device on the same version and saves them', async () => {
    writeStoredDraft(41, { baseVersion: 1, changedAt: Date.now(), changes: { title: 'Left from yesterday' } });
    const { server, hook } = setup();
    expect(hook.result.current.draft.title).toBe('Left from yesterday');
    expect(hook.result.current.snapshot.restoredFields).toEqual(['title']);
    await advance(0);
    expect(server.patches()[0]?.body).toEqual({ version: 1, title: 'Left from yesterday' });
  });

  it('offers, and does not apply, changes made on an older version', async () => {
    writeStoredDraft(41, { baseVersion: 1, changedAt: Date.now(), changes: { title: 'Old idea' } });
    const { server, hook } = setup(makeEpisode({ version: 4 }));
    expect(hook.result.current.draft.title).toBe('A seized caliper');
    expect(hook.result.current.snapshot.setAside?.changes).toEqual({ title: 'Old idea' });
    await advance(AUTOSAVE_DELAY_MS);
    expect(server.patches()).toHaveLength(0);

    act(() => hook.result.current.restoreSetAside());
    await advance(0);
    expect(server.patches()[0]?.body).toEqual({ version: 4, title: 'Old idea' });
  });

  it('saves what is unsaved before a versioned action and hands it the new version', async () => {
    const { server, hook } = setup();
    act(() => hook.result.current.change({ title: 'Ready' }));
    const versions: number[] = [];
    await act(async () => {
      await hook.result.current.commit(async (version) => {
        versions.push(version);
        return { ...server.state.episode, status: 'published', version: version + 1 };
      });
    });
    expect(server.patches()[0]?.body).toEqual({ version: 1, title: 'Ready' });
    expect(versions).toEqual([2]);
    expect(hook.result.current.snapshot.version).toBe(3);
    expect(hook.result.current.snapshot.server.status).toBe('published');
  });
});
