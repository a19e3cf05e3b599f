import { screen, waitFor } from '@testing-library/react';
import { Form, Formik } from 'formik';
import { describe, expect, it, vi } from 'vitest';
import * as yup from 'yup';
import { renderWithProviders } from '@/testing/test-utils';
import type { Swatch } from '../api/get-round';
import { roundSchema } from '../api/save-round';
import { BackgroundEditor, SwatchEditor } from './swatch-editor';

type Values = { swatches: Swatch[]; background: Swatch | null };

function renderEditor(initial: Partial<Values> = {}) {
  const onSubmit = vi.fn();
  const schema = yup.object({ swatches: roundSchema.fields.swatches, background: roundSchema.fields.background });
  const utils = renderWithProviders(
    <Formik<Values> initialValues={{ swatches: [], background: null, ...initial }} validationSchema={schema} onSubmit={onSubmit}>
      <Form>
        <SwatchEditor />
        <BackgroundEditor />
        <button type="submit">Done</button>
      </Form>
    </Formik>,
  );
  return { ...utils, onSubmit };
}

describe('SwatchEditor', () => {
  it('adds colours with a picker and a name, and sends them', async () => {
    const { user, onSubmit } = renderEditor();
    expect(screen.getByText('No colours yet. Makers choose freely.')).toBeInTheDocument();

    await user.click(screen.getByRole('button', { name: 'Add a colour' }));
    expect(screen.getByLabelText('Name of colour 1')).toHaveFocus();
    await user.type(screen.getByLabelText('Name of colour 1'), 'Sky blue');
    await user.click(screen.getByRole('button', { name: 'Add a colour' }));
    await user.type(screen.getByLabelText('Name of colour 2'), 'Lemon');

    const picker = screen.getByLabelText('Colour 1');
    expect(picker).toHaveAttribute('type', 'color');
    // Colour inputs have no typing; set the value as the browser's picker does.
    const { fireEvent } = await import('@testing-library/react');
    fireEvent.change(picker, { target: { value: '#87ceeb' } });
    expect(screen.getByText('#87CEEB')).toBeInTheDocument();
    expect(screen.getByRole('status')).toHaveTextContent('2 of 12 colours');

    await user.click(screen.getByRole('button', { name: 'Done' }));
    await waitFor(() => expect(onSubmit).toHaveBeenCalled());
    expect(onSubmit.mock.calls[0][0].swatches).toEqual([
      { name: 'Sky blue', hex: '#87ceeb' },
      { name: 'Lemon', hex: expect.stringMatching(/^#[0-9A-F]{6}$/i) },
    ]);
  });

  it('stops at 12 colours', async () => {
    const twelve = Array.from({ length: 12 }, (_, i) => ({ name: `Colour ${i}`, hex: '#112233' }));
    renderEditor({ swatches: twelve });
    expect(screen.getByRole('button', { name: 'Add a colour' })).toBeDisabled();
    expect(screen.getByRole('status')).toHaveTextContent('12 of 12 colours (the most a round can ask for)');
  });

  it('removes a colour and moves focus sensibly', async () => {
    const { user } = renderEditor({
      swatches: [
        { name: 'Red', hex: '#FF0000' },
        { name: 'Green', hex: '#00FF00' },
      ],
    });
    await user.click(screen.getByRole('button', { name: /Remove\s*colour 2/ }));
    expect(screen.queryByLabelText('Name of colour 2')).not.toBeInTheDocument();
    expect(screen.getByLabelText('Name of colour 1')).toHaveValue('Red');
    expect(screen.getByLabelText('Name of colour 1')).toHaveFocus();

    await user.click(screen.getByRole('button', { name: /Remove\s*colour 1/ }));
    expect(screen.getByRole('button', { name: 'Add a colour' })).toHaveFocus();
  });

  it('asks for a name for every colour', async () => {
    const { user, onSubmit } = renderEditor();
    await user.click(screen.getByRole('button', { name: 'Add a colour' }));
    await user.click(screen.getByRole('button', { name: 'Done' }));
    const name = screen.getByLabelText('Name of colour 1');
    await waitFor(() => expect(name).toHaveAttribute('aria-invalid', 'true'));
    expect(name).toHaveAccessibleDescription('Name the colour, for example “sky blue”.');
    expect(onSubmit).not.toHaveBeenCalled();
  });

  it('adds and removes a background colour', async () => {
    const { user, onSubmit } = renderEditor();
    await user.click(screen.getByRole('button', { name: 'Add a background colour' }));
    const name = screen.getByLabelText('Name of the background colour');
    expect(name).toHaveFocus();
    await user.type(name, 'Snow');
    expect(screen.getByLabelText('Background colour')).toHaveValue('#ffffff');
    await user.click(screen.getByRole('button', { name: 'Done' }));
    await waitFor(() => expect(onSubmit).toHaveBeenCalled());
    expect(onSubmit.mock.calls[0][0].background).toEqual({ name: 'Snow', hex: '#FFFFFF' });

    await user.click(screen.getByRole('button', { name: /Remove\s*the background colour/ }));
    expect(screen.getByRole('button', { name: 'Add a background colour' })).toHaveFocus();
  });
});
