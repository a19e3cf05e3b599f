import { fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import type { RosterPreview } from '../api/preview-roster';
import { countsText, PreviewStep } from './preview-step';

const preview: RosterPreview = {
  delimiter: 'comma',
  header: ['Full name', 'E-mail', 'Joined'],
  mapping: ['name', 'email', 'memberSince'],
  guessed: true,
  mappingProblem: null,
  dateOrder: 'dmy',
  counts: { rows: 3, new: 12, update: 3, unchanged: 40, problems: 2 },
  page: 1,
  pageCount: 1,
  pageSize: 100,
  onlyProblems: false,
  rows: [
    {
      rowNumber: 2,
      values: { name: 'Agatha Pinwheel', email: 'agatha@example.org', phone: null, town: 'Brackenby', household: null, memberSince: '2015-09-01', paidThrough: null, roles: ['treasurer'] },
      problems: [],
      action: 'new',
      existingAccount: false,
      changes: [],
    },
    {
      rowNumber: 3,
      values: { name: 'Edna Broadcloth', email: null, phone: null, town: null, household: null, memberSince: null, paidThrough: null, roles: [] },
      problems: ['“not-an-address” is not an e-mail address (like name@example.org).'],
      action: 'skip',
      existingAccount: false,
      changes: [],
    },
  ],
};

function renderStep(overrides: Partial<Parameters<typeof PreviewStep>[0]> = {}) {
  const props = {
    preview,
    busy: false,
    error: null,
    onChoicesChange: vi.fn(),
    onPage: vi.fn(),
    onOnlyProblems: vi.fn(),
    onImport: vi.fn().mockResolvedValue(undefined),
    onStartOver: vi.fn(),
    ...overrides,
  };
  render(<PreviewStep {...props} />);
  return props;
}

describe('the roster preview', () => {
  it('says plainly what importing would do and how many it imports', () => {
    renderStep();
    expect(screen.getByTestId('roster-counts')).toHaveTextContent('12 new, 3 to update, 40 unchanged, 2 with problems (will be skipped)');
    expect(screen.getByRole('button', { name: 'Import 15 members' })).toBeInTheDocument();
    expect(countsText({ rows: 1, new: 1, update: 0, unchanged: 0, problems: 0 })).toBe('1 new, 0 to update, 0 unchanged, 0 with problems (will be skipped)');
  });

  it('shows each row, with its problems highlighted, as a table and as cards for phones', () => {
    renderStep();
    const table = screen.getByRole('table');
    const edna = within(table).getByText('Edna Broadcloth').closest('tr')!;
    expect(edna).toHaveClass('table-danger');
    expect(within(edna).getByText(/is not an e-mail address/)).toBeInTheDocument();
    const cards = screen.getByRole('list', { name: 'Rows of the file' });
    expect(within(cards).getByText('Row 3: Edna Broadcloth')).toBeInTheDocument();
    expect(within(cards).getByRole('list', { name: 'Problems on row 3' })).toHaveTextContent('is not an e-mail address');
    expect(within(cards).getByText('Row 2: Agatha Pinwheel').closest('li')).toHaveTextContent('Treasurer');
  });

  it('asks for a fresh preview when a column or the date order changes, and imports with the choices', async () => {
    const props = renderStep();
    fireEvent.change(screen.getByLabelText('Column 3: “Joined”'), { target: { value: 'paidThrough' } });
    await waitFor(() => expect(props.onChoicesChange).toHaveBeenCalledWith({ mapping: ['name', 'email', 'paidThrough'], dateOrder: 'dmy' }));
    fireEvent.click(screen.getByLabelText('Month first: 3/4/2026 is March 4, 2026'));
    await waitFor(() => expect(props.onChoicesChange).toHaveBeenLastCalledWith({ mapping: ['name', 'email', 'paidThrough'], dateOrder: 'mdy' }));
    fireEvent.click(screen.getByRole('button', { name: 'Import 15 members' }));
    await waitFor(() => expect(props.onImport).toHaveBeenCalledWith({ mapping: ['name', 'email', 'paidThrough'], dateOrder: 'mdy' }));
  });

  it('asks which column holds the names when it cannot guess', () => {
    renderStep({ preview: { ...preview, mappingProblem: 'Choose which column holds the names.', rows: [], counts: { rows: 0, new: 0, update: 0, unchanged: 0, problems: 0 } } });
    expect(screen.getByRole('alert')).toHaveTextContent('Choose which column holds the names.');
    expect(screen.queryByRole('button', { name: /^Import/ })).not.toBeInTheDocument();
  });
});
