import { useId, useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { ApiError } from '../../../lib/api-client';

/** A one-field form for a short text (a reason, a reply, an adoption note) with its own error line. */
export function ShortTextForm({
  label,
  submitLabel,
  multiline = false,
  initial = '',
  pending,
  error,
  onSubmit,
  onCancel,
}: {
  label: string;
  submitLabel: string;
  multiline?: boolean;
  initial?: string;
  pending: boolean;
  error: unknown;
  onSubmit: (text: string) => void;
  onCancel: () => void;
}) {
  const id = useId();
  const [text, setText] = useState(initial);
  const submit = (e: FormEvent) => {
    e.preventDefault();
    if (text.trim()) onSubmit(text.trim());
  };
  const message =
    error instanceof ApiError
      ? (Object.values(error.fields ?? {})[0]?.[0] ?? error.message)
      : error
        ? 'That did not work; try again.'
        : null;
  const field = 'mt-1 w-full border border-rule bg-card px-3 py-2 text-[15px] text-ink';
  return (
    <form onSubmit={submit} className="mt-2 max-w-measure">
      <label htmlFor={id} className="block text-[14px] font-semibold text-ink">
        {label}
      </label>
      {multiline ? (
        <textarea id={id} rows={3} value={text} maxLength={4000} onChange={(e) => setText(e.target.value)} className={field} autoFocus />
      ) : (
        <input id={id} value={text} maxLength={500} onChange={(e) => setText(e.target.value)} className={field} autoFocus />
      )}
      {message ? (
        <p role="alert" className="mt-1 text-[14px] text-oxide-2">
          {message}
        </p>
      ) : null}
      <div className="mt-2 flex gap-2">
        <Button type="submit" disabled={pending || !text.trim()}>
          {submitLabel}
        </Button>
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
