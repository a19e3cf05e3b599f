import { CheckboxField, TextField } from '@/components/ui/form-fields';
import { FormModal } from '@/components/ui/form-modal';
import type { Member } from '../api/get-members';
import { memberDetailsSchema, type MemberDetailsValues } from '../api/paper-members';

type MemberDetailsModalProps = {
  member: Member | null;
  onHide: () => void;
  onSave: (member: Member, values: MemberDetailsValues) => Promise<unknown>;
};

/** An officer keeps the details of a member who does not sign in (she cannot keep them herself). */
export function MemberDetailsModal({ member, onHide, onSave }: MemberDetailsModalProps) {
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
    <FormModal
      show={member !== null}
      onHide={onHide}
      titleId="member-details-title"
      title={<>Details for {member?.name}</>}
      initialValues={initialValues}
      validationSchema={memberDetailsSchema}
      onSubmit={(values) => onSave(member!, values)}
      submitLabel="Save details"
    >
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
    </FormModal>
  );
}
