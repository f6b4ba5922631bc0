import { useState } from 'react';
import { SelectField } from '../../../components/ui/select-field';
import { TextField } from '../../../components/ui/text-field';
import { formatSpanner, HEX_FAMILY_LABELS, parseSpannerSize, threadsForSpanner, type SpannerUnit } from '../../../shared/hex-sizes';
import { CalculatorCard } from './calculator-card';

/** From a spanner to the bolt sizes whose hex head it fits, in every size family. */
export function SpannerLookup() {
  const [text, setText] = useState('17');
  const [unit, setUnit] = useState<SpannerUnit>('mm');
  const size = parseSpannerSize(text);
  const matches = size === null ? [] : threadsForSpanner(size, unit);
  return (
    <CalculatorCard
      title="Which bolt does this spanner fit?"
      intro="Type the size stamped on the spanner: millimetres such as 13, or inches such as 9/16. Old vehicles mix size families, so every family is shown where they differ."
      sources="ISO 272 (ISO 4014/4017/4032), older DIN 931/933/934, JIS B 1180 and its annex (Japan Fastener Industry Association bulletin on the 2014 revision), ASME B18.2.1."
      form={
        <div className="grid grid-cols-[minmax(0,1fr)_8rem] gap-3">
          <TextField
            label="Spanner size"
            value={text}
            error={size === null && text.trim() !== '' ? 'a size such as 13 or 9/16' : undefined}
            onChange={(e) => setText(e.target.value)}
          />
          <SelectField label="In" value={unit} onChange={(e) => setUnit(e.target.value as SpannerUnit)}>
            <option value="mm">mm</option>
            <option value="in">inches</option>
          </SelectField>
        </div>
      }
    >
      {size === null ? (
        <p className="text-ink-2">Type a spanner size to look it up.</p>
      ) : matches.length === 0 ? (
        <p className="text-ink">
          A {formatSpanner(size, unit)} spanner matches no standard bolt head in our tables (ISO, older DIN, JIS or ASME hex sizes). It may
          be a nut, a fitting or a special part: check the workshop manual.
        </p>
      ) : (
        <ul className="space-y-2">
          {matches.map((m) => (
            <li key={m.size}>
              <span className="font-mono text-lg text-ink">{m.size}</span>{' '}
              <span className="text-[15px] text-ink-2">— {m.families.map((f) => HEX_FAMILY_LABELS[f]).join('; ')}</span>
            </li>
          ))}
        </ul>
      )}
    </CalculatorCard>
  );
}
