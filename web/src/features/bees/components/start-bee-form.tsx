import { Form, Formik } from 'formik';
import { RadioGroupField, TextareaField, TextField } from '@/components/ui/form-fields';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import { addMonths } from '@/lib/dates';
import type { Bee } from '../api/get-bee';
import { createBeeSchema, toCreateBeeInput, useCreateBee, type CreateBeeValues } from '../api/create-bee';
import { HANDOVER_OPTIONS } from './labels';

type StartBeeFormProps = {
  guildId: string;
  /** This month in the guild's time zone, "YYYY-MM". */
  thisMonth: string;
  onCreated: (bee: Bee) => void;
};

export function StartBeeForm({ guildId, thisMonth, onCreated }: StartBeeFormProps) {
  const create = useCreateBee(guildId);
  const initialValues: CreateBeeValues = {
    name: '',
    description: '',
    handover: '',
    startMonth: addMonths(thisMonth, 1),
    months: '12',
  };
  return (
    <Formik
      initialValues={initialValues}
      validationSchema={createBeeSchema}
      onSubmit={async (values, helpers) => {
        helpers.setStatus(undefined);
        try {
          const bee = await create.mutateAsync(toCreateBeeInput(values));
          helpers.resetForm({ values: initialValues, status: { success: `${values.name.trim()} has started.` } });
          if (bee) onCreated(bee);
        } catch (error) {
          applyServerErrors(error, helpers, values);
        }
      }}
    >
      <Form noValidate aria-label="Start a bee">
        <FormAlert />
        <TextField name="name" label="Name of the bee" autoComplete="off" />
        <TextareaField name="description" label="What the bee is about" optional rows={3} help="For example the style, colours or how often you meet." />
        <RadioGroupField name="handover" legend="How blocks reach the queen" options={HANDOVER_OPTIONS} />
        <TextField
          name="startMonth"
          type="month"
          label="First month"
          help="The month of the first queen. If your browser shows a text box, write it like 2027-01."
        />
        <TextField
          name="months"
          type="number"
          inputMode="numeric"
          min={1}
          max={24}
          step={1}
          label="Number of months"
          help="From 1 to 24. Many bees run for 12 months, one queen each month."
        />
        <p className="text-body-secondary">You will organise the bee: you invite the makers and set the queen order.</p>
        <SubmitButton busyLabel="Starting">Start the bee</SubmitButton>
      </Form>
    </Formik>
  );
}
