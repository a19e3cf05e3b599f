import { Form as FormikForm, Formik } from 'formik';
import { useId, useRef } from 'react';
import Form from 'react-bootstrap/Form';
import { FormAlert } from '@/components/ui/form-alert';
import { TextareaField } from '@/components/ui/form-fields';
import { applyServerErrors } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import type { RosterSource } from '../api/roster-body';

type Values = { text: string; file: File | null };

/** Step 1: a CSV file, or rows pasted from a spreadsheet (which arrive tab-separated). */
export function SourceStep({ onSubmit }: { onSubmit: (source: RosterSource) => Promise<unknown> }) {
  const fileInput = useRef<HTMLInputElement>(null);
  const id = useId();
  return (
    <Formik<Values>
      initialValues={{ text: '', file: null }}
      validate={(v) => (!v.file && !v.text.trim() ? { text: 'Choose a file, or paste the rows from your spreadsheet.' } : {})}
      onSubmit={async (values, helpers) => {
        helpers.setStatus(undefined);
        try {
          await onSubmit(values.file ? { kind: 'file', file: values.file } : { kind: 'text', text: values.text });
        } catch (error) {
          applyServerErrors(error, helpers, values);
        }
      }}
    >
      {({ values, setFieldValue }) => (
        <FormikForm noValidate>
          <FormAlert />
          <section aria-labelledby={`${id}-what`} className="mb-4">
            <h2 id={`${id}-what`} className="h4">What Selvage reads</h2>
            <p className="mb-2">
              The first row must hold the column names. Selvage understands these columns (other columns are left out):
            </p>
            <ul className="mb-2">
              <li><strong>Name</strong> (or “First name” and “Last name”) — the only column you must have</li>
              <li><strong>E-mail</strong>, <strong>Phone</strong>, <strong>Town</strong></li>
              <li><strong>Household</strong> (members who share one household plan)</li>
              <li><strong>Member since</strong> and <strong>Paid through</strong> (dates)</li>
              <li><strong>Roles</strong>: Admin, Treasurer, Membership chair, Show chair, or Member</li>
            </ul>
            <p className="mb-0">
              To save your spreadsheet as a CSV file: choose <strong>File</strong>, then <strong>Save as</strong> (or <strong>Download</strong>), then <strong>CSV</strong>.
              Up to 5 MB and 10,000 members at a time.
            </p>
          </section>
          <Form.Group controlId={`${id}-file`} className="mb-3">
            <Form.Label>Choose the CSV file</Form.Label>
            <Form.Control
              ref={fileInput}
              type="file"
              accept=".csv,.txt,.tsv,text/csv,text/plain"
              size="lg"
              onChange={(e) => void setFieldValue('file', (e.currentTarget as HTMLInputElement).files?.[0] ?? null)}
            />
            {values.file && (
              <Form.Text className="d-block">
                Chosen: {values.file.name}.{' '}
                <button
                  type="button"
                  className="btn btn-link p-0 align-baseline"
                  onClick={() => {
                    if (fileInput.current) fileInput.current.value = '';
                    void setFieldValue('file', null);
                  }}
                >
                  Clear the file
                </button>
              </Form.Text>
            )}
          </Form.Group>
          {!values.file && (
            <TextareaField
              name="text"
              label="Or paste the rows here"
              rows={8}
              help="In your spreadsheet, select the rows including the row of column names, copy, and paste here."
            />
          )}
          <SubmitButton busyLabel="Reading the file" className="btn-lg">
            Show me what will be imported
          </SubmitButton>
        </FormikForm>
      )}
    </Formik>
  );
}
