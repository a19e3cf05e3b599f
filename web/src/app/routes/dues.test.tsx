import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { MyDues } from '@/features/dues/api/get-my-dues';
import { jsonResponse, mockFetch, renderWithProviders } from '@/testing/test-utils';
import DuesRoute from './dues';

const guild = { id: 1, name: 'Wrenfield Quilt Guild', town: 'Wrenfield', timeZone: 'America/Chicago', currency: 'USD', myRoles: [] };
const standard = { id: 3, name: 'Standard', kind: 'standard', yearlyCents: 4000, minAge: null, maxAge: null, active: true } as const;

const paidUp: MyDues = {
  status: 'current',
  statusEndsOn: '2027-09-01',
  paidThrough: '2027-08-31',
  plan: standard,
  household: { id: 2, name: 'Pettigrew household', members: ['June Pettigrew', 'Walter Pettigrew'] },
  quote: { lines: [], totalCents: 0, currency: 'USD', coversFrom: null, coversThrough: null, note: 'Paid through 31 August 2027.' },
  openInvoice: null,
  history: [
    {
      invoiceId: 91,
      label: '2026–27',
      issuedOn: '2026-09-04',
      totalCents: 4000,
      currency: 'USD',
      status: 'paid',
      method: 'card',
      paidOn: '2026-09-04',
      receiptNumber: 'WQG-2026-0007',
      refundedCents: 0,
    },
    {
      invoiceId: 80,
      label: '2025–26',
      issuedOn: '2025-09-10',
      totalCents: 4000,
      currency: 'USD',
      status: 'partially_refunded',
      method: 'cash',
      paidOn: '2025-09-10',
      receiptNumber: 'WQG-2025-0031',
      refundedCents: 1000,
    },
  ],
};

function renderDues(dues: MyDues, route = '/guilds/1/dues', roles: string[] = []) {
  mockFetch({
    'GET /api/guilds/1': jsonResponse(200, { ...guild, myRoles: roles }),
    'GET /api/guilds/1/dues/me': jsonResponse(200, dues),
    'GET /api/guilds/1/dues/plans': jsonResponse(200, [standard]),
  });
  return renderWithProviders(<DuesRoute />, { path: '/guilds/:guildId/dues', route });
}

describe('Dues page', () => {
  it('shows her status in words, her household and every receipt', async () => {
    renderDues(paidUp);
    expect(await screen.findByRole('heading', { level: 1, name: 'Dues' })).toBeInTheDocument();
    expect(screen.getByTestId('dues-status')).toHaveTextContent('Paid up');
    expect(screen.getByText('Your dues are paid through 31 August 2027.')).toBeInTheDocument();
    expect(screen.getByText(/Pettigrew household/).parentElement).toHaveTextContent('(June Pettigrew, Walter Pettigrew)');
    expect(await screen.findByTestId('nothing-to-pay')).toHaveTextContent('Paid through 31 August 2027.');
    expect(screen.getByRole('heading', { name: 'Your next payment' })).toBeInTheDocument();
    expect(screen.queryByRole('radio')).not.toBeInTheDocument();
    expect(screen.getAllByTestId('history-row')[0]).toHaveTextContent(/^Dues for 2026–27/);

    const rows = screen.getAllByTestId('history-row');
    expect(rows[0]).toHaveTextContent('2026–274 September 2026$40.00CardPaid');
    expect(within(rows[0]).getByRole('link', { name: /Receipt WQG-2026-0007/ })).toHaveAttribute(
      'href',
      '/api/guilds/1/dues/invoices/91/receipt.pdf',
    );
    expect(rows[1]).toHaveTextContent('$10.00 refunded');
    expect(rows[1]).toHaveTextContent('Partly refunded');
    expect(screen.queryByRole('link', { name: /Treasurer pages/ })).not.toBeInTheDocument();
  });

  it('says gently that a cancelled payment charged nothing', async () => {
    const { user, router } = renderDues(
      { ...paidUp, status: 'grace', statusEndsOn: '2026-10-01', paidThrough: '2026-08-31' },
      '/guilds/1/dues?cancelled=1',
    );
    const note = await screen.findByTestId('cancelled-note');
    expect(note).toHaveTextContent('Payment cancelled. Nothing was charged.');
    expect(screen.getByText('Your dues are due. Please pay by 1 October 2026 to avoid a late fee.')).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Close this message' }));
    expect(router.state.location.search).toBe('');
  });

  it('points to an unfinished payment and, for the treasurer, to her pages', async () => {
    const owing = {
      lines: [{ kind: 'dues' as const, label: '2027 dues — Standard', amountCents: 4000 }],
      totalCents: 4000,
      currency: 'USD',
      coversFrom: '2027-01-01',
      coversThrough: '2027-12-31',
      note: null,
    };
    renderDues({ ...paidUp, status: 'lapsed', quote: owing, openInvoice: { id: 95 } }, '/guilds/1/dues', ['treasurer']);
    expect(await screen.findByRole('heading', { name: 'Pay your dues' })).toBeInTheDocument();
    expect(screen.getByTestId('open-invoice-note')).toHaveTextContent('If not, nothing was charged and you can pay now.');
    expect(await screen.findByRole('link', { name: 'Check that payment' })).toHaveAttribute('href', '/guilds/1/dues/return?invoice=95');
    expect(screen.getByRole('link', { name: /Treasurer pages/ })).toHaveAttribute('href', '/guilds/1/treasurer');
  });

  it('says so when the guild does not take dues here', async () => {
    mockFetch({
      'GET /api/guilds/1': jsonResponse(200, guild),
      'GET /api/guilds/1/dues/settings': jsonResponse(200, { configured: false, currency: 'USD' }),
      'GET /api/guilds/1/dues/me': jsonResponse(200, { ...paidUp, status: 'lapsed', plan: null, quote: null, history: [], paidThrough: null }),
      'GET /api/guilds/1/dues/plans': jsonResponse(200, []),
    });
    renderWithProviders(<DuesRoute />, { path: '/guilds/:guildId/dues', route: '/guilds/1/dues' });
    expect(await screen.findByText(/does not take dues through Selvage/)).toBeInTheDocument();
    expect(screen.queryByTestId('dues-status')).not.toBeInTheDocument();
  });

  it('has no payment section for an honorary member', async () => {
    renderDues({ ...paidUp, status: 'honorary', quote: null, plan: { ...standard, id: 6, name: 'Honorary', kind: 'honorary', yearlyCents: 0 } });
    expect(await screen.findByText('You are an honorary member. You pay no dues.')).toBeInTheDocument();
    expect(screen.queryByRole('heading', { name: 'Pay your dues' })).not.toBeInTheDocument();
  });
});
