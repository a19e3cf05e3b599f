import { Form, Formik } from 'formik';
import { TextField } from '@/components/ui/form-fields';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import { forgotPasswordSchema, useRequestPasswordReset, type ForgotPasswordInput } from '../api/forgot-password';

export function ForgotPasswordForm({ onSent }: { onSent: (email: string) => void }) {
  const request = useRequestPasswordReset();
  const initialValues: ForgotPasswordInput = { email: '' };
  return (
    <Formik
      initialValues={initialValues}
      validationSchema={forgotPasswordSchema}
      onSubmit={async (values, helpers) => {
        helpers.setStatus(undefined);
        try {
          await request.mutateAsync({ email: values.email.trim() });
          onSent(values.email.trim());
        } catch (error) {
          applyServerErrors(error, helpers, values);
        }
      }}
    >
      <Form noValidate aria-label="Request a password reset link">
        <FormAlert />
        <TextField name="email" type="email" label="E-mail address" autoComplete="email" inputMode="email" />
        <SubmitButton busyLabel="Sending">Send me a reset link</SubmitButton>
      </Form>
    </Formik>
  );
}
