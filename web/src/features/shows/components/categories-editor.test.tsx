import { screen, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { renderWithProviders } from '@/testing/test-utils';
import { categories } from '../testing/fixtures';
import { CategoriesEditor } from './categories-editor';

function renderEditor() {
  const onSave = vi.fn().mockResolvedValue({});
  const utils = renderWithProviders(<CategoriesEditor categories={categories} onSave={onSave} onDelete={vi.fn()} onAddMany={vi.fn()} />);
  return { ...utils, onSave };
}

describe('CategoriesEditor', () => {
  it('refuses 1 maker, more than 50, and a band whose ends meet, in the api’s words', async () => {
    const { user, onSave } = renderEditor();
    await user.click(screen.getByRole('button', { name: 'Add a category' }));
    const dialog = await screen.findByRole('dialog', { name: 'Add a category' });
    await user.type(within(dialog).getByLabelText('Name'), 'Pairs');
    await user.type(within(dialog).getByLabelText(/Fewest makers/), '1');
    await user.type(within(dialog).getByLabelText(/Most quilts per member/), '51');
    await user.click(within(dialog).getByRole('radio', { name: 'Perimeter (the distance around the quilt)' }));
    await user.type(within(dialog).getByLabelText(/Lower limit \(inches\)/), '200');
    await user.type(within(dialog).getByLabelText(/Upper limit \(inches\)/), '200');
    await user.click(within(dialog).getByRole('button', { name: 'Add the category' }));
    expect(await within(dialog).findByText('Enter the least number of makers (2 to 50), or leave it empty.')).toBeInTheDocument();
    expect(within(dialog).getByText('Enter a whole number of quilts from 1 to 50, or leave it empty for no limit.')).toBeInTheDocument();
    expect(within(dialog).getByText('The lower perimeter must be less than the upper one.')).toBeInTheDocument();
    expect(onSave).not.toHaveBeenCalled();

    await user.clear(within(dialog).getByLabelText(/Fewest makers/));
    await user.type(within(dialog).getByLabelText(/Fewest makers/), '51');
    expect(await within(dialog).findByText('Enter the least number of makers (2 to 50), or leave it empty.')).toBeInTheDocument();
  });

  it('offers Delete only for a category without entries, and counts entries of every status', () => {
    const withEntries = [{ ...categories[0], entryCount: 3, acceptedCount: 1 }, ...categories.slice(1)];
    renderWithProviders(<CategoriesEditor categories={withEntries} onSave={vi.fn()} onDelete={vi.fn()} onAddMany={vi.fn()} />);
    const rows = screen.getAllByRole('row').slice(1);
    expect(within(rows[0]).getByTestId('cannot-delete')).toHaveTextContent('To delete it, first move its 3 entries to another category.');
    expect(within(rows[0]).queryByRole('button', { name: /^Delete/ })).not.toBeInTheDocument();
    expect(rows[0]).toHaveTextContent('3 (1 accepted)');
    expect(within(rows[1]).getByRole('button', { name: /^Delete/ })).toBeInTheDocument();
  });
});
