import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { beePath, beeQueryOptions, type Bee } from './get-bee';

export type SetRotationInput = { mode: 'shuffle'; seed?: string } | { mode: 'manual'; order: number[] };

export const setRotation = (guildId: string, beeId: string, input: SetRotationInput) =>
  api.post<Bee>(`${beePath(guildId, beeId)}/rotation`, input);

/** A fresh seed for "Shuffle again". */
export function newSeed(): string {
  const bytes = new Uint32Array(2);
  crypto.getRandomValues(bytes);
  return Array.from(bytes, (b) => b.toString(36)).join('');
}

export function useSetRotation(guildId: string, beeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SetRotationInput) => setRotation(guildId, beeId, input),
    onSuccess: (bee) => {
      if (bee && typeof bee === 'object' && 'rotation' in bee) queryClient.setQueryData(beeQueryOptions(guildId, beeId).queryKey, bee);
      return queryClient.invalidateQueries({ queryKey: beeQueryOptions(guildId, beeId).queryKey });
    },
  });
}
