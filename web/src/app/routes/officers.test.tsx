import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { Offices, Term } from '@/features/offices/api/get-offices';
import { jsonResponse, mockFetch, renderWithProviders, requestBody } from '@/testing/test-utils';
import OfficersRoute from './officers';

const guild = { id: 1, name: 'Wrenfield Quilt Guild', town: 'Wrenfield', timeZone: 'America/Chicago', currency: 'USD' };
const term = (over: Partial<Term>): Term => ({
  id: 1,
  role: 'treasurer',
  roleLabel: 'Treasurer',
  membershipId: 2,
  name: 'Doreen Achterberg',
  startsOn: '2026-01-01',
  endsOn: '2027-01-01',
  note: '',
  recordedBy: { membershipId: 1, name: 'Hazel Ormsby' },
  createdAt: '2026-01-01T10:00:00.000Z',
  ...over,
});
const doreen = term({});
const clementine = term({ id: 2, membershipId: 7, name: 'Clementine Marchbanks', startsOn: '2024-09-01', endsOn: '2026-01-01' });
const hazel = term({ id: 3, role: 'admin', roleLabel: 'Admin', membershipId: 1, name: 'Hazel Ormsby', startsOn: '2024-09-01', endsOn: null, recordedBy: null });
const edith = term({ id: 4, role: 'show_chair', roleLabel: 'Show chair', membershipId: 9, name: 'Edith Vasquez-Orr', startsOn: '2027-04-01', endsOn: null });
const offices: Offices = {
  today: '2026-12-02',
  offices: [
    { role: 'admin', label: 'Admin', holders: [hazel], upcoming: [] },
    { role: 'treasurer', label: 'Treasurer', holders: [doreen], upcoming: [] },
    { role: 'membership_chair', label: 'Membership chair', holders: [], upcoming: [] },
    { role: 'show_chair', label: 'Show chair', holders: [], upcoming: [edith] },
  ],
};
const members = [
  { membershipId: 1, name: 'Hazel Ormsby', roles: ['admin'], status: 'active' },
  { membershipId: 2, name: 'Doreen Achterberg', roles: ['treasurer'], status: 'active' },
  { membershipId: 5, name: 'June Pettigrew', roles: [], status: 'active' },
  { membershipId: 6, name: 'Bernadette Quenneville', roles: [], status: 'left' },
];

function renderOfficers(myRoles: string[], extra: Record<string, Response> = {}) {
  const fetchMock = mockFetch({
    'GET /api/guilds/1': jsonResponse(200, { ...guild, myRoles }),
    'GET /api/guilds/1/offices': jsonResponse(200, offices),
    'GET /api/guilds/1/offices/history': jsonResponse(200, { today: offices.today, terms: [edith, doreen, clementine, hazel] }),
    'GET /api/guilds/1/members': jsonResponse(200, members),
    ...extra,
  });
  const rendered = renderWithProviders(<OfficersRoute />, { path: '/guilds/:guildId/officers', route: '/guilds/1/officers' });
  return { fetchMock, ...rendered };
}

describe('Officers page', () => {
  it('shows every member who holds each office, until when, what is coming up and the history', async () => {
    renderOfficers([]);
    const cards = await screen.findAllByTestId('office-card');
    expect(cards).toHaveLength(4);
    expect(cards[1]).toHaveTextContent('Treasurer');
    expect(cards[1]).toHaveTextContent('Doreen Achterberg, since 1 January 2026, access ends on 1 January 2027');
    expect(cards[0]).toHaveTextContent('Hazel Ormsby, since 1 September 2024, no end date set');
    expect(cards[2]).toHaveTextContent('Nobody holds this office today.');
    expect(within(cards[3]).getByTestId('office-upcoming')).toHaveTextContent('Edith Vasquez-Orr takes over on 1 April 2027');
    const rows = await screen.findAllByTestId('history-row');
    expect(rows).toHaveLength(4);
    expect(rows[2]).toHaveTextContent('Clementine Marchbanks');
    expect(rows[2]).toHaveTextContent('access ended on 1 January 2026');
    expect(rows[0]).not.toHaveTextContent('ended');
    expect(rows[2]).toHaveTextContent('Recorded by Hazel Ormsby');
    // Members read; only admins change terms.
    expect(screen.queryByRole('button', { name: /Set term dates/ })).not.toBeInTheDocument();
    expect(screen.queryByRole('heading', { name: 'Hand over an office' })).not.toBeInTheDocument();
  });

  it('lets an admin hand an office over to an active member on a chosen day', async () => {
    const HANDOVER = 'POST /api/guilds/1/offices/handover';
    const { fetchMock, user } = renderOfficers(['admin'], { [HANDOVER]: jsonResponse(200, { ended: doreen, started: doreen }) });
    await screen.findByRole('heading', { name: 'Hand over an office' });
    const to = screen.getByLabelText('Taken on by');
    expect(within(to).queryByRole('option', { name: 'Bernadette Quenneville' })).not.toBeInTheDocument();
    await user.selectOptions(screen.getByLabelText('Office'), 'Treasurer');
    await user.selectOptions(screen.getByLabelText('Handed over by'), 'Doreen Achterberg');
    await user.selectOptions(to, 'June Pettigrew');
    const day = screen.getByLabelText('Handover day');
    await user.clear(day);
    await user.type(day, '2027-01-01');
    await user.click(screen.getByRole('button', { name: 'Hand over' }));
    expect(await screen.findByText('Treasurer passes to June Pettigrew on 1 January 2027.')).toBeInTheDocument();
    expect(requestBody(fetchMock, HANDOVER)).toEqual({ role: 'treasurer', fromMembershipId: 2, toMembershipId: 5, on: '2027-01-01' });
    // Starting the next handover clears the confirmation, so it never sits above a new mistake.
    await user.selectOptions(screen.getByLabelText('Office'), 'Treasurer');
    await waitFor(() => expect(screen.queryByText('Treasurer passes to June Pettigrew on 1 January 2027.')).not.toBeInTheDocument());
  });

  it('shows why the api refused a handover', async () => {
    const { user } = renderOfficers(['admin'], {
      'POST /api/guilds/1/offices/handover': jsonResponse(409, { statusCode: 409, message: 'June Pettigrew already holds Treasurer from 1 January 2027 with no end date, which overlaps.' }),
    });
    await screen.findByRole('heading', { name: 'Hand over an office' });
    await user.selectOptions(screen.getByLabelText('Office'), 'Treasurer');
    await user.selectOptions(screen.getByLabelText('Handed over by'), 'Doreen Achterberg');
    await user.selectOptions(screen.getByLabelText('Taken on by'), 'June Pettigrew');
    await user.click(screen.getByRole('button', { name: 'Hand over' }));
    expect(await screen.findByText(/already holds Treasurer/)).toBeInTheDocument();
  });

  it('does not send a handover to the outgoing officer herself', async () => {
    const { fetchMock, user } = renderOfficers(['admin']);
    await screen.findByRole('heading', { name: 'Hand over an office' });
    await user.selectOptions(screen.getByLabelText('Office'), 'Treasurer');
    await user.selectOptions(screen.getByLabelText('Handed over by'), 'Doreen Achterberg');
    await user.selectOptions(screen.getByLabelText('Taken on by'), 'Doreen Achterberg');
    await user.click(screen.getByRole('button', { name: 'Hand over' }));
    expect(await screen.findByText('Choose someone other than the outgoing officer.')).toBeInTheDocument();
    expect(fetchMock.mock.calls.some(([, init]) => init?.method === 'POST')).toBe(false);
  });

  it('lets an admin set the day access ends for a current term, or clear it', async () => {
    const PATCH = 'PATCH /api/guilds/1/offices/terms/1';
    const { fetchMock, user } = renderOfficers(['admin'], { [PATCH]: jsonResponse(200, doreen) });
    await user.click(await screen.findByRole('button', { name: /Set term dates\s?for Doreen Achterberg as Treasurer/ }));
    const dialog = await screen.findByRole('dialog', { name: 'Treasurer: Doreen Achterberg' });
    const ends = within(dialog).getByLabelText(/Access ends on/);
    expect(ends).toHaveValue('2027-01-01');
    await user.clear(ends);
    await user.type(within(dialog).getByLabelText(/Note/), 'Re-elected');
    await user.click(within(dialog).getByRole('button', { name: 'Save dates' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).not.toBeInTheDocument());
    expect(requestBody(fetchMock, PATCH)).toEqual({ startsOn: '2026-01-01', endsOn: null, note: 'Re-elected' });
  });

  it('refuses an end date before the first day without asking the api', async () => {
    const { fetchMock, user } = renderOfficers(['admin']);
    await user.click(await screen.findByRole('button', { name: /Set term dates\s?for Doreen Achterberg as Treasurer/ }));
    const dialog = await screen.findByRole('dialog');
    const ends = within(dialog).getByLabelText(/Access ends on/);
    await user.clear(ends);
    await user.type(ends, '2025-06-01');
    await user.click(within(dialog).getByRole('button', { name: 'Save dates' }));
    expect(await within(dialog).findByText('Access must end after the first day in office.')).toBeInTheDocument();
    expect(fetchMock.mock.calls.some(([, init]) => init?.method === 'PATCH')).toBe(false);
  });
});
