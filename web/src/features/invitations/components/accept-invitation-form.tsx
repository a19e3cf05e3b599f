import { Form, Formik } from 'formik';
import { TextField } from '@/components/ui/form-fields';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import { PASSWORD_MIN } from '@/lib/validation';
import { acceptInvitationSchema, useAcceptInvitation, type AcceptInvitationValues } from '../api/accept-invitation';

/** For someone without an account yet: choose a name and password, then join. */
export function AcceptInvitationForm({ token, email, onAccepted }: { token: string; email: string; onAccepted: () => void }) {
  const accept = useAcceptInvitation(token);
  const initialValues: AcceptInvitationValues = { name: '', password: '', confirm: '' };
  return (
    <Formik
      initialValues={initialValues}
      validationSchema={acceptInvitationSchema}
      onSubmit={async (values, helpers) => {
        helpers.setStatus(undefined);
        try {
          await accept.mutateAsync({ name: values.name.trim(), password: values.password });
          onAccepted();
        } catch (error) {
          applyServerErrors(error, helpers, values);
        }
      }}
    >
      <Form noValidate aria-label="Create your account and join">
        <FormAlert />
        <p>
          You will sign in with <strong className="break-anywhere">{email}</strong>.
        </p>
        <TextField name="name" label="Your name" autoComplete="name" help="As your guild friends know you." />
        <TextField
          name="password"
          type="password"
          label="Choose a password"
          autoComplete="new-password"
          help={`At least ${PASSWORD_MIN} characters. A short sentence is easy to remember.`}
        />
        <TextField name="confirm" type="password" label="Password again" autoComplete="new-password" />
        <SubmitButton busyLabel="Joining">Create account and join</SubmitButton>
      </Form>
    </Formik>
  );
}
