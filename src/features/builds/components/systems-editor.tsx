import { useId, useState, type KeyboardEvent } from 'react';
import { useFieldArray, useWatch, type Control, type FieldErrors, type UseFormRegister, type UseFormSetValue } from 'react-hook-form';
import { Button } from '../../../components/ui/button';
import { fieldClass } from '../../../components/ui/text-field';
import { sentence } from '../../../components/ui/field-parts';
import type { BuildCreate } from '../../../shared/schemas/builds';
import type { BuildFormValues } from '../lib/build-form';
import { uniqueKey } from '../lib/system-keys';

const MAX_SYSTEMS = 40;

interface SystemsEditorProps {
  control: Control<BuildFormValues, unknown, BuildCreate>;
  register: UseFormRegister<BuildFormValues>;
  setValue: UseFormSetValue<BuildFormValues>;
  errors: FieldErrors<BuildFormValues>['systems'];
  /** Keys that stay when a system is renamed: the defaults and the saved build's (chapters point at them). */
  lockedKeys: ReadonlySet<string>;
}

/** The build's vehicle systems: rename, flag as safety-critical, remove, add your own. */
export function SystemsEditor({ control, register, setValue, errors, lockedKeys }: SystemsEditorProps) {
  const { fields, append, remove } = useFieldArray({ control, name: 'systems', keyName: 'fieldId' });
  const systems = useWatch({ control, name: 'systems' }) ?? [];
  const newId = useId();
  const [newName, setNewName] = useState('');
  const [addError, setAddError] = useState<string | null>(null);

  const takenExcept = (index: number) => new Set(systems.filter((_, i) => i !== index).map((s) => s.key));

  const add = () => {
    const name = newName.trim();
    if (!name) return setAddError('Type the new system’s name first.');
    if (name.length > 40) return setAddError('A system’s name has at most 40 characters.');
    append({ key: uniqueKey(name, takenExcept(-1)), name, safetyCritical: false });
    setNewName('');
    setAddError(null);
  };

  const onNewKeyDown = (event: KeyboardEvent<HTMLInputElement>) => {
    // Enter adds the system instead of submitting the whole form.
    if (event.key === 'Enter') {
      event.preventDefault();
      add();
    }
  };

  const listError = errors?.root?.message ?? errors?.message;

  return (
    <fieldset>
      <legend className="font-semibold text-ink">Vehicle systems</legend>
      <p className="mt-0.5 max-w-measure text-[15px] text-slate">
        Chapters, parts and spend are sorted by these. An episode that touches a safety-critical system shows a caution to readers.
      </p>
      {fields.length === 0 ? <p className="mt-3 text-ink-2">No vehicle systems. Add at least the ones this build works on.</p> : null}
      <ul className="mt-3 divide-y divide-rule border-y border-rule bg-card">
        {fields.map((field, index) => {
          const current = systems[index];
          const label = current?.name.trim() || `system ${index + 1}`;
          const error = errors?.[index]?.name?.message ?? errors?.[index]?.key?.message;
          const errorId = `system-${field.fieldId}-error`;
          const nameField = register(`systems.${index}.name`, {
            onChange: (event: { target: { value: string } }) => {
              const key = current?.key ?? '';
              // A system added here takes its key from its name; a saved or default key never moves.
              if (!lockedKeys.has(key)) setValue(`systems.${index}.key`, uniqueKey(event.target.value, takenExcept(index)));
            },
          });
          return (
            <li key={field.fieldId} className="flex flex-wrap items-center gap-x-4 gap-y-2 px-3 py-2.5">
              <input
                aria-label={`Name of system ${index + 1}`}
                aria-invalid={error ? true : undefined}
                aria-describedby={error ? errorId : undefined}
                autoComplete="off"
                maxLength={40}
                className={`${fieldClass} max-w-[16rem] flex-1 basis-40`}
                {...nameField}
              />
              <label className="inline-flex min-h-11 items-center gap-2">
                {/* The name starts with the visible label and says which system it is about. */}
                <input
                  type="checkbox"
                  aria-label={`Safety-critical: ${label}`}
                  className="h-5 w-5 accent-ink"
                  {...register(`systems.${index}.safetyCritical`)}
                />
                <span aria-hidden="true">Safety-critical</span>
              </label>
              <Button variant="secondary" className="ml-auto" onClick={() => remove(index)} aria-label={`Remove ${label}`}>
                Remove
              </Button>
              {error ? (
                <p id={errorId} className="w-full text-[15px] font-semibold text-oxide-2">
                  {sentence(error)}
                </p>
              ) : null}
            </li>
          );
        })}
      </ul>
      {listError ? <p className="mt-1 text-[15px] font-semibold text-oxide-2">{sentence(listError)}</p> : null}
      <div className="mt-3 flex flex-wrap items-end gap-3">
        <div className="min-w-0 flex-1 basis-48">
          <label htmlFor={newId} className="block font-semibold text-ink">
            Add your own system
          </label>
          <input
            id={newId}
            value={newName}
            onChange={(event) => setNewName(event.target.value)}
            onKeyDown={onNewKeyDown}
            maxLength={40}
            autoComplete="off"
            placeholder="e.g. Sidecar"
            aria-invalid={addError ? true : undefined}
            aria-describedby={addError ? `${newId}-error` : undefined}
            className={`mt-1.5 ${fieldClass} max-w-[16rem]`}
          />
        </div>
        <Button variant="secondary" onClick={add} disabled={fields.length >= MAX_SYSTEMS}>
          Add system
        </Button>
      </div>
      {addError ? (
        <p id={`${newId}-error`} role="alert" className="mt-1 text-[15px] font-semibold text-oxide-2">
          {addError}
        </p>
      ) : null}
      {fields.length >= MAX_SYSTEMS ? <p className="mt-1 text-[15px] text-slate">A build has at most {MAX_SYSTEMS} systems.</p> : null}
    </fieldset>
  );
}
