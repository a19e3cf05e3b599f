import { useMutation } from '@tanstack/react-query';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import { confirmPasswordField, newPasswordField } from '@/lib/validation';

export const changePasswordSchema = yup.object({
  currentPassword: yup.string().required('Enter your current password.'),
  newPassword: newPasswordField('Choose a new password.'),
  confirm: confirmPasswordField('newPassword'),
});
export type ChangePasswordValues = yup.InferType<typeof changePasswordSchema>;

export const changePassword = (input: Pick<ChangePasswordValues, 'currentPassword' | 'newPassword'>) =>
  api.post<unknown>('/profile/password', input);

export function useChangePassword() {
  return useMutation({ mutationFn: changePassword });
}
