import { CautionBar } from '../../../../components/ui/caution-bar';
import { Plate } from '../../../../components/ui/plate';
import { angleText, gradeText, methodText, sourceText, wrenchText } from '../../../../shared/figure-text';
import type { Figure } from '../../../../shared/schemas/figures';
import { formatTorque } from '../../../../shared/torque';

interface FigureRowProps {
  figure: Figure;
  busy: boolean;
  onEdit: () => void;
  onDelete: () => void;
}

/** One saved figure in the editor: as recorded, with the checks readers will see. */
export function FigureRow({ figure, busy, onEdit, onDelete }: FigureRowProps) {
  const value = figure.value === null ? 'By hand, snug' : formatTorque(figure.value, figure.unit);
  const details = [
    methodText(figure.method),
    gradeText(figure.gradeFitted, figure.gradeSpecified),
    figure.wrenchRange ? wrenchText(figure.wrenchRange, null) : null,
    sourceText(figure.source),
  ].filter(Boolean);
  return (
    <li className="border border-rule bg-card px-4 py-3">
      <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
        <p className="min-w-0 font-semibold break-words text-ink">
          {figure.fastener} <span className="font-mono text-[15px] font-normal text-ink-2">{figure.threadLabel}</span>
        </p>
        <p className="font-mono text-lg text-ink">
          {value}
          {figure.angleStages.length ? <span className="text-[15px] text-ink-2"> {angleText(figure.angleStages)}</span> : null}
        </p>
      </div>
      <p className="mt-1 text-[15px] text-ink-2">{details.join(' · ')}</p>
      {figure.system ? (
        <p className="mt-2">
          <Plate tone={figure.system.safetyCritical ? 'caution' : 'ink'}>{figure.system.name}</Plate>
        </p>
      ) : null}
      {figure.note ? <p className="mt-1 text-[15px] text-ink">{figure.note}</p> : null}
      {figure.checks.map((c) => (
        <CautionBar key={c.kind} label={c.label} className="mt-3">
          <p>{c.text}</p>
        </CautionBar>
      ))}
      <div className="mt-2 flex flex-wrap gap-2">
        <button
          type="button"
          onClick={onEdit}
          disabled={busy}
          className="min-h-11 px-2 font-condensed text-sm font-semibold tracking-label text-ink uppercase underline underline-offset-2"
        >
          Edit<span className="sr-only"> {figure.fastener}</span>
        </button>
        <button
          type="button"
          onClick={onDelete}
          disabled={busy}
          className="min-h-11 px-2 font-condensed text-sm font-semibold tracking-label text-oxide-2 uppercase underline underline-offset-2"
        >
          Delete<span className="sr-only"> {figure.fastener}</span>
        </button>
      </div>
    </li>
  );
}
