import { useFormikContext } from 'formik';
import { useEffect, useRef } from 'react';
import Alert from 'react-bootstrap/Alert';
import type { FormStatus } from './server-errors';

/** The form's general message (from the server or a success note), plus focus on the first invalid field after a submit. */
export function FormAlert() {
  const { status, submitCount, isSubmitting, errors } = useFormikContext();
  const formStatus = status as FormStatus;
  const anchor = useRef<HTMLDivElement>(null);
  const handled = useRef(0);

  useEffect(() => {
    if (isSubmitting || submitCount === 0 || handled.current === submitCount) return;
    const form = anchor.current?.closest('form');
    if (!form) return;
    const hasErrors = Object.keys(errors).length > 0 || Boolean(formStatus?.error);
    if (!hasErrors) return;
    handled.current = submitCount;
    const invalid = form.querySelector<HTMLElement>('[aria-invalid="true"], .is-invalid');
    if (invalid) invalid.focus();
  }, [isSubmitting, submitCount, errors, formStatus]);

  return (
    <div ref={anchor}>
      {formStatus?.error && (
        <Alert variant="danger" className="mb-3">
          {formStatus.error}
        </Alert>
      )}
      {formStatus?.success && (
        <Alert variant="success" role="status" className="mb-3">
          {formStatus.success}
        </Alert>
      )}
    </div>
  );
}
