import { GradeOptions, ThreadOptions, TorqueUnitOptions } from '../../../../components/ui/fastener-options';
import { SelectField } from '../../../../components/ui/select-field';
import { TextAreaField } from '../../../../components/ui/text-area-field';
import { TextField } from '../../../../components/ui/text-field';
import type { BuildSystem } from '../../../../shared/schemas/builds';
import {
  TIGHTENING_METHOD_LABELS,
  TIGHTENING_METHODS,
  VALUE_SOURCE_LABELS,
  VALUE_SOURCES,
  type TighteningMethod,
  type ValueSource,
} from '../../../../shared/schemas/figures';
import type { TorqueUnit } from '../../../../shared/torque';
import type { DraftErrors, FigureDraft } from '../../model/figure-draft';

interface FigureFieldsProps {
  draft: FigureDraft;
  errors: DraftErrors;
  systems: readonly BuildSystem[];
  onChange: (change: Partial<FigureDraft>) => void;
}

/** The inputs of one figure; the method decides whether a value and angles are asked for. */
export function FigureFields({ draft, errors, systems, onChange }: FigureFieldsProps) {
  return (
    <div className="grid gap-4 md:grid-cols-2">
      <TextField
        label="Fastener"
        hint="What it holds, e.g. “housing bolts”."
        value={draft.fastener}
        maxLength={120}
        error={errors.fastener}
        onChange={(e) => onChange({ fastener: e.target.value })}
        className="md:col-span-2"
      />
      <SelectField label="Thread" value={draft.thread} error={errors.thread} onChange={(e) => onChange({ thread: e.target.value })}>
        <ThreadOptions />
      </SelectField>
      <SelectField
        label="Vehicle system"
        value={draft.systemKey}
        error={errors.systemKey}
        onChange={(e) => onChange({ systemKey: e.target.value })}
      >
        <option value="">None</option>
        {systems.map((s) => (
          <option key={s.key} value={s.key}>
            {s.name}
            {s.safetyCritical ? ' (safety-critical)' : ''}
          </option>
        ))}
      </SelectField>
      <SelectField
        label="Grade fitted"
        value={draft.gradeFitted}
        error={errors.gradeFitted}
        onChange={(e) => onChange({ gradeFitted: e.target.value })}
      >
        <GradeOptions empty="Not recorded" />
      </SelectField>
      <SelectField
        label="Grade specified"
        hint="What the manual or the original bolt calls for."
        value={draft.gradeSpecified}
        error={errors.gradeSpecified}
        onChange={(e) => onChange({ gradeSpecified: e.target.value })}
      >
        <GradeOptions empty="Not recorded" />
      </SelectField>
      <SelectField
        label="Tightening method"
        value={draft.method}
        error={errors.method}
        onChange={(e) => onChange({ method: e.target.value as TighteningMethod })}
      >
        {TIGHTENING_METHODS.map((m) => (
          <option key={m} value={m}>
            {TIGHTENING_METHOD_LABELS[m]}
          </option>
        ))}
      </SelectField>
      <SelectField
        label="Where the value came from"
        value={draft.source}
        error={errors.source}
        onChange={(e) => onChange({ source: e.target.value as ValueSource })}
      >
        {VALUE_SOURCES.map((s) => (
          <option key={s} value={s}>
            {VALUE_SOURCE_LABELS[s]}
          </option>
        ))}
      </SelectField>
      <div className="grid grid-cols-[minmax(0,1fr)_8rem] gap-3">
        <TextField
          label={draft.method === 'snug' ? 'Torque (if measured)' : 'Torque'}
          inputMode="decimal"
          value={draft.value}
          error={errors.value}
          onChange={(e) => onChange({ value: e.target.value })}
        />
        <SelectField label="Unit" value={draft.unit} error={errors.unit} onChange={(e) => onChange({ unit: e.target.value as TorqueUnit })}>
          <TorqueUnitOptions />
        </SelectField>
      </div>
      {draft.method === 'torque-angle' ? (
        <TextField
          label="Angle stages (degrees)"
          hint="Each stage in turn, e.g. “90, 90”."
          value={draft.angleStages}
          error={errors.angleStages}
          onChange={(e) => onChange({ angleStages: e.target.value })}
        />
      ) : (
        <div aria-hidden="true" className="hidden md:block" />
      )}
      <fieldset className="md:col-span-2">
        <legend className="font-semibold text-ink">Torque wrench range</legend>
        <p className="mt-0.5 text-[15px] text-slate">When a torque wrench was used: the range marked on it. Leave empty otherwise.</p>
        <div className="mt-1.5 grid grid-cols-2 gap-3 sm:grid-cols-[minmax(0,1fr)_minmax(0,1fr)_8rem]">
          <TextField
            label="From"
            inputMode="decimal"
            value={draft.wrenchMin}
            error={errors.wrenchMin}
            onChange={(e) => onChange({ wrenchMin: e.target.value })}
          />
          <TextField
            label="To"
            inputMode="decimal"
            value={draft.wrenchMax}
            error={errors.wrenchMax}
            onChange={(e) => onChange({ wrenchMax: e.target.value })}
          />
          <SelectField
            label="Wrench unit"
            value={draft.wrenchUnit}
            error={errors.wrenchUnit}
            onChange={(e) => onChange({ wrenchUnit: e.target.value as TorqueUnit })}
          >
            <TorqueUnitOptions />
          </SelectField>
        </div>
      </fieldset>
      <TextAreaField
        label="Note"
        hint="Optional: stages, sequence, lubrication, what was fitted and why."
        rows={2}
        value={draft.note}
        maxLength={2000}
        error={errors.note}
        onChange={(e) => onChange({ note: e.target.value })}
        className="md:col-span-2"
      />
    </div>
  );
}
