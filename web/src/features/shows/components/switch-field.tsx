import { useField } from 'formik';
import { useId, type ReactNode } from 'react';
import Form from 'react-bootstrap/Form';

/** An on/off setting: a checkbox drawn as a switch, with its label and help beside it. */
export function SwitchField({ name, label, help, disabled }: { name: string; label: ReactNode; help?: ReactNode; disabled?: boolean }) {
  const id = useId();
  const [field] = useField({ name, type: 'checkbox' });
  const helpId = help ? `${id}-help` : undefined;
  return (
    <div className="mb-3">
      <Form.Check type="switch" id={id} className="show-switch">
        <Form.Check.Input {...field} type="checkbox" role="switch" disabled={disabled} aria-describedby={helpId} />
        <Form.Check.Label>{label}</Form.Check.Label>
      </Form.Check>
      {help && (
        <Form.Text id={helpId} className="d-block">
          {help}
        </Form.Text>
      )}
    </div>
  );
}
