import { screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { renderWithProviders } from '@/testing/test-utils';
import { RosterTable } from './roster-table';

describe('RosterTable', () => {
  it('links an e-mail address, and says so plainly for a member kept on paper', () => {
    renderWithProviders(
      <RosterTable
        recordHref={(id) => `/record/${id}`}
        rows={[
          { membershipId: 1, name: 'Ottoline Marsh', email: 'ottoline@marsh.example', planName: 'Regular', status: 'current', paidThrough: '2026-12-31', statusEndsOn: null },
          { membershipId: 2, name: 'Mabel Thornbury', email: null, planName: 'Regular', status: 'grace', paidThrough: null, statusEndsOn: null },
        ]}
      />,
    );
    const [ottoline, mabel] = screen.getAllByTestId('roster-row');
    expect(within(ottoline).getByRole('link', { name: 'ottoline@marsh.example' })).toHaveAttribute('href', 'mailto:ottoline@marsh.example');
    expect(mabel).toHaveTextContent('No e-mail (kept on paper)');
    expect(within(mabel).queryByRole('link', { name: /@|null/ })).toBeNull();
  });
});
