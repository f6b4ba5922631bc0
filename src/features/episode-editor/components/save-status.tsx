import type { AutosaveSnapshot, SaveStatus } from '../model/autosave-state';

const text: Record<SaveStatus, string> = {
  saved: 'Saved',
  waiting: 'Saving…',
  saving: 'Saving…',
  offline: 'Offline — changes kept on this device',
  retrying: 'Couldn’t save — retrying',
  held: 'Not saved yet — finish the marked fields (kept on this device)',
  invalid: 'Couldn’t save — fix the marked fields',
  conflict: 'Not saved — this episode was changed elsewhere',
  failed: 'Couldn’t save',
};

const tone: Record<SaveStatus, string> = {
  saved: 'border-gauge text-gauge',
  waiting: 'border-rule text-slate',
  saving: 'border-rule text-slate',
  offline: 'border-caution text-caution',
  retrying: 'border-caution text-caution',
  held: 'border-caution text-caution',
  invalid: 'border-oxide-2 text-oxide-2',
  conflict: 'border-oxide-2 text-oxide-2',
  failed: 'border-oxide-2 text-oxide-2',
};

export function saveStatusText(snapshot: Pick<AutosaveSnapshot, 'status' | 'failure'>): string {
  const base = text[snapshot.status];
  return snapshot.status === 'failed' && snapshot.failure ? `${base}: ${snapshot.failure}. Changes kept on this device` : base;
}

/** The save state, announced politely whenever it changes. */
export function SaveStatusLine({ snapshot }: { snapshot: Pick<AutosaveSnapshot, 'status' | 'failure'> }) {
  return (
    <p
      role="status"
      className={`inline-block border-l-4 bg-card px-3 py-1.5 font-condensed text-sm font-semibold tracking-[0.08em] uppercase ${tone[snapshot.status]}`}
    >
      {saveStatusText(snapshot)}
    </p>
  );
}
