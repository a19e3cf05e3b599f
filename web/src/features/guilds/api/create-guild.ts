import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export type NewGuildInput = { name: string; town: string; timeZone: string; currency: string; unit: 'in' | 'cm'; yearStartMonth: number };
export type NewGuild = NewGuildInput & { id: number; myRoles: string[]; myMembershipId: number };

export const createGuild = (input: NewGuildInput) => api.post<NewGuild>('/guilds', input);

/** Starts a guild with the signed-in person as its admin; the dashboard and nav pick it up. */
export function useCreateGuild() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createGuild,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['dashboard'] }),
  });
}
