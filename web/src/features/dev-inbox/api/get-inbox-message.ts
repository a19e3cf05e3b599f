import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { InboxSummary } from './get-inbox';

export type InboxMessage = InboxSummary & {
  html?: string | null;
  text?: string | null;
};

export const getInboxMessage = (id: string, signal?: AbortSignal) =>
  api.get<InboxMessage>(`/dev/inbox/${encodeURIComponent(id)}`, signal);

export const inboxMessageQueryOptions = (id: string) =>
  queryOptions({
    queryKey: ['dev-inbox', 'message', id] as const,
    queryFn: ({ signal }) => getInboxMessage(id, signal),
    staleTime: Infinity,
  });

export function useInboxMessage(id: string | null) {
  return useQuery({ ...inboxMessageQueryOptions(id ?? ''), enabled: Boolean(id) });
}

/** Links found in the plain-text part, in order, without duplicates. */
export function extractLinks(text: string | null | undefined): string[] {
  if (!text) return [];
  const found = text.match(/https?:\/\/[^\s<>"')\]]+/g) ?? [];
  return [...new Set(found.map((url) => url.replace(/[.,;:!?]+$/, '')))];
}
