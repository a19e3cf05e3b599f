import { Form, Formik } from 'formik';
import { CheckboxField, TextField } from '@/components/ui/form-fields';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import { paperMemberSchema, useAddPaperMember, type PaperMemberValues } from '../api/paper-members';

const initialValues: PaperMemberValues = { name: '', email: '', phone: '', town: '', memberSince: '', showPhone: false, showTown: false };

/** For an officer: a member who has no e-mail address (or will be invited later), kept on her behalf. */
export function AddPaperMemberForm({ guildId }: { guildId: string }) {
  const add = useAddPaperMember(guildId);
  return (
    <Formik
      initialValues={initialValues}
      validationSchema={paperMemberSchema}
      onSubmit={async (values, helpers) => {
        helpers.setStatus(undefined);
        try {
          const member = await add.mutateAsync(values);
          helpers.resetForm({
            values: initialValues,
            status: { success: `${member.name} is on the roster. You can mark her dues, bee blocks and show quilts for her.` },
          });
        } catch (error) {
          applyServerErrors(error, helpers, values);
        }
      }}
    >
      <Form noValidate aria-label="Add a member who has no e-mail">
        <FormAlert />
        <TextField name="name" label="Her name" autoComplete="off" />
        <TextField
          name="email"
          type="email"
          label="E-mail address"
          inputMode="email"
          autoComplete="off"
          optional
          help="Leave it empty if she has none. With an address you can invite her to sign in later."
        />
        <TextField name="phone" type="tel" inputMode="tel" label="Phone number" autoComplete="off" optional />
        <TextField name="town" label="Town" autoComplete="off" optional />
        <TextField name="memberSince" type="date" label="Member since" optional help="Leave it empty for today." />
        <fieldset className="mb-3">
          <legend className="form-label fs-6 fw-bold mb-1">Other members may see</legend>
          <CheckboxField name="showPhone" label="Her phone number" />
          <CheckboxField name="showTown" label="Her town" />
          <p className="form-text mb-0">Ask her first. Her name is always shown.</p>
        </fieldset>
        <SubmitButton busyLabel="Adding">Add her to the roster</SubmitButton>
      </Form>
    </Formik>
  );
}
