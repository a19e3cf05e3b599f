import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { renderWithProviders } from '@/testing/test-utils';
import { entry, show } from '../testing/fixtures';
import { EntryForm } from './entry-form';

function renderForm() {
  const onCreate = vi.fn().mockResolvedValue(entry);
  const utils = renderWithProviders(
    <EntryForm guildId="1" show={show} makerName="Marigold Fenwick" onCreate={onCreate} onUpdate={vi.fn()} onSaved={vi.fn()} />,
    {
      path: '/guilds/:guildId/shows/:showId/enter',
      route: '/guilds/1/shows/2/enter',
      routes: [{ path: '/guilds/:guildId/shows/:showId', element: <p>The show page</p> }],
    },
  );
  return { ...utils, onCreate };
}

describe('EntryForm', () => {
  it('refuses "60,5" and "60 3/2" in the api’s words, and sends nothing', async () => {
    const { user, onCreate } = renderForm();
    await user.selectOptions(screen.getByLabelText('Category'), 'Medium');
    await user.type(screen.getByLabelText('Title of the quilt'), 'Mill Pond at Dusk');
    await user.type(screen.getByLabelText('Width (inches)'), '60,5');
    await user.type(screen.getByLabelText('Height (inches)'), '60 3/2');
    await user.click(screen.getByRole('button', { name: 'Enter this quilt' }));
    expect(await screen.findByText('Could not read "60,5" as inches. Write it like 12 1/2, 12.5 or 12½.')).toBeInTheDocument();
    expect(
      screen.getByText('Could not read "60 3/2" as inches. The fraction after the whole number must be less than 1. Write it like 12 1/2, 12.5 or 12½.'),
    ).toBeInTheDocument();
    expect(onCreate).not.toHaveBeenCalled();
  });

  it('says a quilt does not fit its category and does not send it, as the api would refuse it', async () => {
    const { user, onCreate } = renderForm();
    await user.selectOptions(screen.getByLabelText('Category'), 'Medium');
    await user.type(screen.getByLabelText('Title of the quilt'), 'Mill Pond at Dusk');
    await user.type(screen.getByLabelText('Width (inches)'), '60 1/2');
    await user.type(screen.getByLabelText('Height (inches)'), '60½');
    const warning = screen.getByTestId('size-warning');
    expect(warning).toHaveTextContent(/^It does not fit Medium\..*Choose another category, or check the width and height\.$/);
    expect(warning).not.toHaveTextContent('You can still send it');
    await user.click(screen.getByRole('button', { name: 'Enter this quilt' }));
    await waitFor(() =>
      expect(screen.getByLabelText('Width (inches)')).toHaveAccessibleDescription(
        /This category takes quilts at most 240 in around \(perimeter\); yours is 242 in around, 2 in over\./,
      ),
    );
    // Said once, under the field the api names, not again in the box.
    expect(screen.getAllByText(/yours is 242 in around/)).toHaveLength(1);
    expect(onCreate).not.toHaveBeenCalled();
  });

  it('holds the size, title and makers to the api’s limits', async () => {
    const { user, onCreate } = renderForm();
    await user.selectOptions(screen.getByLabelText('Category'), 'Group quilts');
    await user.type(screen.getByLabelText('Title of the quilt'), 'x'.repeat(161));
    await user.type(screen.getByLabelText('Width (inches)'), '3 1/2');
    await user.type(screen.getByLabelText('Height (inches)'), '201');
    await user.click(screen.getByRole('button', { name: 'Enter this quilt' }));
    expect(await screen.findByText('Use at most 160 characters.')).toBeInTheDocument();
    expect(screen.getByText('Must be at least 4 inches.')).toBeInTheDocument();
    expect(screen.getByText('Must be at most 200 inches.')).toBeInTheDocument();
    expect(screen.getByTestId('makers-error')).toHaveTextContent(
      'Group quilts is for quilts made by 3 or more people; this one names 1. Add the other makers.',
    );
    expect(onCreate).not.toHaveBeenCalled();
  });

  it('lets "Quilted by" be left empty, for a chair who does not know', async () => {
    const { user, onCreate } = renderForm();
    const quilter = screen.getByLabelText(/Quilted by/);
    expect(quilter).not.toHaveAttribute('aria-required');
    expect(quilter).toHaveAccessibleDescription(/Leave empty if you do not know./);
    await user.selectOptions(screen.getByLabelText('Category'), 'Small');
    await user.type(screen.getByLabelText('Title of the quilt'), 'Hedgerow Stars');
    await user.type(screen.getByLabelText('Width (inches)'), '30');
    await user.type(screen.getByLabelText('Height (inches)'), '36 1/4');
    await user.click(screen.getByRole('button', { name: 'Enter this quilt' }));
    await waitFor(() => expect(onCreate).toHaveBeenCalled());
    expect(onCreate.mock.calls[0][0]).not.toHaveProperty('quilter');
  });

  it('says once, under the makers, that a group quilt needs more of them, without marking her own name wrong', async () => {
    const { user, onCreate } = renderForm();
    await user.selectOptions(screen.getByLabelText('Category'), 'Group quilts');
    await user.type(screen.getByLabelText('Title of the quilt'), 'Guild Friendship Medallion');
    await user.type(screen.getByLabelText('Width (inches)'), '80');
    await user.type(screen.getByLabelText('Height (inches)'), '80');
    await user.click(screen.getByRole('button', { name: 'Enter this quilt' }));
    const message = 'Group quilts is for quilts made by 3 or more people; this one names 1. Add the other makers.';
    expect(await screen.findByTestId('makers-error')).toHaveTextContent(message);
    expect(screen.getAllByText(message)).toHaveLength(1);
    // The list's message is a string: read per maker it gave the stray letter "G".
    expect(screen.queryByText('G')).not.toBeInTheDocument();
    const maker1 = screen.getByLabelText('Maker 1');
    expect(maker1).not.toHaveAttribute('aria-invalid');
    expect(maker1).not.toHaveClass('is-invalid');
    await waitFor(() => expect(screen.getByRole('group', { name: 'Who made it' })).toHaveFocus());
    expect(screen.getByRole('group', { name: 'Who made it' })).toHaveAccessibleDescription(message);
    expect(onCreate).not.toHaveBeenCalled();

    // A maker's own problem still shows under her box.
    await user.click(screen.getByRole('button', { name: 'Add another maker' }));
    await user.click(screen.getByRole('button', { name: 'Enter this quilt' }));
    await waitFor(() => expect(screen.getByLabelText('Maker 2')).toHaveAttribute('aria-invalid', 'true'));
    expect(screen.getByLabelText('Maker 2')).toHaveAccessibleDescription('Type the maker’s name, or remove this line.');
    expect(screen.getByLabelText('Maker 1')).not.toHaveAttribute('aria-invalid');
  });

  it('asks before Cancel throws away what she typed', async () => {
    const { user, router } = renderForm();
    await user.type(screen.getByLabelText('Title of the quilt'), 'Mill Pond at Dusk');
    await user.click(screen.getByRole('button', { name: 'Cancel' }));
    const question = screen.getByRole('group', { name: 'Leave without entering this quilt? What you typed will be lost.' });
    expect(router.state.location.pathname).toBe('/guilds/1/shows/2/enter');
    await user.click(within(question).getByRole('button', { name: 'Keep typing' }));
    expect(screen.getByLabelText('Title of the quilt')).toHaveValue('Mill Pond at Dusk');
    await user.click(screen.getByRole('button', { name: 'Cancel' }));
    await user.click(screen.getByRole('button', { name: 'Yes, leave' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/guilds/1/shows/2'));
  });

  it('leaves at once on Cancel when nothing was typed', async () => {
    const { user, router } = renderForm();
    await user.click(screen.getByRole('link', { name: 'Cancel' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/guilds/1/shows/2'));
  });
});
