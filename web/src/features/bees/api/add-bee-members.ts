import { useMutation, useQueryClient } from '@tanstack/react-query';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import { beePath, beeQueryOptions } from './get-bee';

export const addBeeMembersSchema = yup.object({
  membershipIds: yup.array(yup.string().required()).min(1, 'Tick at least one member to add.').required(),
});
export type AddBeeMembersValues = { membershipIds: string[] };

/** The organiser adds members who do not sign in straight to the bee as makers. */
export const addBeeMembers = (guildId: string, beeId: string, membershipIds: number[]) =>
  api.post<unknown>(`${beePath(guildId, beeId)}/members`, { membershipIds });

export function useAddBeeMembers(guildId: string, beeId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (membershipIds: number[]) => addBeeMembers(guildId, beeId, membershipIds),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: beeQueryOptions(guildId, beeId).queryKey }),
  });
}
