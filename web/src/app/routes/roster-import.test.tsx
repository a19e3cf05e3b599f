import { fireEvent, screen, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { jsonResponse, mockFetch, renderWithProviders, requestBody } from '@/testing/test-utils';
import RosterImportRoute from './roster-import';

const guild = (myRoles: string[]) => ({ id: 5, name: 'Wrenfield Quilt Guild', town: 'Wrenfield', timeZone: 'Europe/London', currency: 'GBP', myRoles });
const row = (rowNumber: number, name: string, action: string, problems: string[] = []) => ({
  rowNumber,
  values: { name, email: null, phone: null, town: null, household: null, memberSince: null, paidThrough: null, roles: [] },
  problems,
  action,
  existingAccount: false,
  changes: [],
});
const preview = (overrides: Record<string, unknown> = {}) => ({
  delimiter: 'tab',
  header: ['Name', 'Email'],
  mapping: ['name', 'email'],
  guessed: true,
  mappingProblem: null,
  dateOrder: 'dmy',
  counts: { rows: 3, new: 2, update: 0, unchanged: 0, problems: 1 },
  page: 1,
  pageCount: 1,
  pageSize: 100,
  onlyProblems: false,
  rows: [row(2, 'Agatha Pinwheel', 'new'), row(3, 'Basil Pinwheel', 'new'), row(4, '', 'skip', ['No name: every member needs one.'])],
  ...overrides,
});
const path = '/guilds/:guildId/members/import';
const route = '/guilds/5/members/import';

describe('Import a roster', () => {
  it('goes from pasted rows to a preview, imports, then sends the invitations', async () => {
    const fetchMock = mockFetch({
      'GET /api/guilds/5': jsonResponse(200, guild(['membership_chair'])),
      'POST /api/guilds/5/roster-import/preview': jsonResponse(200, preview()),
      'POST /api/guilds/5/roster-import': jsonResponse(201, {
        counts: { created: 2, updated: 0, unchanged: 0, skipped: 1 },
        skipped: [{ rowNumber: 4, name: '', problems: ['No name: every member needs one.'] }],
        toInvite: [
          { membershipId: 21, name: 'Agatha Pinwheel', email: 'agatha@example.org', invited: false },
          { membershipId: 22, name: 'Basil Pinwheel', email: 'basil@example.org', invited: false },
        ],
      }),
      'POST /api/guilds/5/roster-import/invitations': jsonResponse(200, {
        sent: [
          { membershipId: 21, name: 'Agatha Pinwheel', email: 'agatha@example.org' },
          { membershipId: 22, name: 'Basil Pinwheel', email: 'basil@example.org' },
        ],
        skipped: [],
      }),
    });
    renderWithProviders(<RosterImportRoute />, { path, route });
    expect(await screen.findByRole('heading', { name: 'Import a roster from a spreadsheet' })).toBeInTheDocument();
    expect(screen.getByText(/the only column you must have/)).toBeInTheDocument();
    fireEvent.click(screen.getByRole('button', { name: 'Show me what will be imported' }));
    expect(await screen.findByText('Choose a file, or paste the rows from your spreadsheet.')).toBeInTheDocument();
    const pasted = 'Name\tEmail\nAgatha Pinwheel\tagatha@example.org\n';
    fireEvent.change(screen.getByLabelText('Or paste the rows here'), { target: { value: pasted } });
    fireEvent.click(screen.getByRole('button', { name: 'Show me what will be imported' }));
    expect(await screen.findByTestId('roster-counts')).toHaveTextContent('2 new, 0 to update, 0 unchanged, 1 with problems (will be skipped)');
    expect(requestBody(fetchMock, 'POST /api/guilds/5/roster-import/preview')).toEqual({ text: pasted, page: 1, onlyProblems: false });

    fireEvent.click(screen.getByRole('button', { name: 'Import 2 members' }));
    expect(await screen.findByText(/2 new members added, 0 updated, 0 already up to date\. 1 row was skipped\./)).toBeInTheDocument();
    expect(requestBody(fetchMock, 'POST /api/guilds/5/roster-import')).toEqual({ text: pasted, mapping: ['name', 'email'], dateOrder: 'dmy' });
    expect(screen.getByRole('list', { name: 'Rows not imported' })).toHaveTextContent('Row 4: No name: every member needs one.');

    fireEvent.click(screen.getByRole('button', { name: 'Send 2 invitations' }));
    expect(await screen.findByText(/2 invitations were sent\./)).toBeInTheDocument();
    expect(requestBody(fetchMock, 'POST /api/guilds/5/roster-import/invitations')).toEqual({ membershipIds: [21, 22] });
  });

  it('sends a chosen file as an upload and shows what the server refused', async () => {
    const fetchMock = mockFetch({
      'GET /api/guilds/5': jsonResponse(200, guild(['admin'])),
      'POST /api/guilds/5/roster-import/preview': jsonResponse(413, {
        statusCode: 413,
        message: 'The file is larger than 5 MB, more than a roster needs. Save only the member columns, or split the file into two and import each.',
      }),
    });
    renderWithProviders(<RosterImportRoute />, { path, route });
    const input = await screen.findByLabelText('Choose the CSV file');
    fireEvent.change(input, { target: { files: [new File(['Name\nAda\n'], 'roster.csv', { type: 'text/csv' })] } });
    expect(await screen.findByText(/Chosen: roster\.csv/)).toBeInTheDocument();
    fireEvent.click(screen.getByRole('button', { name: 'Show me what will be imported' }));
    expect(await screen.findByText(/larger than 5 MB/)).toBeInTheDocument();
    const call = fetchMock.mock.calls.find(([url]) => String(url).endsWith('/roster-import/preview'))!;
    const body = (call[1] as RequestInit).body as FormData;
    expect(body).toBeInstanceOf(FormData);
    expect((body.get('file') as File).name).toBe('roster.csv');
  });

  it('previews again when she changes a column, and tells a plain member it is not for her', async () => {
    const fetchMock = mockFetch({
      'GET /api/guilds/5': jsonResponse(200, guild(['admin'])),
      'POST /api/guilds/5/roster-import/preview': (_url, init) => {
        const body = JSON.parse(String(init?.body)) as { mapping?: string[] };
        return jsonResponse(200, body.mapping ? preview({ mapping: body.mapping, counts: { rows: 3, new: 3, update: 0, unchanged: 0, problems: 0 } }) : preview());
      },
    });
    renderWithProviders(<RosterImportRoute />, { path, route });
    fireEvent.change(await screen.findByLabelText('Or paste the rows here'), { target: { value: 'Name\tEmail\nAda\t\n' } });
    fireEvent.click(screen.getByRole('button', { name: 'Show me what will be imported' }));
    fireEvent.change(await screen.findByLabelText('Column 2: “Email”'), { target: { value: 'ignore' } });
    expect(await screen.findByRole('button', { name: 'Import 3 members' })).toBeInTheDocument();
    const bodies = fetchMock.mock.calls.filter(([url]) => String(url).endsWith('/preview')).map(([, init]) => JSON.parse(String(init?.body)));
    expect(bodies[1]).toMatchObject({ mapping: ['name', 'ignore'], dateOrder: 'dmy', page: 1 });

    mockFetch({ 'GET /api/guilds/5': jsonResponse(200, guild([])) });
    renderWithProviders(<RosterImportRoute />, { path, route });
    await waitFor(() => expect(screen.getByText("Only the guild's admins and membership chair can import a roster.")).toBeInTheDocument());
  });
});
