import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { duesPath, duesQueryKey } from './dues-path';

export type AuditEntry = { at: string; actor: string; action: string; summary: string };

export const getDuesAudit = (guildId: string, signal?: AbortSignal) => api.get<AuditEntry[]>(`${duesPath(guildId)}/audit`, signal);

export const duesAuditQueryOptions = (guildId: string) =>
  queryOptions({
    queryKey: [...duesQueryKey(guildId), 'audit'] as const,
    queryFn: ({ signal }) => getDuesAudit(guildId, signal),
  });

export function useDuesAudit(guildId: string) {
  return useQuery(duesAuditQueryOptions(guildId));
}
