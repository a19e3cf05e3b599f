import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { guildQueryOptions } from './get-guild';

export type Member = {
  membershipId: number | string;
  name: string;
  roles: string[];
  /** Officers (admin, membership chair) see these always; other members when the person chose to show them. */
  email?: string | null;
  /** Officers only: false until she has chosen a password (kept on paper, or not signed in yet). */
  signsIn?: boolean;
  showEmail?: boolean;
  showPhone?: boolean;
  showTown?: boolean;
  phone?: string | null;
  town?: string | null;
  status?: string;
  joinedAt?: string | null;
  /** Officers only: when she left, whether she asked to be erased, and whether she was. */
  leftAt?: string | null;
  eraseRequestedAt?: string | null;
  erased?: boolean;
};

type MembersResponse = { members: Member[] } | Member[];

export const getMembers = async (guildId: string, signal?: AbortSignal): Promise<Member[]> => {
  const data = await api.get<MembersResponse>(`/guilds/${encodeURIComponent(guildId)}/members`, signal);
  return Array.isArray(data) ? data : (data?.members ?? []);
};

export const membersQueryOptions = (guildId: string) =>
  queryOptions({
    queryKey: [...guildQueryOptions(guildId).queryKey, 'members'] as const,
    queryFn: ({ signal }) => getMembers(guildId, signal),
  });

export function useMembers(guildId: string) {
  return useQuery(membersQueryOptions(guildId));
}
