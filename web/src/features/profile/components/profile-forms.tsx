import { Form, Formik } from 'formik';
import { TextField } from '@/components/ui/form-fields';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import { PASSWORD_MIN } from '@/lib/validation';
import { changeEmailSchema, useChangeEmail, type ChangeEmailValues } from '../api/change-email';
import { changePasswordSchema, useChangePassword, type ChangePasswordValues } from '../api/change-password';
import { updateProfileSchema, useUpdateProfile, type UpdateProfileValues } from '../api/update-profile';

export function NameForm({ name }: { name: string }) {
  const update = useUpdateProfile();
  const initialValues: UpdateProfileValues = { name };
  return (
    <Formik
      initialValues={initialValues}
      enableReinitialize
      validationSchema={updateProfileSchema}
      onSubmit={async (values, helpers) => {
        helpers.setStatus(undefined);
        try {
          await update.mutateAsync(values);
          helpers.setStatus({ success: 'Your name has been saved.' });
        } catch (error) {
          applyServerErrors(error, helpers, values);
        }
      }}
    >
      <Form noValidate aria-label="Your name">
        <FormAlert />
        <TextField name="name" label="Name" autoComplete="name" help="Other members of your guilds see this name." />
        <SubmitButton busyLabel="Saving">Save name</SubmitButton>
      </Form>
    </Formik>
  );
}

export function ChangeEmailForm({ currentEmail }: { currentEmail?: string }) {
  const change = useChangeEmail();
  const initialValues: ChangeEmailValues = { email: '', currentPassword: '' };
  return (
    <Formik
      initialValues={initialValues}
      validationSchema={changeEmailSchema}
      onSubmit={async (values, helpers) => {
        helpers.setStatus(undefined);
        try {
          await change.mutateAsync(values);
          helpers.resetForm({
            values: initialValues,
            status: { success: `Your e-mail address is now ${values.email.trim()}.` },
          });
        } catch (error) {
          applyServerErrors(error, helpers, values);
          helpers.setFieldValue('currentPassword', '', false);
        }
      }}
    >
      <Form noValidate aria-label="Change e-mail address">
        <FormAlert />
        {currentEmail && (
          <p>
            You sign in with <strong className="break-anywhere">{currentEmail}</strong>.
          </p>
        )}
        <TextField name="email" type="email" label="New e-mail address" autoComplete="email" inputMode="email" />
        <TextField
          name="currentPassword"
          type="password"
          label="Current password"
          autoComplete="current-password"
          help="To make sure it is really you."
        />
        <SubmitButton busyLabel="Saving">Change e-mail address</SubmitButton>
      </Form>
    </Formik>
  );
}

export function ChangePasswordForm() {
  const change = useChangePassword();
  const initialValues: ChangePasswordValues = { currentPassword: '', newPassword: '', confirm: '' };
  return (
    <Formik
      initialValues={initialValues}
      validationSchema={changePasswordSchema}
      onSubmit={async (values, helpers) => {
        helpers.setStatus(undefined);
        try {
          await change.mutateAsync({ currentPassword: values.currentPassword, newPassword: values.newPassword });
          helpers.resetForm({ values: initialValues, status: { success: 'Your password has been changed.' } });
        } catch (error) {
          applyServerErrors(error, helpers, values);
        }
      }}
    >
      <Form noValidate aria-label="Change password">
        <FormAlert />
        <TextField name="currentPassword" type="password" label="Current password" autoComplete="current-password" />
        <TextField
          name="newPassword"
          type="password"
          label="New password"
          autoComplete="new-password"
          help={`At least ${PASSWORD_MIN} characters.`}
        />
        <TextField name="confirm" type="password" label="New password again" autoComplete="new-password" />
        <SubmitButton busyLabel="Saving">Change password</SubmitButton>
      </Form>
    </Formik>
  );
}
