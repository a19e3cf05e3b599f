import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { entry, guild, show } from '@/features/shows/testing/fixtures';
import { jsonResponse, mockFetch, renderWithProviders, requestBody } from '@/testing/test-utils';
import ShowEntryRoute from './show-entry';

const me = { user: { id: 3, email: 'marigold@wrenfield.example', name: 'Marigold Fenwick' } };
const members = {
  members: [
    { membershipId: 7, name: 'Marigold Fenwick', roles: ['show_chair'] },
    { membershipId: 31, name: 'Winifred Ashdown', roles: [] },
  ],
};
const POST = 'POST /api/guilds/1/shows/2/entries';

function renderEnter({ canManage = false, post = jsonResponse(201, entry) }: { canManage?: boolean; post?: Response } = {}) {
  const fetchMock = mockFetch({
    'GET /api/guilds/1': jsonResponse(200, guild),
    'GET /api/guilds/1/shows/2': jsonResponse(200, { ...show, canManage }),
    'GET /api/auth/me': jsonResponse(200, me),
    'GET /api/guilds/1/members': jsonResponse(200, members),
    [POST]: post,
  });
  const utils = renderWithProviders(<ShowEntryRoute />, {
    path: '/guilds/:guildId/shows/:showId/enter',
    route: '/guilds/1/shows/2/enter',
    routes: [{ path: '/guilds/:guildId/shows/:showId', element: <p>The show page</p> }],
  });
  return { ...utils, fetchMock };
}

describe('Entering a quilt', () => {
  it('reads fractions, shows the perimeter as she types and warns when the quilt is too big for the category', async () => {
    const { user, fetchMock, router } = renderEnter();
    const category = await screen.findByLabelText('Category');
    expect(screen.queryByLabelText('Entering on behalf of')).not.toBeInTheDocument();
    expect(screen.getByLabelText('Maker 1')).toHaveValue('Marigold Fenwick');
    expect(screen.getByTestId('sleeve-note')).toHaveTextContent('Every quilt needs a 4 in hanging sleeve');

    await user.selectOptions(category, 'Medium');
    expect(screen.getByTestId('category-rule')).toHaveTextContent('Perimeter at least 160 in and at most 240 in. Judged.');
    await user.type(screen.getByLabelText('Title of the quilt'), 'Mill Pond at Dusk');
    await user.type(screen.getByLabelText('Width (inches)'), '60 1/2');
    expect(screen.getByTestId('perimeter')).toHaveTextContent('Perimeter: type the width and height to see it.');
    await user.type(screen.getByLabelText('Height (inches)'), '60½');
    expect(screen.getByTestId('perimeter')).toHaveTextContent('Perimeter 242 in');
    expect(screen.getByLabelText('Height (inches)')).toHaveAccessibleDescription(/Perimeter 242 in/);
    const tooBig = 'This category takes quilts at most 240 in around (perimeter); yours is 242 in around, 2 in over.';
    // The refusal is said once, under the width field (the field the server names), and the box says what to do.
    expect(screen.getByTestId('size-warning')).toHaveTextContent(
      /^It does not fit Medium\.Choose another category, or check the width and height\.$/,
    );
    expect(screen.getByTestId('size-warning')).not.toHaveTextContent('You can still send it');
    expect(screen.getByLabelText('Width (inches)')).toHaveAccessibleDescription(new RegExp(tooBig.replace(/[()]/g, '\\$&')));
    expect(screen.getAllByText(tooBig)).toHaveLength(1);

    // Too big for Medium: refused before sending, so nothing goes to the server.
    await user.click(screen.getByRole('button', { name: 'Enter this quilt' }));
    await waitFor(() => expect(screen.getByLabelText('Width (inches)')).toHaveAttribute('aria-invalid', 'true'));
    expect(screen.getByText(tooBig)).toBeInTheDocument();
    expect(fetchMock.mock.calls.some(([, init]) => init?.method === 'POST')).toBe(false);
    expect(router.state.location.pathname).toBe('/guilds/1/shows/2/enter');

    await user.clear(screen.getByLabelText('Height (inches)'));
    await user.type(screen.getByLabelText('Height (inches)'), '59.5');
    expect(screen.getByTestId('perimeter')).toHaveTextContent('Perimeter 240 in');
    expect(screen.queryByTestId('size-warning')).not.toBeInTheDocument();

    await user.click(screen.getByRole('button', { name: 'Add another maker' }));
    expect(screen.getByLabelText('Maker 2')).toHaveFocus();
    await user.type(screen.getByLabelText('Maker 2'), 'Tamsin Oakes');
    await user.type(screen.getByLabelText('Quilted by (optional)'), 'Tamsin Oakes');
    await user.type(screen.getByLabelText(/The story of your quilt/), 'Pieced from shirts.');
    expect(screen.getByTestId('story-count')).toHaveTextContent('19 of 1000 characters.');
    await user.click(screen.getByLabelText('This quilt is for sale'));
    await user.type(screen.getByLabelText('Price (USD)'), '$1,200.50');
    await user.click(screen.getByRole('button', { name: 'Enter this quilt' }));

    await waitFor(() => expect(router.state.location.pathname).toBe('/guilds/1/shows/2'));
    expect(requestBody(fetchMock, POST)).toEqual({
      categoryId: 12,
      title: 'Mill Pond at Dusk',
      widthIn: '60 1/2',
      heightIn: '59.5',
      makers: ['Marigold Fenwick', 'Tamsin Oakes'],
      quilter: 'Tamsin Oakes',
      story: 'Pieced from shirts.',
      forSale: true,
      priceCents: 120050,
    });
    expect(router.state.location.state).toEqual({ notice: '“Mill Pond at Dusk” is entered. The show chair will look at it; you can add a photo below.' });
  });

  it('refuses a size it cannot read and shows the server’s size refusal under the field', async () => {
    const refusal = jsonResponse(400, {
      statusCode: 400,
      message: 'Please check the form.',
      errors: { widthIn: ['This category takes quilts less than 160 in around (perimeter); yours is 242 in around, 82 in over.'] },
    });
    const { user, fetchMock } = renderEnter({ post: refusal });
    await user.selectOptions(await screen.findByLabelText('Category'), 'Small');
    await user.type(screen.getByLabelText('Title of the quilt'), 'Kitchen Garden');
    await user.type(screen.getByLabelText('Width (inches)'), 'sixty');
    await user.type(screen.getByLabelText('Height (inches)'), '60');
    await user.type(screen.getByLabelText('Quilted by (optional)'), 'Marigold Fenwick');
    await user.click(screen.getByRole('button', { name: 'Enter this quilt' }));
    expect(await screen.findByText('Could not read "sixty" as inches. Write it like 12 1/2, 12.5 or 12½.')).toBeInTheDocument();
    expect(screen.getByLabelText('Width (inches)')).toHaveAccessibleDescription(/Could not read "sixty" as inches\./);
    expect(fetchMock.mock.calls.some(([, init]) => init?.method === 'POST')).toBe(false);

    await user.clear(screen.getByLabelText('Width (inches)'));
    await user.type(screen.getByLabelText('Width (inches)'), '61');
    await user.click(screen.getByRole('button', { name: 'Enter this quilt' }));
    // Too big for Small: refused before sending, in the server's words, under the width field.
    expect(
      await screen.findByText('This category takes quilts less than 160 in around (perimeter); yours is 242 in around, 82 in over.'),
    ).toBeInTheDocument();
    expect(screen.getByText(/yours is 242 in around, 82 in over/)).toBeInTheDocument();
    expect(screen.getByLabelText('Width (inches)')).toHaveAccessibleDescription(/82 in over/);
    expect(screen.getByTestId('size-warning')).toHaveTextContent(/^It does not fit Small\.Choose another category, or check the width and height\.$/);
    expect(fetchMock.mock.calls.some(([, init]) => init?.method === 'POST')).toBe(false);
  });

  it('asks a group quilt for its makers', async () => {
    const { user, fetchMock } = renderEnter();
    await user.selectOptions(await screen.findByLabelText('Category'), 'Group quilts');
    await user.click(screen.getByRole('button', { name: 'Enter this quilt' }));
    expect(await screen.findByTestId('makers-error')).toHaveTextContent(
      'Group quilts is for quilts made by 3 or more people; this one names 1. Add the other makers.',
    );
    expect(fetchMock.mock.calls.some(([, init]) => init?.method === 'POST')).toBe(false);
  });

  it('lets the show chair enter for a member, with that member as the first maker', async () => {
    const { user, fetchMock } = renderEnter({ canManage: true });
    const onBehalf = await screen.findByLabelText('Entering on behalf of');
    expect(within(onBehalf).getAllByRole('option').map((o) => o.textContent)).toEqual(['Myself', 'Marigold Fenwick', 'Winifred Ashdown']);
    await user.selectOptions(onBehalf, 'Winifred Ashdown');
    expect(screen.getByLabelText('Maker 1')).toHaveValue('Winifred Ashdown');

    await user.selectOptions(screen.getByLabelText('Category'), 'Small');
    await user.type(screen.getByLabelText('Title of the quilt'), 'Hedgerow Stars');
    await user.type(screen.getByLabelText('Width (inches)'), '30');
    await user.type(screen.getByLabelText('Height (inches)'), '36 1/4');
    await user.type(screen.getByLabelText('Quilted by (optional)'), 'Winifred Ashdown');
    await user.click(screen.getByRole('button', { name: 'Enter this quilt' }));
    await waitFor(() => expect(requestBody(fetchMock, POST)).toMatchObject({ onBehalfOf: 31, makers: ['Winifred Ashdown'], heightIn: '36 1/4' }));
  });
});
