import { screen, waitFor } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { renderWithProviders } from '@/testing/test-utils';
import { entry, show } from '../testing/fixtures';
import { EntryForm } from './entry-form';

function renderForm() {
  const onCreate = vi.fn().mockResolvedValue(entry);
  const utils = renderWithProviders(
    <EntryForm guildId="1" show={show} makerName="Marigold Fenwick" onCreate={onCreate} onUpdate={vi.fn()} onSaved={vi.fn()} />,
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
});
