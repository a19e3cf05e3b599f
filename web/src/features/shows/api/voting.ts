import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { showQueryOptions } from './get-show';
import { showPath, showQueryKey } from './show-path';
import type { Show } from './types';

export const openVoting = (guildId: string, showId: string) => api.post<Show>(`${showPath(guildId, showId)}/voting/open`);
export const closeVoting = (guildId: string, showId: string) => api.post<Show>(`${showPath(guildId, showId)}/voting/close`);

/** Opens or closes voting now; the show comes back with its new state. */
export function useSetVoting(guildId: string, showId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (action: 'open' | 'close') => (action === 'open' ? openVoting(guildId, showId) : closeVoting(guildId, showId)),
    onSuccess: (show) => {
      queryClient.setQueryData(showQueryOptions(guildId, showId).queryKey, show);
      return queryClient.invalidateQueries({ queryKey: showQueryKey(guildId, showId) });
    },
  });
}
