import * as yup from 'yup';
import { emailField } from '@/lib/validation';

export const signInSchema = yup.object({
  email: emailField(),
  password: yup.string().required('Enter your password.'),
  remember: yup.boolean().default(false),
});

export type SignInValues = yup.InferType<typeof signInSchema>;
