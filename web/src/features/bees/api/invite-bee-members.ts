import { useMutation, useQueryClient } from '@tanstack/react-query';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import { beePath, beeQueryOptions } from './get-bee';

export const inviteBeeMembersSchema = yup.object({
  membershipIds: yup.array(yup.string().required()).min(1, 'Tick at least one member to invite.').required(),
});
export type InviteBeeMembersValues = { membershipIds: string[] };

export const inviteBeeMembers = (guildId: string, beeId: string, membershipIds: number[]) =>
  api.post<unknown>(`${beePath(guildId, beeId)}/invitations`, { membershipIds });

export function useInviteBeeMembers(guildId: string, beeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (membershipIds: number[]) => inviteBeeMembers(guildId, beeId, membershipIds),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: beeQueryOptions(guildId, beeId).queryKey }),
  });
}
