import { Form, Formik } from 'formik';
import Button from 'react-bootstrap/Button';
import Modal from 'react-bootstrap/Modal';
import { TextareaField, TextField } from '@/components/ui/form-fields';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import type { Term } from '../api/get-offices';
import { termDatesSchema, type TermDatesValues, type UpdateTermInput } from '../api/update-term';

type TermDatesModalProps = {
  term: Term | null;
  onHide: () => void;
  onSave: (term: Term, input: UpdateTermInput) => Promise<unknown>;
};

/** "Set term dates": the first day in office, the day access ends (optional) and a note. */
export function TermDatesModal({ term, onHide, onSave }: TermDatesModalProps) {
  const titleId = 'term-dates-title';
  return (
    <Modal show={term !== null} onHide={onHide} aria-labelledby={titleId} centered>
      {term && (
        <Formik<TermDatesValues>
          initialValues={{ startsOn: term.startsOn, endsOn: term.endsOn ?? '', note: term.note }}
          validationSchema={termDatesSchema}
          onSubmit={async (values, helpers) => {
            helpers.setStatus(undefined);
            try {
              await onSave(term, { startsOn: values.startsOn, endsOn: values.endsOn || null, note: values.note.trim() });
              onHide();
            } catch (error) {
              applyServerErrors(error, helpers, values);
            }
          }}
        >
          <Form noValidate aria-labelledby={titleId}>
            <Modal.Header closeButton closeLabel="Close without saving">
              <Modal.Title id={titleId} as="h2" className="h4">
                {term.roleLabel}: {term.name}
              </Modal.Title>
            </Modal.Header>
            <Modal.Body>
              <FormAlert />
              <TextField name="startsOn" label="First day in office" type="date" />
              <TextField
                name="endsOn"
                label="Access ends on"
                type="date"
                optional
                help="She can no longer act in this office from the start of this day. Leave it empty if there is no end date."
              />
              <TextareaField name="note" label="Note" optional rows={2} />
            </Modal.Body>
            <Modal.Footer>
              <Button variant="outline-secondary" onClick={onHide}>
                Cancel
              </Button>
              <SubmitButton busyLabel="Saving">Save dates</SubmitButton>
            </Modal.Footer>
          </Form>
        </Formik>
      )}
    </Modal>
  );
}
