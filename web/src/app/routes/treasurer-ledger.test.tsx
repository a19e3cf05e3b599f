import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { Ledger, LedgerRow } from '@/features/dues/api/get-ledger';
import { jsonResponse, mockFetch, renderWithProviders, requestBody } from '@/testing/test-utils';
import TreasurerLedgerRoute from './treasurer-ledger';

const guild = { id: 1, name: 'Wrenfield Quilt Guild', town: 'Wrenfield', timeZone: 'America/Chicago', currency: 'USD', myRoles: ['treasurer'] };
const plans = [{ id: 3, name: 'Standard', kind: 'standard', yearlyCents: 4000, minAge: null, maxAge: null, active: true }];

const row: LedgerRow = {
  invoiceId: 91,
  memberName: 'June Pettigrew',
  planName: 'Standard',
  label: '2026–27 dues',
  issuedOn: '2026-09-04',
  status: 'paid',
  method: 'card',
  grossCents: 4000,
  feeCents: 146,
  refundedCents: 0,
  netCents: 3854,
  paidOn: '2026-09-04',
  receiptNumber: 'WQG-2026-0007',
  reference: 'pi_123',
};
const ledger = (rows: LedgerRow[]): Ledger => ({
  rows,
  totals: {
    count: rows.length,
    grossCents: rows.reduce((s, r) => s + r.grossCents, 0),
    feeCents: rows.reduce((s, r) => s + r.feeCents, 0),
    refundedCents: rows.reduce((s, r) => s + r.refundedCents, 0),
    netCents: rows.reduce((s, r) => s + r.netCents, 0),
  },
  years: ['2026–27', '2025–26'],
});
const cash: LedgerRow = { ...row, invoiceId: 92, memberName: 'Hazel Ormsby', method: 'cash', feeCents: 0, netCents: 4000, reference: null, receiptNumber: 'WQG-2026-0008' };

const BASE = {
  'GET /api/guilds/1': jsonResponse(200, guild),
  'GET /api/guilds/1/dues/plans': jsonResponse(200, plans),
};

function renderLedger(route = '/guilds/1/treasurer/ledger') {
  return renderWithProviders(<TreasurerLedgerRoute />, { path: '/guilds/:guildId/treasurer/ledger', route });
}

describe('Treasurer ledger', () => {
  it('turns the chosen filters into the query string, for the table and the CSV link', async () => {
    const fetchMock = mockFetch({
      ...BASE,
      'GET /api/guilds/1/dues/ledger': jsonResponse(200, ledger([row, cash])),
      'GET /api/guilds/1/dues/ledger?year=2025%E2%80%9326&planId=3&method=cash': jsonResponse(200, ledger([cash])),
    });
    const { user, router } = renderLedger();
    expect(await screen.findAllByTestId('ledger-row')).toHaveLength(2);
    expect(screen.getByTestId('ledger-totals')).toHaveTextContent('Totals (2 invoices)$80.00$1.46$0.00$78.54');

    await user.selectOptions(screen.getByLabelText('Membership year'), '2025–26');
    await user.selectOptions(screen.getByLabelText('Plan'), 'Standard');
    await user.selectOptions(screen.getByLabelText('Paid by'), 'Cash');
    // Nothing is asked for until she presses the button.
    expect(fetchMock.mock.calls.some(([url]) => String(url).includes('method=cash'))).toBe(false);
    await user.click(screen.getByRole('button', { name: 'Show payments' }));

    await waitFor(() => expect(screen.getAllByTestId('ledger-row')).toHaveLength(1));
    expect(router.state.location.search).toBe('?year=2025%E2%80%9326&planId=3&method=cash');
    expect(screen.getByRole('link', { name: 'Download these payments (CSV)' })).toHaveAttribute(
      'href',
      '/api/guilds/1/dues/ledger.csv?year=2025%E2%80%9326&planId=3&method=cash',
    );

    await user.click(screen.getByRole('button', { name: 'Show all payments' }));
    await waitFor(() => expect(screen.getAllByTestId('ledger-row')).toHaveLength(2));
    expect(router.state.location.search).toBe('');
    expect(screen.getByLabelText('Paid by')).toHaveValue('');
  });

  it('reads filters from the address', async () => {
    mockFetch({ ...BASE, 'GET /api/guilds/1/dues/ledger?status=paid': jsonResponse(200, ledger([row])) });
    renderLedger('/guilds/1/treasurer/ledger?status=paid');
    expect(await screen.findAllByTestId('ledger-row')).toHaveLength(1);
    expect(screen.getByLabelText('Status')).toHaveValue('paid');
  });

  it('refunds after reading the amount back, and only then', async () => {
    const REFUND = 'POST /api/guilds/1/dues/invoices/91/refunds';
    const fetchMock = mockFetch({
      ...BASE,
      'GET /api/guilds/1/dues/ledger': jsonResponse(200, ledger([row])),
      [REFUND]: jsonResponse(201, {}),
    });
    const { user } = renderLedger();
    await user.click(await screen.findByRole('button', { name: /^Refund…\s?June Pettigrew/ }));
    const dialog = await screen.findByRole('dialog', { name: 'Refund June Pettigrew' });
    const amount = within(dialog).getByLabelText('Amount to refund (USD)');
    expect(amount).toHaveValue('40.00');

    await user.clear(amount);
    await user.type(amount, '45');
    await user.click(within(dialog).getByRole('button', { name: 'Continue' }));
    expect(await within(dialog).findByText('You can refund at most $40.00.')).toBeInTheDocument();

    await user.clear(amount);
    await user.type(amount, '12.50');
    await user.type(within(dialog).getByLabelText(/Reason/), 'Moved away');
    await user.click(within(dialog).getByRole('button', { name: 'Continue' }));
    expect(await within(dialog).findByText('Refund $12.50 to June Pettigrew?')).toBeInTheDocument();
    expect(within(dialog).getByText(/goes back to the card she paid with/)).toBeInTheDocument();
    expect(fetchMock.mock.calls.some(([url]) => String(url).includes('/refunds'))).toBe(false);

    await user.click(within(dialog).getByRole('button', { name: 'Yes, refund $12.50' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).not.toBeInTheDocument());
    expect(requestBody(fetchMock, REFUND)).toEqual({ amountCents: 1250, reason: 'Moved away' });
    expect(screen.getByText('Refunded $12.50 to June Pettigrew.')).toBeInTheDocument();
  });
});
