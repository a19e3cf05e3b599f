import { render, screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { PaymentHistory } from './payment-history';

describe('PaymentHistory', () => {
  it('says who recorded a cash payment made for her', () => {
    render(
      <PaymentHistory
        guildId="4"
        history={[
          { invoiceId: 1, label: '2026', issuedOn: '2026-01-05', totalCents: 3000, currency: 'USD', status: 'paid', method: 'cash', paidOn: '2026-01-05', receiptNumber: '2026-0003', refundedCents: 0, recordedBy: 'Doreen Achterberg' },
          { invoiceId: 2, label: '2025', issuedOn: '2025-01-05', totalCents: 3000, currency: 'USD', status: 'paid', method: 'card', paidOn: '2025-01-05', receiptNumber: '2025-0009', refundedCents: 0, recordedBy: null },
        ]}
      />,
    );
    const [cash, card] = screen.getAllByTestId('history-row');
    expect(cash).toHaveTextContent('Recorded by Doreen Achterberg');
    expect(card).not.toHaveTextContent('Recorded by');
  });
});
