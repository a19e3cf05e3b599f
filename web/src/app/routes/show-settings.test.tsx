import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { guild, show } from '@/features/shows/testing/fixtures';
import { jsonResponse, mockFetch, renderWithProviders, requestBody } from '@/testing/test-utils';
import ShowSettingsRoute from './show-settings';

const ADD = 'POST /api/guilds/1/shows/2/categories';

function renderSettings(overrides: Partial<typeof show> = {}, extra: Parameters<typeof mockFetch>[0] = {}) {
  const fetchMock = mockFetch({
    'GET /api/guilds/1': jsonResponse(200, { ...guild, myRoles: ['show_chair'] }),
    'GET /api/guilds/1/shows/2': jsonResponse(200, { ...show, canManage: true, ...overrides }),
    ...extra,
  });
  const utils = renderWithProviders(<ShowSettingsRoute />, { path: '/guilds/:guildId/shows/:showId/settings', route: '/guilds/1/shows/2/settings' });
  return { ...utils, fetchMock };
}

describe('Show settings', () => {
  it('adds the usual size bands one request each, only those the show lacks', async () => {
    const bodies: unknown[] = [];
    const { user } = renderSettings(
      { categories: [{ ...show.categories[1] }] },
      {
        [ADD]: (_url, init) => {
          bodies.push(JSON.parse(String(init?.body)));
          return jsonResponse(201, {});
        },
      },
    );
    expect(await screen.findByText(/Published bands leave 240–241 in undecided; Selvage puts anything over 240 in Large./)).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Add the usual size categories' }));
    expect(await screen.findByText('Added Small, Large and Extra large.')).toBeInTheDocument();
    expect(bodies).toEqual([
      { name: 'Small', judged: true, sizeRule: { kind: 'perimeter', maxIn: '160', maxInclusive: false }, sortOrder: 3 },
      { name: 'Large', judged: true, sizeRule: { kind: 'perimeter', minIn: '240', minInclusive: false, maxIn: '320', maxInclusive: true }, sortOrder: 4 },
      { name: 'Extra large', judged: true, sizeRule: { kind: 'perimeter', minIn: '320', minInclusive: false }, sortOrder: 5 },
    ]);
  });

  it('adds a category with a perimeter band from the dialog', async () => {
    const { user, fetchMock } = renderSettings({}, { [ADD]: jsonResponse(201, {}) });
    await user.click(await screen.findByRole('button', { name: 'Add a category' }));
    const dialog = await screen.findByRole('dialog', { name: 'Add a category' });
    await user.type(within(dialog).getByLabelText('Name'), 'Wall hangings');
    await user.click(within(dialog).getByRole('radio', { name: 'Exhibit only (not judged)' }));
    await user.click(within(dialog).getByRole('radio', { name: 'Perimeter (the distance around the quilt)' }));
    await user.selectOptions(within(dialog).getByLabelText('Lower limit'), 'more than');
    await user.type(within(dialog).getByLabelText(/Lower limit \(inches\)/), '100');
    await user.selectOptions(within(dialog).getByLabelText('Upper limit'), 'less than');
    await user.type(within(dialog).getByLabelText(/Upper limit \(inches\)/), '180 1/2');
    await user.click(within(dialog).getByRole('button', { name: 'Add the category' }));
    await waitFor(() => expect(screen.queryByRole('dialog')).not.toBeInTheDocument());
    expect(requestBody(fetchMock, ADD)).toEqual({
      name: 'Wall hangings',
      judged: false,
      sizeRule: { kind: 'perimeter', minIn: '100', minInclusive: false, maxIn: '180 1/2', maxInclusive: false },
      sortOrder: 4,
    });
  });

  it('locks how people vote once voting has opened, and saves the rest', async () => {
    const PATCH = 'PATCH /api/guilds/1/shows/2';
    const { user, fetchMock } = renderSettings(
      { votingState: 'open', votingOpenedAt: '2026-10-02T15:00:00Z' },
      { [PATCH]: jsonResponse(200, { ...show, canManage: true, votingState: 'open', votingOpenedAt: '2026-10-02T15:00:00Z' }) },
    );
    expect(await screen.findByTestId('voting-locked')).toHaveTextContent('cannot be changed now that voting has opened');
    expect(screen.getByRole('radio', { name: /One vote per category/ })).toBeDisabled();
    expect(screen.getByRole('radio', { name: /One vote per category/ })).toBeChecked();
    await user.click(screen.getByRole('switch', { name: 'Makers hidden until judging is done' }));
    await user.click(screen.getByRole('button', { name: 'Save the show' }));
    expect(await screen.findByText('The show is saved.')).toBeInTheDocument();
    const body = requestBody(fetchMock, PATCH) as Record<string, unknown>;
    expect(body).toMatchObject({ makersHidden: true, sleeveDepthIn: '4', entryFeeCents: 1000, entryFeeCapCents: 2500 });
    expect(body).not.toHaveProperty('votingKind');
  });
});
