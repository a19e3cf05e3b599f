import { useMutation, useQueryClient } from '@tanstack/react-query';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import type { Term } from './get-offices';
import { invalidateOffices } from './invalidate';

export type TermDatesValues = { startsOn: string; endsOn: string; note: string };

export const termDatesSchema = yup.object({
  startsOn: yup.string().required('Choose the first day in office.'),
  endsOn: yup
    .string()
    .default('')
    .test('after-start', 'Access must end after the first day in office.', function (value) {
      return !value || !this.parent.startsOn || value > this.parent.startsOn;
    }),
  note: yup.string().max(300, 'Keep the note to 300 characters.').default(''),
});

export type UpdateTermInput = { startsOn?: string; endsOn?: string | null; note?: string };

export const updateTerm = (guildId: string, termId: number, input: UpdateTermInput) =>
  api.patch<Term>(`/guilds/${encodeURIComponent(guildId)}/offices/terms/${encodeURIComponent(String(termId))}`, input);

export function useUpdateTerm(guildId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ termId, ...input }: UpdateTermInput & { termId: number }) => updateTerm(guildId, termId, input),
    onSuccess: () => invalidateOffices(queryClient, guildId),
  });
}
