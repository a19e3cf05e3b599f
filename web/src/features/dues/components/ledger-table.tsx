import Button from 'react-bootstrap/Button';
import { ConfirmAction } from '@/components/ui/confirm-action';
import type { Ledger, LedgerRow } from '../api/get-ledger';
import { formatDayShort } from '../lib/format';
import { invoiceStatusLabel, methodLabel } from '../lib/labels';
import { formatMoney } from '../lib/money';

type LedgerTableProps = {
  ledger: Ledger;
  currency: string;
  onRefund: (row: LedgerRow) => void;
  onVoid: (row: LedgerRow) => Promise<unknown>;
  voiding?: boolean;
};

const canRefund = (row: LedgerRow) => (row.status === 'paid' || row.status === 'partially_refunded') && row.grossCents > row.refundedCents;

/** Every invoice that matches the filters, with totals; a card per row on narrow screens. */
export function LedgerTable({ ledger, currency, onRefund, onVoid, voiding }: LedgerTableProps) {
  const money = (cents: number) => formatMoney(cents, currency);
  if (ledger.rows.length === 0) return <p className="fs-5">No payments match. Try another year or “Show all payments”.</p>;
  return (
    <table className="table stack-table stack-table-wide ledger-table">
      <caption className="visually-hidden">Dues payments, with card fees, refunds and what the guild keeps</caption>
      <thead>
        <tr>
          <th scope="col">Member</th>
          <th scope="col">Payment</th>
          <th scope="col">Date</th>
          <th scope="col">Paid by</th>
          <th scope="col">Status</th>
          <th scope="col" className="amount">
            Amount
          </th>
          <th scope="col" className="amount">
            Card fee
          </th>
          <th scope="col" className="amount">
            Refunded
          </th>
          <th scope="col" className="amount">
            Guild keeps
          </th>
          <th scope="col">
            <span className="visually-hidden">Actions</span>
          </th>
        </tr>
      </thead>
      <tbody>
        {ledger.rows.map((row) => (
          <tr key={row.invoiceId} data-testid="ledger-row">
            <th scope="row">{row.memberName}</th>
            <td data-label="Payment">
              {row.label}
              {row.planName && <> · {row.planName}</>}
              {row.receiptNumber && <span className="d-block small text-body-secondary">Receipt {row.receiptNumber}</span>}
              {row.reference && <span className="d-block small text-body-secondary break-anywhere">Ref. {row.reference}</span>}
            </td>
            <td data-label="Date" className="text-nowrap">
              {formatDayShort(row.paidOn ?? row.issuedOn)}
            </td>
            <td data-label="Paid by">{methodLabel(row.method) || '—'}</td>
            <td data-label="Status">{invoiceStatusLabel(row.status)}</td>
            <td data-label="Amount" className="amount">
              {money(row.grossCents)}
              {(row.status === 'open' || row.status === 'void') && row.totalCents !== undefined && (
                <span className="d-block small text-body-secondary">of {money(row.totalCents)} asked</span>
              )}
            </td>
            <td data-label="Card fee" className="amount">
              {money(row.feeCents)}
            </td>
            <td data-label="Refunded" className="amount">
              {money(row.refundedCents)}
            </td>
            <td data-label="Guild keeps" className="amount fw-bold">
              {money(row.netCents)}
            </td>
            <td data-label="Actions" className="no-label">
              {canRefund(row) && (
                <Button variant="outline-danger" onClick={() => onRefund(row)}>
                  Refund…<span className="visually-hidden"> {row.memberName}, {row.label}</span>
                </Button>
              )}
              {row.status === 'open' && (
                <ConfirmAction
                  label={
                    <>
                      Cancel invoice<span className="visually-hidden"> for {row.memberName}</span>
                    </>
                  }
                  question={`Cancel the unpaid invoice for ${row.memberName}? She can no longer pay it; she can start a new payment.`}
                  confirmLabel="Yes, cancel it"
                  cancelLabel="Keep it"
                  busy={voiding}
                  onConfirm={() => onVoid(row)}
                />
              )}
            </td>
          </tr>
        ))}
      </tbody>
      <tfoot>
        <tr className="ledger-totals" data-testid="ledger-totals">
          <th scope="row" colSpan={5}>
            Totals ({ledger.totals.count} {ledger.totals.count === 1 ? 'invoice' : 'invoices'})
          </th>
          <td data-label="Amount" className="amount">
            {money(ledger.totals.grossCents)}
          </td>
          <td data-label="Card fees" className="amount">
            {money(ledger.totals.feeCents)}
          </td>
          <td data-label="Refunded" className="amount">
            {money(ledger.totals.refundedCents)}
          </td>
          <td data-label="Guild keeps" className="amount fw-bold">
            {money(ledger.totals.netCents)}
          </td>
          <td />
        </tr>
      </tfoot>
    </table>
  );
}
