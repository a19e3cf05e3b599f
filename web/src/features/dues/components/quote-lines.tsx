import type { QuoteLine } from '../api/get-my-dues';
import { formatMoney } from '../lib/money';

type QuoteLinesProps = {
  lines: QuoteLine[];
  totalCents: number;
  currency: string;
  caption: string;
  totalLabel?: string;
};

/** What a payment is made of, line by line, with the total at the foot. */
export function QuoteLines({ lines, totalCents, currency, caption, totalLabel = 'Total' }: QuoteLinesProps) {
  return (
    <table className="table money-lines mb-3">
      <caption className="visually-hidden">{caption}</caption>
      <thead className="visually-hidden">
        <tr>
          <th scope="col">Item</th>
          <th scope="col">Amount</th>
        </tr>
      </thead>
      <tbody>
        {lines.map((line, i) => (
          <tr key={`${line.kind}-${i}`} className={line.kind === 'late-fee' ? 'is-late-fee' : undefined}>
            <th scope="row" className="fw-normal">
              {line.label}
            </th>
            <td className="amount">{formatMoney(line.amountCents, currency)}</td>
          </tr>
        ))}
      </tbody>
      <tfoot>
        <tr>
          <th scope="row">{totalLabel}</th>
          <td className="amount" data-testid="quote-total">
            {formatMoney(totalCents, currency)}
          </td>
        </tr>
      </tfoot>
    </table>
  );
}
