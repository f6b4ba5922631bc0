import { useId } from 'react';
import type { UseFormRegisterReturn } from 'react-hook-form';
import { TextField } from '../../../components/ui/text-field';
import { COMMON_CURRENCIES } from '../lib/currencies';

/** A currency: pick a common one from the list or type any ISO 4217 code (the input is a combobox). */
export function CurrencyField({ registration, error }: { registration: UseFormRegisterReturn<'currency'>; error?: string }) {
  const listId = useId();
  return (
    <div>
      <TextField
        label="Currency"
        hint="Pick one from the list or type any three-letter ISO 4217 code. Every total of the build is in this currency."
        list={listId}
        autoComplete="off"
        autoCapitalize="characters"
        spellCheck={false}
        maxLength={3}
        className="max-w-[12rem]"
        error={error}
        {...registration}
      />
      <datalist id={listId}>
        {COMMON_CURRENCIES.map((c) => (
          <option key={c.code} value={c.code}>
            {c.name}
          </option>
        ))}
      </datalist>
    </div>
  );
}

/** The name of a common currency ("Euro"), from our own list so server and browser print the same. */
export function currencyName(code: string): string | null {
  return COMMON_CURRENCIES.find((c) => c.code === code)?.name ?? null;
}
