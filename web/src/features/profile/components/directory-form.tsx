import { Form, Formik } from 'formik';
import { ErrorAlert } from '@/components/ui/error-alert';
import { CheckboxField, TextField } from '@/components/ui/form-fields';
import { FormAlert } from '@/components/ui/form-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { applyServerErrors } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import { directorySchema, useDirectoryDetails, useSaveDirectoryDetails, type DirectoryValues } from '../api/directory-details';

/** Her phone and town, and which contact details the other members of her guilds may see. */
export function DirectoryForm() {
  const details = useDirectoryDetails();
  const save = useSaveDirectoryDetails();
  if (details.isPending) return <PageSpinner label="Loading your contact details" />;
  if (details.isError) return <ErrorAlert error={details.error} />;
  const d = details.data;
  const initialValues: DirectoryValues = { phone: d.phone ?? '', town: d.town ?? '', showEmail: d.showEmail, showPhone: d.showPhone, showTown: d.showTown };
  return (
    <Formik
      initialValues={initialValues}
      enableReinitialize
      validationSchema={directorySchema}
      onSubmit={async (values, helpers) => {
        helpers.setStatus(undefined);
        try {
          await save.mutateAsync(values);
          helpers.setStatus({ success: 'Saved. The member directory shows what you chose.' });
        } catch (error) {
          applyServerErrors(error, helpers, values);
        }
      }}
    >
      <Form noValidate aria-label="Contact details and the directory">
        <FormAlert />
        <TextField name="phone" label="Phone number" type="tel" autoComplete="tel" inputMode="tel" optional />
        <TextField name="town" label="Town you live in" autoComplete="address-level2" optional />
        <fieldset className="mb-3">
          <legend className="form-label fs-6 fw-bold mb-1">Other members may see</legend>
          <CheckboxField name="showEmail" label="My e-mail address" />
          <CheckboxField name="showPhone" label="My phone number" />
          <CheckboxField name="showTown" label="My town" />
          <p className="form-text mb-0">Your name is always shown. The officers who keep the roster see your details whatever you choose.</p>
        </fieldset>
        <SubmitButton busyLabel="Saving">Save my choices</SubmitButton>
      </Form>
    </Formik>
  );
}
