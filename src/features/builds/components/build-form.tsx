import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useState, type ReactNode } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { Button } from '../../../components/ui/button';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { Notice } from '../../../components/ui/notice';
import { SelectField } from '../../../components/ui/select-field';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { TextField } from '../../../components/ui/text-field';
import { VEHICLE_KINDS, type BuildCreate, type BuildSystem } from '../../../shared/schemas/builds';
import { buildFormSchema, type BuildFormValues } from '../lib/build-form';
import { currencyForLocale } from '../lib/currencies';
import { currencyDigits } from '../lib/money';
import { CurrencyField, currencyName } from './currency-field';
import { applyServerFieldErrors } from './server-field-errors';
import { SystemsEditor } from './systems-editor';
import { VideoLinkField } from './video-link-field';
import { VisibilityField } from './visibility-field';

export const VEHICLE_KIND_LABELS: Record<(typeof VEHICLE_KINDS)[number], string> = {
  car: 'Car',
  motorcycle: 'Motorcycle',
  tractor: 'Tractor',
  boat: 'Boat',
  other: 'Other machine',
};

/** An empty optional text means "none": the schema takes null, not an empty string. */
const emptyToNull = (value: unknown) => (typeof value === 'string' && value.trim() === '' ? null : value);
const upperCode = (value: unknown) => (typeof value === 'string' ? value.trim().toUpperCase() : value);

interface BuildFormProps {
  defaultValues: BuildFormValues;
  /** System keys that stay when the system is renamed (defaults and the saved build's). */
  lockedKeys: ReadonlySet<string>;
  /** A new build: take the currency from the browser's region after mount, unless already chosen. */
  guessCurrency?: boolean;
  /** The saved build's title and systems: removing a saved system asks first, naming it. */
  saved?: { title: string; systems: readonly BuildSystem[] };
  submitLabel: string;
  pendingLabel: string;
  /** Sends the values; a rejected ApiError with `fields` puts the messages on the fields. */
  onSubmit: (values: BuildCreate) => Promise<unknown>;
  /** Shown above the submit button, e.g. "Settings saved". */
  status?: ReactNode;
}

/** Everything about a build the owner decides: the create form and the settings form. */
export function BuildForm({
  defaultValues,
  lockedKeys,
  guessCurrency,
  saved,
  submitLabel,
  pendingLabel,
  onSubmit,
  status,
}: BuildFormProps) {
  const form = useForm<BuildFormValues, unknown, BuildCreate>({ resolver: zodResolver(buildFormSchema), defaultValues });
  const {
    control,
    register,
    setValue,
    getFieldState,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = form;
  const [formError, setFormError] = useState<string | null>(null);
  const [sending, setSending] = useState(false);
  const [confirming, setConfirming] = useState<{ values: BuildCreate; removed: BuildSystem[] } | null>(null);
  const currency = useWatch({ control, name: 'currency' });
  const pattern = useWatch({ control, name: 'videoLinkPattern' }) ?? '';

  useEffect(() => {
    if (!guessCurrency || getFieldState('currency').isDirty) return;
    const guess = currencyForLocale(navigator.language);
    if (guess) setValue('currency', guess);
  }, [guessCurrency, getFieldState, setValue]);

  const send = async (values: BuildCreate) => {
    setFormError(null);
    setSending(true);
    try {
      await onSubmit(values);
    } catch (err) {
      const leftOver = applyServerFieldErrors(err, setError);
      if (leftOver === null) setFormError(err instanceof Error ? err.message : 'Something went wrong.');
      else if (leftOver.length > 0) setFormError(leftOver.join('; '));
    } finally {
      setSending(false);
    }
  };

  const submit = handleSubmit(async (values) => {
    const keep = new Set((values.systems ?? []).map((s) => s.key));
    const removed = saved ? saved.systems.filter((s) => !keep.has(s.key)) : [];
    if (removed.length > 0) setConfirming({ values, removed });
    else await send(values);
  });

  const digits = currencyDigits(currency);
  const name = currencyName(currency);
  const budgetHint =
    digits === null
      ? 'In the build’s currency. Leave it empty for no budget.'
      : `In ${name ? `${name} (${currency})` : currency}, ${digits === 0 ? 'whole amounts only' : `up to ${digits} decimals`}. Leave it empty for no budget.`;

  return (
    <form noValidate onSubmit={(event) => void submit(event)} className="max-w-2xl space-y-10">
      <fieldset className="space-y-5">
        <legend className="label-condensed mb-4 w-full border-b-2 border-ink pb-2">The build</legend>
        <TextField
          label="Title"
          hint="What readers will know the series by."
          autoComplete="off"
          error={errors.title?.message}
          {...register('title')}
        />
        <TextAreaField
          label="Summary"
          hint="A few sentences on the vehicle and what the restoration sets out to do. Optional."
          rows={4}
          error={errors.summary?.message}
          {...register('summary', { setValueAs: emptyToNull })}
        />
      </fieldset>

      <fieldset className="space-y-5">
        <legend className="label-condensed mb-4 w-full border-b-2 border-ink pb-2">The vehicle</legend>
        <SelectField label="Kind of vehicle" className="max-w-xs" error={errors.vehicleKind?.message} {...register('vehicleKind')}>
          {VEHICLE_KINDS.map((k) => (
            <option key={k} value={k}>
              {VEHICLE_KIND_LABELS[k]}
            </option>
          ))}
        </SelectField>
        <div className="grid gap-5 sm:grid-cols-3">
          <TextField
            label="Make"
            autoComplete="off"
            error={errors.vehicleMake?.message}
            {...register('vehicleMake', { setValueAs: emptyToNull })}
          />
          <TextField
            label="Model"
            autoComplete="off"
            error={errors.vehicleModel?.message}
            {...register('vehicleModel', { setValueAs: emptyToNull })}
          />
          <TextField
            label="Year"
            hint="As you know it: 1974, c. 1970, 1968–71."
            autoComplete="off"
            error={errors.vehicleYear?.message}
            {...register('vehicleYear', { setValueAs: emptyToNull })}
          />
        </div>
      </fieldset>

      <fieldset className="space-y-5">
        <legend className="label-condensed mb-4 w-full border-b-2 border-ink pb-2">Money</legend>
        <CurrencyField registration={register('currency', { setValueAs: upperCode })} error={errors.currency?.message} />
        <TextField
          label="Budget"
          hint={budgetHint}
          inputMode="decimal"
          autoComplete="off"
          className="max-w-xs"
          error={errors.budget?.message}
          {...register('budget')}
        />
      </fieldset>

      <fieldset className="space-y-5">
        <legend className="label-condensed mb-4 w-full border-b-2 border-ink pb-2">Readers and video</legend>
        <VisibilityField registration={register('visibility')} error={errors.visibility?.message} />
        <VideoLinkField registration={register('videoLinkPattern')} pattern={pattern} error={errors.videoLinkPattern?.message} />
      </fieldset>

      <SystemsEditor control={control} register={register} setValue={setValue} errors={errors.systems} lockedKeys={lockedKeys} />

      <div className="space-y-4">
        {formError ? <Notice kind="error">The build could not be saved: {formError}</Notice> : null}
        {status}
        <Button type="submit" disabled={isSubmitting || sending}>
          {isSubmitting || sending ? pendingLabel : submitLabel}
        </Button>
      </div>

      <ConfirmDialog
        open={confirming !== null}
        title={`Remove ${listNames(confirming?.removed ?? [])} from ${saved?.title ?? 'the build'}?`}
        confirmLabel={confirming && confirming.removed.length > 1 ? 'Remove systems and save' : 'Remove system and save'}
        cancelLabel="Keep them"
        onClose={() => setConfirming(null)}
        onConfirm={() => {
          const values = confirming?.values;
          setConfirming(null);
          if (values) void send(values);
        }}
      >
        <p>
          Chapters and parts filed under {confirming && confirming.removed.length > 1 ? 'these systems' : 'this system'} lose it, and its
          spend is no longer shown on its own.
        </p>
      </ConfirmDialog>
    </form>
  );
}

function listNames(systems: readonly BuildSystem[]): string {
  const names = systems.map((s) => s.name);
  if (names.length <= 1) return `the ${names[0] ?? ''} system`;
  return `the systems ${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;
}
