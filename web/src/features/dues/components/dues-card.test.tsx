import { screen } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { jsonResponse, mockFetch, renderWithProviders } from '@/testing/test-utils';
import type { MyDues } from '../api/get-my-dues';
import { DuesCard } from './dues-card';

const SETTINGS = 'GET /api/guilds/1/dues/settings';
const ME = 'GET /api/guilds/1/dues/me';
const plan = { id: 1, name: 'Regular', kind: 'standard', yearlyCents: 3000, minAge: null, maxAge: null, active: true } as const;
const renewal = {
  lines: [{ kind: 'dues' as const, label: '2027 dues — Regular', amountCents: 3000 }],
  totalCents: 3000,
  currency: 'USD',
  coversFrom: '2027-01-01',
  coversThrough: '2027-12-31',
  note: null,
};
const base: MyDues = {
  status: 'current',
  statusEndsOn: '2027-01-01',
  paidThrough: '2026-12-31',
  plan,
  household: null,
  quote: renewal,
  openInvoice: null,
  history: [],
};

function renderCard(me: MyDues | null, configured = true) {
  mockFetch({
    [SETTINGS]: jsonResponse(200, { configured, currency: 'USD' }),
    ...(me ? { [ME]: jsonResponse(200, me) } : {}),
  });
  return renderWithProviders(<DuesCard guildId="1" guildName="Wrenfield Quilt Guild" href="/guilds/1/dues" />);
}

describe('DuesCard', () => {
  it('invites a paid-up member to renew once renewal is open', async () => {
    renderCard(base);
    expect(await screen.findByText(/You can renew now: \$30\.00\./)).toBeInTheDocument();
    expect(screen.getByTestId('dues-status')).toHaveTextContent('Paid up');
    expect(screen.getByRole('link', { name: /^Pay my dues\s?for Wrenfield Quilt Guild$/ })).toHaveAttribute('href', '/guilds/1/dues');
  });

  it('says what is owed when she is late', async () => {
    renderCard({ ...base, status: 'grace', statusEndsOn: '2027-02-01' });
    expect(await screen.findByText(/Please pay by 1 February 2027 to avoid a late fee\. You owe \$30\.00\./)).toBeInTheDocument();
    expect(screen.getByTestId('dues-status')).toHaveTextContent('Due now');
  });

  it('calls a member who has never paid "not paid yet", not overdue', async () => {
    renderCard({ ...base, status: 'lapsed', statusEndsOn: null, paidThrough: null, plan: null, quote: null });
    expect(await screen.findByTestId('dues-status')).toHaveTextContent('Not paid yet');
    expect(screen.getByRole('link', { name: /^My dues and receipts\s?for Wrenfield Quilt Guild$/ })).toBeInTheDocument();
  });

  it('says plainly when the guild does not take dues here, and asks nothing more', async () => {
    const fetchMock = mockFetch({ [SETTINGS]: jsonResponse(200, { configured: false, currency: 'USD' }) });
    renderWithProviders(<DuesCard guildId="1" guildName="Millbrook Modern Quilters" href="/guilds/1/dues" showGuildName />);
    expect(await screen.findByText('This guild does not take dues through Selvage.')).toBeInTheDocument();
    expect(screen.getByRole('heading', { name: 'Dues: Millbrook Modern Quilters' })).toBeInTheDocument();
    expect(screen.queryByRole('link')).not.toBeInTheDocument();
    expect(fetchMock.mock.calls.map(([url]) => String(url))).toEqual(['/api/guilds/1/dues/settings']);
  });
});
