import { queryOptions, useQuery } from '@tanstack/react-query';
import { env } from '@/config/env';
import { api } from '@/lib/api-client';

/** The SMTP fake may hand back addresses as a string, a list, or parsed address objects. */
export type RawAddress = string | { address?: string; name?: string; text?: string } | RawAddress[] | null | undefined;

export type InboxSummary = {
  id: string;
  to: RawAddress;
  from?: RawAddress;
  subject: string;
  receivedAt?: string;
  date?: string;
};

export const messageDate = (m: Pick<InboxSummary, 'receivedAt' | 'date'>) => m.receivedAt ?? m.date ?? '';

type InboxResponse = { messages: InboxSummary[] } | InboxSummary[];

export function formatAddress(value: RawAddress): string {
  if (!value) return '';
  if (typeof value === 'string') return value;
  if (Array.isArray(value)) return value.map(formatAddress).filter(Boolean).join(', ');
  return value.text ?? value.address ?? value.name ?? '';
}

export const getInbox = async (to: string, signal?: AbortSignal): Promise<InboxSummary[]> => {
  const query = to ? `?to=${encodeURIComponent(to)}` : '';
  const data = await api.get<InboxResponse>(`/dev/inbox${query}`, signal);
  const list = Array.isArray(data) ? data : (data?.messages ?? []);
  return list.map((m) => ({ ...m, id: String(m.id) }));
};

export const inboxQueryOptions = (to = '') =>
  queryOptions({
    queryKey: ['dev-inbox', 'list', to] as const,
    queryFn: ({ signal }) => getInbox(to, signal),
    refetchInterval: env.inboxRefreshMs,
    staleTime: 0,
  });

export function useInbox(to: string, options: { enabled?: boolean } = {}) {
  return useQuery({ ...inboxQueryOptions(to), ...options });
}
