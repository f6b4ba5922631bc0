import { useId, type ComponentPropsWithRef, type ReactNode } from 'react';
import { FieldError, FieldHint, fieldIds } from './field-parts';
import { fieldClass } from './text-field';

type SelectFieldProps = Omit<ComponentPropsWithRef<'select'>, 'id'> & {
  label: string;
  hint?: ReactNode;
  error?: string;
  id?: string;
};

/** A labelled native select with an optional hint and error; takes react-hook-form's `register()` spread. */
export function SelectField({ label, hint, error, id, className = '', children, ...select }: SelectFieldProps) {
  const autoId = useId();
  const selectId = id ?? autoId;
  const { hintId, errorId, describedBy } = fieldIds(selectId, hint, error);
  return (
    <div className={className}>
      <label htmlFor={selectId} className="block font-semibold text-ink">
        {label}
      </label>
      {hint ? <FieldHint id={hintId}>{hint}</FieldHint> : null}
      <select
        id={selectId}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className={`mt-1.5 ${fieldClass}`}
        {...select}
      >
        {children}
      </select>
      {error ? <FieldError id={errorId} message={error} /> : null}
    </div>
  );
}
