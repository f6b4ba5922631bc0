import { TORQUE_UNIT_LABELS, TORQUE_UNITS, type TorqueUnit } from '../../../shared/torque';

interface UnitToggleProps {
  /** The unit shown now. */
  value: TorqueUnit;
  /** The unit the figure was recorded in, marked as such. */
  recorded: TorqueUnit;
  onChange: (unit: TorqueUnit) => void;
  /** Names the figure for screen readers: "Unit for caliper bolts". */
  label: string;
}

/** A row of four pressed/unpressed buttons; each is a real button, so Tab and Enter/Space work. */
export function UnitToggle({ value, recorded, onChange, label }: UnitToggleProps) {
  return (
    <div role="group" aria-label={label} className="mt-2 inline-flex flex-wrap border border-ink-2">
      {TORQUE_UNITS.map((u) => (
        <button
          key={u}
          type="button"
          aria-pressed={u === value}
          title={u === recorded ? 'As recorded' : undefined}
          onClick={() => onChange(u)}
          className={`min-h-11 min-w-11 px-2.5 font-mono text-sm ${u === value ? 'bg-ink text-paper' : 'bg-card text-ink hover:bg-paper-2'}`}
        >
          {TORQUE_UNIT_LABELS[u]}
          {u === recorded ? <span className="sr-only"> (as recorded)</span> : null}
        </button>
      ))}
    </div>
  );
}
