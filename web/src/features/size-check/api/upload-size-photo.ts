import { useMutation, useQueryClient, type QueryKey } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { blockPath, invalidateSizeChecks, type SizeCheck } from './get-size-checks';

export const PHOTO_TYPES = ['image/jpeg', 'image/png'] as const;
export const PHOTO_MAX_BYTES = 20 * 1024 * 1024;

export type RulerUnit = 'in' | 'cm';

export type SizePhotoInput = {
  photo: Blob;
  /** What her ruler reads for the card's long bar; left out, the api reuses her last reading. */
  rulerReading?: string;
  rulerUnit: RulerUnit;
};

export const uploadSizePhoto = (guildId: string, beeId: string, month: string, membershipId: number, input: SizePhotoInput) => {
  const form = new FormData();
  // Text fields first, so the server has them before the file streams in.
  const reading = input.rulerReading?.trim();
  if (reading) form.append('rulerReading', reading);
  form.append('rulerUnit', input.rulerUnit);
  const name = input.photo instanceof File ? input.photo.name : input.photo.type === 'image/png' ? 'block.png' : 'block.jpg';
  form.append('photo', input.photo, name);
  return api.upload<SizeCheck>(`${blockPath(guildId, beeId, month, membershipId)}/photos`, form);
};

/** `alsoInvalidate`: other queries that show the latest check, such as the round page. */
export function useUploadSizePhoto(
  guildId: string,
  beeId: string,
  month: string,
  membershipId: number,
  alsoInvalidate: readonly QueryKey[] = [],
) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SizePhotoInput) => uploadSizePhoto(guildId, beeId, month, membershipId, input),
    onSuccess: () => invalidateSizeChecks(queryClient, { guildId, beeId, month, membershipId }, alsoInvalidate),
  });
}
