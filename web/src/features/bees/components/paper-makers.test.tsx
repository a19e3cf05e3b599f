import { fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { jsonResponse, mockFetch, renderWithProviders, requestBody } from '@/testing/test-utils';
import type { Block } from '../api/get-round';
import { AddPaperMakersForm } from './add-paper-makers-form';
import { MakersGrid } from './makers-grid';

// Invented people.
const block = (over: Partial<Block>): Block => ({
  membershipId: 1,
  name: 'Mabel Thornbury',
  status: 'not_started',
  trackingNumber: null,
  late: false,
  updatedAt: null,
  updatedOnBehalf: false,
  ...over,
});

describe('AddPaperMakersForm', () => {
  it('adds the ticked members straight to the bee', async () => {
    const fetchMock = mockFetch({ 'POST /api/guilds/4/bees/8/members': jsonResponse(201, {}) });
    renderWithProviders(<AddPaperMakersForm guildId="4" beeId="8" candidates={[{ membershipId: 12, name: 'Mabel Thornbury' }]} />);
    fireEvent.click(screen.getByRole('checkbox', { name: 'Mabel Thornbury' }));
    fireEvent.click(screen.getByRole('button', { name: 'Add to the bee' }));
    expect(await screen.findByText(/Added Mabel Thornbury/)).toBeInTheDocument();
    expect(requestBody(fetchMock, 'POST /api/guilds/4/bees/8/members')).toEqual({ membershipIds: [12] });
  });

  it('says so when there is nobody to add', () => {
    renderWithProviders(<AddPaperMakersForm guildId="4" beeId="8" candidates={[]} />);
    expect(screen.getByText('Every member kept on paper is already in this bee.')).toBeInTheDocument();
  });
});

describe('MakersGrid for the queen', () => {
  it("lets the queen mark a paper maker's block for her, and says who marked it", async () => {
    const onUpdate = vi.fn(async () => undefined);
    render(
      <MakersGrid
        canMarkReceived
        canSetOnBehalf={false}
        onUpdate={onUpdate}
        blocks={[
          block({ membershipId: 1, onPaper: true, status: 'made', updatedOnBehalf: true, updatedByName: 'Agnes Hollowell' }),
          block({ membershipId: 2, name: 'June Pettigrew', onPaper: false }),
        ]}
      />,
    );
    const [mabel, june] = screen.getAllByTestId('maker-card');
    expect(mabel).toHaveTextContent('Kept on paper');
    expect(mabel).toHaveTextContent('Marked by Agnes Hollowell on her behalf.');
    expect(within(june).queryByRole('button', { name: /Save on her behalf/ })).toBeNull();
    fireEvent.change(within(mabel).getByLabelText(/Status, on her behalf/), { target: { value: 'handed_over' } });
    fireEvent.click(within(mabel).getByRole('button', { name: /Save on her behalf/ }));
    await waitFor(() => expect(onUpdate).toHaveBeenCalledWith(1, { status: 'handed_over' }));
  });
});
