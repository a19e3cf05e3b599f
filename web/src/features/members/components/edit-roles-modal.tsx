import { Form, Formik } from 'formik';
import Button from 'react-bootstrap/Button';
import Modal from 'react-bootstrap/Modal';
import { CheckboxGroupField } from '@/components/ui/form-fields';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import { ROLE_OPTIONS, ROLES, type Role } from '@/config/roles';
import type { Member } from '../api/get-members';
import { memberRolesSchema, type MemberRolesValues } from '../api/update-member-roles';

type EditRolesModalProps = {
  member: Member | null;
  onHide: () => void;
  onSave: (member: Member, roles: Role[]) => Promise<unknown>;
};

export function EditRolesModal({ member, onHide, onSave }: EditRolesModalProps) {
  const titleId = 'edit-roles-title';
  const initialValues: MemberRolesValues = {
    roles: (member?.roles ?? []).filter((r): r is Role => (ROLES as readonly string[]).includes(r)),
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
              await onSave(member, values.roles);
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
