import { screen, waitFor } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { ApiError } from '@/lib/api-client';
import { renderWithProviders } from '@/testing/test-utils';
import type { DuesPlan } from '../api/get-dues-plans';
import type { RosterRow } from '../api/get-roster';
import type { RecordPaymentInput } from '../api/record-payment';
import { RecordPaymentForm } from './record-payment-form';

const members: RosterRow[] = [
  { membershipId: 12, name: 'June Pettigrew', email: 'june@wrenfield.example', plan: { id: 4, name: 'Household', kind: 'household' }, status: 'grace', paidThrough: '2026-08-31', statusEndsOn: '2026-09-30' },
  { membershipId: 9, name: 'Agnes Byrd', email: 'agnes@wrenfield.example', planName: null, status: 'lapsed', paidThrough: null, statusEndsOn: null },
];
const plans: DuesPlan[] = [
  { id: 3, name: 'Standard', kind: 'standard', yearlyCents: 4000, minAge: null, maxAge: null, active: true },
  { id: 4, name: 'Household', kind: 'household', yearlyCents: 6500, minAge: null, maxAge: null, active: true },
  { id: 6, name: 'Honorary', kind: 'honorary', yearlyCents: 0, minAge: null, maxAge: null, active: true },
];

function renderForm(onRecord = vi.fn(async (_input: RecordPaymentInput) => ({ invoiceId: 93, receiptNumber: 'WQG-2026-0009' })), membershipId = '') {
  const utils = renderWithProviders(
    <RecordPaymentForm members={members} plans={plans} currency="USD" today="2026-09-15" membershipId={membershipId} onRecord={onRecord} />,
  );
  return { ...utils, onRecord };
}

describe('RecordPaymentForm', () => {
  it('says what is missing, under each field, and sends nothing', async () => {
    const { user, onRecord } = renderForm();
    await user.click(screen.getByRole('button', { name: 'Record the payment' }));
    expect(await screen.findByText('Choose the member who paid.')).toBeInTheDocument();
    expect(screen.getByText('Choose the plan she paid for.')).toBeInTheDocument();
    expect(screen.getByText('Choose cash or cheque.')).toBeInTheDocument();
    expect(screen.getByText('Enter the amount received.')).toBeInTheDocument();
    expect(screen.getByLabelText('Member')).toHaveAccessibleDescription('Choose the member who paid.');
    await waitFor(() => expect(screen.getByLabelText('Member')).toHaveFocus());
    expect(onRecord).not.toHaveBeenCalled();
  });

  it('fills the amount from the plan, asks for the cheque number and sends whole cents', async () => {
    const { user, onRecord } = renderForm(undefined, '12');
    expect(screen.getByLabelText('Member')).toHaveValue('12');
    // Honorary is not something anyone pays for.
    expect(screen.queryByRole('option', { name: /Honorary/ })).not.toBeInTheDocument();
    await user.selectOptions(screen.getByLabelText('Plan'), '4');
    expect(screen.getByLabelText('Amount received (USD)')).toHaveValue('65.00');
    await user.selectOptions(screen.getByLabelText('Plan'), '3');
    expect(screen.getByLabelText('Amount received (USD)')).toHaveValue('40.00');

    await user.click(screen.getByRole('radio', { name: 'Cheque' }));
    await user.click(screen.getByRole('button', { name: 'Record the payment' }));
    expect(await screen.findByText('Enter the number printed on the cheque.')).toBeInTheDocument();
    await user.type(screen.getByLabelText('Cheque number'), '000417');
    await user.clear(screen.getByLabelText('Amount received (USD)'));
    await user.type(screen.getByLabelText('Amount received (USD)'), '$20.10');
    await user.click(screen.getByRole('button', { name: 'Record the payment' }));

    await waitFor(() => expect(onRecord).toHaveBeenCalledTimes(1));
    expect(onRecord.mock.calls[0][0]).toEqual({
      membershipId: 12,
      planId: 3,
      method: 'cheque',
      chequeNumber: '000417',
      amountCents: 2010,
      receivedOn: '2026-09-15',
    });
    expect(await screen.findByText('Recorded $20.10 (cheque 000417) from June Pettigrew. Receipt number WQG-2026-0009.')).toBeInTheDocument();
    expect(screen.getByLabelText('Member')).toHaveValue('');
  });

  it('chooses the member’s own plan and its price when she is picked', async () => {
    const { user } = renderForm();
    await user.selectOptions(screen.getByLabelText('Member'), 'June Pettigrew');
    expect(screen.getByLabelText('Plan')).toHaveValue('4');
    expect(screen.getByLabelText('Amount received (USD)')).toHaveValue('65.00');
  });

  it('refuses amounts it cannot read and days in the future', async () => {
    const { user, onRecord } = renderForm();
    await user.type(screen.getByLabelText('Amount received (USD)'), '40,5');
    const day = screen.getByLabelText('Day received');
    await user.clear(day);
    await user.type(day, '2026-09-16');
    await user.click(screen.getByRole('button', { name: 'Record the payment' }));
    expect(await screen.findByText('Type an amount like 25 or 25.00.')).toBeInTheDocument();
    expect(screen.getByText('The day cannot be in the future.')).toBeInTheDocument();
    await user.clear(screen.getByLabelText('Amount received (USD)'));
    await user.type(screen.getByLabelText('Amount received (USD)'), '0');
    await user.click(screen.getByRole('button', { name: 'Record the payment' }));
    expect(await screen.findByText('The amount must be more than nothing.')).toBeInTheDocument();
    expect(onRecord).not.toHaveBeenCalled();
  });

  it('puts the api’s field errors under the fields, amountCents under the amount', async () => {
    const onRecord = vi.fn(async () => {
      throw new ApiError(400, 'Please check the highlighted fields.', { amountCents: ['The amount must be at most 10000000 cents.'] });
    });
    const { user } = renderForm(onRecord, '9');
    await user.selectOptions(screen.getByLabelText('Plan'), '3');
    await user.click(screen.getByRole('radio', { name: 'Cash' }));
    await user.click(screen.getByRole('button', { name: 'Record the payment' }));
    const amount = screen.getByLabelText('Amount received (USD)');
    await waitFor(() => expect(amount).toHaveAttribute('aria-invalid', 'true'));
    expect(amount).toHaveAccessibleDescription(expect.stringContaining('The amount must be at most 10000000 cents.'));
    expect(screen.getByRole('alert')).toHaveTextContent('Please check the highlighted fields.');
  });
});
