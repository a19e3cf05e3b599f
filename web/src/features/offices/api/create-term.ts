import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Term } from './get-offices';
import { invalidateOffices } from './invalidate';

export type CreateTermInput = { membershipId: number; role: string; startsOn: string; endsOn?: string | null; note?: string };

export const createTerm = (guildId: string, input: CreateTermInput) =>
  api.post<Term>(`/guilds/${encodeURIComponent(guildId)}/offices/terms`, input);

export function useCreateTerm(guildId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateTermInput) => createTerm(guildId, input),
    onSuccess: () => invalidateOffices(queryClient, guildId),
  });
}
