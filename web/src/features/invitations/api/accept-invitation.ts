import { useMutation, useQueryClient } from '@tanstack/react-query';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import { useSetSignedInUser, type User } from '@/lib/auth';
import { confirmPasswordField, newPasswordField } from '@/lib/validation';
import { invitationQueryOptions } from './get-invitation';

export const acceptInvitationSchema = yup.object({
  name: yup.string().trim().required('Enter your name.').max(120, 'Keep your name under 120 characters.'),
  password: newPasswordField(),
  confirm: confirmPasswordField('password'),
});
export type AcceptInvitationValues = yup.InferType<typeof acceptInvitationSchema>;

export type AcceptInvitationBody = { name: string; password: string } | Record<string, never>;
type AcceptInvitationResponse = { user?: User } | undefined;

export const acceptInvitation = (token: string, body: AcceptInvitationBody) =>
  api.post<AcceptInvitationResponse>(`/invitations/${encodeURIComponent(token)}/accept`, body);

export function useAcceptInvitation(token: string) {
  const queryClient = useQueryClient();
  const setSignedInUser = useSetSignedInUser();
  return useMutation({
    mutationFn: (body: AcceptInvitationBody) => acceptInvitation(token, body),
    onSuccess: (data) => {
      setSignedInUser(data?.user);
      queryClient.removeQueries({ queryKey: invitationQueryOptions(token).queryKey });
    },
  });
}
