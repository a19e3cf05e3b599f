import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { rosterBody, type ColumnUse, type DateOrder, type RosterSource } from './roster-body';

export type InvitableMember = { membershipId: number; name: string; email: string; invited: boolean };

export type RosterImportResult = {
  counts: { created: number; updated: number; unchanged: number; skipped: number };
  skipped: { rowNumber: number; name: string; problems: string[] }[];
  toInvite: InvitableMember[];
};

export type ImportInput = { source: RosterSource; mapping: ColumnUse[]; dateOrder: DateOrder };

export const importRoster = (guildId: string, { source, mapping, dateOrder }: ImportInput) => {
  const path = `/guilds/${encodeURIComponent(guildId)}/roster-import`;
  const body = rosterBody(source, { mapping, dateOrder });
  return body instanceof FormData ? api.upload<RosterImportResult>(path, body) : api.post<RosterImportResult>(path, body);
};

export function useImportRoster(guildId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ImportInput) => importRoster(guildId, input),
    // The member directory now lists the imported members.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: ['guilds', guildId] }),
  });
}
