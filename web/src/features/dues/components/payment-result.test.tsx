import { screen, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { jsonResponse, mockFetch, renderWithProviders } from '@/testing/test-utils';
import type { Invoice } from '../api/get-invoice';
import { PaymentResult } from './payment-result';

const INVOICE = 'GET /api/guilds/1/dues/invoices/91';

const open: Invoice = {
  id: 91,
  status: 'open',
  label: '2026–27',
  lines: [{ kind: 'dues', label: '2026–27 dues — Standard', amountCents: 4000 }],
  totalCents: 4000,
  currency: 'USD',
  coversFrom: '2026-09-01',
  coversThrough: '2027-08-31',
  receiptNumber: null,
  paidOn: null,
  method: null,
  memberName: 'June Pettigrew',
};
const paid: Invoice = { ...open, status: 'paid', receiptNumber: 'WQG-2026-0007', paidOn: '2026-09-04', method: 'card' };

function renderResult(giveUpAfterMs = 60_000) {
  return renderWithProviders(
    <PaymentResult guildId="1" invoiceId="91" duesHref="/guilds/1/dues" intervalMs={20} giveUpAfterMs={giveUpAfterMs} />,
  );
}

/** Answers each request with the next invoice in the list, then keeps answering with the last. */
function answerInTurn(...invoices: Invoice[]) {
  let calls = 0;
  const fetchMock = mockFetch({
    [INVOICE]: () => jsonResponse(200, invoices[Math.min(calls++, invoices.length - 1)]),
  });
  return { fetchMock, calls: () => calls };
}

describe('PaymentResult', () => {
  it('waits while the payment is open, then thanks her with the receipt number and a download link', async () => {
    const { fetchMock } = answerInTurn(open, open, paid);
    renderResult();
    expect(screen.getByRole('heading', { level: 1, name: 'Checking your payment' })).toBeInTheDocument();
    expect(await screen.findByText(/We are waiting to hear from the card payment service/)).toBeInTheDocument();

    expect(await screen.findByRole('heading', { level: 1, name: 'Thank you: your dues are paid' })).toHaveFocus();
    expect(screen.getByTestId('receipt-number')).toHaveTextContent('WQG-2026-0007');
    expect(screen.getByText(/We received/)).toHaveTextContent('We received $40.00 from June Pettigrew on 4 September 2026.');
    expect(screen.getByText('1 September 2026 to 31 August 2027')).toBeInTheDocument();
    expect(screen.getByRole('link', { name: /Download the receipt \(PDF\)/ })).toHaveAttribute('href', '/api/guilds/1/dues/invoices/91/receipt.pdf');
    expect(screen.getByRole('link', { name: 'Back to my dues' })).toHaveAttribute('href', '/guilds/1/dues');
    expect(screen.getByRole('status')).toHaveTextContent('Thank you: your dues are paid');

    // Polling stops once the invoice is settled.
    const settledCalls = fetchMock.mock.calls.length;
    await new Promise((r) => setTimeout(r, 100));
    expect(fetchMock.mock.calls.length).toBe(settledCalls);
  });

  it('gives up politely after the time limit, and checks again on request', async () => {
    const seen = answerInTurn(open);
    const { user } = renderResult(150);
    expect(await screen.findByRole('heading', { level: 1, name: 'We have not heard back yet' })).toBeInTheDocument();
    expect(screen.getByText(/you will get an e-mail receipt when your payment goes through/)).toBeInTheDocument();
    const before = seen.calls();
    expect(before).toBeGreaterThan(1);
    await new Promise((r) => setTimeout(r, 100));
    expect(seen.calls()).toBe(before);

    mockFetch({ [INVOICE]: jsonResponse(200, paid) });
    await user.click(screen.getByRole('button', { name: 'Check again' }));
    expect(await screen.findByRole('heading', { level: 1, name: 'Thank you: your dues are paid' })).toBeInTheDocument();
  });

  it('says nothing was charged for a cancelled invoice', async () => {
    answerInTurn({ ...open, status: 'void' });
    renderResult();
    expect(await screen.findByRole('heading', { level: 1, name: 'This payment was cancelled' })).toBeInTheDocument();
    expect(screen.getByText(/Nothing was charged for it/)).toBeInTheDocument();
  });

  it('shows the refund state', async () => {
    answerInTurn({ ...paid, status: 'partially_refunded' });
    renderResult();
    expect(await screen.findByRole('heading', { level: 1, name: 'This payment was refunded' })).toBeInTheDocument();
    expect(screen.getByText(/Part of this payment was given back/)).toBeInTheDocument();
  });

  it('explains an invoice it cannot find and does not keep asking', async () => {
    const fetchMock = mockFetch({ [INVOICE]: jsonResponse(404, { statusCode: 404, message: 'No such invoice.' }) });
    renderResult();
    expect(await screen.findByRole('heading', { level: 1, name: 'We could not check your payment' })).toBeInTheDocument();
    expect(screen.getByText('No such invoice.')).toBeInTheDocument();
    await new Promise((r) => setTimeout(r, 100));
    await waitFor(() => expect(fetchMock).toHaveBeenCalledTimes(1));
  });
});
