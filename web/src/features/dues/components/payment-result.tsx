import { useEffect, useRef, useState } from 'react';
import Alert from 'react-bootstrap/Alert';
import Button from 'react-bootstrap/Button';
import Spinner from 'react-bootstrap/Spinner';
import { Link } from 'react-router-dom';
import { ErrorAlert } from '@/components/ui/error-alert';
import { receiptHref, useInvoicePoll, type Invoice } from '../api/get-invoice';
import { formatDay } from '../lib/format';
import { methodLabel } from '../lib/labels';
import { formatMoney } from '../lib/money';
import { QuoteLines } from './quote-lines';

export const POLL_INTERVAL_MS = 1500;
export const GIVE_UP_AFTER_MS = 60_000;

type PaymentResultProps = {
  guildId: string;
  invoiceId: string;
  /** Where "Back to my dues" goes. */
  duesHref: string;
  intervalMs?: number;
  giveUpAfterMs?: number;
};

type View = 'checking' | 'waiting' | 'not-heard' | 'paid' | 'refunded' | 'void' | 'error';

function viewOf(invoice: Invoice | undefined, failed: boolean, gaveUp: boolean): View {
  if (!invoice) return failed ? 'error' : gaveUp ? 'not-heard' : 'checking';
  switch (invoice.status) {
    case 'paid':
      return 'paid';
    case 'refunded':
    case 'partially_refunded':
      return 'refunded';
    case 'void':
      return 'void';
    default:
      return gaveUp ? 'not-heard' : 'waiting';
  }
}

const HEADINGS: Record<View, string> = {
  checking: 'Checking your payment',
  waiting: 'Checking your payment',
  'not-heard': 'We have not heard back yet',
  paid: 'Thank you: your dues are paid',
  refunded: 'This payment was refunded',
  void: 'This payment was cancelled',
  error: 'We could not check your payment',
};

/**
 * The page she lands on after the payment service. The service tells Selvage about the payment
 * on its own line, so for a few seconds the invoice can still be open: ask every 1.5 s, and after a
 * minute stop and say so plainly, with a button to ask again.
 */
export function PaymentResult({ guildId, invoiceId, duesHref, intervalMs = POLL_INTERVAL_MS, giveUpAfterMs = GIVE_UP_AFTER_MS }: PaymentResultProps) {
  const [round, setRound] = useState(0);
  const [gaveUp, setGaveUp] = useState(false);
  const query = useInvoicePoll(guildId, invoiceId, { intervalMs, keepPolling: !gaveUp });
  const invoice = query.data;
  const settled = invoice !== undefined && invoice.status !== 'open';
  const headingRef = useRef<HTMLHeadingElement>(null);

  useEffect(() => {
    if (settled || gaveUp) return;
    const timer = window.setTimeout(() => setGaveUp(true), giveUpAfterMs);
    return () => window.clearTimeout(timer);
  }, [settled, gaveUp, giveUpAfterMs, round]);

  const view = viewOf(invoice, query.isError && !invoice, gaveUp);
  const entryFees = invoice?.purpose === 'show_entry' && invoice.showId != null;
  const heading = view === 'paid' && entryFees ? 'Thank you: your entry fees are paid' : HEADINGS[view];
  const final = view !== 'checking' && view !== 'waiting';

  // Screen readers hear the outcome once it is known; the heading takes focus so the page reads from the top.
  useEffect(() => {
    if (final) headingRef.current?.focus();
  }, [final, view]);

  const checkAgain = () => {
    setGaveUp(false);
    setRound((r) => r + 1);
    void query.refetch();
  };

  return (
    <div data-testid="payment-result" data-view={view}>
      <h1 ref={headingRef} tabIndex={-1}>
        {heading}
      </h1>
      <p role="status" aria-live="polite" className="visually-hidden">
        {final ? heading : ''}
      </p>

      {(view === 'checking' || view === 'waiting') && (
        <div className="d-flex align-items-center gap-3 py-3">
          <Spinner animation="border" variant="primary" aria-hidden="true" />
          <p className="mb-0 fs-5">We are waiting to hear from the card payment service. This usually takes a few seconds. Please keep this page open.</p>
        </div>
      )}

      {view === 'not-heard' && (
        <>
          <p className="fs-5">
            We have not heard back yet — you will get an e-mail receipt when your payment goes through. Please check again later.
          </p>
          <p>If you were charged, your payment is safe: it will show on your dues page as soon as we hear about it.</p>
          <div className="d-flex flex-wrap gap-2">
            <Button variant="primary" onClick={checkAgain}>
              Check again
            </Button>
            <Link to={duesHref} className="btn btn-outline-primary">
              Back to my dues
            </Link>
          </div>
        </>
      )}

      {view === 'error' && (
        <>
          <ErrorAlert error={query.error} />
          <div className="d-flex flex-wrap gap-2">
            <Button variant="primary" onClick={checkAgain}>
              Check again
            </Button>
            <Link to={duesHref} className="btn btn-outline-primary">
              Back to my dues
            </Link>
          </div>
        </>
      )}

      {view === 'paid' && invoice && (
        <>
          <Alert variant="success" className="fs-5">
            We received <strong>{formatMoney(invoice.totalCents, invoice.currency)}</strong>
            {invoice.memberName ? ` from ${invoice.memberName}` : ''}
            {invoice.paidOn ? ` on ${formatDay(invoice.paidOn)}` : ''}. An e-mail receipt is on its way.
          </Alert>
          <dl className="facts facts-wide">
            {invoice.receiptNumber && (
              <div>
                <dt>Receipt number</dt>
                <dd data-testid="receipt-number">{invoice.receiptNumber}</dd>
              </div>
            )}
            {invoice.coversFrom && invoice.coversThrough && (
              <div>
                <dt>Paid for</dt>
                <dd>
                  {formatDay(invoice.coversFrom)} to {formatDay(invoice.coversThrough)}
                </dd>
              </div>
            )}
            {invoice.method && (
              <div>
                <dt>Paid by</dt>
                <dd>{methodLabel(invoice.method)}</dd>
              </div>
            )}
          </dl>
          <QuoteLines lines={invoice.lines} totalCents={invoice.totalCents} currency={invoice.currency} caption="What you paid for" totalLabel="Paid" />
          <div className="d-flex flex-wrap gap-2">
            <a href={receiptHref(guildId, invoice.id)} className="btn btn-primary" target="_blank" rel="noopener">
              Download the receipt (PDF)<span className="visually-hidden">, opens in a new tab</span>
            </a>
            {entryFees ? (
              <Link to={`/guilds/${encodeURIComponent(guildId)}/shows/${invoice.showId}`} className="btn btn-outline-primary">
                Back to the show
              </Link>
            ) : (
              <Link to={duesHref} className="btn btn-outline-primary">
                Back to my dues
              </Link>
            )}
          </div>
        </>
      )}

      {view === 'refunded' && invoice && (
        <>
          <p className="fs-5">
            {invoice.status === 'refunded' ? 'The whole payment was given back.' : 'Part of this payment was given back.'} Your dues page shows the details.
          </p>
          <Link to={duesHref} className="btn btn-primary">
            Back to my dues
          </Link>
        </>
      )}

      {view === 'void' && (
        <>
          <p className="fs-5">Nothing was charged for it. You can start a new payment from your dues page.</p>
          <Link to={duesHref} className="btn btn-primary">
            Back to my dues
          </Link>
        </>
      )}
    </div>
  );
}
