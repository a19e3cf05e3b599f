import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { EntryInput } from '../lib/entry-form';
import { showPath, showQueryKey } from './show-path';
import type { Entry } from './types';

export const entryPath = (guildId: string, showId: string, entryId: number | string) =>
  `${showPath(guildId, showId)}/entries/${encodeURIComponent(String(entryId))}`;

export const createEntry = (guildId: string, showId: string, input: EntryInput) => api.post<Entry>(`${showPath(guildId, showId)}/entries`, input);

/** A chair's change may also move the entry (categoryId) or number it (entryNumber, null to clear). */
export type EntryPatch = Partial<EntryInput> & { entryNumber?: number | null };

export const updateEntry = (guildId: string, showId: string, entryId: number | string, input: EntryPatch) =>
  api.patch<Entry>(entryPath(guildId, showId, entryId), input);

export function useCreateEntry(guildId: string, showId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: EntryInput) => createEntry(guildId, showId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: showQueryKey(guildId, showId) }),
  });
}

export function useUpdateEntry(guildId: string, showId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ entryId, input }: { entryId: number | string; input: EntryPatch }) => updateEntry(guildId, showId, entryId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: showQueryKey(guildId, showId) }),
  });
}
