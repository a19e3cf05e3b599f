import { useMutation, useQueryClient } from '@tanstack/react-query';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import type { Term } from './get-offices';
import { invalidateOffices } from './invalidate';

export type HandoverValues = { role: string; fromMembershipId: string; toMembershipId: string; on: string };

export const handoverSchema = yup.object({
  role: yup.string().required('Choose the office.'),
  fromMembershipId: yup.string().required('Choose who hands the office over.'),
  toMembershipId: yup
    .string()
    .required('Choose who takes the office on.')
    .test('not-same', 'Choose someone other than the outgoing officer.', function (value) {
      return !value || value !== this.parent.fromMembershipId;
    }),
  on: yup.string().required('Choose the day of the handover.'),
});

export type HandoverInput = { role: string; fromMembershipId: number; toMembershipId: number; on: string };
export type HandoverResult = { ended: Term; started: Term };

export const handOver = (guildId: string, input: HandoverInput) =>
  api.post<HandoverResult>(`/guilds/${encodeURIComponent(guildId)}/offices/handover`, input);

export function useHandOver(guildId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: HandoverInput) => handOver(guildId, input),
    onSuccess: () => invalidateOffices(queryClient, guildId),
  });
}
