import { useMutation, useQueryClient } from '@tanstack/react-query';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import { userQueryOptions } from '@/lib/auth';
import { emailField } from '@/lib/validation';
import { profileQueryOptions } from './get-profile';

export const changeEmailSchema = yup.object({
  email: emailField('Enter your new e-mail address.'),
  currentPassword: yup.string().required('Enter your current password.'),
});
export type ChangeEmailValues = yup.InferType<typeof changeEmailSchema>;

export const changeEmail = (input: ChangeEmailValues) =>
  api.post<unknown>('/profile/email', { email: input.email.trim(), currentPassword: input.currentPassword });

export function useChangeEmail() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: changeEmail,
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: profileQueryOptions().queryKey }),
        queryClient.invalidateQueries({ queryKey: userQueryOptions().queryKey }),
      ]),
  });
}
