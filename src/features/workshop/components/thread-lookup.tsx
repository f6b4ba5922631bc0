import { useState } from 'react';
import { ThreadOptions } from '../../../components/ui/fastener-options';
import { SelectField } from '../../../components/ui/select-field';
import { findGrade, GRADES } from '../../../shared/fasteners';
import { formatSpanner, hexSizesForThread, HEX_FAMILY_LABELS } from '../../../shared/hex-sizes';
import { findThread, isMetric, THREAD_FAMILY_LABELS, type ThreadSpec } from '../../../shared/threads';
import { proofLoad } from '../../../shared/tightening';
import { CalculatorCard } from './calculator-card';

const LBF_N = 4.4482216152605;
const fmt = (n: number, digits = 0) => n.toLocaleString('en-GB', { maximumFractionDigits: digits, minimumFractionDigits: digits });

function pitchText(t: ThreadSpec): string {
  if (t.pitchMm !== null) return `${t.pitchMm} mm pitch`;
  return `${t.threadsPerInch} threads per inch (pitch ${fmt(25.4 / t.threadsPerInch!, 3)} mm)`;
}

/** Proof loads for the grades that go with this thread: ISO 898-1 for metric, SAE J429 for unified. */
function ProofLoads({ thread }: { thread: ThreadSpec }) {
  const family = isMetric(thread) ? 'iso-898-1' : 'sae-j429';
  const rows = GRADES.filter((g) => g.family === family).flatMap((g) => {
    const load = proofLoad(thread.code, g.code);
    return load ? [{ grade: g, load }] : [];
  });
  if (!rows.length) return <p className="mt-2 text-ink-2">No proof loads: our sources give no tensile stress area for this thread.</p>;
  return (
    <table className="mt-2 w-full text-[15px]">
      <caption className="sr-only">Proof load per grade for {thread.label}</caption>
      <thead>
        <tr className="border-b-2 border-ink text-left">
          <th scope="col" className="label-condensed py-1 pr-2">
            Grade
          </th>
          <th scope="col" className="label-condensed py-1 pr-2 text-right">
            Proof load
          </th>
          <th scope="col" className="label-condensed py-1 text-right">
            From
          </th>
        </tr>
      </thead>
      <tbody>
        {rows.map(({ grade, load }) => (
          <tr key={grade.code} className="border-b border-rule">
            <th scope="row" className="py-1.5 pr-2 text-left font-normal">
              {grade.label}
            </th>
            <td className="py-1.5 pr-2 text-right font-mono">
              {fmt(load.newtons)} N
              {isMetric(thread) ? null : <span className="block text-sm text-ink-2">{fmt(load.newtons / LBF_N)} lbf</span>}
            </td>
            <td className="py-1.5 text-right text-sm text-ink-2">{load.kind === 'published' ? 'ISO 898-1 table' : 'As × Sp'}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

/** Pitch or threads per inch, stress area, proof loads per grade and the hex head's spanner sizes. */
export function ThreadLookup() {
  const [code, setCode] = useState('M10');
  const thread = findThread(code)!;
  const hex = hexSizesForThread(code);
  return (
    <CalculatorCard
      title="Thread look-up"
      intro="Pick a thread to see its pitch, stress area, proof loads and hex head sizes."
      sources="ISO 261/262 (metric pitches), ISO 898-1 (stress-area formula, proof stresses and load table), ASME B1.1 (unified threads and stress areas), SAE J429 (inch grades), BS 84 (Whitworth), ISO 272, older DIN 931/933/934, JIS B 1180 and ASME B18.2.1 (across flats)."
      form={
        <SelectField label="Thread" value={code} onChange={(e) => setCode(e.target.value)}>
          <ThreadOptions />
        </SelectField>
      }
    >
      <dl className="grid gap-x-4 gap-y-2 sm:grid-cols-2">
        <div>
          <dt className="label-condensed">Family</dt>
          <dd>{THREAD_FAMILY_LABELS[thread.family]}</dd>
        </div>
        <div>
          <dt className="label-condensed">Pitch</dt>
          <dd className="font-mono">{pitchText(thread)}</dd>
        </div>
        <div className="sm:col-span-2">
          <dt className="label-condensed">Tensile stress area</dt>
          <dd>
            {thread.stressAreaMm2 === null ? (
              'Not in our sources for this thread.'
            ) : (
              <>
                <span className="font-mono">{fmt(thread.stressAreaMm2, 1)} mm²</span>{' '}
                <span className="text-sm text-ink-2">({thread.stressAreaSource})</span>
              </>
            )}
          </dd>
        </div>
        <div className="sm:col-span-2">
          <dt className="label-condensed">Hex head, across flats</dt>
          <dd>
            {hex.length === 0 ? (
              'Our tables hold no head size for this thread.'
            ) : (
              <ul className="space-y-0.5">
                {hex.map((g) => (
                  <li key={`${g.acrossFlats}${g.unit}`}>
                    <span className="font-mono">{formatSpanner(g.acrossFlats, g.unit)}</span>{' '}
                    <span className="text-[15px] text-ink-2">— {g.families.map((f) => HEX_FAMILY_LABELS[f]).join('; ')}</span>
                  </li>
                ))}
              </ul>
            )}
          </dd>
        </div>
      </dl>
      <h3 className="mt-4 label-condensed">Proof load per grade</h3>
      <ProofLoads thread={thread} />
      <p className="mt-2 text-sm text-ink-2">
        Stainless bolts ({findGrade('A2-70')?.label}, A4 and the rest) have no proof load: ISO 3506-1 gives none.
      </p>
    </CalculatorCard>
  );
}
