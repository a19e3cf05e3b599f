import type { PaymentRecord } from '../api/get-my-dues';
import { receiptHref } from '../api/get-invoice';
import { formatDay } from '../lib/format';
import { invoiceStatusLabel, methodLabel, paymentLabel } from '../lib/labels';
import { formatMoney } from '../lib/money';

const hasReceipt = (row: PaymentRecord) => Boolean(row.receiptNumber) && row.status !== 'open' && row.status !== 'void';

/** Her payments, newest first, each with its receipt. */
export function PaymentHistory({ guildId, history }: { guildId: string; history: PaymentRecord[] }) {
  if (history.length === 0) return <p>No payments yet. When you pay, the receipt will be here.</p>;
  return (
    <table className="table stack-table dues-table">
      <caption className="visually-hidden">Your dues payments, newest first</caption>
      <thead>
        <tr>
          <th scope="col">Payment</th>
          <th scope="col">Date</th>
          <th scope="col">Amount</th>
          <th scope="col">How</th>
          <th scope="col">Status</th>
          <th scope="col">Receipt</th>
        </tr>
      </thead>
      <tbody>
        {history.map((row) => (
          <tr key={row.invoiceId} data-testid="history-row">
            <th scope="row">{paymentLabel(row.label)}</th>
            <td data-label="Date">{formatDay(row.paidOn ?? row.issuedOn)}</td>
            <td data-label="Amount">
              {formatMoney(row.totalCents, row.currency)}
              {row.refundedCents > 0 && <span className="d-block small">{formatMoney(row.refundedCents, row.currency)} refunded</span>}
            </td>
            <td data-label="How">
              {methodLabel(row.method) || '—'}
              {row.recordedBy && <span className="d-block small">Recorded by {row.recordedBy}</span>}
            </td>
            <td data-label="Status">{invoiceStatusLabel(row.status)}</td>
            <td data-label="Receipt">
              {hasReceipt(row) ? (
                <a href={receiptHref(guildId, row.invoiceId)} className="tap-link" target="_blank" rel="noopener">
                  Receipt {row.receiptNumber}
                  <span className="visually-hidden"> for {paymentLabel(row.label)}, PDF, opens in a new tab</span>
                </a>
              ) : (
                '—'
              )}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
