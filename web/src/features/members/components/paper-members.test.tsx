import { fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { jsonResponse, mockFetch, renderWithProviders, requestBody } from '@/testing/test-utils';
import { AddPaperMemberForm } from './add-paper-member-form';
import { MemberDetailsModal } from './member-details-modal';
import { MemberList } from './member-list';

// Invented people in invented towns.
describe('AddPaperMemberForm', () => {
  it('adds a member with no e-mail, empty boxes sent as null', async () => {
    const fetchMock = mockFetch({
      'POST /api/guilds/4/members': jsonResponse(201, { membershipId: 9, name: 'Mabel Thornbury', roles: [], email: null, signsIn: false }),
    });
    renderWithProviders(<AddPaperMemberForm guildId="4" />);
    fireEvent.change(screen.getByRole('textbox', { name: /^Her name/ }), { target: { value: 'Mabel Thornbury' } });
    fireEvent.change(screen.getByRole('textbox', { name: /^Phone number/ }), { target: { value: '555 0199' } });
    fireEvent.change(screen.getByLabelText(/^Member since/), { target: { value: '2019-09-01' } });
    fireEvent.click(screen.getByRole('checkbox', { name: 'Her phone number' }));
    fireEvent.click(screen.getByRole('button', { name: 'Add her to the roster' }));
    expect(await screen.findByText(/Mabel Thornbury is on the roster/)).toBeInTheDocument();
    expect(requestBody(fetchMock, 'POST /api/guilds/4/members')).toEqual({
      name: 'Mabel Thornbury',
      email: null,
      phone: '555 0199',
      town: null,
      memberSince: '2019-09-01',
      showPhone: true,
      showTown: false,
    });
  });

  it('asks for her name and refuses a day in the future before sending', async () => {
    const fetchMock = mockFetch({});
    renderWithProviders(<AddPaperMemberForm guildId="4" />);
    fireEvent.change(screen.getByLabelText(/^Member since/), { target: { value: '2999-01-01' } });
    fireEvent.click(screen.getByRole('button', { name: 'Add her to the roster' }));
    expect(await screen.findByText('Enter her name.')).toBeInTheDocument();
    expect(await screen.findByText('The date she joined cannot be after today.')).toBeInTheDocument();
    expect(fetchMock.mock.calls.some(([, init]) => (init as RequestInit | undefined)?.method === 'POST')).toBe(false);
  });

  it("shows the server's answer when the e-mail already has an account", async () => {
    mockFetch({
      'POST /api/guilds/4/members': jsonResponse(409, { statusCode: 409, message: 'ivy@wrenfield.example already has an account; invite her instead.' }),
    });
    renderWithProviders(<AddPaperMemberForm guildId="4" />);
    fireEvent.change(screen.getByRole('textbox', { name: /^Her name/ }), { target: { value: 'Ivy Marsh' } });
    fireEvent.change(screen.getByRole('textbox', { name: /^E-mail address/ }), { target: { value: 'ivy@wrenfield.example' } });
    fireEvent.click(screen.getByRole('button', { name: 'Add her to the roster' }));
    expect(await screen.findByText(/already has an account; invite her instead/)).toBeInTheDocument();
  });
});

describe('MemberList for the roster officers', () => {
  it('marks members who do not sign in and offers to edit only their details', () => {
    const onEditDetails = vi.fn();
    render(
      <MemberList
        canEditRoles={false}
        onEditRoles={() => undefined}
        onEditDetails={onEditDetails}
        members={[
          { membershipId: 1, name: 'Mabel Thornbury', roles: [], email: null, signsIn: false },
          { membershipId: 2, name: 'Nora Pilkington', roles: [], email: 'nora@saltmere.example', signsIn: false },
          { membershipId: 3, name: 'Hazel Ormsby', roles: ['admin'], email: 'hazel@wrenfield.example', signsIn: true },
        ]}
      />,
    );
    const [mabel, nora, hazel] = screen.getAllByTestId('member-card');
    expect(within(mabel).getByTestId('paper-badge')).toHaveTextContent('Kept on paper');
    expect(within(nora).getByTestId('paper-badge')).toHaveTextContent('Has not signed in yet');
    expect(within(hazel).queryByTestId('paper-badge')).toBeNull();
    expect(within(hazel).queryByRole('button', { name: /Edit her details/ })).toBeNull();
    fireEvent.click(within(mabel).getByRole('button', { name: /Edit her details/ }));
    expect(onEditDetails).toHaveBeenCalledWith(expect.objectContaining({ membershipId: 1 }));
  });
});

describe('MemberDetailsModal', () => {
  it('saves the details with empty boxes as empty and closes', async () => {
    const onSave = vi.fn(async () => undefined);
    const onHide = vi.fn();
    render(
      <MemberDetailsModal
        member={{ membershipId: 1, name: 'Mabel Thornbury', roles: [], email: null, phone: '555 0199', town: 'Little Wrenfield', signsIn: false, showPhone: true }}
        onHide={onHide}
        onSave={onSave}
      />,
    );
    const phone = screen.getByRole('textbox', { name: /^Phone number/ });
    expect(phone).toHaveValue('555 0199');
    fireEvent.change(phone, { target: { value: '555 0198' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save details' }));
    await waitFor(() => expect(onHide).toHaveBeenCalled());
    expect(onSave).toHaveBeenCalledWith(
      expect.objectContaining({ membershipId: 1 }),
      { name: 'Mabel Thornbury', email: '', phone: '555 0198', town: 'Little Wrenfield', showEmail: false, showPhone: true, showTown: false },
    );
  });
});
