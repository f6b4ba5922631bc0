import { useId, useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { fieldClass } from '../../../components/ui/text-field';
import { ApiError } from '../../../lib/api-client';
import {
  SUPPORT_KIND_LABELS,
  SUPPORT_KINDS,
  sponsorshipInput,
  type Sponsorship,
  type SponsorshipInput,
  type SponsorRef,
} from '../../../shared/schemas/sponsors';

interface SponsorshipFormProps {
  sponsors: readonly SponsorRef[];
  initial: Sponsorship | null;
  submitLabel: string;
  onSave: (input: SponsorshipInput) => Promise<unknown>;
  onCancel?: () => void;
}

type Errors = Partial<Record<keyof SponsorshipInput | 'root', string>>;

/** Sponsor, kind of support, first day and optional last day; the shared schema checks it before sending. */
export function SponsorshipForm({ sponsors, initial, submitLabel, onSave, onCancel }: SponsorshipFormProps) {
  const id = useId();
  const [sponsorId, setSponsorId] = useState(initial ? String(initial.sponsor.id) : '');
  const [kind, setKind] = useState<string>(initial?.kind ?? 'gifted');
  const [startsOn, setStartsOn] = useState(initial?.startsOn ?? '');
  const [endsOn, setEndsOn] = useState(initial?.endsOn ?? '');
  const [errors, setErrors] = useState<Errors>({});
  const [pending, setPending] = useState(false);

  const submit = async (event: FormEvent) => {
    event.preventDefault();
    const parsed = sponsorshipInput.safeParse({
      sponsorId: sponsorId === '' ? 0 : Number(sponsorId),
      kind,
      startsOn,
      endsOn: endsOn === '' ? null : endsOn,
    });
    if (!parsed.success) {
      const next: Errors = {};
      for (const issue of parsed.error.issues) {
        const key = String(issue.path[0] ?? 'root') as keyof Errors;
        next[key] ??= key === 'sponsorId' ? 'choose a sponsor' : issue.message;
      }
      return setErrors(next);
    }
    setPending(true);
    setErrors({});
    try {
      await onSave(parsed.data);
      if (!initial) {
        setSponsorId('');
        setStartsOn('');
        setEndsOn('');
      }
    } catch (err) {
      const next: Errors = {};
      if (err instanceof ApiError && err.fields) for (const [k, m] of Object.entries(err.fields)) next[k as keyof Errors] = m[0];
      else next.root = err instanceof Error ? err.message : 'not saved';
      setErrors(next);
    } finally {
      setPending(false);
    }
  };

  const field = (
    name: keyof SponsorshipInput,
    label: string,
    input: (a: { id: string; 'aria-invalid'?: boolean; 'aria-describedby'?: string }) => React.ReactNode,
  ) => (
    <div className="min-w-0">
      <label htmlFor={`${id}-${name}`} className="block font-semibold text-ink">
        {label}
      </label>
      {input({
        id: `${id}-${name}`,
        'aria-invalid': errors[name] ? true : undefined,
        'aria-describedby': errors[name] ? `${id}-${name}-error` : undefined,
      })}
      {errors[name] ? (
        <p id={`${id}-${name}-error`} className="mt-1 text-[14px] font-semibold text-oxide-2">
          {errors[name]}
        </p>
      ) : null}
    </div>
  );

  return (
    <form noValidate onSubmit={(e) => void submit(e)} className="grid gap-3 sm:grid-cols-2" aria-label={submitLabel}>
      {field('sponsorId', 'Sponsor', (a) => (
        <select {...a} value={sponsorId} onChange={(e) => setSponsorId(e.target.value)} className={`mt-1 ${fieldClass}`}>
          <option value="">Choose…</option>
          {sponsors.map((s) => (
            <option key={s.id} value={s.id}>
              {s.name}
            </option>
          ))}
        </select>
      ))}
      {field('kind', 'Kind of support', (a) => (
        <select {...a} value={kind} onChange={(e) => setKind(e.target.value)} className={`mt-1 ${fieldClass}`}>
          {SUPPORT_KINDS.map((k) => (
            <option key={k} value={k}>
              {SUPPORT_KIND_LABELS[k]}
            </option>
          ))}
        </select>
      ))}
      {field('startsOn', 'Starts on', (a) => (
        <input
          {...a}
          type="date"
          value={startsOn}
          onChange={(e) => setStartsOn(e.target.value)}
          className={`mt-1 ${fieldClass} font-mono`}
        />
      ))}
      {field('endsOn', 'Ends on (optional)', (a) => (
        <input {...a} type="date" value={endsOn} onChange={(e) => setEndsOn(e.target.value)} className={`mt-1 ${fieldClass} font-mono`} />
      ))}
      <div className="flex flex-wrap items-center gap-2 sm:col-span-2">
        <Button type="submit" disabled={pending}>
          {pending ? 'Saving…' : submitLabel}
        </Button>
        {onCancel ? (
          <Button variant="secondary" onClick={onCancel}>
            Cancel
          </Button>
        ) : null}
        {errors.root ? (
          <p role="alert" className="w-full font-semibold text-oxide-2">
            Not saved: {errors.root}
          </p>
        ) : null}
      </div>
    </form>
  );
}
