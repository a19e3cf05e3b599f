import { Form, Formik, useFormikContext } from 'formik';
import { useEffect, useRef } from 'react';
import { RadioGroupField, SelectField, TextField } from '@/components/ui/form-fields';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import { payablePlans, type DuesPlan } from '../api/get-dues-plans';
import type { RosterRow } from '../api/get-roster';
import {
  recordPaymentSchema,
  toRecordPaymentInput,
  type RecordedPayment,
  type RecordPaymentInput,
  type RecordPaymentValues,
} from '../api/record-payment';
import { centsToInput, formatMoney } from '../lib/money';

type RecordPaymentFormProps = {
  members: RosterRow[];
  plans: DuesPlan[];
  currency: string;
  /** Today in the guild's time zone, "YYYY-MM-DD". */
  today: string;
  /** Chosen in advance, e.g. from the roster's "Record a payment" link. */
  membershipId?: string;
  onRecord: (input: RecordPaymentInput) => Promise<RecordedPayment | undefined>;
};

const METHOD_CHOICES = [
  { value: 'cash', label: 'Cash' },
  { value: 'cheque', label: 'Cheque' },
] as const;

/** When she picks a plan, fill in its price unless an amount was typed by hand. */
function PlanPrice({ plans, currency }: { plans: DuesPlan[]; currency: string }) {
  const { values, setFieldValue } = useFormikContext<RecordPaymentValues>();
  const filled = useRef<string>('');
  useEffect(() => {
    const plan = plans.find((p) => String(p.id) === values.planId);
    if (!plan) return;
    const price = centsToInput(plan.yearlyCents, currency);
    if (values.amount === '' || values.amount === filled.current) {
      filled.current = price;
      if (values.amount !== price) void setFieldValue('amount', price, false);
    }
    // Only a change of plan should fill the amount.
  }, [values.planId]);
  return null;
}

/** Choosing a member picks her plan, when she has one that can be paid for. */
function MemberPlan({ members, plans }: { members: RosterRow[]; plans: DuesPlan[] }) {
  const { values, setFieldValue } = useFormikContext<RecordPaymentValues>();
  useEffect(() => {
    const member = members.find((m) => String(m.membershipId) === values.membershipId);
    const planId = member?.plan?.id;
    if (planId && plans.some((p) => p.id === planId) && values.planId === '') void setFieldValue('planId', String(planId), false);
    // Only a change of member should choose the plan.
  }, [values.membershipId]);
  return null;
}

/** Cash or a cheque handed to the treasurer, written into the ledger with a receipt. */
export function RecordPaymentForm({ members, plans, currency, today, membershipId = '', onRecord }: RecordPaymentFormProps) {
  const choices = payablePlans(plans);
  const memberOptions = [...members]
    .sort((a, b) => a.name.localeCompare(b.name))
    .map((m) => ({ value: String(m.membershipId), label: m.name }));
  const initialValues: RecordPaymentValues = {
    membershipId: memberOptions.some((m) => m.value === membershipId) ? membershipId : '',
    planId: choices.length === 1 ? String(choices[0].id) : '',
    method: '',
    chequeNumber: '',
    amount: choices.length === 1 ? centsToInput(choices[0].yearlyCents, currency) : '',
    receivedOn: today,
  };
  return (
    <Formik
      initialValues={initialValues}
      validationSchema={recordPaymentSchema(currency, today)}
      onSubmit={async (values, helpers) => {
        helpers.setStatus(undefined);
        try {
          const input = toRecordPaymentInput(values, currency);
          const result = await onRecord(input);
          const who = memberOptions.find((m) => m.value === values.membershipId)?.label ?? 'the member';
          const how = values.method === 'cheque' ? `cheque ${input.chequeNumber}` : 'cash';
          const receipt = result?.receiptNumber ? ` Receipt number ${result.receiptNumber}.` : '';
          helpers.resetForm({
            values: { ...initialValues, membershipId: '' },
            status: { success: `Recorded ${formatMoney(input.amountCents, currency)} (${how}) from ${who}.${receipt}` },
          });
        } catch (error) {
          applyServerErrors(error, helpers, values, { amountCents: 'amount' });
        }
      }}
    >
      {({ values }) => (
        <Form noValidate aria-label="Record a cash or cheque payment" className="record-payment-form">
          <FormAlert />
          <MemberPlan members={members} plans={choices} />
          <PlanPrice plans={choices} currency={currency} />
          <SelectField name="membershipId" label="Member" options={memberOptions} placeholder="Choose a member" />
          <SelectField
            name="planId"
            label="Plan"
            options={choices.map((p) => ({ value: String(p.id), label: `${p.name} (${formatMoney(p.yearlyCents, currency)} a year)` }))}
            placeholder="Choose a plan"
          />
          <RadioGroupField name="method" legend="Paid by" options={METHOD_CHOICES} inline />
          {values.method === 'cheque' && <TextField name="chequeNumber" label="Cheque number" autoComplete="off" inputMode="numeric" />}
          <TextField
            name="amount"
            label={`Amount received (${currency})`}
            inputMode="decimal"
            autoComplete="off"
            help="Filled in from the plan; change it if she paid a different amount."
          />
          <TextField name="receivedOn" type="date" label="Day received" max={today} help="Write it like 2026-09-15 if your browser shows a text box." />
          <SubmitButton busyLabel="Recording">Record the payment</SubmitButton>
        </Form>
      )}
    </Formik>
  );
}
