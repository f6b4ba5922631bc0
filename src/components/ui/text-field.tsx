import { useId, type ComponentPropsWithRef, type ReactNode } from 'react';

type TextFieldProps = Omit<ComponentPropsWithRef<'input'>, 'id'> & {
  label: string;
  /** A line under the label that says what the field is for or what format it wants. */
  hint?: ReactNode;
  /** The field's error; shown under the input and tied to it with aria-describedby. */
  error?: string;
  id?: string;
};

export const fieldClass =
  'block min-h-11 w-full min-w-0 border-[1.5px] border-ink-2 bg-card px-3 py-2 text-base text-ink placeholder:text-slate aria-invalid:border-oxide-2';

/** A labelled text input with an optional hint and error; takes react-hook-form's `register()` spread. */
export function TextField({ label, hint, error, id, className = '', ...input }: TextFieldProps) {
  const autoId = useId();
  const inputId = id ?? autoId;
  const hintId = `${inputId}-hint`;
  const errorId = `${inputId}-error`;
  const describedBy = [hint ? hintId : null, error ? errorId : null].filter(Boolean).join(' ') || undefined;

  return (
    <div className={className}>
      <label htmlFor={inputId} className="block font-semibold text-ink">
        {label}
      </label>
      {hint ? (
        <p id={hintId} className="mt-0.5 text-[15px] text-slate">
          {hint}
        </p>
      ) : null}
      <input
        id={inputId}
        aria-invalid={error ? true : undefined}
        aria-describedby={describedBy}
        className={`mt-1.5 ${fieldClass}`}
        {...input}
      />
      {error ? (
        <p id={errorId} className="mt-1 text-[15px] font-semibold text-oxide-2">
          {sentence(error)}
        </p>
      ) : null}
    </div>
  );
}

/** Schema messages are written lower-case ("must be an e-mail address"); on screen they start a sentence. */
function sentence(message: string): string {
  return message.charAt(0).toUpperCase() + message.slice(1);
}
