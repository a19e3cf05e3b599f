import type { MonthIncome } from '../api/get-dues-report';
import { formatMonthShort } from '../lib/format';
import { formatMoney } from '../lib/money';

type IncomeChartProps = {
  months: MonthIncome[];
  currency: string;
};

/** Bar length as a share of the biggest month, for drawing only (never money). */
export function barPercent(cents: number, maxCents: number): number {
  if (maxCents <= 0 || cents <= 0) return 0;
  return Math.max(1, Math.round((cents / maxCents) * 1000) / 10);
}

/**
 * What the guild kept each month as horizontal bars, which stay readable on a phone. It is one
 * labelled picture for screen readers: the table under it holds the same figures.
 */
export function IncomeChart({ months, currency }: IncomeChartProps) {
  const max = Math.max(0, ...months.map((m) => m.netCents));
  const best = months.reduce<MonthIncome | null>((top, m) => (!top || m.netCents > top.netCents ? m : top), null);
  const summary =
    months.length === 0 || !best
      ? 'Bar chart: no payments in this year.'
      : `Bar chart of what the guild kept each month, ${months.length} months. The most was ${formatMoney(best.netCents, currency)} in ${formatMonthShort(best.month, true)}. The table below has every month.`;
  return (
    <figure className="income-chart mb-3">
      <div role="img" aria-label={summary} className="income-bars" data-testid="income-chart">
        {months.map((m) => (
          <div key={m.month} className="income-bar-row">
            <span className="income-bar-month">{formatMonthShort(m.month)}</span>
            <span className="income-bar-track">
              <span className="income-bar" style={{ width: `${barPercent(m.netCents, max)}%` }} />
            </span>
            <span className="income-bar-amount">{formatMoney(m.netCents, currency)}</span>
          </div>
        ))}
      </div>
      <figcaption className="text-body-secondary mt-2">What the guild kept each month, after card fees and refunds.</figcaption>
    </figure>
  );
}
