import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { showPath, showQueryKey } from './show-path';
import type { Entry, EntryStatus } from './types';

const entriesPath = (guildId: string, showId: string) => `${showPath(guildId, showId)}/entries`;

/** Her own entries (or, for a chair who entered for someone, those too, as the api decides). */
export const getMyEntries = (guildId: string, showId: string, signal?: AbortSignal) =>
  api.get<Entry[]>(`${entriesPath(guildId, showId)}/mine`, signal);

export const myEntriesQueryOptions = (guildId: string, showId: string) =>
  queryOptions({
    queryKey: [...showQueryKey(guildId, showId), 'entries', 'mine'] as const,
    queryFn: ({ signal }) => getMyEntries(guildId, showId, signal),
  });

export function useMyEntries(guildId: string, showId: string, options: { enabled?: boolean } = {}) {
  return useQuery({ ...myEntriesQueryOptions(guildId, showId), ...options });
}

/** Every entry, for the chair; `status` empty for all. */
export const getEntries = (guildId: string, showId: string, status: EntryStatus | '' = '', signal?: AbortSignal) =>
  api.get<Entry[]>(`${entriesPath(guildId, showId)}${status ? `?status=${encodeURIComponent(status)}` : ''}`, signal);

export const entriesQueryOptions = (guildId: string, showId: string, status: EntryStatus | '' = '') =>
  queryOptions({
    queryKey: [...showQueryKey(guildId, showId), 'entries', 'all', status] as const,
    queryFn: ({ signal }) => getEntries(guildId, showId, status, signal),
  });

export function useEntries(guildId: string, showId: string, status: EntryStatus | '' = '', options: { enabled?: boolean } = {}) {
  return useQuery({ ...entriesQueryOptions(guildId, showId, status), placeholderData: keepPreviousData, ...options });
}
