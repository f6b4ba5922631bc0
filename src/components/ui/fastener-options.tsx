import { GRADE_FAMILIES, GRADE_FAMILY_LABELS, GRADES } from '../../shared/fasteners';
import { THREAD_FAMILIES, THREAD_FAMILY_LABELS, THREADS } from '../../shared/threads';
import { TORQUE_UNIT_LABELS, TORQUE_UNITS } from '../../shared/torque';

/** `<option>`s for every thread in the tables, grouped by family; for a native `<select>`. */
export function ThreadOptions() {
  return THREAD_FAMILIES.map((family) => (
    <optgroup key={family} label={THREAD_FAMILY_LABELS[family]}>
      {THREADS.filter((t) => t.family === family).map((t) => (
        <option key={t.code} value={t.code}>
          {t.label}
        </option>
      ))}
    </optgroup>
  ));
}

/** `<option>`s for every strength grade, grouped by standard; `empty` adds a first "none" choice. */
export function GradeOptions({ empty }: { empty?: string }) {
  return (
    <>
      {empty !== undefined ? <option value="">{empty}</option> : null}
      {GRADE_FAMILIES.map((family) => (
        <optgroup key={family} label={GRADE_FAMILY_LABELS[family]}>
          {GRADES.filter((g) => g.family === family).map((g) => (
            <option key={g.code} value={g.code}>
              {g.label}
            </option>
          ))}
        </optgroup>
      ))}
    </>
  );
}

/** `<option>`s for the four torque units. */
export function TorqueUnitOptions() {
  return TORQUE_UNITS.map((u) => (
    <option key={u} value={u}>
      {TORQUE_UNIT_LABELS[u]}
    </option>
  ));
}
