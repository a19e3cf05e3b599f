import { useMutation } from '@tanstack/react-query';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import { emailField } from '@/lib/validation';

export const forgotPasswordSchema = yup.object({ email: emailField() });
export type ForgotPasswordInput = yup.InferType<typeof forgotPasswordSchema>;

export const requestPasswordReset = (input: ForgotPasswordInput) => api.post<void>('/auth/forgot-password', input);

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}
