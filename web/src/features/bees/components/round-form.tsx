import { Form, Formik, useFormikContext } from 'formik';
import { useId, type ReactNode } from 'react';
import Button from 'react-bootstrap/Button';
import { RadioGroupField, TextareaField, TextField } from '@/components/ui/form-fields';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import { addMonths } from '@/lib/dates';
import type { DeliveryMethod, Round } from '../api/get-round';
import { roundSchema, SIZE_PRESETS, toRoundInput, type RoundFormValues, type RoundInput } from '../api/save-round';
import { SizePair, sizePreview } from './size-preview';
import { BackgroundEditor, SwatchEditor } from './swatch-editor';

export function roundInitialValues(round: Round | null, month: string, handover: DeliveryMethod): RoundFormValues {
  if (!round) {
    return {
      title: '',
      instructions: '',
      patternLink: '',
      finishedWidth: '',
      finishedHeight: '',
      seamAllowance: '1/4',
      tolerance: '1/8',
      trimMode: 'trim',
      swatches: [],
      background: null,
      fabricSource: 'stash',
      dueDate: `${addMonths(month, 1)}-15`,
      sendDate: `${month}-01`,
      sendTime: '08:00',
      deliveryMethod: handover,
      deliveryAddress: '',
      meetingDetails: '',
    };
  }
  return {
    title: round.title ?? '',
    instructions: round.instructions ?? '',
    patternLink: round.patternLink ?? '',
    finishedWidth: round.finishedWidth ?? round.finished?.widthText ?? '',
    finishedHeight: round.finishedHeight ?? round.finished?.heightText ?? '',
    seamAllowance: round.seamAllowance ?? round.seamAllowanceText ?? '1/4',
    tolerance: round.tolerance ?? round.toleranceText ?? '1/8',
    trimMode: round.trimMode ?? 'trim',
    swatches: (round.swatches ?? []).map((s) => ({ name: s.name, hex: s.hex })),
    background: round.background ? { name: round.background.name, hex: round.background.hex } : null,
    fabricSource: round.fabricSource ?? 'stash',
    dueDate: round.dueDate ?? '',
    sendDate: round.sendDate ?? `${month}-01`,
    sendTime: round.sendTime ?? '08:00',
    deliveryMethod: round.deliveryMethod ?? handover,
    deliveryAddress: round.deliveryAddress ?? '',
    meetingDetails: round.meetingDetails ?? '',
  };
}

function SizeFields() {
  const { values, setFieldValue, setFieldTouched } = useFormikContext<RoundFormValues>();
  const previewId = useId();
  const preview = sizePreview(values.finishedWidth, values.finishedHeight, values.seamAllowance);
  const choose = (inches: string) => {
    void setFieldValue('finishedWidth', inches);
    void setFieldValue('finishedHeight', inches);
    void setFieldTouched('finishedWidth', true, false);
    void setFieldTouched('finishedHeight', true, false);
  };
  return (
    <fieldset className="form-section">
      <legend className="h4">Size</legend>
      <p className="mb-2">Give the finished size: what shows in the quilt once it is sewn in. Selvage adds the seam allowance for the cut size.</p>
      <div role="group" aria-label="Quick finished sizes, square" className="d-flex flex-wrap gap-2 mb-3">
        {SIZE_PRESETS.map((inches) => {
          const pressed = values.finishedWidth.trim() === inches && values.finishedHeight.trim() === inches;
          return (
            <Button
              key={inches}
              variant={pressed ? 'primary' : 'outline-primary'}
              aria-pressed={pressed}
              onClick={() => choose(inches)}
            >
              {inches} inch
            </Button>
          );
        })}
      </div>
      <div className="row g-3">
        <div className="col-12 col-sm-6">
          <TextField
            name="finishedWidth"
            label="Finished width (inches)"
            autoComplete="off"
            help="For example 12, 12 1/2 or 12.5"
            describedBy={previewId}
          />
        </div>
        <div className="col-12 col-sm-6">
          <TextField
            name="finishedHeight"
            label="Finished height (inches)"
            autoComplete="off"
            help="For example 12, 12 1/2 or 12.5"
            describedBy={previewId}
          />
        </div>
      </div>
      <div aria-live="polite" aria-atomic="true" className="mb-3">
        {preview ? (
          <SizePair id={previewId} finished={preview.finished} unfinished={preview.unfinished} />
        ) : (
          <p id={previewId} className="text-body-secondary mb-0">
            Type a finished width and height to see the unfinished (cut) size.
          </p>
        )}
      </div>
      <div className="row g-3">
        <div className="col-12 col-sm-6">
          <TextField name="seamAllowance" label="Seam allowance (inches)" autoComplete="off" help="Usually 1/4" />
        </div>
        <div className="col-12 col-sm-6">
          <TextField name="tolerance" label="Tolerance (inches)" autoComplete="off" help="How far off a block may be; often 1/8" />
        </div>
      </div>
      <RadioGroupField
        name="trimMode"
        legend="Trimming"
        options={[
          { value: 'trim', label: 'Trim the block to the unfinished size' },
          { value: 'untrimmed', label: 'Leave it untrimmed: I will trim it myself' },
        ]}
      />
    </fieldset>
  );
}

function DeliveryFields() {
  const { values } = useFormikContext<RoundFormValues>();
  return (
    <fieldset className="form-section">
      <legend className="h4">Hand-over</legend>
      <RadioGroupField
        name="deliveryMethod"
        legend="How makers get the block to you"
        options={[
          { value: 'mail', label: 'By mail' },
          { value: 'meeting', label: 'At a meeting' },
        ]}
      />
      {values.deliveryMethod === 'mail' ? (
        <TextareaField
          name="deliveryAddress"
          label="Address to mail blocks to"
          rows={3}
          autoComplete="street-address"
          help="Only makers in this bee see it."
        />
      ) : (
        <TextareaField
          name="meetingDetails"
          label="Which meeting, and where"
          optional
          rows={3}
          help="For example: the March meeting, church hall, 7 pm. Only makers in this bee see it."
        />
      )}
    </fieldset>
  );
}

type RoundFormProps = {
  round: Round | null;
  month: string;
  handover: DeliveryMethod;
  onSave: (input: RoundInput) => Promise<unknown>;
  /** Rendered inside the form after Save, e.g. the publish step (it can read whether the form is dirty). */
  footer?: (state: { dirty: boolean }) => ReactNode;
};

export function RoundForm({ round, month, handover, onSave, footer }: RoundFormProps) {
  const initialValues = roundInitialValues(round, month, handover);
  return (
    <Formik
      initialValues={initialValues}
      validationSchema={roundSchema}
      onSubmit={async (values, helpers) => {
        helpers.setStatus(undefined);
        try {
          await onSave(toRoundInput(values));
          // What was saved is the new starting point, so "unsaved changes" means changes since now.
          helpers.resetForm({ values, status: { success: 'The round is saved.' } });
        } catch (error) {
          applyServerErrors(error, helpers, values);
        }
      }}
    >
      {({ dirty }) => (
        <Form noValidate aria-label="Set the block for this month">
          <FormAlert />
          <fieldset className="form-section">
            <legend className="h4">The block</legend>
            <TextField name="title" label="Title" autoComplete="off" help="For example: Wonky star" />
            <TextareaField
              name="instructions"
              label="Instructions"
              optional
              rows={6}
              help={
                <>
                  You can write <strong>**bold**</strong>, <em>*italic*</em>, and lists with a line starting “- ”.
                </>
              }
            />
            <TextField name="patternLink" type="url" inputMode="url" label="Link to the pattern" optional autoComplete="off" />
          </fieldset>
          <SizeFields />
          <fieldset className="form-section">
            <legend className="h4">Colours</legend>
            <SwatchEditor />
            <h3 className="h5 mt-3">Background</h3>
            <BackgroundEditor />
          </fieldset>
          <fieldset className="form-section">
            <legend className="h4">Fabric and dates</legend>
            <RadioGroupField
              name="fabricSource"
              legend="Fabric"
              options={[
                { value: 'stash', label: 'Makers use fabric from their own stash' },
                { value: 'queen_sends', label: 'I send fabric to each maker' },
              ]}
            />
            <TextField name="dueDate" type="date" label="Due date" help="The day blocks should reach you." />
            <div className="row g-3">
              <div className="col-12 col-sm-6">
                <TextField name="sendDate" type="date" label="E-mail the makers on" optional help="Usually the 1st of the month." />
              </div>
              <div className="col-12 col-sm-6">
                <TextField name="sendTime" type="time" label="Time of the e-mail" optional help="Guild time, for example 08:00." />
              </div>
            </div>
          </fieldset>
          <DeliveryFields />
          <SubmitButton busyLabel="Saving">Save the round</SubmitButton>
          {footer?.({ dirty })}
        </Form>
      )}
    </Formik>
  );
}
