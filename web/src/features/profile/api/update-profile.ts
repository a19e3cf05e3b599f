import { useMutation, useQueryClient } from '@tanstack/react-query';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import { userQueryOptions } from '@/lib/auth';
import { profileQueryOptions, type Profile } from './get-profile';

export const updateProfileSchema = yup.object({
  name: yup.string().trim().required('Enter your name.').max(120, 'Keep your name under 120 characters.'),
});
export type UpdateProfileValues = yup.InferType<typeof updateProfileSchema>;

export const updateProfile = (input: UpdateProfileValues) =>
  api.patch<Profile | undefined>('/profile', { name: input.name.trim() });

export function useUpdateProfile() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateProfile,
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: profileQueryOptions().queryKey }),
        queryClient.invalidateQueries({ queryKey: userQueryOptions().queryKey }),
      ]),
  });
}
