import { useMutation, useQueryClient } from '@tanstack/react-query';
import * as yup from 'yup';
import { api } from '@/lib/api-client';
import { moneyField } from '../lib/money-field';
import { moneyToCents } from '../lib/money';
import { duesPath, duesQueryKey } from './dues-path';

export type RecordPaymentValues = {
  membershipId: string;
  planId: string;
  method: 'cash' | 'cheque' | '';
  chequeNumber: string;
  amount: string;
  receivedOn: string;
};

export type RecordPaymentInput = {
  membershipId: number;
  planId: number;
  method: 'cash' | 'cheque';
  chequeNumber?: string;
  amountCents: number;
  receivedOn: string;
};

/** What the api answers; only the receipt number is shown, and only when it is there. */
export type RecordedPayment = { invoiceId?: number; receiptNumber?: string | null };

export const recordPaymentSchema = (currency: string, today: string) =>
  yup.object({
    membershipId: yup.string().required('Choose the member who paid.'),
    planId: yup.string().required('Choose the plan she paid for.'),
    method: yup.string().oneOf(['cash', 'cheque'], 'Choose cash or cheque.').required('Choose cash or cheque.'),
    chequeNumber: yup
      .string()
      .trim()
      .max(40, 'Keep the cheque number under 40 characters.')
      .when('method', {
        is: 'cheque',
        then: (s) => s.required('Enter the number printed on the cheque.'),
      }),
    amount: moneyField(currency, { required: 'Enter the amount received.', min: 1, minMessage: 'The amount must be more than nothing.' }),
    receivedOn: yup
      .string()
      .required('Enter the day the money was received.')
      .matches(/^\d{4}-\d{2}-\d{2}$/, 'Write the date like 2026-09-15.')
      .test('not-future', 'The day cannot be in the future.', (v) => !v || v <= today),
  });

export const toRecordPaymentInput = (values: RecordPaymentValues, currency: string): RecordPaymentInput => ({
  membershipId: Number(values.membershipId),
  planId: Number(values.planId),
  method: values.method as 'cash' | 'cheque',
  ...(values.method === 'cheque' ? { chequeNumber: values.chequeNumber.trim() } : {}),
  amountCents: moneyToCents(values.amount, currency),
  receivedOn: values.receivedOn,
});

export const recordPayment = (guildId: string, input: RecordPaymentInput) =>
  api.post<RecordedPayment | undefined>(`${duesPath(guildId)}/payments`, input);

export function useRecordPayment(guildId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: RecordPaymentInput) => recordPayment(guildId, input),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: duesQueryKey(guildId) }),
  });
}
