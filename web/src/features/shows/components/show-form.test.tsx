import { screen, waitFor } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { renderWithProviders } from '@/testing/test-utils';
import type { Show } from '../api/types';
import { show } from '../testing/fixtures';
import { ShowForm } from './show-form';

function renderForm(existing: Show | null = null) {
  const onSave = vi.fn().mockResolvedValue(existing ?? show);
  const utils = renderWithProviders(<ShowForm show={existing} currency="USD" timeZone="America/Chicago" onSave={onSave} />);
  return { ...utils, onSave };
}

describe('ShowForm', () => {
  it('asks for the places on a ranked ballot only for ranked voting, and sends them as a number', async () => {
    const { user, onSave } = renderForm();
    await user.type(screen.getByLabelText('Name of the show'), 'Harvest Quilt Show');
    await user.type(screen.getByLabelText('Where'), 'Wrenfield Grange Hall');
    await user.type(screen.getByLabelText('First day'), '2026-10-02');
    await user.type(screen.getByLabelText('Last day'), '2026-10-04');
    expect(screen.queryByLabelText('Places on a ranked ballot')).not.toBeInTheDocument();
    await user.click(screen.getByRole('radio', { name: /^Ranked/ }));
    const depth = screen.getByLabelText('Places on a ranked ballot');
    expect(depth).toHaveValue(3);
    await user.clear(depth);
    await user.type(depth, '6');
    await user.click(screen.getByRole('button', { name: 'Create the show' }));
    expect(await screen.findByText('A ranked ballot lists 2 to 5 places.')).toBeInTheDocument();
    expect(onSave).not.toHaveBeenCalled();

    await user.clear(depth);
    await user.type(depth, '5');
    await user.click(screen.getByRole('button', { name: 'Create the show' }));
    await waitFor(() => expect(onSave).toHaveBeenCalledWith(expect.objectContaining({ votingKind: 'ranked', rankDepth: 5 })));
  });

  it('refuses entries that open or close after the last day, and too many quilts per member', async () => {
    const { user, onSave } = renderForm({ ...show, canManage: true });
    await user.clear(screen.getByLabelText(/Entries open/));
    await user.type(screen.getByLabelText(/Entries open/), '2026-10-05');
    await user.clear(screen.getByLabelText(/Entries close/));
    await user.type(screen.getByLabelText(/Entries close/), '2026-10-06');
    await user.clear(screen.getByLabelText(/Most quilts one member may enter/));
    await user.type(screen.getByLabelText(/Most quilts one member may enter/), '51');
    await user.click(screen.getByRole('button', { name: 'Save the show' }));
    expect(await screen.findByText("Entries must open on or before the show's last day.")).toBeInTheDocument();
    expect(screen.getByText('Entries must close by the last day of the show.')).toBeInTheDocument();
    expect(screen.getByText('Enter a whole number of quilts from 1 to 50, or leave it empty for no limit.')).toBeInTheDocument();
    expect(onSave).not.toHaveBeenCalled();
  });

  it('does not send the opening time once voting is open', async () => {
    const open = { ...show, canManage: true, votingState: 'open' as const, votingOpenedAt: '2026-10-02T15:00:00Z', votingOpensAt: '2026-10-02T15:00:00Z' };
    const { user, onSave } = renderForm(open);
    expect(screen.getByLabelText(/Voting opens/)).toBeDisabled();
    expect(screen.getByLabelText(/Voting closes/)).toBeEnabled();
    await user.click(screen.getByRole('button', { name: 'Save the show' }));
    await waitFor(() => expect(onSave).toHaveBeenCalled());
    expect(onSave.mock.calls[0][0]).not.toHaveProperty('votingOpensAt');
  });

  it('refuses an opening time already past before sending, and moves to the first field to mend', async () => {
    const { user, onSave } = renderForm({ ...show, canManage: true, votingState: 'not_open' });
    await user.type(screen.getByLabelText(/Voting opens/), '2020-03-01T09:00');
    await user.type(screen.getByLabelText(/Voting closes/), '2020-02-28T09:00');
    await user.click(screen.getByRole('button', { name: 'Save the show' }));
    const opens = screen.getByLabelText(/Voting opens/);
    await waitFor(() => expect(opens).toHaveAccessibleDescription('Choose an opening time in the future, or open voting now from the ballot desk.'));
    expect(screen.getByLabelText(/Voting closes/)).toHaveAccessibleDescription('Voting must close after it opens.');
    await waitFor(() => expect(opens).toHaveFocus());
    expect(onSave).not.toHaveBeenCalled();
  });

  it('moves to the first of several mistakes, far up the form, after a refused save', async () => {
    const { user, onSave } = renderForm({ ...show, canManage: true });
    await user.clear(screen.getByLabelText('Name of the show'));
    await user.clear(screen.getByLabelText(/Sleeve depth \(inches\)/));
    await user.type(screen.getByLabelText(/Voting opens/), '2020-03-01T09:00');
    await user.click(screen.getByRole('button', { name: 'Save the show' }));
    expect(await screen.findByText('Give the show a name.')).toBeInTheDocument();
    await waitFor(() => expect(screen.getByLabelText('Name of the show')).toHaveFocus());
    expect(screen.getByText('Choose an opening time in the future, or open voting now from the ballot desk.')).toBeInTheDocument();
    expect(onSave).not.toHaveBeenCalled();
  });
});
