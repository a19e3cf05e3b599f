import { useMutation, useQueryClient } from '@tanstack/react-query';
import * as yup from 'yup';
import { isMonth } from '@/lib/dates';
import { api } from '@/lib/api-client';
import type { Bee } from './get-bee';
import { beesPath, beesQueryOptions, type Handover } from './get-bees';

export type CreateBeeValues = {
  name: string;
  description: string;
  handover: Handover | '';
  startMonth: string;
  months: string;
};

export const createBeeSchema = yup.object({
  name: yup.string().trim().required('Give the bee a name.').max(120, 'Keep the name under 120 characters.'),
  description: yup.string().trim().max(2000, 'Keep the description under 2,000 characters.'),
  handover: yup.string().oneOf(['mail', 'meeting'], 'Choose how blocks are handed over.').required('Choose how blocks are handed over.'),
  startMonth: yup
    .string()
    .trim()
    .required('Choose the first month.')
    .test('month', 'Write the month as year and month, like 2027-01.', (v) => !v || isMonth(v)),
  months: yup
    .number()
    .transform((value, original) => (original === '' ? undefined : value))
    .typeError('Enter a number from 1 to 24.')
    .required('Enter how many months the bee runs.')
    .integer('Enter a whole number of months.')
    .min(1, 'A bee runs for at least 1 month.')
    .max(24, 'A bee runs for at most 24 months.'),
});

export type CreateBeeInput = {
  name: string;
  description?: string;
  handover: Handover;
  startMonth: string;
  months: number;
};

export const toCreateBeeInput = (values: CreateBeeValues): CreateBeeInput => ({
  name: values.name.trim(),
  ...(values.description.trim() ? { description: values.description.trim() } : {}),
  handover: values.handover as Handover,
  startMonth: values.startMonth.trim(),
  months: Number(values.months),
});

export const createBee = (guildId: string, input: CreateBeeInput) => api.post<Bee>(beesPath(guildId), input);

export function useCreateBee(guildId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateBeeInput) => createBee(guildId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: beesQueryOptions(guildId).queryKey }),
  });
}
