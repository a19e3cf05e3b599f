import Button from 'react-bootstrap/Button';
import Card from 'react-bootstrap/Card';
import { ErrorAlert } from '@/components/ui/error-alert';
import { formatMoney } from '@/features/dues/lib/money';
import { usePaymentHandoff } from '@/features/dues/lib/use-payment-handoff';
import { useEntryFees, usePayEntryFees } from '../api/entry-fees';

/**
 * What she owes in entry fees for her quilts in this show, and a button to pay by card on the payment
 * service's page (the same checkout and receipts as dues). Shown only when the show charges a fee.
 */
export function EntryFeesPanel({ guildId, showId, hasEntries }: { guildId: string; showId: string; hasEntries: boolean }) {
  const fees = useEntryFees(guildId, showId, { enabled: hasEntries });
  const pay = usePayEntryFees(guildId, showId);
  const { start: handoff, redirecting } = usePaymentHandoff<void>((_, callbacks) => pay.mutate(undefined, callbacks));
  const f = fees.data;
  if (!hasEntries || !f || !f.feeText) return null;
  const money = (cents: number) => formatMoney(cents, f.currency);

  const start = () => handoff(undefined);

  return (
    <Card as="section" aria-labelledby="fees-heading" className="mb-4" data-testid="entry-fees">
      <Card.Body>
        <h3 id="fees-heading" className="h4">
          Entry fees
        </h3>
        <p className="mb-2">{f.feeText}.</p>
        <p className="mb-2">
          For your {f.quilts} {f.quilts === 1 ? 'quilt' : 'quilts'}: <strong>{money(f.owedCents)}</strong>
          {f.paidCents > 0 && <>; paid {money(f.paidCents)}</>}.
        </p>
        {f.dueCents > 0 ? (
          <>
            <p className="fs-5">
              Still to pay: <strong>{money(f.dueCents)}</strong>
            </p>
            {f.canPayOnline ? (
              <Button size="lg" onClick={start} disabled={pay.isPending || redirecting}>
                {redirecting ? 'Opening the payment page…' : `Pay ${money(f.dueCents)} by card`}
              </Button>
            ) : (
              <p className="mb-0">Pay the show chair at drop-off.</p>
            )}
            <ErrorAlert error={pay.error} />
          </>
        ) : (
          <p className="fs-5 mb-0" role="status">
            Your entry fees are paid. Thank you.
          </p>
        )}
        {f.payments.length > 0 && (
          <ul className="list-unstyled mt-3 mb-0 small">
            {f.payments.map((p) => (
              <li key={p.invoiceId}>
                {money(p.amountCents)} paid{p.receiptNumber ? `, receipt ${p.receiptNumber}` : ''}
                {p.refundedCents > 0 && `, ${money(p.refundedCents)} refunded`}
              </li>
            ))}
          </ul>
        )}
      </Card.Body>
    </Card>
  );
}
