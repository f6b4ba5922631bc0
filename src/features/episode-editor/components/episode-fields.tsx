import { useId } from 'react';
import { fieldClass, TextField } from '../../../components/ui/text-field';
import type { DraftChanges, DraftField, EditorDraft } from '../model/draft';

interface EpisodeFieldsProps {
  draft: EditorDraft;
  /** Messages by field: what does not convert yet, and what the server refused. */
  errors: Partial<Record<DraftField, string>>;
  onChange: (changes: DraftChanges) => void;
}

/** Title, number, summary, video, length, hours and the raised-vehicle mark. */
export function EpisodeFields({ draft, errors, onChange }: EpisodeFieldsProps) {
  const id = useId();
  return (
    <div className="space-y-5">
      <div className="grid gap-5 md:grid-cols-[minmax(0,1fr)_8rem]">
        <TextField
          label="Title"
          value={draft.title}
          maxLength={160}
          error={errors.title}
          onChange={(e) => onChange({ title: e.target.value })}
        />
        <TextField
          label="Episode number"
          value={draft.number}
          inputMode="numeric"
          autoComplete="off"
          error={errors.number}
          onChange={(e) => onChange({ number: e.target.value })}
        />
      </div>
      <div>
        <label htmlFor={`${id}-summary`} className="block font-semibold text-ink">
          Summary <span className="font-normal text-slate">(optional)</span>
        </label>
        <p id={`${id}-summary-hint`} className="mt-0.5 text-[15px] text-slate">
          One or two sentences for the episode list and link previews.
        </p>
        <textarea
          id={`${id}-summary`}
          value={draft.summary}
          rows={3}
          maxLength={1000}
          aria-invalid={errors.summary ? true : undefined}
          aria-describedby={`${id}-summary-hint${errors.summary ? ` ${id}-summary-error` : ''}`}
          className={`mt-1.5 ${fieldClass}`}
          onChange={(e) => onChange({ summary: e.target.value })}
        />
        {errors.summary ? (
          <p id={`${id}-summary-error`} className="mt-1 text-[15px] font-semibold text-oxide-2">
            {errors.summary}
          </p>
        ) : null}
      </div>
      <div className="grid gap-5 md:grid-cols-[minmax(0,1fr)_10rem_10rem]">
        <TextField
          label="Video link"
          hint="Optional: where the video of this session is."
          type="url"
          inputMode="url"
          spellCheck={false}
          value={draft.videoUrl}
          error={errors.videoUrl}
          onChange={(e) => onChange({ videoUrl: e.target.value })}
        />
        <TextField
          label="Video length"
          hint="m:ss or h:mm:ss"
          inputMode="numeric"
          autoComplete="off"
          value={draft.duration}
          error={errors.duration}
          onChange={(e) => onChange({ duration: e.target.value })}
        />
        <TextField
          label="Hours worked"
          hint="In the garage, e.g. 3.5"
          inputMode="decimal"
          autoComplete="off"
          value={draft.hoursWorked}
          error={errors.hoursWorked}
          onChange={(e) => onChange({ hoursWorked: e.target.value })}
        />
      </div>
      <div className="flex items-start gap-3">
        <input
          id={`${id}-raised`}
          type="checkbox"
          checked={draft.raisedVehicle}
          aria-describedby={`${id}-raised-hint`}
          className="mt-1 h-5 w-5 shrink-0 accent-ink"
          onChange={(e) => onChange({ raisedVehicle: e.target.checked })}
        />
        <div>
          <label htmlFor={`${id}-raised`} className="font-semibold text-ink">
            Work under a raised vehicle
          </label>
          <p id={`${id}-raised-hint`} className="text-[15px] text-slate">
            Readers then see the safety caution under the title.
          </p>
        </div>
      </div>
    </div>
  );
}
