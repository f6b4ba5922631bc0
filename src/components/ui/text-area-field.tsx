import { useId, type ComponentPropsWithRef, type ReactNode } from 'react';
import { FieldError, FieldHint, fieldIds } from './field-parts';
import { fieldClass } from './text-field';

type TextAreaFieldProps = Omit<ComponentPropsWithRef<'textarea'>, 'id'> & {
  label: string;
  hint?: ReactNode;
  error?: string;
  id?: string;
};

/** A labelled multi-line text field with an optional hint and error. */
export function TextAreaField({ label, hint, error, id, className = '', rows = 4, ...textarea }: TextAreaFieldProps) {
  const autoId = useId();
  const areaId = id ?? autoId;
  const { hintId, errorId, describedBy } = fieldIds(areaId, hint, error);
  return (
    <div className={className}>
      <label htmlFor={areaId} className="block font-semibold text-ink">
        {label}
      </label>
      {hint ? <FieldHint id={hintId}>{hint}</FieldHint> : null}
      <textarea
        id={areaId}
        rows={rows}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className={`mt-1.5 ${fieldClass}`}
        {...textarea}
      />
      {error ? <FieldError id={errorId} message={error} /> : null}
    </div>
  );
}
