import type { DuesReport } from '../api/get-dues-report';
import type { DuesStatus } from '../api/get-my-dues';
import { formatMonthShort } from '../lib/format';
import { DUES_STATUS } from '../lib/labels';
import { formatMoney } from '../lib/money';
import { IncomeChart } from './income-chart';

const STATUS_ORDER: DuesStatus[] = ['current', 'grace', 'lapsed', 'lifetime', 'honorary'];

/** A year's dues in figures: totals, members by status, income by plan and by month. */
export function DuesReportView({ report, currency }: { report: DuesReport; currency: string }) {
  const money = (cents: number) => formatMoney(cents, currency);
  return (
    <div className="dues-report" data-testid="dues-report">
      <section aria-labelledby="report-totals" className="mb-4">
        <h3 id="report-totals" className="h4">
          Money in {report.year}
        </h3>
        <dl className="report-totals">
          <div>
            <dt>Paid in</dt>
            <dd>{money(report.totals.grossCents)}</dd>
          </div>
          <div>
            <dt>Card fees</dt>
            <dd>{money(report.totals.feeCents)}</dd>
          </div>
          <div>
            <dt>Refunded</dt>
            <dd>{money(report.totals.refundedCents)}</dd>
          </div>
          <div className="is-net">
            <dt>Guild keeps</dt>
            <dd>{money(report.totals.netCents)}</dd>
          </div>
        </dl>
      </section>

      <section aria-labelledby="report-months" className="mb-4">
        <h3 id="report-months" className="h4">
          Month by month
        </h3>
        <IncomeChart months={report.incomeByMonth} currency={currency} />
        <table className="table stack-table report-table">
          <caption className="visually-hidden">Money in each month of {report.year}</caption>
          <thead>
            <tr>
              <th scope="col">Month</th>
              <th scope="col" className="amount">
                Paid in
              </th>
              <th scope="col" className="amount">
                Card fees
              </th>
              <th scope="col" className="amount">
                Refunded
              </th>
              <th scope="col" className="amount">
                Guild keeps
              </th>
            </tr>
          </thead>
          <tbody>
            {report.incomeByMonth.map((m) => (
              <tr key={m.month}>
                <th scope="row">{formatMonthShort(m.month, true)}</th>
                <td data-label="Paid in" className="amount">
                  {money(m.grossCents)}
                </td>
                <td data-label="Card fees" className="amount">
                  {money(m.feeCents)}
                </td>
                <td data-label="Refunded" className="amount">
                  {money(m.refundedCents)}
                </td>
                <td data-label="Guild keeps" className="amount fw-bold">
                  {money(m.netCents)}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>

      <div className="row g-4">
        <section aria-labelledby="report-plans" className="col-lg-7">
          <h3 id="report-plans" className="h4">
            By plan
          </h3>
          {report.incomeByPlan.length === 0 ? (
            <p>No payments in this year.</p>
          ) : (
            <table className="table stack-table report-table">
              <caption className="visually-hidden">Payments in {report.year} by plan</caption>
              <thead>
                <tr>
                  <th scope="col">Plan</th>
                  <th scope="col" className="amount">
                    Payments
                  </th>
                  <th scope="col" className="amount">
                    Paid in
                  </th>
                </tr>
              </thead>
              <tbody>
                {report.incomeByPlan.map((p) => (
                  <tr key={p.planName}>
                    <th scope="row">{p.planName}</th>
                    <td data-label="Payments" className="amount">
                      {p.count}
                    </td>
                    <td data-label="Paid in" className="amount">
                      {money(p.grossCents)}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          )}
        </section>
        <section aria-labelledby="report-members" className="col-lg-5">
          <h3 id="report-members" className="h4">
            Members today
          </h3>
          <ul className="plain-list report-members">
            {STATUS_ORDER.map((status) => (
              <li key={status} className="d-flex justify-content-between gap-3 py-1 border-bottom">
                <span>{DUES_STATUS[status].label}</span>
                <strong>{report.membersByStatus[status] ?? 0}</strong>
              </li>
            ))}
          </ul>
        </section>
      </div>
    </div>
  );
}
