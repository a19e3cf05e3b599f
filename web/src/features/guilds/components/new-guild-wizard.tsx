import { Form as FormikForm, Formik, type FormikHelpers, type FormikProps } from 'formik';
import { useMemo, useRef, useState } from 'react';
import Button from 'react-bootstrap/Button';
import * as yup from 'yup';
import { FormAlert } from '@/components/ui/form-alert';
import { RadioGroupField, SelectField, TextField } from '@/components/ui/form-fields';
import { applyServerErrors } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import type { NewGuild, NewGuildInput } from '../api/create-guild';
import { currencyOptions, guessTimeZone, MONTH_OPTIONS, timeZoneOptions } from '../lib/guild-options';

type Values = { name: string; town: string; timeZone: string; currency: string; unit: 'in' | 'cm'; yearStartMonth: string };

/** The three short steps; each lists the fields it asks for, so a server error can send her back to it. */
const STEPS = [
  { title: 'Your guild', fields: ['name', 'town'] },
  { title: 'Where and how you measure', fields: ['timeZone', 'currency', 'unit'] },
  { title: 'Your membership year', fields: ['yearStartMonth'] },
] as const;

const schemas = [
  yup.object({
    name: yup.string().trim().min(2, "Write the guild's name (at least 2 letters).").max(120, 'Use at most 120 characters.').required("Write the guild's name."),
    town: yup.string().trim().max(120, 'Use at most 120 characters.').required('Write the town the guild meets in.'),
  }),
  yup.object({
    timeZone: yup.string().required('Choose your time zone.'),
    currency: yup.string().required('Choose the currency you collect dues in.'),
    unit: yup.string().oneOf(['in', 'cm'], 'Choose inches or centimetres.').required('Choose inches or centimetres.'),
  }),
  yup.object({ yearStartMonth: yup.string().required('Choose the month the membership year starts.') }),
];

/**
 * A short wizard for a new guild: its name and town, then time zone, currency and unit, then the
 * membership year. She becomes its admin. One form underneath, so Back keeps what she typed.
 */
export function NewGuildWizard({ onCreate, onCreated }: { onCreate: (input: NewGuildInput) => Promise<NewGuild>; onCreated: (guild: NewGuild) => void }) {
  const [step, setStep] = useState(0);
  const zones = useMemo(() => timeZoneOptions(), []);
  const currencies = useMemo(() => currencyOptions(), []);
  const heading = useRef<HTMLHeadingElement>(null);
  const initial: Values = { name: '', town: '', timeZone: guessTimeZone(), currency: 'USD', unit: 'in', yearStartMonth: '1' };
  const last = step === STEPS.length - 1;

  const go = (next: number) => {
    setStep(next);
    // Start the next step from its heading, for screen readers and keyboards.
    requestAnimationFrame(() => heading.current?.focus());
  };

  const submit = async (values: Values, helpers: FormikHelpers<Values>) => {
    if (!last) {
      helpers.setTouched({});
      helpers.setSubmitting(false);
      go(step + 1);
      return;
    }
    try {
      const guild = await onCreate({ ...values, name: values.name.trim(), town: values.town.trim(), yearStartMonth: Number(values.yearStartMonth) });
      onCreated(guild);
    } catch (error) {
      applyServerErrors(error, helpers, values);
      const errors = (error as { errors?: Record<string, string[]> }).errors ?? {};
      const back = STEPS.findIndex((s) => s.fields.some((f) => f in errors));
      if (back >= 0 && back !== step) go(back);
    }
  };

  return (
    <Formik<Values> initialValues={initial} validationSchema={schemas[step]} onSubmit={submit}>
      {(form: FormikProps<Values>) => (
        <FormikForm noValidate aria-label="Start a new guild">
          <p className="text-body-secondary mb-1" data-testid="wizard-step">
            Step {step + 1} of {STEPS.length}
          </p>
          <h2 ref={heading} tabIndex={-1} className="h3 mb-3">
            {STEPS[step].title}
          </h2>
          <FormAlert />
          {step === 0 && (
            <>
              <TextField name="name" label="Name of the guild" autoComplete="organization" help="As members know it, e.g. Fernhollow Quilters." />
              <TextField name="town" label="Town where you meet" />
            </>
          )}
          {step === 1 && (
            <>
              <SelectField name="timeZone" label="Time zone" options={zones} help="Meeting days, due dates and e-mails follow this clock." />
              <SelectField name="currency" label="Currency for dues and fees" options={currencies} />
              <RadioGroupField
                name="unit"
                legend="Measure blocks and quilts in"
                options={[
                  { value: 'in', label: 'Inches' },
                  { value: 'cm', label: 'Centimetres' },
                ]}
              />
            </>
          )}
          {step === 2 && (
            <>
              <SelectField
                name="yearStartMonth"
                label="The membership year starts in"
                options={MONTH_OPTIONS}
                help="Most guilds use January (a calendar year) or the month their programme year begins. The treasurer can change the dues rules later."
              />
              <dl className="facts mb-3" data-testid="wizard-summary">
                <div>
                  <dt>Guild</dt>
                  <dd>
                    {form.values.name.trim()}, {form.values.town.trim()}
                  </dd>
                </div>
                <div>
                  <dt>Time zone</dt>
                  <dd>{form.values.timeZone}</dd>
                </div>
                <div>
                  <dt>Money and measures</dt>
                  <dd>
                    {form.values.currency}, {form.values.unit === 'in' ? 'inches' : 'centimetres'}
                  </dd>
                </div>
              </dl>
              <p>You will be the guild’s admin: you invite members and give out the offices.</p>
            </>
          )}
          <div className="d-flex flex-wrap gap-2">
            {step > 0 && (
              <Button variant="outline-primary" onClick={() => go(step - 1)} disabled={form.isSubmitting}>
                Back
              </Button>
            )}
            <SubmitButton busyLabel={last ? 'Starting the guild' : 'Checking'}>{last ? 'Start the guild' : 'Next'}</SubmitButton>
          </div>
        </FormikForm>
      )}
    </Formik>
  );
}
