import * as yup from 'yup';

export const PASSWORD_MIN = 10;

export const emailField = (required = 'Enter your e-mail address.') =>
  yup.string().trim().required(required).email('Enter an e-mail address like name@example.com.');

export const newPasswordField = (required = 'Choose a password.') =>
  yup.string().required(required).min(PASSWORD_MIN, `Use at least ${PASSWORD_MIN} characters.`);

export const confirmPasswordField = (other: string) =>
  yup
    .string()
    .required('Type the password again.')
    .oneOf([yup.ref(other)], 'The two passwords do not match.');
