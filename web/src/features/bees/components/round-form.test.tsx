import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { ApiError } from '@/lib/api-client';
import { renderWithProviders } from '@/testing/test-utils';
import type { RoundInput } from '../api/save-round';
import { RoundForm } from './round-form';

function renderForm(onSave = vi.fn(async (_input: RoundInput) => undefined)) {
  const utils = renderWithProviders(<RoundForm round={null} month="2027-03" handover="meeting" onSave={onSave} />);
  return { ...utils, onSave };
}

function preview() {
  // The live preview sits beside the size fields and names both sizes.
  return screen.getByLabelText('Finished width (inches)').getAttribute('aria-describedby') ?? '';
}

describe('RoundForm', () => {
  it('shows the unfinished (cut) size live as finished + 2 × seam allowance', async () => {
    const { user } = renderForm();
    expect(screen.getByText('Type a finished width and height to see the unfinished (cut) size.')).toBeInTheDocument();

    await user.type(screen.getByLabelText('Finished width (inches)'), '12½');
    await user.type(screen.getByLabelText('Finished height (inches)'), '9-1/2');

    const pair = document.getElementById(preview().split(' ').pop()!)!;
    expect(within(pair).getByText('Finished size').parentElement).toHaveTextContent('Finished size 12 1/2 x 9 1/2 in');
    expect(within(pair).getByText('Unfinished (cut) size').parentElement).toHaveTextContent('Unfinished (cut) size 13 x 10 in');

    const seam = screen.getByLabelText('Seam allowance (inches)');
    await user.clear(seam);
    await user.type(seam, '3/8');
    await waitFor(() =>
      expect(screen.getByText('Unfinished (cut) size').parentElement).toHaveTextContent('13 1/4 x 10 1/4 in'),
    );
  });

  it('fills width and height from a preset button and marks it pressed', async () => {
    const { user } = renderForm();
    const twelve = screen.getByRole('button', { name: '12 inch' });
    expect(twelve).toHaveAttribute('aria-pressed', 'false');

    await user.click(twelve);

    expect(screen.getByLabelText('Finished width (inches)')).toHaveValue('12');
    expect(screen.getByLabelText('Finished height (inches)')).toHaveValue('12');
    expect(twelve).toHaveAttribute('aria-pressed', 'true');
    expect(screen.getByRole('button', { name: '9 inch' })).toHaveAttribute('aria-pressed', 'false');
    // TRADE.md §1.1: 12 finished is 12 1/2 unfinished.
    expect(screen.getByText('Unfinished (cut) size').parentElement).toHaveTextContent('12 1/2 x 12 1/2 in');

    await user.click(screen.getByRole('button', { name: '6 inch' }));
    expect(screen.getByText('Unfinished (cut) size').parentElement).toHaveTextContent('6 1/2 x 6 1/2 in');
  });

  it('sends the round with the defaults (1/4 seam, 1/8 tolerance, the 1st at 08:00)', async () => {
    const { user, onSave } = renderForm();
    await user.type(screen.getByLabelText('Title'), 'Wonky star');
    await user.click(screen.getByRole('button', { name: '12 inch' }));
    await user.click(screen.getByRole('button', { name: 'Save the round' }));

    await waitFor(() => expect(onSave).toHaveBeenCalledTimes(1));
    expect(onSave.mock.calls[0][0]).toMatchObject({
      title: 'Wonky star',
      finishedWidth: '12',
      finishedHeight: '12',
      seamAllowance: '1/4',
      tolerance: '1/8',
      trimMode: 'trim',
      swatches: [],
      background: null,
      fabricSource: 'stash',
      dueDate: '2027-04-15',
      sendDate: '2027-03-01',
      sendTime: '08:00',
      deliveryMethod: 'meeting',
    });
    expect(await screen.findByText('The round is saved.')).toBeInTheDocument();
  });

  it('puts the api field errors under the matching fields, nested ones too', async () => {
    const onSave = vi.fn(async () => {
      throw new ApiError(400, 'Please check the highlighted fields.', {
        finishedWidth: ['A block is at most 120 inches wide.'],
        'swatches.0.name': ['Name the colour.'],
        somethingElse: ['The api says no.'],
      });
    });
    const { user } = renderForm(onSave);
    await user.type(screen.getByLabelText('Title'), 'Giant star');
    await user.type(screen.getByLabelText('Finished width (inches)'), '130');
    await user.type(screen.getByLabelText('Finished height (inches)'), '12');
    await user.click(screen.getByRole('button', { name: 'Add a colour' }));
    await user.type(screen.getByLabelText('Name of colour 1'), 'x');
    await user.click(screen.getByRole('button', { name: 'Save the round' }));

    const width = screen.getByLabelText('Finished width (inches)');
    await waitFor(() => expect(width).toHaveAttribute('aria-invalid', 'true'));
    expect(width).toHaveAccessibleDescription(expect.stringContaining('A block is at most 120 inches wide.'));
    expect(screen.getByLabelText('Name of colour 1')).toHaveAccessibleDescription('Name the colour.');
    expect(screen.getByRole('alert')).toHaveTextContent('Please check the highlighted fields. The api says no.');
    await waitFor(() => expect(width).toHaveFocus());
  });

  it('checks the obvious on the client: a title, readable sizes, a due date', async () => {
    const { user, onSave } = renderForm();
    await user.clear(screen.getByLabelText('Due date'));
    await user.type(screen.getByLabelText('Finished width (inches)'), 'twelve');
    await user.click(screen.getByRole('button', { name: 'Save the round' }));

    expect(await screen.findByText('Give the block a title.')).toBeInTheDocument();
    expect(screen.getByText('Write the width in inches, like 12 or 12 1/2.')).toBeInTheDocument();
    expect(screen.getByText('Enter the finished height.')).toBeInTheDocument();
    expect(screen.getByText('Choose the date the blocks are due.')).toBeInTheDocument();
    expect(onSave).not.toHaveBeenCalled();
  });
});
