import { useMutation, useQueryClient } from '@tanstack/react-query';
import * as yup from 'yup';
import { ROLES, type Role } from '@/config/roles';
import { api } from '@/lib/api-client';
import { emailField } from '@/lib/validation';
import { guildInvitationsQueryOptions, type PendingInvitation } from './get-guild-invitations';

export const createInvitationSchema = yup.object({
  email: emailField('Enter the e-mail address to invite.'),
  roles: yup.array(yup.string().oneOf(ROLES).required()).default([]),
});
export type CreateInvitationValues = { email: string; roles: Role[] };

export const createInvitation = (guildId: string, input: CreateInvitationValues) =>
  api.post<PendingInvitation | undefined>(`/guilds/${encodeURIComponent(guildId)}/invitations`, {
    email: input.email.trim(),
    roles: input.roles,
  });

export function useCreateInvitation(guildId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateInvitationValues) => createInvitation(guildId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: guildInvitationsQueryOptions(guildId).queryKey }),
  });
}
