import { Bar, BarChart, CartesianGrid, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { currencyExponent, formatMinor } from '../../../shared/money';
import type { SponsorSummary } from '../../../shared/schemas/sponsors';

// LOOK.md tokens: oxide for the bars, rule for the grid, slate for the labels.
const OXIDE = '#A3412A';
const RULE = '#D6CCBA';
const SLATE = '#66625B';

/** Value given per month, one small chart per currency (never added across currencies). Decorative: the table beside it has the figures. */
export default function SummaryChartDrawing({ series }: { series: SponsorSummary['series'] }) {
  const currencies = [...new Set(series.map((p) => p.currency))];
  const font = { fontFamily: 'Barlow, sans-serif', fontSize: 12, fill: SLATE };
  return (
    <div className="grid grid-cols-1 gap-4 lg:grid-cols-2 [&>*]:min-w-0">
      {currencies.map((currency) => {
        const unit = 10 ** (currencyExponent(currency) ?? 2);
        const data = series.filter((p) => p.currency === currency).map((p) => ({ month: p.month, value: p.valueGivenMinor / unit }));
        const tick = (v: number) => formatMinor(Math.round(v * unit), currency).replace(/[.,]00$/, '');
        return (
          <div key={currency}>
            <p className="label-condensed mb-1">Value given per month, {currency}</p>
            <ResponsiveContainer width="100%" height={200}>
              <BarChart accessibilityLayer={false} data={data} margin={{ top: 8, right: 8, bottom: 0, left: 8 }}>
                <CartesianGrid stroke={RULE} vertical={false} />
                <XAxis dataKey="month" tick={font} />
                <YAxis tick={font} tickFormatter={tick} width={70} />
                <Tooltip formatter={(v) => tick(Number(v))} />
                <Bar dataKey="value" name="Value given" fill={OXIDE} isAnimationActive={false} />
              </BarChart>
            </ResponsiveContainer>
          </div>
        );
      })}
    </div>
  );
}
