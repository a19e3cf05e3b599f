import { FieldArray, getIn, useField, useFormikContext } from 'formik';
import { useEffect, useId, useRef } from 'react';
import Button from 'react-bootstrap/Button';
import Form from 'react-bootstrap/Form';
import { TextField } from '@/components/ui/form-fields';
import type { Swatch } from '../api/get-round';
import { MAX_SWATCHES } from '../api/save-round';

// Starting colours for new swatches; the queen changes them with the picker.
const STARTERS = ['#D94F3D', '#F2B134', '#3E8E5E', '#3A6EA5', '#8152A8', '#E27FA4', '#2B2B2B', '#A66B3A'];

function ColourInput({ name, label }: { name: string; label: string }) {
  const id = useId();
  const [field, meta] = useField<string>(name);
  const { submitCount } = useFormikContext();
  const error = meta.error && (meta.touched || submitCount > 0) ? String(meta.error) : undefined;
  const valueId = `${id}-value`;
  return (
    <Form.Group controlId={id} className="colour-input">
      <Form.Label>{label}</Form.Label>
      <div className="d-flex align-items-center gap-2">
        <Form.Control
          type="color"
          {...field}
          value={field.value || '#FFFFFF'}
          isInvalid={Boolean(error)}
          aria-invalid={error ? true : undefined}
          aria-describedby={error ? `${id}-error ${valueId}` : valueId}
        />
        <span id={valueId} className="text-body-secondary small">
          {(field.value || '').toUpperCase()}
        </span>
      </div>
      {error && (
        <div className="invalid-feedback d-block" id={`${id}-error`}>
          {error}
        </div>
      )}
    </Form.Group>
  );
}

/** The colours the queen asks for: up to 12, each a picked colour and a name in words. */
export function SwatchEditor({ name = 'swatches' }: { name?: string }) {
  const { values, errors, submitCount } = useFormikContext<Record<string, unknown>>();
  const swatches = (getIn(values, name) as Swatch[] | undefined) ?? [];
  const listError = getIn(errors, name);
  const focusIndex = useRef<number | null>(null);
  const rowRefs = useRef<(HTMLFieldSetElement | null)[]>([]);
  const addRef = useRef<HTMLButtonElement>(null);

  useEffect(() => {
    if (focusIndex.current === null) return;
    const index = focusIndex.current;
    focusIndex.current = null;
    if (index < 0) addRef.current?.focus();
    else rowRefs.current[index]?.querySelector<HTMLInputElement>('input[type="text"]')?.focus();
  }, [swatches.length]);

  return (
    <FieldArray name={name}>
      {(helpers) => (
        <div className="swatch-editor">
          {swatches.length === 0 && <p className="text-body-secondary">No colours yet. Makers choose freely.</p>}
          <ol className="plain-list swatch-rows" aria-label="Colours">
            {swatches.map((swatch, index) => (
              <li key={index}>
                <fieldset
                  className="swatch-row"
                  ref={(el) => {
                    rowRefs.current[index] = el;
                  }}
                >
                  <legend className="h6 mb-2">
                    <span className="swatch-chip me-2" style={{ backgroundColor: swatch.hex }} aria-hidden="true" />
                    Colour {index + 1}
                  </legend>
                  <div className="d-flex flex-wrap align-items-end column-gap-3">
                    <ColourInput name={`${name}.${index}.hex`} label={`Colour ${index + 1}`} />
                    <div className="flex-grow-1 swatch-name">
                      <TextField name={`${name}.${index}.name`} label={`Name of colour ${index + 1}`} autoComplete="off" className="mb-2" />
                    </div>
                    <Button
                      variant="outline-danger"
                      className="mb-2"
                      onClick={() => {
                        focusIndex.current = swatches.length > 1 ? Math.max(0, index - 1) : -1;
                        helpers.remove(index);
                      }}
                    >
                      Remove<span className="visually-hidden"> colour {index + 1}</span>
                    </Button>
                  </div>
                </fieldset>
              </li>
            ))}
          </ol>
          {typeof listError === 'string' && (submitCount > 0 || swatches.length > 0) && (
            <div className="invalid-feedback d-block mb-2">{listError}</div>
          )}
          <div className="d-flex flex-wrap align-items-center gap-3">
            <Button
              ref={addRef}
              variant="outline-primary"
              disabled={swatches.length >= MAX_SWATCHES}
              onClick={() => {
                focusIndex.current = swatches.length;
                helpers.push({ name: '', hex: STARTERS[swatches.length % STARTERS.length] });
              }}
            >
              Add a colour
            </Button>
            <span role="status" aria-live="polite" className="text-body-secondary">
              {swatches.length} of {MAX_SWATCHES} colours
              {swatches.length >= MAX_SWATCHES ? ' (the most a round can ask for)' : ''}
            </span>
          </div>
        </div>
      )}
    </FieldArray>
  );
}

/** The background colour: none, or one picked colour with a name. */
export function BackgroundEditor({ name = 'background' }: { name?: string }) {
  const { values, setFieldValue } = useFormikContext<Record<string, unknown>>();
  const background = getIn(values, name) as Swatch | null;
  const addRef = useRef<HTMLButtonElement>(null);
  const rowRef = useRef<HTMLFieldSetElement>(null);
  const focusNext = useRef<'add' | 'row' | null>(null);

  useEffect(() => {
    if (focusNext.current === 'add') addRef.current?.focus();
    if (focusNext.current === 'row') rowRef.current?.querySelector<HTMLInputElement>('input[type="text"]')?.focus();
    focusNext.current = null;
  }, [background === null]);

  if (!background) {
    return (
      <div className="mb-3">
        <p className="text-body-secondary mb-2">No background colour asked for.</p>
        <Button
          ref={addRef}
          variant="outline-primary"
          onClick={() => {
            focusNext.current = 'row';
            void setFieldValue(name, { name: '', hex: '#FFFFFF' });
          }}
        >
          Add a background colour
        </Button>
      </div>
    );
  }
  return (
    <fieldset className="swatch-row mb-3" ref={rowRef}>
      <legend className="h6 mb-2">
        <span className="swatch-chip me-2" style={{ backgroundColor: background.hex }} aria-hidden="true" />
        Background
      </legend>
      <div className="d-flex flex-wrap align-items-end column-gap-3">
        <ColourInput name={`${name}.hex`} label="Background colour" />
        <div className="flex-grow-1 swatch-name">
          <TextField name={`${name}.name`} label="Name of the background colour" autoComplete="off" className="mb-2" />
        </div>
        <Button
          variant="outline-danger"
          className="mb-2"
          onClick={() => {
            focusNext.current = 'add';
            void setFieldValue(name, null);
          }}
        >
          Remove<span className="visually-hidden"> the background colour</span>
        </Button>
      </div>
    </fieldset>
  );
}
