import { Form, Formik, useFormikContext } from 'formik';
import { useEffect, useRef } from 'react';
import { SelectField, TextField } from '@/components/ui/form-fields';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors, type FormStatus } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import type { Office } from '../api/get-offices';
import { handoverSchema, type HandoverInput, type HandoverValues } from '../api/hand-over';
import { formatDay } from '../lib/format';

type HandoverFormProps = {
  offices: Office[];
  members: { membershipId: number | string; name: string }[];
  today: string;
  onSubmit: (input: HandoverInput) => Promise<unknown>;
};

/** The outgoing officer follows the chosen office: only its current holders can hand it over. */
function FromField({ offices }: { offices: Office[] }) {
  const { values, setFieldValue } = useFormikContext<HandoverValues>();
  const holders = offices.find((o) => o.role === values.role)?.holders ?? [];
  useEffect(() => {
    if (values.fromMembershipId && !holders.some((h) => String(h.membershipId) === values.fromMembershipId))
      void setFieldValue('fromMembershipId', '');
  }, [holders, values.fromMembershipId, setFieldValue]);
  return (
    <SelectField
      name="fromMembershipId"
      label="Handed over by"
      placeholder={values.role ? (holders.length ? 'Choose the outgoing officer' : 'Nobody holds this office') : 'Choose the office first'}
      options={holders.map((h) => ({ value: String(h.membershipId), label: h.name }))}
    />
  );
}

/** The last handover's confirmation goes once she starts the next one, so it never sits above a new error. */
function ClearDoneOnEdit() {
  const { values, status, setStatus } = useFormikContext<HandoverValues>();
  const shown = useRef<{ status: unknown; values: HandoverValues } | null>(null);
  useEffect(() => {
    if (!(status as FormStatus)?.success) return;
    if (shown.current?.status !== status) shown.current = { status, values };
    else if (shown.current?.values !== values) setStatus(undefined);
  }, [values, status, setStatus]);
  return null;
}

export function HandoverForm({ offices, members, today, onSubmit }: HandoverFormProps) {
  const initialValues: HandoverValues = { role: '', fromMembershipId: '', toMembershipId: '', on: today };
  return (
    <Formik
      initialValues={initialValues}
      validationSchema={handoverSchema}
      onSubmit={async (values, helpers) => {
        helpers.setStatus(undefined);
        try {
          await onSubmit({
            role: values.role,
            fromMembershipId: Number(values.fromMembershipId),
            toMembershipId: Number(values.toMembershipId),
            on: values.on,
          });
          const office = offices.find((o) => o.role === values.role)?.label ?? 'The office';
          const to = members.find((m) => String(m.membershipId) === values.toMembershipId)?.name ?? 'The new officer';
          helpers.resetForm({
            values: initialValues,
            status: { success: `${office} passes to ${to} on ${formatDay(values.on)}.` },
          });
        } catch (error) {
          applyServerErrors(error, helpers, values);
        }
      }}
    >
      <Form noValidate aria-labelledby="handover-heading">
        <FormAlert />
        <ClearDoneOnEdit />
        <SelectField name="role" label="Office" placeholder="Choose the office" options={offices.map((o) => ({ value: o.role, label: o.label }))} />
        <FromField offices={offices} />
        <SelectField
          name="toMembershipId"
          label="Taken on by"
          placeholder="Choose the new officer"
          options={members.map((m) => ({ value: String(m.membershipId), label: m.name }))}
        />
        <TextField
          name="on"
          label="Handover day"
          type="date"
          min={today}
          help="The outgoing officer's access ends on this day and the new officer's begins. Today or later."
        />
        <SubmitButton busyLabel="Handing over">Hand over</SubmitButton>
      </Form>
    </Formik>
  );
}
