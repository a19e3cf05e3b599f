import { Form, Formik, type FormikValues } from 'formik';
import type { ReactNode } from 'react';
import Button from 'react-bootstrap/Button';
import Modal from 'react-bootstrap/Modal';
import { FormAlert } from './form-alert';
import { applyServerErrors } from './server-errors';
import { SubmitButton } from './submit-button';

type FormModalProps<T extends FormikValues> = {
  show: boolean;
  onHide: () => void;
  /** Ties the dialog and its form to the title for screen readers; unique on the page. */
  titleId: string;
  title: ReactNode;
  initialValues: T;
  validationSchema?: unknown;
  /** Saves; the dialog closes when it resolves and shows the server's errors when it throws. */
  onSubmit: (values: T) => Promise<unknown>;
  submitLabel: string;
  busyLabel?: string;
  children: ReactNode;
};

/** A dialog holding one form: title, fields, the server's message, Cancel and the save button. */
export function FormModal<T extends FormikValues>({
  show,
  onHide,
  titleId,
  title,
  initialValues,
  validationSchema,
  onSubmit,
  submitLabel,
  busyLabel = 'Saving',
  children,
}: FormModalProps<T>) {
  return (
    <Modal show={show} onHide={onHide} aria-labelledby={titleId} centered>
      {show && (
        <Formik<T>
          initialValues={initialValues}
          validationSchema={validationSchema}
          onSubmit={async (values, helpers) => {
            helpers.setStatus(undefined);
            try {
              await onSubmit(values);
              onHide();
            } catch (error) {
              applyServerErrors(error, helpers, values);
            }
          }}
        >
          <Form noValidate aria-labelledby={titleId}>
            <Modal.Header closeButton closeLabel="Close without saving">
              <Modal.Title id={titleId} as="h2" className="h4">
                {title}
              </Modal.Title>
            </Modal.Header>
            <Modal.Body>
              <FormAlert />
              {children}
            </Modal.Body>
            <Modal.Footer>
              <Button variant="outline-secondary" onClick={onHide}>
                Cancel
              </Button>
              <SubmitButton busyLabel={busyLabel}>{submitLabel}</SubmitButton>
            </Modal.Footer>
          </Form>
        </Formik>
      )}
    </Modal>
  );
}
