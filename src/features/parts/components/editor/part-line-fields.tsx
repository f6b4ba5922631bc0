import type { ReactNode } from 'react';
import type { FieldErrors, UseFormRegister } from 'react-hook-form';
import { sentence } from '../../../../components/ui/field-parts';
import { fieldClass } from '../../../../components/ui/text-field';
import type { PartFormField, PartLineFormValues } from '../../lib/part-line-form';

export const cellInput = `mt-1 ${fieldClass} min-h-10 px-2 py-1.5 text-[15px]`;

/** Errors of the row, by the id of the message under each cell. */
export function errorIdOf(idBase: string, field: PartFormField): string {
  return `${idBase}-${field}-error`;
}

export function CellError({ idBase, field, errors }: { idBase: string; field: PartFormField; errors: FieldErrors<PartLineFormValues> }) {
  const message = errors[field]?.message;
  if (!message) return null;
  return (
    <p id={errorIdOf(idBase, field)} className="mt-1 text-[13px] font-semibold text-oxide-2">
      {sentence(String(message))}
    </p>
  );
}

interface CellProps {
  idBase: string;
  field: PartFormField;
  label: string;
  errors: FieldErrors<PartLineFormValues>;
  className?: string;
  children: (props: { id: string; 'aria-invalid'?: boolean; 'aria-describedby'?: string }) => ReactNode;
}

/** One labelled cell of the row being edited, with its message beside it. */
export function Cell({ idBase, field, label, errors, className = '', children }: CellProps) {
  const id = `${idBase}-${field}`;
  const invalid = Boolean(errors[field]);
  return (
    <div className={`min-w-0 ${className}`}>
      <label htmlFor={id} className="block text-[14px] font-semibold text-ink">
        {label}
      </label>
      {children({ id, 'aria-invalid': invalid || undefined, 'aria-describedby': invalid ? errorIdOf(idBase, field) : undefined })}
      <CellError idBase={idBase} field={field} errors={errors} />
    </div>
  );
}

export function TextCell({
  register,
  inputMode,
  mono = false,
  placeholder,
  ...cell
}: Omit<CellProps, 'children'> & {
  register: UseFormRegister<PartLineFormValues>;
  inputMode?: 'decimal' | 'text' | 'url';
  mono?: boolean;
  placeholder?: string;
}) {
  return (
    <Cell {...cell}>
      {(a) => (
        <input
          {...a}
          {...register(cell.field)}
          autoComplete="off"
          inputMode={inputMode}
          placeholder={placeholder}
          className={`${cellInput} ${mono ? 'font-mono' : ''}`}
        />
      )}
    </Cell>
  );
}

/** Controlled by the watched value, so the DOM always shows what the form holds (after a reset too). */
export function SelectCell({
  register,
  options,
  value,
  ...cell
}: Omit<CellProps, 'children'> & {
  register: UseFormRegister<PartLineFormValues>;
  options: ReadonlyArray<{ value: string; label: string }>;
  value: string;
}) {
  return (
    <Cell {...cell}>
      {(a) => (
        <select {...a} {...register(cell.field)} value={value} className={cellInput}>
          {options.map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
        </select>
      )}
    </Cell>
  );
}

export function CheckCell({
  register,
  idBase,
  field,
  label,
  errors,
}: {
  register: UseFormRegister<PartLineFormValues>;
  idBase: string;
  field: 'taxIncluded' | 'affiliate';
  label: string;
  errors: FieldErrors<PartLineFormValues>;
}) {
  const id = `${idBase}-${field}`;
  return (
    <div className="min-w-0 self-end pb-2">
      <div className="flex items-center gap-2">
        <input id={id} type="checkbox" {...register(field)} className="h-5 w-5 accent-ink" />
        <label htmlFor={id} className="text-[14px] font-semibold text-ink">
          {label}
        </label>
      </div>
      <CellError idBase={idBase} field={field} errors={errors} />
    </div>
  );
}
