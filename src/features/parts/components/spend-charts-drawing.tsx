import { Bar, BarChart, CartesianGrid, Legend, Line, LineChart, ReferenceLine, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { currencyExponent, formatMinor } from '../../../shared/money';
import type { BuildTotals } from '../../../shared/schemas/parts';

// LOOK.md tokens: ink, oxide, brass (fills and lines only), gauge, rule.
const INK = '#1E1B18';
const OXIDE = '#A3412A';
const BRASS = '#A8823F';
const RULE = '#D6CCBA';
const SLATE = '#66625B';

/** The drawings themselves (recharts); decorative for screen readers, whose figures are in the tables. */
export default function SpendChartsDrawing({ totals }: { totals: BuildTotals }) {
  const currency = totals.totals.currency;
  const unit = 10 ** (currencyExponent(currency) ?? 2);
  const major = (m: number | null) => (m === null ? null : m / unit);
  const tick = (v: number) => formatMinor(Math.round(v * unit), currency).replace(/[.,]00$/, '');
  const systems = totals.bySystem
    .filter((s) => s.spentMinor || s.committedMinor || s.budgetMinor)
    .map((s) => ({ name: s.name, spent: major(s.spentMinor), onOrder: major(s.committedMinor), budget: major(s.budgetMinor) }));
  const episodes = totals.byEpisode.map((e) => ({ name: `Ep. ${e.number}`, toDate: major(e.cumulativeMinor) }));
  const budget = major(totals.budgetMinor);
  const font = { fontFamily: 'Barlow, sans-serif', fontSize: 12, fill: SLATE };
  return (
    <div className="grid grid-cols-1 gap-4 lg:grid-cols-2 [&>*]:min-w-0">
      <div>
        <p className="label-condensed mb-1">By system, against budget</p>
        <ResponsiveContainer width="100%" height={220}>
          <BarChart accessibilityLayer={false} data={systems} margin={{ top: 8, right: 8, bottom: 0, left: 8 }}>
            <CartesianGrid stroke={RULE} vertical={false} />
            <XAxis dataKey="name" tick={font} interval={0} angle={-20} textAnchor="end" height={48} />
            <YAxis tick={font} tickFormatter={tick} width={70} />
            <Tooltip formatter={(v) => tick(Number(v))} />
            <Legend wrapperStyle={font} />
            <Bar dataKey="spent" name="Spent" stackId="s" fill={OXIDE} isAnimationActive={false} />
            <Bar dataKey="onOrder" name="On order" stackId="s" fill={BRASS} isAnimationActive={false} />
            <Bar dataKey="budget" name="Budget" fill={RULE} stroke={INK} isAnimationActive={false} />
          </BarChart>
        </ResponsiveContainer>
      </div>
      <div>
        <p className="label-condensed mb-1">Spend to date, episode by episode</p>
        <ResponsiveContainer width="100%" height={220}>
          <LineChart accessibilityLayer={false} data={episodes} margin={{ top: 8, right: 8, bottom: 0, left: 8 }}>
            <CartesianGrid stroke={RULE} vertical={false} />
            <XAxis dataKey="name" tick={font} />
            <YAxis tick={font} tickFormatter={tick} width={70} domain={[0, (max: number) => Math.max(max, budget ?? 0)]} />
            <Tooltip formatter={(v) => tick(Number(v))} />
            {budget !== null ? (
              <ReferenceLine
                y={budget}
                stroke={INK}
                strokeDasharray="4 3"
                label={{ value: 'Budget', ...font, position: 'insideTopLeft' }}
              />
            ) : null}
            <Line type="monotone" dataKey="toDate" name="Spent to date" stroke={OXIDE} strokeWidth={2} dot isAnimationActive={false} />
          </LineChart>
        </ResponsiveContainer>
      </div>
    </div>
  );
}
