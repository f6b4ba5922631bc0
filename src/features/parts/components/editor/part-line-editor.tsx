import { zodResolver } from '@hookform/resolvers/zod';
import { useCallback, useEffect, useId, useRef, type FocusEvent, type KeyboardEvent } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { Button } from '../../../../components/ui/button';
import { formatTime } from '../../../../shared/chapters';
import { PART_KINDS, PART_SOURCES, PART_STATUSES, PART_UNITS, type PartLineInput } from '../../../../shared/schemas/parts';
import { ApiError } from '../../../../lib/api-client';
import { formFieldOf, partLineFormSchema, valuesToInput, type PartLineFormValues } from '../../lib/part-line-form';
import { KIND_LABELS, SOURCE_LABELS, STATUS_LABELS } from '../../lib/labels';
import { CheckCell, SelectCell, TextCell, errorIdOf } from './part-line-fields';
import { SupplierField } from './supplier-field';
import { useSponsorOptions } from '../../api/get-sponsors';
import { SUPPORT_KINDS, SUPPORT_KIND_LABELS } from '../../../../shared/schemas/sponsors';

export interface PartsContext {
  buildId: number;
  buildCurrency: string;
  systems: ReadonlyArray<{ key: string; name: string }>;
  chapters: ReadonlyArray<{ startSeconds: number; title: string }>;
  openItems: ReadonlyArray<{ id: number; title: string }>;
}

interface PartLineEditorProps {
  ctx: PartsContext;
  mode: 'new' | 'edit';
  /** "New part line" or "Line 3"; prefixes every label so screen readers know the row. */
  rowLabel: string;
  defaultValues: PartLineFormValues;
  /** A line whose moment matches no chapter keeps it unless the chapter is changed. */
  keepAtSeconds?: number | null;
  /** Rejects with the API's error; its field messages land beside their cells. */
  onSubmit: (input: PartLineInput, values: PartLineFormValues) => Promise<unknown>;
  /** The row as it would be sent, for the totals while typing (null while it does not convert). */
  onDraft: (input: PartLineInput | null) => void;
  onCancel?: () => void;
}

const opts = <T extends string>(values: readonly T[], labels: Record<T, string>) => values.map((v) => ({ value: v, label: labels[v] }));

/**
 * The row being typed: every field of a part line, Tab between cells, Enter saves (a new line,
 * or the changes of this one), Escape leaves an edit. An edited line also saves when the focus
 * leaves it.
 */
export function PartLineEditor({
  ctx,
  mode,
  rowLabel,
  defaultValues,
  keepAtSeconds = null,
  onSubmit,
  onDraft,
  onCancel,
}: PartLineEditorProps) {
  const idBase = useId();
  const formRef = useRef<HTMLFormElement>(null);
  const form = useForm<PartLineFormValues, unknown, PartLineInput>({
    defaultValues,
    resolver: zodResolver(partLineFormSchema(ctx.buildCurrency, keepAtSeconds)),
  });
  const { register, handleSubmit, control, setValue, setError, reset, formState } = form;
  const values = useWatch({ control }) as PartLineFormValues;
  const { currency, source, status, supplierName, supplierId, suggestedSponsorId, suggestedSponsorName, sponsorId } = values;
  const sponsors = useSponsorOptions().data?.items ?? [];
  // A linked supplier only suggests its sponsor: the creator accepts it (DESIGN.md "Sponsor").
  const suggestion = suggestedSponsorId !== '' && suggestedSponsorId !== sponsorId ? suggestedSponsorName : null;
  const foreign = currency.trim().toUpperCase() !== ctx.buildCurrency;

  useEffect(() => {
    const result = valuesToInput(values, ctx.buildCurrency, keepAtSeconds);
    onDraft(result.ok ? result.input : null);
  }, [values, ctx.buildCurrency, keepAtSeconds, onDraft]);
  useEffect(() => () => onDraft(null), [onDraft]);
  const focusDescription = useCallback(() => document.getElementById(`${idBase}-description`)?.focus(), [idBase]);
  useEffect(() => {
    if (mode === 'edit') focusDescription();
  }, [mode, focusDescription]);

  const submit = handleSubmit(async (input, event) => {
    void event;
    try {
      await onSubmit(input, values);
      if (mode === 'new') {
        // The next line usually shares the chapter, system, supplier and money settings.
        const {
          systemKey,
          chapter,
          status: st,
          currency: cur,
          taxRate,
          taxIncluded,
          fxRate,
          supplierId: sid,
          supplierName: sname,
          suggestedSponsorId: ssid,
          suggestedSponsorName: ssname,
        } = values;
        reset({
          ...defaultValues,
          systemKey,
          chapter,
          status: st,
          currency: cur,
          taxRate,
          taxIncluded,
          fxRate,
          supplierId: sid,
          supplierName: sname,
          suggestedSponsorId: ssid,
          suggestedSponsorName: ssname,
        });
        focusDescription();
      }
    } catch (err) {
      if (err instanceof ApiError && err.fields) {
        for (const [key, messages] of Object.entries(err.fields)) setError(formFieldOf(key), { message: messages[0] ?? 'not accepted' });
      } else {
        setError('root', { message: err instanceof Error ? err.message : 'not saved' });
      }
    }
  });

  const onKeyDown = (event: KeyboardEvent<HTMLFormElement>) => {
    const target = event.target as HTMLElement;
    if (event.key === 'Escape' && onCancel) {
      event.preventDefault();
      onCancel();
    }
    if (event.key !== 'Enter' || event.nativeEvent.isComposing || target.tagName === 'BUTTON') return;
    event.preventDefault();
    void submit();
  };

  const onBlur = (event: FocusEvent<HTMLFormElement>) => {
    if (mode !== 'edit' || formRef.current?.contains(event.relatedTarget as Node | null)) return;
    if (formState.isDirty) void submit();
    else onCancel?.();
  };

  const label = (text: string) => (mode === 'new' ? text : `${text}, ${rowLabel}`);
  const common = { idBase, register, errors: formState.errors };
  return (
    <form
      ref={formRef}
      noValidate
      aria-label={rowLabel}
      onSubmit={(e) => void submit(e)}
      onKeyDown={onKeyDown}
      onBlur={onBlur}
      className="grid grid-cols-2 gap-x-3 gap-y-2 sm:grid-cols-4 lg:grid-cols-8"
    >
      <TextCell {...common} field="description" label={label('Description')} className="col-span-2 sm:col-span-4 lg:col-span-3" />
      <SelectCell {...common} field="kind" value={String(values.kind)} label={label('Kind')} options={opts(PART_KINDS, KIND_LABELS)} />
      <TextCell {...common} field="partNumber" label={label('Part number')} mono />
      <div className="col-span-2 min-w-0 sm:col-span-2 lg:col-span-3">
        <SupplierField
          buildId={ctx.buildId}
          label={label('Supplier')}
          name={supplierName}
          supplierId={supplierId}
          error={formState.errors.supplierName?.message}
          errorId={errorIdOf(idBase, 'supplierName')}
          onChange={(next) => {
            setValue('supplierId', next.supplierId, { shouldDirty: true });
            setValue('supplierName', next.supplierName, { shouldDirty: true });
            setValue('suggestedSponsorId', next.sponsor ? String(next.sponsor.id) : '');
            setValue('suggestedSponsorName', next.sponsor?.name ?? '');
          }}
        />
      </div>
      <SelectCell
        {...common}
        field="systemKey"
        value={String(values.systemKey)}
        label={label('System')}
        options={[{ value: '', label: 'None' }, ...ctx.systems.map((s) => ({ value: s.key, label: s.name }))]}
      />
      <SelectCell
        {...common}
        field="chapter"
        value={String(values.chapter)}
        label={label('Chapter')}
        className="lg:col-span-2"
        options={[
          { value: '', label: keepAtSeconds !== null && values.chapter === '' ? `At ${formatTime(keepAtSeconds)}` : 'None' },
          ...ctx.chapters.map((c) => ({ value: String(c.startSeconds), label: `${formatTime(c.startSeconds)} ${c.title}` })),
        ]}
      />
      <SelectCell
        {...common}
        field="source"
        value={String(values.source)}
        label={label('Source')}
        options={opts(PART_SOURCES, SOURCE_LABELS)}
      />
      <SelectCell
        {...common}
        field="status"
        value={String(values.status)}
        label={label('Status')}
        options={opts(PART_STATUSES, STATUS_LABELS)}
      />
      <TextCell {...common} field="quantity" label={label('Quantity')} inputMode="decimal" mono />
      <SelectCell
        {...common}
        field="unit"
        value={String(values.unit)}
        label={label('Unit')}
        options={PART_UNITS.map((u) => ({ value: u, label: u }))}
      />
      <TextCell {...common} field="unitPrice" label={label(`Unit price`)} inputMode="decimal" mono placeholder="0.00" />
      <TextCell {...common} field="currency" label={label('Currency')} mono />
      <TextCell {...common} field="taxRate" label={label('Tax %')} inputMode="decimal" mono />
      <CheckCell {...common} field="taxIncluded" label={label('Price includes tax')} />
      {foreign ? (
        <TextCell
          {...common}
          field="fxRate"
          label={label(`${ctx.buildCurrency} per 1 ${currency.toUpperCase() || '…'}`)}
          inputMode="decimal"
          mono
        />
      ) : null}
      {source === 'reused' || source === 'made' ? (
        <TextCell {...common} field="avoidedCost" label={label('Avoided cost')} inputMode="decimal" mono />
      ) : null}
      <TextCell {...common} field="buyUrl" label={label('Where to buy (link)')} inputMode="url" className="col-span-2 lg:col-span-2" />
      <CheckCell {...common} field="affiliate" label={label('Affiliate link')} />
      <SelectCell
        {...common}
        field="supportKind"
        value={String(values.supportKind)}
        label={label('Support')}
        options={[{ value: '', label: 'None' }, ...SUPPORT_KINDS.map((k) => ({ value: k, label: SUPPORT_KIND_LABELS[k] }))]}
      />
      <SelectCell
        {...common}
        field="sponsorId"
        value={String(values.sponsorId)}
        label={label('Sponsor')}
        options={[{ value: '', label: 'None' }, ...sponsors.map((s) => ({ value: String(s.id), label: s.name }))]}
      />
      <TextCell {...common} field="listPrice" label={label('List price (unit)')} inputMode="decimal" mono placeholder="0.00" />
      {suggestion ? (
        <div className="col-span-2 flex flex-wrap items-center gap-2 border border-brass bg-brass-soft px-3 py-2 sm:col-span-4 lg:col-span-8">
          <p className="text-[14px] text-ink">
            {supplierName || 'This supplier'} is backed by <strong>{suggestion}</strong>. Was this line supported by them?
          </p>
          <Button variant="secondary" onClick={() => setValue('sponsorId', suggestedSponsorId, { shouldDirty: true })}>
            Credit {suggestion}
          </Button>
        </div>
      ) : null}
      {status === 'needed' || status === 'on-order' ? (
        <SelectCell
          {...common}
          field="openItemId"
          value={String(values.openItemId)}
          label={label('Open item')}
          className="col-span-2"
          options={[{ value: '', label: 'None' }, ...ctx.openItems.map((o) => ({ value: String(o.id), label: o.title }))]}
        />
      ) : null}
      <div className="col-span-2 flex flex-wrap items-end gap-2 sm:col-span-4 lg:col-span-8">
        <Button type="submit" variant={mode === 'new' ? 'primary' : 'secondary'} disabled={formState.isSubmitting}>
          {formState.isSubmitting ? 'Saving…' : mode === 'new' ? 'Add line' : 'Save line'}
        </Button>
        {onCancel ? (
          <Button variant="secondary" onClick={onCancel}>
            Cancel
          </Button>
        ) : null}
        <p className="text-[13px] text-slate">Enter saves · Tab moves between cells{onCancel ? ' · Escape cancels' : ''}</p>
        {formState.errors.root ? (
          <p role="alert" className="w-full text-[14px] font-semibold text-oxide-2">
            Not saved: {formState.errors.root.message}
          </p>
        ) : null}
      </div>
    </form>
  );
}
