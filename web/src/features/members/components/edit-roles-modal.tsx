import { Form, Formik } from 'formik';
import Button from 'react-bootstrap/Button';
import Modal from 'react-bootstrap/Modal';
import { CheckboxGroupField, TextField } from '@/components/ui/form-fields';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import { ROLE_OPTIONS, ROLES, type Role } from '@/config/roles';
import type { Member } from '../api/get-members';
import { memberRolesSchema, type MemberRolesValues } from '../api/update-member-roles';

type EditRolesModalProps = {
  member: Member | null;
  onHide: () => void;
  /** endsOn: for roles being added, the day her access ends ('' = no end date). */
  onSave: (member: Member, roles: Role[], endsOn: string) => Promise<unknown>;
};

export function EditRolesModal({ member, onHide, onSave }: EditRolesModalProps) {
  const titleId = 'edit-roles-title';
  const initialValues: MemberRolesValues = {
    roles: (member?.roles ?? []).filter((r): r is Role => (ROLES as readonly string[]).includes(r)),
    endsOn: '',
  };
  return (
    <Modal show={member !== null} onHide={onHide} aria-labelledby={titleId} centered>
      {member && (
        <Formik
          initialValues={initialValues}
          validationSchema={memberRolesSchema}
          onSubmit={async (values, helpers) => {
            helpers.setStatus(undefined);
            try {
              await onSave(member, values.roles, values.endsOn);
              onHide();
            } catch (error) {
              applyServerErrors(error, helpers, values);
            }
          }}
        >
          <Form noValidate aria-labelledby={titleId}>
            <Modal.Header closeButton closeLabel="Close without saving">
              <Modal.Title id={titleId} as="h2" className="h4">
                Roles for {member.name}
              </Modal.Title>
            </Modal.Header>
            <Modal.Body>
              <FormAlert />
              <CheckboxGroupField
                name="roles"
                legend="Roles"
                help="Everyone is a member; roles add officer duties on top."
                options={ROLE_OPTIONS}
              />
              <TextField
                name="endsOn"
                label="Access ends on"
                type="date"
                optional
                help="Only for roles you tick now. From the start of this day she can no longer act in that role. Leave it empty if there is no end date."
              />
            </Modal.Body>
            <Modal.Footer>
              <Button variant="outline-secondary" onClick={onHide}>
                Cancel
              </Button>
              <SubmitButton busyLabel="Saving">Save roles</SubmitButton>
            </Modal.Footer>
          </Form>
        </Formik>
      )}
    </Modal>
  );
}
