import { CheckboxGroupField, TextField } from '@/components/ui/form-fields';
import { FormModal } from '@/components/ui/form-modal';
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
  const initialValues: MemberRolesValues = {
    roles: (member?.roles ?? []).filter((r): r is Role => (ROLES as readonly string[]).includes(r)),
    endsOn: '',
  };
  return (
    <FormModal
      show={member !== null}
      onHide={onHide}
      titleId="edit-roles-title"
      title={<>Roles for {member?.name}</>}
      initialValues={initialValues}
      validationSchema={memberRolesSchema}
      onSubmit={(values) => onSave(member!, values.roles, values.endsOn)}
      submitLabel="Save roles"
    >
      <CheckboxGroupField name="roles" legend="Roles" help="Everyone is a member; roles add officer duties on top." options={ROLE_OPTIONS} />
      <TextField
        name="endsOn"
        label="Access ends on"
        type="date"
        optional
        help="Only for roles you tick now. From the start of this day she can no longer act in that role. Leave it empty if there is no end date."
      />
    </FormModal>
  );
}
