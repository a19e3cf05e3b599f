import { Form, Formik } from 'formik';
import { RadioGroupField, TextField } from '@/components/ui/form-fields';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import Badge from 'react-bootstrap/Badge';
import { blockStatusLabel, type Block, type DeliveryMethod } from '../api/get-round';
import { blockStatusSchema, toUpdateBlockInput, type BlockStatusValues, type UpdateBlockInput } from '../api/update-block';

type MyBlockFormProps = {
  block: Block;
  deliveryMethod: DeliveryMethod;
  onSave: (input: UpdateBlockInput) => Promise<unknown>;
};

export function MyBlockForm({ block, deliveryMethod, onSave }: MyBlockFormProps) {
  if (block.status === 'received') {
    return (
      <p className="mb-0">
        <strong>The queen has your block.</strong> Thank you!
      </p>
    );
  }
  const initialValues: BlockStatusValues = { status: block.status, trackingNumber: block.trackingNumber ?? '' };
  const options = [
    { value: 'not_started', label: 'Not started' },
    { value: 'made', label: 'Made' },
    { value: 'mailed', label: 'Mailed' },
    { value: 'handed_over', label: 'Handed over' },
  ];
  return (
    <Formik
      initialValues={initialValues}
      validationSchema={blockStatusSchema}
      onSubmit={async (values, helpers) => {
        helpers.setStatus(undefined);
        try {
          await onSave(toUpdateBlockInput(values));
          helpers.resetForm({ values, status: { success: `Saved: ${blockStatusLabel(values.status).toLowerCase()}.` } });
        } catch (error) {
          applyServerErrors(error, helpers, values);
        }
      }}
    >
      {({ values }) => (
        <Form noValidate aria-label="My block">
          {block.late && (
            <p>
              <Badge bg="danger" className="status-badge">
                Late
              </Badge>{' '}
              The due date has passed. If it is on its way, mark it mailed or handed over.
            </p>
          )}
          {block.updatedOnBehalf && <p className="text-body-secondary">{block.updatedByName ?? 'The organiser'} last set this on your behalf.</p>}
          <FormAlert />
          <RadioGroupField
            name="status"
            legend="Where is your block?"
            options={options}
            help={deliveryMethod === 'mail' ? 'This bee mails blocks to the queen.' : 'This bee hands blocks over at a meeting.'}
          />
          {values.status === 'mailed' && (
            <TextField name="trackingNumber" label="Tracking number" optional autoComplete="off" help="If the post office gave you one." />
          )}
          <SubmitButton busyLabel="Saving">Save</SubmitButton>
        </Form>
      )}
    </Formik>
  );
}
