import { CautionBar } from '../../../components/ui/caution-bar';
import { Plate } from '../../../components/ui/plate';
import { angleText, gradeText, methodText, sourceText, wrenchText } from '../../../shared/figure-text';
import type { Figure } from '../../../shared/schemas/figures';
import { convertTorque, formatNumber, roundTorque, TORQUE_UNIT_LABELS, type TorqueUnit } from '../../../shared/torque';
import { UnitToggle } from './unit-toggle';

interface FigureCardProps {
  figure: Figure;
  /** The reader's unit, or null to show each figure as recorded. */
  unit: TorqueUnit | null;
  onUnitChange: (unit: TorqueUnit) => void;
}

/** LOOK.md's figure card: fastener and thread left, the value large in mono right with its unit toggle. */
export function FigureCard({ figure, unit, onUnitChange }: FigureCardProps) {
  const shown = unit ?? figure.unit;
  const converted = figure.value !== null && shown !== figure.unit;
  const value = figure.value === null ? null : converted ? roundTorque(convertTorque(figure.value, figure.unit, shown)) : figure.value;
  const details = [
    methodText(figure.method),
    gradeText(figure.gradeFitted, figure.gradeSpecified),
    figure.wrenchRange ? wrenchText(figure.wrenchRange, unit) : null,
    sourceText(figure.source),
  ].filter(Boolean);

  return (
    <li className="border border-rule bg-card p-4">
      <div className="flex flex-wrap items-start justify-between gap-x-6 gap-y-3">
        <div className="min-w-0 flex-1 basis-48">
          <h3 className="font-semibold break-words text-ink">{figure.fastener}</h3>
          <p className="mt-0.5 font-mono text-[15px] text-ink-2">{figure.threadLabel}</p>
          {figure.system ? (
            <p className="mt-2 flex flex-wrap gap-2">
              <Plate tone={figure.system.key === 'brakes' ? 'oxide' : 'ink'}>{figure.system.name}</Plate>
              {figure.system.safetyCritical ? <Plate tone="caution">Safety-critical</Plate> : null}
            </p>
          ) : null}
        </div>
        <div className="sm:text-right">
          {value === null ? (
            <p className="font-mono text-xl text-ink">By hand, snug</p>
          ) : (
            <p className="font-mono text-[28px] leading-none text-ink">
              {formatNumber(value)} <span className="text-base text-ink-2">{TORQUE_UNIT_LABELS[shown]}</span>
            </p>
          )}
          {figure.angleStages.length ? <p className="mt-1 font-mono text-[15px] text-ink-2">{angleText(figure.angleStages)}</p> : null}
          {figure.value !== null ? (
            <>
              <UnitToggle value={shown} recorded={figure.unit} onChange={onUnitChange} label={`Unit for ${figure.fastener}`} />
              <p className="mt-1 text-sm text-slate">
                {converted
                  ? `Recorded as ${formatNumber(figure.value)} ${TORQUE_UNIT_LABELS[figure.unit]}; converted and rounded`
                  : 'As recorded'}
              </p>
            </>
          ) : null}
        </div>
      </div>
      <p className="mt-3 text-[15px] text-ink-2">{details.join(' · ')}</p>
      {figure.note ? <p className="mt-1 text-[15px] text-ink">{figure.note}</p> : null}
      {figure.checks.map((c) => (
        <CautionBar key={c.kind} label={c.label} className="mt-3">
          <p>{c.text}</p>
        </CautionBar>
      ))}
      <p className="mt-3 text-sm text-ink-2">
        <span className="font-condensed font-semibold tracking-label text-caution uppercase">Caution</span> {figure.caution}
      </p>
    </li>
  );
}
