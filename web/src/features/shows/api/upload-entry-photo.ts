import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { entryPath } from './save-entry';
import { showQueryKey } from './show-path';
import type { Entry } from './types';

export const ENTRY_PHOTO_TYPES = ['image/jpeg', 'image/png'] as const;
export const ENTRY_PHOTO_MAX_BYTES = 20 * 1024 * 1024;

export const uploadEntryPhoto = (guildId: string, showId: string, entryId: number, photo: Blob) => {
  const form = new FormData();
  const name = photo instanceof File ? photo.name : photo.type === 'image/png' ? 'quilt.png' : 'quilt.jpg';
  form.append('photo', photo, name);
  return api.upload<Entry>(`${entryPath(guildId, showId, entryId)}/photo`, form);
};

export function useUploadEntryPhoto(guildId: string, showId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ entryId, photo }: { entryId: number; photo: Blob }) => uploadEntryPhoto(guildId, showId, entryId, photo),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: showQueryKey(guildId, showId) }),
  });
}
