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

export const getInbox = async (signal?: AbortSignal): Promise<InboxSummary[]> => {
  const data = await api.get<InboxResponse>('/dev/inbox', signal);
  const list = Array.isArray(data) ? data : (data?.messages ?? []);
  return list.map((m) => ({ ...m, id: String(m.id) }));
};

export const inboxQueryOptions = () =>
  queryOptions({
    queryKey: ['dev-inbox'] as const,
    queryFn: ({ signal }) => getInbox(signal),
    refetchInterval: env.inboxRefreshMs,
    staleTime: 0,
  });

export function useInbox(options: { enabled?: boolean } = {}) {
  return useQuery({ ...inboxQueryOptions(), ...options });
}
