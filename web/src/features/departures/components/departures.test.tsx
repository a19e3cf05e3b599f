import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { jsonResponse, mockFetch, renderWithProviders, requestBody } from '@/testing/test-utils';
import { EraseMemberDialog } from './erase-member-dialog';
import { LeaveGuildSection } from './leave-guild-section';
import { RecordDepartureDialog } from './record-departure-dialog';

const plan = {
  membershipId: 12,
  name: 'Mabel Orchard',
  newName: 'Former member 12',
  leftAt: '2026-11-30T10:00:00.000Z',
  eraseRequestedAt: '2026-11-30T10:00:00.000Z',
  refusals: [],
  erases: ['her name (replaced by the record name), e-mail address, phone, town and password'],
  keeps: ['every invoice, payment, refund and receipt number'],
};

describe('LeaveGuildSection', () => {
  it('leaves the chosen guild, with the erase request when ticked', async () => {
    const fetchMock = mockFetch({
      'GET /api/dashboard': jsonResponse(200, {
        user: { id: 1, email: 'mabel@orchard.example', name: 'Mabel' },
        guilds: [
          { id: 4, name: 'Fernhollow Quilters', town: 'Fernhollow', roles: [], status: 'active', memberCount: 9 },
          { id: 5, name: 'Old Circle', town: 'Fernhollow', roles: [], status: 'left', memberCount: 3 },
        ],
      }),
      'POST /api/guilds/4/leave': jsonResponse(200, { membershipId: 12, name: 'Mabel', status: 'left', leftAt: '2026-12-02', eraseRequestedAt: '2026-12-02' }),
    });
    renderWithProviders(<LeaveGuildSection />);
    fireEvent.click(await screen.findByRole('button', { name: 'Leave Fernhollow Quilters' }));
    expect(screen.queryByRole('button', { name: 'Leave Old Circle' })).not.toBeInTheDocument();
    fireEvent.click(await screen.findByRole('checkbox', { name: /ask the admins to erase/ }));
    const dialog = screen.getByRole('dialog', { name: 'Leave Fernhollow Quilters?' });
    fireEvent.click(within(dialog).getByRole('button', { name: 'Leave Fernhollow Quilters' }));
    await waitFor(() => expect(requestBody(fetchMock, 'POST /api/guilds/4/leave')).toEqual({ eraseRequest: true }));
    expect(await screen.findByText(/You have left Fernhollow Quilters/)).toBeInTheDocument();
  });

  it("shows the server's reason when an officer may not leave yet", async () => {
    mockFetch({
      'GET /api/dashboard': jsonResponse(200, { user: { id: 1, email: 'a@b.example', name: 'A' }, guilds: [{ id: 4, name: 'Fernhollow Quilters', town: 'F', roles: ['treasurer'], status: 'active', memberCount: 9 }] }),
      'POST /api/guilds/4/leave': jsonResponse(409, { statusCode: 409, message: "You are the guild's Treasurer. Ask an admin to hand the office on (Officers page) before you leave." }),
    });
    renderWithProviders(<LeaveGuildSection />);
    fireEvent.click(await screen.findByRole('button', { name: 'Leave Fernhollow Quilters' }));
    const dialog = screen.getByRole('dialog');
    fireEvent.click(within(dialog).getByRole('button', { name: 'Leave Fernhollow Quilters' }));
    expect(await screen.findByText(/hand the office on/)).toBeInTheDocument();
  });
});

describe('EraseMemberDialog', () => {
  it('lists what goes and what stays, and erases only once the admin ticks that she understands', async () => {
    const fetchMock = mockFetch({
      'GET /api/guilds/3/members/12/erasure': jsonResponse(200, plan),
      'POST /api/guilds/3/members/12/erasure': jsonResponse(200, { membershipId: 12, name: 'Former member 12', erasedAt: '2026-12-02', photosRemoved: 2, showEntriesChanged: 1 }),
    });
    renderWithProviders(<EraseMemberDialog guildId="3" member={{ membershipId: 12, name: 'Mabel Orchard' }} onHide={() => {}} />);
    expect(await screen.findByText('She asked for this when she left.')).toBeInTheDocument();
    expect(screen.getByText(/every invoice, payment, refund/)).toBeInTheDocument();
    const erase = screen.getByRole('button', { name: 'Erase her details' });
    expect(erase).toBeDisabled();
    fireEvent.click(screen.getByRole('checkbox', { name: 'I understand this cannot be undone' }));
    fireEvent.click(erase);
    await waitFor(() => expect(requestBody(fetchMock, 'POST /api/guilds/3/members/12/erasure')).toEqual({ confirm: true }));
    expect(await screen.findByText(/Her records now read “Former member 12”. 2 photos were removed./)).toBeInTheDocument();
  });

  it('says why it cannot be done yet and offers no erase button', async () => {
    mockFetch({
      'GET /api/guilds/3/members/12/erasure': jsonResponse(200, {
        ...plan,
        refusals: [{ code: 'unpaid_invoices', message: 'She has an unpaid invoice (2026 dues $30.00). The treasurer must record the payment or void it first, so the books stay whole.' }],
      }),
    });
    renderWithProviders(<EraseMemberDialog guildId="3" member={{ membershipId: 12, name: 'Mabel Orchard' }} onHide={() => {}} />);
    expect(await screen.findByTestId('erase-refusals')).toHaveTextContent('She has an unpaid invoice (2026 dues $30.00)');
    expect(screen.queryByRole('button', { name: 'Erase her details' })).not.toBeInTheDocument();
  });
});

describe('RecordDepartureDialog', () => {
  it('records that she has left', async () => {
    const fetchMock = mockFetch({
      'POST /api/guilds/3/members/12/departure': jsonResponse(200, { membershipId: 12, name: 'Mabel Orchard', status: 'left', leftAt: '2026-12-02', eraseRequestedAt: null }),
    });
    let closed = false;
    renderWithProviders(<RecordDepartureDialog guildId="3" member={{ membershipId: 12, name: 'Mabel Orchard' }} onHide={() => (closed = true)} />);
    fireEvent.click(screen.getByRole('button', { name: 'Yes, she has left' }));
    await waitFor(() => expect(closed).toBe(true));
    expect(requestBody(fetchMock, 'POST /api/guilds/3/members/12/departure')).toEqual({});
  });
});
