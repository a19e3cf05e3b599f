import { useMutation, useQueryClient } from '@tanstack/react-query';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import { isFreeKind } from '../lib/labels';
import { centsToInput, moneyToCents } from '../lib/money';
import { moneyField } from '../lib/money-field';
import { duesPath, duesQueryKey } from './dues-path';
import type { DuesPlan, PlanKind } from './get-dues-plans';

export type PlanValues = {
  name: string;
  kind: PlanKind | '';
  yearly: string;
  /** Formik turns what is typed in a number box into a number. */
  minAge: string | number;
  maxAge: string | number;
  active: boolean;
};

export type PlanInput = {
  name: string;
  kind: PlanKind;
  yearlyCents: number;
  minAge?: number | null;
  maxAge?: number | null;
  active: boolean;
};

const age = (label: string) =>
  yup
    .number()
    .transform((value, original) => (typeof original === 'string' && original.trim() === '' ? undefined : value))
    .typeError(`Enter the ${label} as a whole number of years, or leave it empty.`)
    .integer(`Enter the ${label} as a whole number of years.`)
    .min(0, `The ${label} cannot be below 0.`)
    .max(150, `The ${label} is at most 150.`);

export const planSchema = (currency: string) =>
  yup.object({
    name: yup.string().trim().required('Give the plan a name.').max(80, 'Keep the name under 80 characters.'),
    kind: yup
      .string()
      .oneOf(['standard', 'household', 'lifetime', 'honorary'], 'Choose what kind of plan it is.')
      .required('Choose what kind of plan it is.'),
    yearly: yup.string().when('kind', {
      is: (kind: string) => isFreeKind(kind),
      then: (s) => s.strip(),
      otherwise: () =>
        moneyField(currency, {
          required: 'Enter the dues for one year.',
          min: 1,
          minMessage: 'Yearly dues must be more than 0. For members who pay nothing, choose honorary.',
        }),
    }),
    minAge: age('lowest age'),
    maxAge: age('highest age').test('above-min', 'The highest age must not be below the lowest age.', (value, context) => {
      const min = context.parent.minAge;
      return value === undefined || min === undefined || min === null || value >= min;
    }),
    active: yup.boolean(),
  });

export const EMPTY_PLAN_VALUES: PlanValues = { name: '', kind: '', yearly: '', minAge: '', maxAge: '', active: true };

export const toPlanValues = (plan: DuesPlan, currency: string): PlanValues => ({
  name: plan.name,
  kind: plan.kind,
  yearly: isFreeKind(plan.kind) ? '' : centsToInput(plan.yearlyCents, currency),
  minAge: plan.minAge === null || plan.minAge === undefined ? '' : String(plan.minAge),
  maxAge: plan.maxAge === null || plan.maxAge === undefined ? '' : String(plan.maxAge),
  active: plan.active,
});

const optionalNumber = (value: string | number) => (String(value).trim() === '' ? null : Number(value));

export const toPlanInput = (values: PlanValues, currency: string): PlanInput => ({
  name: values.name.trim(),
  kind: values.kind as PlanKind,
  yearlyCents: isFreeKind(values.kind) ? 0 : moneyToCents(values.yearly, currency),
  minAge: optionalNumber(values.minAge),
  maxAge: optionalNumber(values.maxAge),
  active: values.active,
});

export const PLAN_FIELD_MAP = { yearlyCents: 'yearly' } as const;

export const createDuesPlan = (guildId: string, input: PlanInput) => api.post<DuesPlan>(`${duesPath(guildId)}/plans`, input);

export function useCreateDuesPlan(guildId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: PlanInput) => createDuesPlan(guildId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: duesQueryKey(guildId) }),
  });
}
