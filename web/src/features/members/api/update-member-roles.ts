import { useMutation, useQueryClient, type QueryKey } from '@tanstack/react-query';
import * as yup from 'yup';
import { ROLES, type Role } from '@/config/roles';
import { api } from '@/lib/api-client';
import { guildQueryOptions } from './get-guild';
import { membersQueryOptions } from './get-members';

export const memberRolesSchema = yup.object({
  roles: yup.array(yup.string().oneOf(ROLES).required()).default([]),
});
export type MemberRolesValues = { roles: Role[] };

export const updateMemberRoles = (guildId: string, membershipId: string | number, roles: Role[]) =>
  api.patch<unknown>(`/guilds/${encodeURIComponent(guildId)}/members/${encodeURIComponent(String(membershipId))}/roles`, {
    roles,
  });

/** `alsoInvalidate`: keys of other features' queries that show roles (passed in by the route). */
export function useUpdateMemberRoles(guildId: string, alsoInvalidate: readonly QueryKey[] = []) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ membershipId, roles }: { membershipId: string | number; roles: Role[] }) =>
      updateMemberRoles(guildId, membershipId, roles),
    onSuccess: async () => {
      await Promise.all([
        queryClient.invalidateQueries({ queryKey: membersQueryOptions(guildId).queryKey }),
        // My own roles may have changed too.
        queryClient.invalidateQueries({ queryKey: guildQueryOptions(guildId).queryKey, exact: true }),
        ...alsoInvalidate.map((queryKey) => queryClient.invalidateQueries({ queryKey })),
      ]);
    },
  });
}
