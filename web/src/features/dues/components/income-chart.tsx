import { Bar, BarChart, CartesianGrid, ResponsiveContainer, XAxis, YAxis } from 'recharts';
import type { MonthIncome } from '../api/get-dues-report';
import { formatMonthShort } from '../lib/format';
import { formatMoney } from '../lib/money';

type IncomeChartProps = {
  months: MonthIncome[];
  currency: string;
};

const ROW_PX = 34;

/**
 * What the guild kept each month, drawn by recharts as horizontal bars, which stay readable on a phone.
 * Bar lengths are the integer cents as they come (no money arithmetic). It is one labelled picture for
 * screen readers: the table under it holds the same figures.
 */
export function IncomeChart({ months, currency }: IncomeChartProps) {
  const best = months.reduce<MonthIncome | null>((top, m) => (!top || m.netCents > top.netCents ? m : top), null);
  const summary =
    months.length === 0 || !best
      ? 'Bar chart: no payments in this year.'
      : `Bar chart of what the guild kept each month, ${months.length} months. The most was ${formatMoney(best.netCents, currency)} in ${formatMonthShort(best.month, true)}. The table below has every month.`;
  const data = months.map((m) => ({ month: formatMonthShort(m.month), net: m.netCents }));
  return (
    <figure className="income-chart mb-3">
      <div role="img" aria-label={summary} data-testid="income-chart" style={{ width: '100%', height: months.length * ROW_PX + 48 }}>
        <ResponsiveContainer width="100%" height="100%">
          <BarChart data={data} layout="vertical" margin={{ top: 4, right: 16, bottom: 4, left: 4 }}>
            <CartesianGrid horizontal={false} stroke="#d8d2c4" />
            <XAxis
              type="number"
              tickFormatter={(cents: number) => formatMoney(Math.round(cents), currency)}
              tick={{ fontSize: 14, fill: '#333' }}
              tickCount={3}
            />
            <YAxis type="category" dataKey="month" width={92} tick={{ fontSize: 16, fill: '#222' }} interval={0} />
            <Bar dataKey="net" fill="#1d5c63" isAnimationActive={false} barSize={20} />
          </BarChart>
        </ResponsiveContainer>
      </div>
      <figcaption className="text-body-secondary mt-2">What the guild kept each month, after card fees and refunds.</figcaption>
    </figure>
  );
}
