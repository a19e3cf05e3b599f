import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ShowInput } from '../lib/show-form';
import { showQueryOptions } from './get-show';
import { showPath, showsQueryKey } from './show-path';
import type { Show } from './types';

export const updateShow = (guildId: string, showId: string, input: Partial<ShowInput>) => api.patch<Show>(showPath(guildId, showId), input);

export function useUpdateShow(guildId: string, showId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: Partial<ShowInput>) => updateShow(guildId, showId, input),
    onSuccess: (show) => {
      queryClient.setQueryData(showQueryOptions(guildId, showId).queryKey, show);
      return queryClient.invalidateQueries({ queryKey: [...showsQueryKey(guildId), 'list'] });
    },
  });
}
