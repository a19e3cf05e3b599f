import { Form, Formik } from 'formik';
import { TextField } from '@/components/ui/form-fields';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import { PASSWORD_MIN } from '@/lib/validation';
import { resetPasswordSchema, useResetPassword, type ResetPasswordValues } from '../api/reset-password';

export function ResetPasswordForm({ token, onDone }: { token: string; onDone: () => void }) {
  const reset = useResetPassword();
  const initialValues: ResetPasswordValues = { password: '', confirm: '' };
  return (
    <Formik
      initialValues={initialValues}
      validationSchema={resetPasswordSchema}
      onSubmit={async (values, helpers) => {
        helpers.setStatus(undefined);
        try {
          await reset.mutateAsync({ token, password: values.password });
          onDone();
        } catch (error) {
          applyServerErrors(error, helpers, values);
        }
      }}
    >
      <Form noValidate aria-label="Choose a new password">
        <FormAlert />
        <TextField
          name="password"
          type="password"
          label="New password"
          autoComplete="new-password"
          help={`At least ${PASSWORD_MIN} characters. A short sentence is easy to remember.`}
        />
        <TextField name="confirm" type="password" label="New password again" autoComplete="new-password" />
        <SubmitButton busyLabel="Saving">Save new password</SubmitButton>
      </Form>
    </Formik>
  );
}
