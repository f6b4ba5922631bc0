import { useState, type FormEvent } from 'react';
import { Button } from '../../../../components/ui/button';
import { CautionBar } from '../../../../components/ui/caution-bar';
import { Notice } from '../../../../components/ui/notice';
import { ApiError } from '../../../../lib/api-client';
import { FIGURE_CAUTION } from '../../../../shared/figure-checks';
import type { BuildSystem } from '../../../../shared/schemas/builds';
import type { FigureInput } from '../../../../shared/schemas/figures';
import { draftChecks, draftField, validateDraft, type DraftErrors, type FigureDraft } from '../../model/figure-draft';
import { FigureFields } from './figure-fields';

interface FigureFormProps {
  title: string;
  initial: FigureDraft;
  systems: readonly BuildSystem[];
  submitLabel: string;
  pending: boolean;
  onSubmit: (input: FigureInput) => Promise<unknown>;
  onCancel?: () => void;
}

/** Adds or edits one figure; the checks readers will see update as it is typed. */
export function FigureForm({ title, initial, systems, submitLabel, pending, onSubmit, onCancel }: FigureFormProps) {
  const [draft, setDraft] = useState(initial);
  const [errors, setErrors] = useState<DraftErrors>({});
  const [failure, setFailure] = useState<string | null>(null);
  const checks = draftChecks(draft);

  const change = (c: Partial<FigureDraft>) => {
    setDraft((d) => ({ ...d, ...c }));
    setErrors((e) => {
      const next = { ...e };
      for (const k of Object.keys(c) as Array<keyof FigureDraft>) delete next[k];
      return next;
    });
  };

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const result = validateDraft(draft);
    if (!result.ok) return setErrors(result.errors);
    setFailure(null);
    onSubmit(result.input)
      .then(() => setDraft(initial))
      .catch((err: unknown) => {
        const fieldErrors: DraftErrors = {};
        if (err instanceof ApiError && err.fields)
          for (const [path, messages] of Object.entries(err.fields)) {
            const field = draftField(path);
            if (field && messages[0]) fieldErrors[field] = messages[0];
          }
        setErrors(fieldErrors);
        setFailure(err instanceof Error ? err.message : 'The figure was not saved.');
      });
  };

  return (
    <form noValidate onSubmit={submit} aria-label={title} className="mt-4 space-y-4 border border-rule bg-card p-4">
      <p className="font-condensed text-sm font-semibold tracking-label text-ink-2 uppercase">{title}</p>
      <FigureFields draft={draft} errors={errors} systems={systems} onChange={change} />
      <div aria-live="polite" className="space-y-3">
        {checks.map((c) => (
          <CautionBar key={c.kind} label={c.label}>
            <p>{c.text}</p>
          </CautionBar>
        ))}
      </div>
      <p className="text-sm text-ink-2">
        <span className="font-condensed font-semibold tracking-label text-caution uppercase">Caution</span> Readers see this beside every
        figure: {FIGURE_CAUTION}
      </p>
      {failure ? <Notice kind="error">The figure was not saved: {failure}</Notice> : null}
      <div className="flex flex-wrap gap-3">
        <Button type="submit" variant="secondary" disabled={pending}>
          {pending ? 'Saving…' : submitLabel}
        </Button>
        {onCancel ? (
          <Button variant="secondary" onClick={onCancel} disabled={pending}>
            Cancel
          </Button>
        ) : null}
      </div>
    </form>
  );
}
