import { useMutation, useQueryClient, type QueryKey } from '@tanstack/react-query';
import * as yup from 'yup';
import { ROLES, type Role } from '@/config/roles';
import { api } from '@/lib/api-client';
import { guildQueryOptions } from './get-guild';
import { membersQueryOptions } from './get-members';

export const memberRolesSchema = yup.object({
  roles: yup.array(yup.string().oneOf(ROLES).required()).default([]),
  endsOn: yup.string().default(''),
});
/** endsOn: for roles being added, the day her access ends ('' = no end date). */
export type MemberRolesValues = { roles: Role[]; endsOn: string };

export const updateMemberRoles = (guildId: string, membershipId: string | number, roles: Role[], endsOn?: string) =>
  api.patch<unknown>(`/guilds/${encodeURIComponent(guildId)}/members/${encodeURIComponent(String(membershipId))}/roles`, {
    roles,
    ...(endsOn ? { endsOn } : {}),
  });

/** `alsoInvalidate`: keys of other features' queries that show roles (passed in by the route). */
export function useUpdateMemberRoles(guildId: string, alsoInvalidate: readonly QueryKey[] = []) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ membershipId, roles, endsOn }: { membershipId: string | number; roles: Role[]; endsOn?: string }) =>
      updateMemberRoles(guildId, membershipId, roles, endsOn),
    onSuccess: async () => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: membersQueryOptions(guildId).queryKey }),
        // My own roles may have changed too.
        queryClient.invalidateQueries({ queryKey: guildQueryOptions(guildId).queryKey, exact: true }),
        // Terms changed too (the Officers page).
        queryClient.invalidateQueries({ queryKey: [...guildQueryOptions(guildId).queryKey, 'offices'] }),
        ...alsoInvalidate.map((queryKey) => queryClient.invalidateQueries({ queryKey })),
      ]);
    },
  });
}
