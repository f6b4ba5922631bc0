import { useState } from 'react';
import { CautionBar } from '../../../components/ui/caution-bar';
import { GradeOptions, ThreadOptions } from '../../../components/ui/fastener-options';
import { SelectField } from '../../../components/ui/select-field';
import { ESTIMATE_CAUTION } from '../../../shared/figure-checks';
import { estimateTightening, NUT_FACTORS, REUSED_PRELOAD_FRACTION, type NutCondition } from '../../../shared/tightening';
import { convertTorque, formatNumber, roundTorque } from '../../../shared/torque';
import { CalculatorCard } from './calculator-card';

const fmt = (n: number) => Math.round(n).toLocaleString('en-GB');

/** T = K·Fi·d from thread, grade and condition: always an estimate, never a specification. */
export function TorqueEstimate() {
  const [thread, setThread] = useState('M10');
  const [grade, setGrade] = useState('8.8');
  const [condition, setCondition] = useState<NutCondition>('unknown');
  const e = estimateTightening(thread, grade, condition);
  return (
    <CalculatorCard
      title="Tightening-torque estimate"
      intro={
        <>
          From a textbook formula, T = K · F<sub>i</sub> · d, with a preload of 75 % of the proof load (reused fasteners). An estimate for
          when there is no published figure: never a specification.
        </>
      }
      sources="Budynas & Nisbett, Shigley’s Mechanical Engineering Design, 9th ed., §8-8: Eq. 8-27 (T = K·Fi·d), Eq. 8-31 (Fi = 0.75·Fp, reused fasteners), Table 8-15 (nut factors); proof loads as in the thread look-up (ISO 898-1, SAE J429)."
      form={
        <div className="grid gap-3 sm:grid-cols-2">
          <SelectField label="Thread" value={thread} onChange={(ev) => setThread(ev.target.value)}>
            <ThreadOptions />
          </SelectField>
          <SelectField label="Grade" value={grade} onChange={(ev) => setGrade(ev.target.value)}>
            <GradeOptions />
          </SelectField>
          <SelectField
            label="Thread condition"
            className="sm:col-span-2"
            value={condition}
            onChange={(ev) => setCondition(ev.target.value as NutCondition)}
          >
            {NUT_FACTORS.map((n) => (
              <option key={n.condition} value={n.condition}>
                {n.label} (K = {n.k.toFixed(2)})
              </option>
            ))}
          </SelectField>
        </div>
      }
    >
      {e.ok ? (
        <>
          <p className="label-condensed text-caution">Estimate — not a specification</p>
          <p className="mt-1 font-mono text-[28px] leading-tight text-ink">
            ≈ {formatNumber(roundTorque(e.torqueNm))} N·m
            <span className="block text-base text-ink-2">
              ≈ {formatNumber(roundTorque(convertTorque(e.torqueNm, 'N-m', 'lbf-ft')))} lbf·ft ·{' '}
              {formatNumber(roundTorque(convertTorque(e.torqueNm, 'N-m', 'kgf-m')))} kgf·m
            </span>
          </p>
          <ul className="mt-3 space-y-0.5 text-[15px] text-ink-2">
            <li>
              Proof load F<sub>p</sub> = <span className="font-mono">{fmt(e.proofLoad.newtons)} N</span> (
              {e.proofLoad.kind === 'published' ? 'ISO 898-1 load table' : e.proofLoad.source})
            </li>
            <li>
              Preload F<sub>i</sub> = {REUSED_PRELOAD_FRACTION} × F<sub>p</sub> = <span className="font-mono">{fmt(e.preloadN)} N</span>
            </li>
            <li>
              Nut factor K = <span className="font-mono">{e.k.toFixed(2)}</span>, nominal diameter d ={' '}
              <span className="font-mono">{formatNumber(e.thread.diameterMm)} mm</span>
            </li>
          </ul>
          <CautionBar label="Workshop manual first" className="mt-3">
            <p>{ESTIMATE_CAUTION}</p>
          </CautionBar>
        </>
      ) : (
        <p className="text-ink">No estimate: {e.reason}</p>
      )}
      <table className="mt-4 w-full text-[15px]">
        <caption className="label-condensed text-left">Nut factors by condition (Shigley Table 8-15)</caption>
        <tbody>
          {NUT_FACTORS.map((n) => (
            <tr key={n.condition} className="border-b border-rule">
              <th scope="row" className="py-1 text-left font-normal">
                {n.label}
              </th>
              <td className="py-1 text-right font-mono">{n.k.toFixed(2)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </CalculatorCard>
  );
}
