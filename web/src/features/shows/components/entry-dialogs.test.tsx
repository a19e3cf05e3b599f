import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { renderWithProviders } from '@/testing/test-utils';
import { categories, entry } from '../testing/fixtures';
import { ChangeEntryDialog } from './entry-dialogs';

const big = { ...entry, widthMm: 1536.7, heightMm: 1536.7, widthText: '60 1/2', heightText: '60 1/2', perimeterText: '242 in' };

function renderDialog(e = big) {
  const onSave = vi.fn().mockResolvedValue(e);
  const onHide = vi.fn();
  const utils = renderWithProviders(<ChangeEntryDialog entry={e} categories={categories} onHide={onHide} onSave={onSave} />);
  return { ...utils, onSave, onHide };
}

describe('ChangeEntryDialog', () => {
  it('says plainly a quilt that does not fit will not be moved, and sends nothing', async () => {
    const { user, onSave } = renderDialog();
    const dialog = await screen.findByRole('dialog');
    await user.selectOptions(within(dialog).getByLabelText('Category'), '11');
    expect(within(dialog).getByTestId('move-warning')).toHaveTextContent(
      "It does not fit Small: This category takes quilts less than 160 in around (perimeter); yours is 242 in around, 82 in over. Choose another category, or change the quilt's size first.",
    );
    expect(dialog).not.toHaveTextContent('You can still move it');
    await user.type(within(dialog).getByLabelText(/Entry number/), '17');
    await user.click(within(dialog).getByRole('button', { name: 'Save' }));
    expect(await within(dialog).findByText('Choose a category this quilt fits, or keep it in Medium.')).toBeInTheDocument();
    expect(onSave).not.toHaveBeenCalled();
  });

  it('refuses a group category for a quilt with too few makers', async () => {
    const { user } = renderDialog(entry);
    const dialog = await screen.findByRole('dialog');
    await user.selectOptions(within(dialog).getByLabelText('Category'), '13');
    expect(within(dialog).getByTestId('move-warning')).toHaveTextContent(
      'It does not fit Group quilts: Group quilts is for quilts made by 3 or more people; this one names 1.',
    );
  });

  it('still saves a number alone, even for a quilt that fits no other category', async () => {
    const { user, onSave, onHide } = renderDialog();
    const dialog = await screen.findByRole('dialog');
    await user.type(within(dialog).getByLabelText(/Entry number/), '17');
    await user.click(within(dialog).getByRole('button', { name: 'Save' }));
    await waitFor(() => expect(onSave).toHaveBeenCalledWith(big, { entryNumber: 17 }));
    expect(onHide).toHaveBeenCalled();
  });

  it('moves a quilt to a category it fits', async () => {
    const small = { ...entry, widthMm: 762, heightMm: 1016 };
    const { user, onSave } = renderDialog(small);
    const dialog = await screen.findByRole('dialog');
    await user.selectOptions(within(dialog).getByLabelText('Category'), '11');
    expect(within(dialog).queryByTestId('move-warning')).not.toBeInTheDocument();
    await user.click(within(dialog).getByRole('button', { name: 'Save' }));
    await waitFor(() => expect(onSave).toHaveBeenCalledWith(small, { categoryId: 11 }));
  });
});
