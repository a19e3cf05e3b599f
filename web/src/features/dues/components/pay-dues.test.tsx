import { screen, waitFor } from '@testing-library/react';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { jsonResponse, mockFetch, renderWithProviders, requestBody } from '@/testing/test-utils';
import type { DuesPlan } from '../api/get-dues-plans';
import type { MyDues } from '../api/get-my-dues';
import { goToPaymentPage } from '../lib/redirect';
import { PayDues } from './pay-dues';

vi.mock('../lib/redirect', () => ({ goToPaymentPage: vi.fn() }));

const CHECKOUT = 'POST /api/guilds/1/dues/checkout';

const standard: DuesPlan = { id: 3, name: 'Standard', kind: 'standard', yearlyCents: 4000, minAge: null, maxAge: null, active: true };
const household: DuesPlan = { id: 4, name: 'Household', kind: 'household', yearlyCents: 6500, minAge: null, maxAge: null, active: true };
const junior: DuesPlan = { id: 5, name: 'Junior', kind: 'standard', yearlyCents: 1500, minAge: null, maxAge: 17, active: true };
const honorary: DuesPlan = { id: 6, name: 'Honorary', kind: 'honorary', yearlyCents: 0, minAge: null, maxAge: null, active: true };
const retired: DuesPlan = { id: 7, name: 'Old rate', kind: 'standard', yearlyCents: 3000, minAge: null, maxAge: null, active: false };

const lapsed: MyDues = {
  status: 'grace',
  statusEndsOn: '2026-09-30',
  paidThrough: '2026-08-31',
  plan: standard,
  household: null,
  quote: {
    lines: [
      { kind: 'dues', label: '2026–27 dues — Standard', amountCents: 4000 },
      { kind: 'late-fee', label: 'Late fee (renewed after 30 September 2026)', amountCents: 550 },
    ],
    totalCents: 4550,
    currency: 'USD',
    coversFrom: '2026-09-01',
    coversThrough: '2027-08-31',
    note: null,
  },
  openInvoice: null,
  history: [],
};

function renderPay(dues: MyDues = lapsed, plans: DuesPlan[] = [standard, household, junior, honorary, retired]) {
  return renderWithProviders(<PayDues guildId="1" dues={dues} plans={plans} currency="USD" />);
}

describe('PayDues', () => {
  beforeEach(() => vi.mocked(goToPaymentPage).mockClear());

  it('shows what she owes line by line, what it pays for, and one Pay button with the total', () => {
    renderPay();
    const rows = screen.getAllByRole('row');
    expect(rows.map((r) => r.textContent)).toEqual([
      'ItemAmount',
      '2026–27 dues — Standard$40.00',
      'Late fee (renewed after 30 September 2026)$5.50',
      'To pay$45.50',
    ]);
    expect(screen.getByText(/This pays your dues from/)).toHaveTextContent('This pays your dues from 1 September 2026 to 31 August 2027.');
    const pay = screen.getByRole('button', { name: 'Pay $45.50 by card' });
    expect(pay).toHaveAccessibleDescription('This pays your dues from 1 September 2026 to 31 August 2027.');
    // Only plans she can pay for herself, each with its price; her own is marked.
    const radios = screen.getAllByRole('radio');
    expect(radios.map((r) => r.closest('.form-check')?.textContent)).toEqual([
      'Standard: $40.00 a year (your plan)',
      'Household: $65.00 a year',
      'Junior: $15.00 a yearFor ages up to 17',
    ]);
    expect(screen.getByRole('radio', { name: /^Standard/ })).toBeChecked();
  });

  it('starts one checkout however often she presses, then goes to the payment page', async () => {
    let answer: (r: Response) => void = () => undefined;
    const fetchMock = mockFetch({
      [CHECKOUT]: () => new Promise<Response>((resolve) => (answer = resolve)),
    });
    const { user } = renderPay();
    const pay = screen.getByRole('button', { name: 'Pay $45.50 by card' });
    await user.dblClick(pay);
    await user.click(pay);

    await waitFor(() => expect(screen.getByRole('button', { name: /Opening the payment page/ })).toBeDisabled());
    answer(jsonResponse(201, { invoiceId: 91, url: 'https://pay.example/checkout/cs_1' }));
    await waitFor(() => expect(goToPaymentPage).toHaveBeenCalledWith('https://pay.example/checkout/cs_1'));
    expect(fetchMock).toHaveBeenCalledTimes(1);
    expect(requestBody(fetchMock, CHECKOUT)).toEqual({ planId: 3 });
    // Still disabled while the browser leaves.
    expect(screen.getByRole('button', { name: /Opening the payment page/ })).toBeDisabled();
  });

  it('shows why a checkout failed and lets her try again', async () => {
    const fetchMock = mockFetch({
      [CHECKOUT]: jsonResponse(503, { statusCode: 503, message: 'Card payments are not available just now. Please try again in a few minutes.' }),
    });
    const { user } = renderPay();
    await user.click(screen.getByRole('button', { name: 'Pay $45.50 by card' }));
    expect(await screen.findByText('Card payments are not available just now. Please try again in a few minutes.')).toBeInTheDocument();
    const pay = screen.getByRole('button', { name: 'Pay $45.50 by card' });
    expect(pay).toBeEnabled();
    await user.click(pay);
    await waitFor(() => expect(fetchMock).toHaveBeenCalledTimes(2));
    expect(goToPaymentPage).not.toHaveBeenCalled();
  });

  it('for another plan, gives its yearly price and leaves the exact amount to the payment page', async () => {
    const fetchMock = mockFetch({ [CHECKOUT]: jsonResponse(201, { invoiceId: 92, url: 'https://pay.example/checkout/cs_2' }) });
    const { user } = renderPay();
    await user.click(screen.getByRole('radio', { name: /^Household/ }));
    expect(screen.queryByRole('table')).not.toBeInTheDocument();
    expect(screen.getByText(/Household is \$65\.00 a year/)).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Go to the card payment page' }));
    await waitFor(() => expect(goToPaymentPage).toHaveBeenCalledWith('https://pay.example/checkout/cs_2'));
    expect(requestBody(fetchMock, CHECKOUT)).toEqual({ planId: 4 });
  });

  it('shows the exact lines for another plan she picks when the api has quoted it', async () => {
    const householdQuote = {
      lines: [{ kind: 'dues' as const, label: '2026–27 dues — Household', amountCents: 6500 }],
      totalCents: 6500,
      currency: 'USD',
      coversFrom: '2026-09-01',
      coversThrough: '2027-08-31',
      note: null,
    };
    const { user } = renderPay({ ...lapsed, quotes: [{ planId: 3, quote: lapsed.quote }, { planId: 4, quote: householdQuote }] }, [standard, household]);
    await user.click(screen.getByRole('radio', { name: /^Household/ }));
    expect(screen.getAllByRole('row').map((r) => r.textContent)).toEqual(['ItemAmount', '2026–27 dues — Household$65.00', 'To pay$65.00']);
    expect(screen.getByRole('button', { name: 'Pay $65.00 by card' })).toBeEnabled();
  });

  it('says so when there is nothing to pay, with no button', () => {
    renderPay(
      {
        ...lapsed,
        status: 'current',
        quote: {
          lines: [],
          totalCents: 0,
          currency: 'USD',
          coversFrom: null,
          coversThrough: null,
          note: 'Paid through 31 August 2027. Renewal for 2027–28 opens on 2 July 2027.',
        },
      },
      [standard, household, junior],
    );
    expect(screen.queryByRole('radio')).not.toBeInTheDocument();
    expect(screen.getByTestId('nothing-to-pay')).toHaveTextContent('Renewal for 2027–28 opens on 2 July 2027.');
    expect(screen.queryByRole('button')).not.toBeInTheDocument();
    expect(screen.getByText('Standard')).toBeInTheDocument();
  });

  it('asks a member without a plan to choose one first', async () => {
    const { user } = renderPay({ ...lapsed, status: 'lapsed', plan: null, quote: null }, [standard, household]);
    expect(screen.getByText('Choose a plan to see what you owe.')).toBeInTheDocument();
    expect(screen.queryByRole('button')).not.toBeInTheDocument();
    await user.click(screen.getByRole('radio', { name: /^Standard/ }));
    expect(screen.getByRole('button', { name: 'Go to the card payment page' })).toBeEnabled();
  });
});
