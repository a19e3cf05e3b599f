import { Form, Formik } from 'formik';
import { Link } from 'react-router-dom';
import { CheckboxField, TextField } from '@/components/ui/form-fields';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import { paths } from '@/config/paths';
import { useSignIn, type User } from '@/lib/auth';
import { signInSchema, type SignInValues } from '../api/sign-in-schema';

type SignInFormProps = {
  onSuccess: (user: User) => void;
  initialEmail?: string;
};

export function SignInForm({ onSuccess, initialEmail = '' }: SignInFormProps) {
  const signIn = useSignIn();
  const initialValues: SignInValues = { email: initialEmail, password: '', remember: false };

  return (
    <Formik
      initialValues={initialValues}
      validationSchema={signInSchema}
      onSubmit={async (values, helpers) => {
        helpers.setStatus(undefined);
        try {
          const { user } = await signIn.mutateAsync({
            email: values.email.trim(),
            password: values.password,
            remember: values.remember,
          });
          onSuccess(user);
        } catch (error) {
          applyServerErrors(error, helpers, values);
          helpers.setFieldValue('password', '', false);
        }
      }}
    >
      <Form noValidate aria-label="Sign in">
        <FormAlert />
        <TextField name="email" type="email" label="E-mail address" autoComplete="email" inputMode="email" />
        <TextField name="password" type="password" label="Password" autoComplete="current-password" />
        <CheckboxField name="remember" label="Keep me signed in on this device" />
        <div className="d-flex flex-wrap align-items-center gap-3">
          <SubmitButton busyLabel="Signing in">Sign in</SubmitButton>
          <Link to={paths.forgotPassword.getHref()} className="tap-link">
            Forgot your password?
          </Link>
        </div>
      </Form>
    </Formik>
  );
}
