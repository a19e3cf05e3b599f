import { useField, useFormikContext } from 'formik';
import { useId, type ReactNode } from 'react';
import Form from 'react-bootstrap/Form';

/**
 * The message for this field alone. Formik reads "makers.0" out of a list-wide message such as
 * "Add the other makers." as its first letter; a message met before the end of the path belongs to
 * the list, which shows it once, so the field has none.
 */
export function ownError(errors: unknown, name: string): string | undefined {
  let at: unknown = errors;
  for (const part of name.split('.')) {
    if (at === null || typeof at !== 'object') return undefined;
    at = (at as Record<string, unknown>)[part];
  }
  return typeof at === 'string' ? at : undefined;
}

function useFieldState(name: string) {
  const [field, meta, helpers] = useField(name);
  const { submitCount, errors } = useFormikContext();
  const own = ownError(errors, name);
  const error = own && (meta.touched || submitCount > 0) ? own : undefined;
  return { field, meta, helpers, error };
}

function describedBy(...ids: Array<string | false | undefined>) {
  const value = ids.filter(Boolean).join(' ');
  return value || undefined;
}

/**
 * The label, error and help around one control, with the ids the control needs for
 * aria-describedby. Text, textarea and select fields differ only in the control they render.
 */
function LabelledControl({
  name,
  label,
  help,
  optional,
  className = 'mb-3',
  children,
}: {
  name: string;
  label: ReactNode;
  help?: ReactNode;
  optional?: boolean;
  className?: string;
  children: (state: ReturnType<typeof useFieldState> & { a11y: Record<string, unknown>; errorId?: string; helpId?: string }) => ReactNode;
}) {
  const id = useId();
  const state = useFieldState(name);
  const helpId = help ? `${id}-help` : undefined;
  const errorId = state.error ? `${id}-error` : undefined;
  const a11y = {
    isInvalid: Boolean(state.error),
    'aria-invalid': state.error ? true : undefined,
  };
  return (
    <Form.Group className={className} controlId={id}>
      <Form.Label>
        {label}
        {optional && <span className="fw-normal text-body-secondary"> (optional)</span>}
      </Form.Label>
      {children({ ...state, a11y, errorId, helpId })}
      {state.error && (
        <Form.Control.Feedback type="invalid" id={errorId}>
          {state.error}
        </Form.Control.Feedback>
      )}
      {help && (
        <Form.Text id={helpId} className="d-block">
          {help}
        </Form.Text>
      )}
    </Form.Group>
  );
}

type TextFieldProps = {
  name: string;
  label: ReactNode;
  type?: 'text' | 'email' | 'password' | 'url' | 'date' | 'time' | 'month' | 'number' | 'tel';
  autoComplete?: string;
  help?: ReactNode;
  optional?: boolean;
  inputMode?: 'text' | 'email' | 'decimal' | 'numeric' | 'url' | 'tel';
  autoFocus?: boolean;
  min?: number | string;
  max?: number | string;
  step?: number | string;
  placeholder?: string;
  className?: string;
  /** Extra ids for aria-describedby, e.g. a live preview next to the field. */
  describedBy?: string;
};

export function TextField({ name, label, type = 'text', help, optional, className = 'mb-3', describedBy: extra, ...inputProps }: TextFieldProps) {
  return (
    <LabelledControl name={name} label={label} help={help} optional={optional} className={className}>
      {({ field, a11y, errorId, helpId }) => (
        <Form.Control
          {...field}
          {...inputProps}
          {...a11y}
          value={field.value ?? ''}
          type={type}
          aria-required={optional ? undefined : true}
          aria-describedby={describedBy(errorId, helpId, extra)}
        />
      )}
    </LabelledControl>
  );
}

type TextareaFieldProps = {
  name: string;
  label: ReactNode;
  help?: ReactNode;
  optional?: boolean;
  rows?: number;
  autoComplete?: string;
};

export function TextareaField({ name, label, help, optional, rows = 4, autoComplete }: TextareaFieldProps) {
  return (
    <LabelledControl name={name} label={label} help={help} optional={optional}>
      {({ field, a11y, errorId, helpId }) => (
        <Form.Control
          as="textarea"
          rows={rows}
          {...field}
          {...a11y}
          value={field.value ?? ''}
          autoComplete={autoComplete}
          aria-required={optional ? undefined : true}
          aria-describedby={describedBy(errorId, helpId)}
        />
      )}
    </LabelledControl>
  );
}

type RadioGroupFieldProps = {
  name: string;
  legend: ReactNode;
  options: readonly Option[];
  help?: ReactNode;
  inline?: boolean;
};

export function RadioGroupField({ name, legend, options, help, inline }: RadioGroupFieldProps) {
  const id = useId();
  const { field, helpers, error } = useFieldState(name);
  const helpId = help ? `${id}-help` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  return (
    <fieldset className="mb-3" aria-describedby={describedBy(errorId, helpId)}>
      <legend className="form-label fs-6 fw-bold mb-1">{legend}</legend>
      {help && (
        <Form.Text id={helpId} className="d-block mb-1">
          {help}
        </Form.Text>
      )}
      <div className={inline ? 'd-flex flex-wrap column-gap-4' : undefined}>
        {options.map((option) => (
          <Form.Check key={option.value} id={`${id}-${option.value}`}>
            <Form.Check.Input
              type="radio"
              name={name}
              value={option.value}
              checked={field.value === option.value}
              onChange={() => void helpers.setValue(option.value)}
              onBlur={() => void helpers.setTouched(true)}
              isInvalid={Boolean(error)}
            />
            <Form.Check.Label>{option.label}</Form.Check.Label>
          </Form.Check>
        ))}
      </div>
      {error && (
        <div className="invalid-feedback d-block" id={errorId}>
          {error}
        </div>
      )}
    </fieldset>
  );
}

type CheckboxFieldProps = {
  name: string;
  label: ReactNode;
  help?: ReactNode;
};

export function CheckboxField({ name, label, help }: CheckboxFieldProps) {
  const id = useId();
  const [field] = useField({ name, type: 'checkbox' });
  const { error } = useFieldState(name);
  const helpId = help ? `${id}-help` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  return (
    <div className="mb-3">
      <Form.Check id={id}>
        <Form.Check.Input
          {...field}
          type="checkbox"
          isInvalid={Boolean(error)}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy(errorId, helpId)}
        />
        <Form.Check.Label>{label}</Form.Check.Label>
      </Form.Check>
      {error && (
        <div className="invalid-feedback d-block" id={errorId}>
          {error}
        </div>
      )}
      {help && (
        <Form.Text id={helpId} className="d-block">
          {help}
        </Form.Text>
      )}
    </div>
  );
}

export type Option = { value: string; label: string };

type CheckboxGroupFieldProps = {
  name: string;
  legend: ReactNode;
  options: readonly Option[];
  help?: ReactNode;
};

export function CheckboxGroupField({ name, legend, options, help }: CheckboxGroupFieldProps) {
  const id = useId();
  const { field, helpers, error } = useFieldState(name);
  const selected: string[] = Array.isArray(field.value) ? field.value : [];
  const helpId = help ? `${id}-help` : undefined;
  const errorId = error ? `${id}-error` : undefined;

  const toggle = (value: string, checked: boolean) => {
    const next = checked ? [...selected, value] : selected.filter((v) => v !== value);
    // Keep the order of the options so payloads are stable.
    void helpers.setValue(options.map((o) => o.value).filter((v) => next.includes(v)));
  };

  return (
    <fieldset className="mb-3" aria-describedby={describedBy(errorId, helpId)}>
      <legend className="form-label fs-6 fw-bold mb-1">{legend}</legend>
      {help && (
        <Form.Text id={helpId} className="d-block mb-1">
          {help}
        </Form.Text>
      )}
      {options.map((option) => (
        <Form.Check key={option.value} id={`${id}-${option.value}`}>
          <Form.Check.Input
            type="checkbox"
            name={name}
            value={option.value}
            checked={selected.includes(option.value)}
            onChange={(e) => toggle(option.value, e.currentTarget.checked)}
            onBlur={() => void helpers.setTouched(true)}
            isInvalid={Boolean(error)}
          />
          <Form.Check.Label>{option.label}</Form.Check.Label>
        </Form.Check>
      ))}
      {error && (
        <div className="invalid-feedback d-block" id={errorId}>
          {error}
        </div>
      )}
    </fieldset>
  );
}

type SelectFieldProps = {
  name: string;
  label: ReactNode;
  options: readonly Option[];
  help?: ReactNode;
  placeholder?: string;
};

export function SelectField({ name, label, options, help, placeholder }: SelectFieldProps) {
  return (
    <LabelledControl name={name} label={label} help={help}>
      {({ field, a11y, errorId, helpId }) => (
        <Form.Select {...field} {...a11y} value={field.value ?? ''} aria-describedby={describedBy(errorId, helpId)}>
          {placeholder && <option value="">{placeholder}</option>}
          {options.map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
        </Form.Select>
      )}
    </LabelledControl>
  );
}
