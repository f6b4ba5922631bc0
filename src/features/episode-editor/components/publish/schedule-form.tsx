import { useId, useState, type FormEvent } from 'react';
import { Button } from '../../../../components/ui/button';
import { fieldClass } from '../../../../components/ui/text-field';
import { useHydrated } from '../../hooks/use-hydrated';
import { isoToLocalInput, localInputToIso, localTimeZoneName } from '../../model/local-time';

interface ScheduleFormProps {
  /** The publish time already set, when rescheduling. */
  current: string | null;
  pending: boolean;
  onSchedule: (publishAt: string) => void;
}

/** A date and time in the reader's own time zone, sent as ISO with that zone's offset. */
export function ScheduleForm({ current, pending, onSchedule }: ScheduleFormProps) {
  const id = useId();
  const hydrated = useHydrated();
  // Null until typed into: the current time in the reader's zone is known only in the browser.
  const [typed, setValue] = useState<string | null>(null);
  const value = typed ?? (hydrated && current ? isoToLocalInput(current) : '');
  const [error, setError] = useState<string | null>(null);
  const zone = hydrated ? localTimeZoneName() : 'your local time';

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const iso = localInputToIso(value);
    if (!iso) return setError('Choose a date and a time (a time skipped by a clock change does not exist).');
    if (new Date(iso).getTime() <= Date.now()) return setError('Choose a time in the future, or publish now.');
    setError(null);
    onSchedule(iso);
  };

  return (
    <form noValidate onSubmit={submit} className="flex flex-wrap items-end gap-3">
      <div className="min-w-0">
        <label htmlFor={`${id}-at`} className="block font-semibold text-ink">
          Publish on
        </label>
        <p id={`${id}-hint`} className="mt-0.5 text-[15px] text-slate">
          In your time zone, {zone}.
        </p>
        <input
          id={`${id}-at`}
          type="datetime-local"
          value={value}
          aria-invalid={error ? true : undefined}
          aria-describedby={`${id}-hint${error ? ` ${id}-error` : ''}`}
          className={`mt-1.5 ${fieldClass} max-w-64`}
          onChange={(e) => setValue(e.target.value)}
        />
      </div>
      <Button type="submit" variant="secondary" disabled={pending}>
        {current ? 'Change the time' : 'Schedule'}
      </Button>
      {error ? (
        <p id={`${id}-error`} className="w-full text-[15px] font-semibold text-oxide-2">
          {error}
        </p>
      ) : null}
    </form>
  );
}
