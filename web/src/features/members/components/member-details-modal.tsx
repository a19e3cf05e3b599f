import { Form, Formik } from 'formik';
import Button from 'react-bootstrap/Button';
import Modal from 'react-bootstrap/Modal';
import { CheckboxField, TextField } from '@/components/ui/form-fields';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import type { Member } from '../api/get-members';
import { memberDetailsSchema, type MemberDetailsValues } from '../api/paper-members';

type MemberDetailsModalProps = {
  member: Member | null;
  onHide: () => void;
  onSave: (member: Member, values: MemberDetailsValues) => Promise<unknown>;
};

/** An officer keeps the details of a member who does not sign in (she cannot keep them herself). */
export function MemberDetailsModal({ member, onHide, onSave }: MemberDetailsModalProps) {
  const titleId = 'member-details-title';
  const initialValues: MemberDetailsValues = {
    name: member?.name ?? '',
    email: member?.email ?? '',
    phone: member?.phone ?? '',
    town: member?.town ?? '',
    showEmail: member?.showEmail ?? false,
    showPhone: member?.showPhone ?? false,
    showTown: member?.showTown ?? false,
  };
  return (
    <Modal show={member !== null} onHide={onHide} aria-labelledby={titleId} centered>
      {member && (
        <Formik
          initialValues={initialValues}
          validationSchema={memberDetailsSchema}
          onSubmit={async (values, helpers) => {
            helpers.setStatus(undefined);
            try {
              await onSave(member, values);
              onHide();
            } catch (error) {
              applyServerErrors(error, helpers, values);
            }
          }}
        >
          <Form noValidate aria-labelledby={titleId}>
            <Modal.Header closeButton closeLabel="Close without saving">
              <Modal.Title id={titleId} as="h2" className="h4">
                Details for {member.name}
              </Modal.Title>
            </Modal.Header>
            <Modal.Body>
              <FormAlert />
              <TextField name="name" label="Her name" autoComplete="off" />
              <TextField name="email" type="email" inputMode="email" label="E-mail address" autoComplete="off" optional help="Leave it empty if she has none." />
              <TextField name="phone" type="tel" inputMode="tel" label="Phone number" autoComplete="off" optional />
              <TextField name="town" label="Town" autoComplete="off" optional />
              <fieldset className="mb-1">
                <legend className="form-label fs-6 fw-bold mb-1">Other members may see</legend>
                <CheckboxField name="showEmail" label="Her e-mail address" />
                <CheckboxField name="showPhone" label="Her phone number" />
                <CheckboxField name="showTown" label="Her town" />
              </fieldset>
            </Modal.Body>
            <Modal.Footer>
              <Button variant="outline-secondary" onClick={onHide}>
                Cancel
              </Button>
              <SubmitButton busyLabel="Saving">Save details</SubmitButton>
            </Modal.Footer>
          </Form>
        </Formik>
      )}
    </Modal>
  );
}
