import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { renderWithProviders } from '@/testing/test-utils';
import type { PlanInput } from '../api/create-dues-plan';
import type { DuesPlan } from '../api/get-dues-plans';
import { PlansEditor } from './plans-editor';

const plans: DuesPlan[] = [
  { id: 3, name: 'Standard', kind: 'standard', yearlyCents: 4000, minAge: 18, maxAge: null, active: true },
  { id: 6, name: 'Honorary', kind: 'honorary', yearlyCents: 0, minAge: null, maxAge: null, active: false },
];

function renderEditor() {
  const onSave = vi.fn(async (_planId: number | null, _input: PlanInput) => ({}));
  return { ...renderWithProviders(<PlansEditor plans={plans} currency="USD" onSave={onSave} />), onSave };
}

describe('PlansEditor', () => {
  it('lists plans in words', () => {
    renderEditor();
    const rows = screen.getAllByTestId('plan-row');
    expect(rows[0]).toHaveTextContent('Standard Standard$40.0018 and overChange Standard');
    expect(rows[1]).toHaveTextContent('Honorary Not offeredHonoraryNo duesAny ageChange Honorary');
  });

  it('adds a plan, checking the amount and the ages first', async () => {
    const { user, onSave } = renderEditor();
    await user.click(screen.getByRole('button', { name: 'Add a plan' }));
    const dialog = await screen.findByRole('dialog', { name: 'Add a plan' });
    await user.click(within(dialog).getByRole('button', { name: 'Add the plan' }));
    expect(await within(dialog).findByText('Give the plan a name.')).toBeInTheDocument();
    expect(within(dialog).getByText('Choose what kind of plan it is.')).toBeInTheDocument();

    await user.type(within(dialog).getByLabelText('Name'), 'Junior');
    await user.click(within(dialog).getByRole('radio', { name: /^Standard/ }));
    await user.type(within(dialog).getByLabelText('Dues for one year (USD)'), '0');
    await user.type(within(dialog).getByLabelText(/Lowest age/), '18');
    await user.type(within(dialog).getByLabelText(/Highest age/), '12');
    await user.click(within(dialog).getByRole('button', { name: 'Add the plan' }));
    expect(await within(dialog).findByText('Yearly dues must be more than 0. For members who pay nothing, choose honorary.')).toBeInTheDocument();
    expect(within(dialog).getByText('The highest age must not be below the lowest age.')).toBeInTheDocument();

    await user.clear(within(dialog).getByLabelText('Dues for one year (USD)'));
    await user.type(within(dialog).getByLabelText('Dues for one year (USD)'), '15');
    await user.clear(within(dialog).getByLabelText(/Lowest age/));
    await user.click(within(dialog).getByRole('button', { name: 'Add the plan' }));
    await waitFor(() => expect(onSave).toHaveBeenCalledTimes(1));
    expect(onSave.mock.calls[0]).toEqual([null, { name: 'Junior', kind: 'standard', yearlyCents: 1500, minAge: null, maxAge: 12, active: true }]);
    expect(await screen.findByText('Junior is added.')).toBeInTheDocument();
  });

  it('changes a plan; a free plan sends no dues', async () => {
    const { user, onSave } = renderEditor();
    await user.click(screen.getByRole('button', { name: /^Change\s?Standard/ }));
    const dialog = await screen.findByRole('dialog', { name: 'Change Standard' });
    expect(within(dialog).getByLabelText('Dues for one year (USD)')).toHaveValue('40.00');
    await user.click(within(dialog).getByRole('radio', { name: /^Lifetime/ }));
    expect(within(dialog).queryByLabelText('Dues for one year (USD)')).not.toBeInTheDocument();
    await user.click(within(dialog).getByRole('button', { name: 'Save the plan' }));
    await waitFor(() => expect(onSave).toHaveBeenCalledTimes(1));
    expect(onSave.mock.calls[0]).toEqual([3, { name: 'Standard', kind: 'lifetime', yearlyCents: 0, minAge: 18, maxAge: null, active: true }]);
  });
});
