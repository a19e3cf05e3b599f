import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { renderWithProviders } from '@/testing/test-utils';
import type { DuesSettings } from '../api/get-dues-settings';
import type { DuesSettingsInput } from '../api/update-dues-settings';
import { DuesSettingsForm } from './dues-settings-form';

const settings: DuesSettings = {
  currency: 'USD',
  yearStartMonth: 9,
  dueMonth: 9,
  dueDay: 1,
  graceDays: 30,
  lateFeeCents: 500,
  earlyRenewalDays: 60,
  proration: [
    { fromMonth: 9, charge: 'full', coversNextYear: false },
    { fromMonth: 3, charge: 'half', coversNextYear: false },
    { fromMonth: 7, charge: 'full', coversNextYear: true },
  ],
  currentYear: { label: '2026–27', startsOn: '2026-09-01', endsOn: '2027-08-31' },
  dueOn: '2026-09-01',
  graceEndsOn: '2026-10-01',
};

function renderForm() {
  const onSave = vi.fn(async (input: DuesSettingsInput) => ({ ...settings, ...input }));
  return { ...renderWithProviders(<DuesSettingsForm settings={settings} onSave={onSave} />), onSave };
}

describe('DuesSettingsForm', () => {
  it('sends the settings back as numbers and whole cents', async () => {
    const { user, onSave } = renderForm();
    expect(screen.getByLabelText(/Late fee/)).toHaveValue('5.00');
    await user.clear(screen.getByLabelText(/Late fee/));
    await user.type(screen.getByLabelText(/Late fee/), '7.5');
    await user.click(screen.getByRole('button', { name: 'Save the settings' }));
    await waitFor(() => expect(onSave).toHaveBeenCalledTimes(1));
    expect(onSave.mock.calls[0][0]).toEqual({
      currency: 'USD',
      yearStartMonth: 9,
      dueMonth: 9,
      dueDay: 1,
      graceDays: 30,
      lateFeeCents: 750,
      earlyRenewalDays: 60,
      proration: settings.proration,
    });
    expect(await screen.findByText(/Settings saved\. The 2026–27 dues are due on 1 September 2026/)).toBeInTheDocument();
  });

  it('mirrors the api’s rules: real days of the month, ranges, amounts', async () => {
    const { user, onSave } = renderForm();
    await user.selectOptions(screen.getByLabelText('Dues are due in'), 'February');
    await user.clear(screen.getByLabelText('On day'));
    await user.type(screen.getByLabelText('On day'), '30');
    await user.clear(screen.getByLabelText('Days of grace after the due date'));
    await user.type(screen.getByLabelText('Days of grace after the due date'), '400');
    await user.clear(screen.getByLabelText(/Late fee/));
    await user.type(screen.getByLabelText(/Late fee/), '-2');
    await user.clear(screen.getByLabelText('Renewal opens this many days before the due date'));
    await user.type(screen.getByLabelText('Renewal opens this many days before the due date'), '2.5');
    await user.click(screen.getByRole('button', { name: 'Save the settings' }));
    expect(await screen.findByText('February has days 1 to 29.')).toBeInTheDocument();
    expect(screen.getByText('Enter the days of grace from 0 to 364.')).toBeInTheDocument();
    expect(screen.getByText('The amount cannot be negative.')).toBeInTheDocument();
    expect(screen.getByText('Enter the days as a whole number.')).toBeInTheDocument();
    expect(onSave).not.toHaveBeenCalled();
  });

  it('keeps the joiner bands in order through the membership year', async () => {
    const { user, onSave } = renderForm();
    const bands = screen.getAllByTestId('proration-band');
    expect(bands).toHaveLength(3);
    // Band 2 moved before band 1 in a September year: October comes after September, but band 3 (July) is after it.
    await user.selectOptions(within(bands[1]).getByLabelText('Joining from'), 'August');
    await user.click(screen.getByRole('button', { name: 'Save the settings' }));
    expect(
      await within(bands[2]).findByText('Each band must start later in the membership year than the one above it (the year starts in September).'),
    ).toBeInTheDocument();

    await user.click(within(bands[2]).getByRole('button', { name: 'Remove band 3' }));
    await user.selectOptions(screen.getByLabelText('The membership year starts in'), 'January');
    await user.click(screen.getByRole('button', { name: 'Save the settings' }));
    expect(
      await within(screen.getAllByTestId('proration-band')[0]).findByText(
        'The first band must start in January, the first month of the membership year.',
      ),
    ).toBeInTheDocument();
    expect(onSave).not.toHaveBeenCalled();

    await user.click(screen.getByRole('button', { name: 'Add a band' }));
    expect(screen.getAllByTestId('proration-band')).toHaveLength(3);
    expect(within(screen.getAllByTestId('proration-band')[2]).getByLabelText('Joining from')).toHaveValue('9');
  });
});
