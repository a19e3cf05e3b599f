import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import * as yup from 'yup';
import { api } from '@/lib/api-client';

export type DirectoryDetails = { phone: string | null; town: string | null; showEmail: boolean; showPhone: boolean; showTown: boolean };
export type DirectoryValues = { phone: string; town: string; showEmail: boolean; showPhone: boolean; showTown: boolean };

const key = ['profile', 'directory'] as const;

export const directorySchema = yup.object({
  phone: yup
    .string()
    .trim()
    .matches(/^(\+?[0-9 ()./-]{5,40})?$/, 'Write a phone number with digits, spaces and + ( ) - only, like +1 555 0142.'),
  town: yup.string().trim().max(120, 'Use at most 120 characters.'),
});

export function useDirectoryDetails() {
  return useQuery({ queryKey: key, queryFn: ({ signal }) => api.get<DirectoryDetails>('/profile/directory', signal) });
}

export function useSaveDirectoryDetails() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (v: DirectoryValues) => api.put<DirectoryDetails>('/profile/directory', { ...v, phone: v.phone.trim() || null, town: v.town.trim() || null }),
    onSuccess: (data) => {
      queryClient.setQueryData(key, data);
      return queryClient.invalidateQueries({ queryKey: ['guilds'] });
    },
  });
}
