import { Form, Formik } from 'formik';
import { CheckboxGroupField, TextField } from '@/components/ui/form-fields';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import { ROLE_OPTIONS } from '@/config/roles';
import { createInvitationSchema, useCreateInvitation, type CreateInvitationValues } from '../api/create-invitation';

export function InviteMemberForm({ guildId, guildName }: { guildId: string; guildName: string }) {
  const create = useCreateInvitation(guildId);
  const initialValues: CreateInvitationValues = { email: '', roles: [] };
  return (
    <Formik
      initialValues={initialValues}
      validationSchema={createInvitationSchema}
      onSubmit={async (values, helpers) => {
        helpers.setStatus(undefined);
        try {
          await create.mutateAsync(values);
          helpers.resetForm({
            values: initialValues,
            status: { success: `Invitation sent to ${values.email.trim()}.` },
          });
        } catch (error) {
          applyServerErrors(error, helpers, values);
        }
      }}
    >
      <Form noValidate aria-label={`Invite a member to ${guildName}`}>
        <FormAlert />
        <TextField
          name="email"
          type="email"
          label="E-mail address"
          autoComplete="off"
          inputMode="email"
          help="We e-mail them a link to join. It works for a limited time."
        />
        <CheckboxGroupField name="roles" legend="Roles (optional)" options={ROLE_OPTIONS} />
        <SubmitButton busyLabel="Sending">Send invitation</SubmitButton>
      </Form>
    </Formik>
  );
}
