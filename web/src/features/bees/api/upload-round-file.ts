import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { roundPath, roundQueryOptions, type RoundFile } from './get-round';

export const ROUND_FILE_TYPES = ['application/pdf', 'image/png', 'image/jpeg', 'image/gif', 'image/webp'] as const;
export const ROUND_FILE_MAX_BYTES = 20 * 1024 * 1024;

export const uploadRoundFile = (guildId: string, beeId: string, month: string, file: File) => {
  const form = new FormData();
  form.append('file', file);
  return api.upload<RoundFile>(`${roundPath(guildId, beeId, month)}/files`, form);
};

export function useUploadRoundFile(guildId: string, beeId: string, month: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (file: File) => uploadRoundFile(guildId, beeId, month, file),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: roundQueryOptions(guildId, beeId, month).queryKey }),
  });
}
