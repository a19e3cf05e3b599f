import { FieldArray, Form, Formik } from 'formik';
import Button from 'react-bootstrap/Button';
import Col from 'react-bootstrap/Col';
import Row from 'react-bootstrap/Row';
import { CheckboxField, RadioGroupField, SelectField, TextField } from '@/components/ui/form-fields';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import type { DuesSettings } from '../api/get-dues-settings';
import {
  duesSettingsSchema,
  MAX_EARLY_RENEWAL_DAYS,
  MAX_GRACE_DAYS,
  SETTINGS_FIELD_MAP,
  toDuesSettingsInput,
  toDuesSettingsValues,
  type BandValues,
  type DuesSettingsInput,
  type DuesSettingsValues,
} from '../api/update-dues-settings';
import { formatDay, MONTH_NAMES, MONTH_OPTIONS } from '../lib/format';

type DuesSettingsFormProps = {
  settings: DuesSettings;
  onSave: (input: DuesSettingsInput) => Promise<DuesSettings>;
};

const CHARGE_OPTIONS = [
  { value: 'full', label: 'Full dues' },
  { value: 'half', label: 'Half dues' },
] as const;

/** The next month after the last band, for a new band. */
function nextBandMonth(values: DuesSettingsValues): string {
  const last = values.proration[values.proration.length - 1];
  if (!last) return values.yearStartMonth || '1';
  return String((Number(last.fromMonth) % 12) + 1);
}

/** When dues fall due, the grace period, the late fee and what people joining mid-year pay. */
export function DuesSettingsForm({ settings, onSave }: DuesSettingsFormProps) {
  const currency = settings.currency;
  return (
    <Formik<DuesSettingsValues>
      initialValues={toDuesSettingsValues(settings)}
      validationSchema={duesSettingsSchema(currency)}
      onSubmit={async (values, helpers) => {
        helpers.setStatus(undefined);
        try {
          const saved = await onSave(toDuesSettingsInput(values, currency));
          helpers.setStatus({
            success: `Settings saved. The ${saved.currentYear.label} dues are due on ${formatDay(saved.dueOn)}; the grace period ends on ${formatDay(saved.graceEndsOn)}.`,
          });
        } catch (error) {
          applyServerErrors(error, helpers, values, SETTINGS_FIELD_MAP);
        }
      }}
    >
      {({ values }) => (
        <Form noValidate aria-label="Dues settings" className="dues-settings-form">
          <FormAlert />
          <p>
            Amounts are in <strong>{currency}</strong>. This year is <strong>{settings.currentYear.label}</strong>:{' '}
            {formatDay(settings.currentYear.startsOn)} to {formatDay(settings.currentYear.endsOn)}.
          </p>
          <SelectField name="yearStartMonth" label="The membership year starts in" options={MONTH_OPTIONS} />
          <Row xs={1} sm={2} className="g-0 gx-sm-3">
            <Col>
              <SelectField name="dueMonth" label="Dues are due in" options={MONTH_OPTIONS} />
            </Col>
            <Col>
              <TextField name="dueDay" type="number" inputMode="numeric" min={1} max={31} label="On day" help="29 in February means its last day." />
            </Col>
          </Row>
          <TextField
            name="graceDays"
            type="number"
            inputMode="numeric"
            min={0}
            max={MAX_GRACE_DAYS}
            label="Days of grace after the due date"
            help="Members can still renew without a late fee for this many days."
          />
          <TextField
            name="lateFee"
            inputMode="decimal"
            autoComplete="off"
            label={`Late fee (${currency})`}
            help="Added when someone renews after the grace period. 0 for none."
          />
          <TextField
            name="earlyRenewalDays"
            type="number"
            inputMode="numeric"
            min={0}
            max={MAX_EARLY_RENEWAL_DAYS}
            label="Renewal opens this many days before the due date"
            help={`From 0 to ${MAX_EARLY_RENEWAL_DAYS}. Payments from then on count for the coming year.`}
          />

          <fieldset className="form-section">
            <legend className="h5">New members joining part-way through the year</legend>
            <p className="text-body-secondary">
              Each band starts in a month and runs until the next band. The first band starts in the first month of the membership year
              {values.yearStartMonth ? ` (${MONTH_NAMES[Number(values.yearStartMonth) - 1]})` : ''}. With no bands, new members pay full dues.
            </p>
            <FieldArray name="proration">
              {({ push, remove }) => (
                <>
                  {values.proration.map((_band, i) => (
                    <fieldset key={i} className="swatch-row proration-band" data-testid="proration-band">
                      <legend className="h6 mb-0">Band {i + 1}</legend>
                      <SelectField name={`proration.${i}.fromMonth`} label="Joining from" options={MONTH_OPTIONS} />
                      <RadioGroupField name={`proration.${i}.charge`} legend="They pay" options={CHARGE_OPTIONS} inline />
                      <CheckboxField name={`proration.${i}.coversNextYear`} label="This also pays for all of the next membership year" />
                      <Button variant="outline-danger" className="mb-2" onClick={() => remove(i)}>
                        Remove band {i + 1}
                      </Button>
                    </fieldset>
                  ))}
                  {values.proration.length < 12 && (
                    <Button
                      variant="outline-primary"
                      className="mb-3"
                      onClick={() => push({ fromMonth: nextBandMonth(values), charge: 'full', coversNextYear: false } satisfies BandValues)}
                    >
                      Add a band
                    </Button>
                  )}
                </>
              )}
            </FieldArray>
          </fieldset>
          <SubmitButton busyLabel="Saving">Save the settings</SubmitButton>
        </Form>
      )}
    </Formik>
  );
}
