import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { roundPath, roundQueryOptions } from './get-round';

export const roundFileHref = (guildId: string, beeId: string, month: string, fileId: number) =>
  `/api${roundPath(guildId, beeId, month)}/files/${encodeURIComponent(String(fileId))}`;

export const deleteRoundFile = (guildId: string, beeId: string, month: string, fileId: number) =>
  api.delete(`${roundPath(guildId, beeId, month)}/files/${encodeURIComponent(String(fileId))}`);

export function useDeleteRoundFile(guildId: string, beeId: string, month: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (fileId: number) => deleteRoundFile(guildId, beeId, month, fileId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: roundQueryOptions(guildId, beeId, month).queryKey }),
  });
}
