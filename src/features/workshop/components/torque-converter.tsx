import { useState } from 'react';
import { TorqueUnitOptions } from '../../../components/ui/fastener-options';
import { SelectField } from '../../../components/ui/select-field';
import { TextField } from '../../../components/ui/text-field';
import { convertTorque, formatNumber, roundTorque, TORQUE_UNIT_LABELS, TORQUE_UNITS, type TorqueUnit } from '../../../shared/torque';
import { CalculatorCard } from './calculator-card';

/** A torque in one unit, shown in all four. */
export function TorqueConverter() {
  const [text, setText] = useState('25');
  const [unit, setUnit] = useState<TorqueUnit>('N-m');
  const value = Number(text.trim().replace(',', '.'));
  const valid = text.trim() !== '' && Number.isFinite(value) && value > 0;

  return (
    <CalculatorCard
      title="Torque unit converter"
      intro="Type a torque and pick its unit; it is shown in the other three."
      sources="NIST SP 811, Appendix B (1 lbf·ft = 1.355 818 N·m; 1 lbf·in = 0.112 984 8 N·m; 1 kgf·m = 9.806 65 N·m), worked from the exact definitions of the pound, foot, inch and standard gravity. Rounded to three significant figures."
      form={
        <div className="grid grid-cols-[minmax(0,1fr)_8rem] gap-3">
          <TextField
            label="Torque"
            inputMode="decimal"
            value={text}
            error={valid || text.trim() === '' ? undefined : 'a number above zero'}
            onChange={(e) => setText(e.target.value)}
          />
          <SelectField label="Unit" value={unit} onChange={(e) => setUnit(e.target.value as TorqueUnit)}>
            <TorqueUnitOptions />
          </SelectField>
        </div>
      }
    >
      {valid ? (
        <dl className="grid grid-cols-2 gap-x-4 gap-y-2 sm:grid-cols-4">
          {TORQUE_UNITS.map((u) => (
            <div key={u}>
              <dt className="label-condensed">{TORQUE_UNIT_LABELS[u]}</dt>
              <dd className="font-mono text-xl text-ink">
                {formatNumber(u === unit ? value : roundTorque(convertTorque(value, unit, u)))}
              </dd>
            </div>
          ))}
        </dl>
      ) : (
        <p className="text-ink-2">Type a torque above zero to convert it.</p>
      )}
    </CalculatorCard>
  );
}
