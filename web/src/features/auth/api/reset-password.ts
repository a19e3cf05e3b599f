import { useMutation } from '@tanstack/react-query';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import { confirmPasswordField, newPasswordField } from '@/lib/validation';

export const resetPasswordSchema = yup.object({
  password: newPasswordField(),
  confirm: confirmPasswordField('password'),
});
export type ResetPasswordValues = yup.InferType<typeof resetPasswordSchema>;

export type ResetPasswordInput = { token: string; password: string };

export const resetPassword = (input: ResetPasswordInput) => api.post<void>('/auth/reset-password', input);

export function useResetPassword() {
  return useMutation({ mutationFn: resetPassword });
}
