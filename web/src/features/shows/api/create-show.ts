import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ShowInput } from '../lib/show-form';
import { showQueryOptions } from './get-show';
import { showsPath, showsQueryKey } from './show-path';
import type { Show } from './types';

export const createShow = (guildId: string, input: ShowInput) => api.post<Show>(showsPath(guildId), input);

export function useCreateShow(guildId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ShowInput) => createShow(guildId, input),
    onSuccess: (show) => {
      queryClient.setQueryData(showQueryOptions(guildId, String(show.id)).queryKey, show);
      return queryClient.invalidateQueries({ queryKey: [...showsQueryKey(guildId), 'list'] });
    },
  });
}
