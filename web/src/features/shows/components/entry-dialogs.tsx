import { Form, Formik } from 'formik';
import Button from 'react-bootstrap/Button';
import Modal from 'react-bootstrap/Modal';
import * as yup from 'yup';
import { SelectField, TextareaField, TextField } from '@/components/ui/form-fields';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import type { EntryPatch } from '../api/save-entry';
import type { Category, Entry } from '../api/types';
import { makersProblem, sizeProblemMm } from '../lib/size-rule';

type DeclineDialogProps = {
  entry: Entry | null;
  onHide: () => void;
  onDecline: (entry: Entry, reason: string) => Promise<unknown>;
};

const declineSchema = yup.object({ reason: yup.string().trim().required('Say why, so the entrant knows. She will see it.') });

/** Decline an entry with a reason the entrant will read. */
export function DeclineDialog({ entry, onHide, onDecline }: DeclineDialogProps) {
  const titleId = 'decline-title';
  return (
    <Modal show={entry !== null} onHide={onHide} aria-labelledby={titleId} centered>
      {entry && (
        <Formik
          initialValues={{ reason: '' }}
          validationSchema={declineSchema}
          onSubmit={async (values, helpers) => {
            helpers.setStatus(undefined);
            try {
              await onDecline(entry, values.reason.trim());
              onHide();
            } catch (error) {
              applyServerErrors(error, helpers, values);
            }
          }}
        >
          <Form noValidate aria-labelledby={titleId}>
            <Modal.Header closeButton closeLabel="Close without declining">
              <Modal.Title id={titleId} as="h2" className="h4">
                Decline “{entry.title}”
              </Modal.Title>
            </Modal.Header>
            <Modal.Body>
              <FormAlert />
              <p>Entered by {entry.entrant.name}.</p>
              <TextareaField name="reason" label="Reason" rows={3} help="For example: the quilt was shown here last year." />
            </Modal.Body>
            <Modal.Footer>
              <Button variant="outline-secondary" onClick={onHide}>
                Cancel
              </Button>
              <SubmitButton busyLabel="Declining">Decline the entry</SubmitButton>
            </Modal.Footer>
          </Form>
        </Formik>
      )}
    </Modal>
  );
}

type ChangeEntryDialogProps = {
  entry: Entry | null;
  categories: Category[];
  onHide: () => void;
  onSave: (entry: Entry, input: EntryPatch) => Promise<unknown>;
};

type ChangeValues = { categoryId: string; entryNumber: string | number };

/**
 * Why the entry cannot move to the chosen category, or null. The api checks the size rule and the
 * makers again on a move and refuses with 400, so the dialog does not offer it.
 */
export function moveProblem(entry: Entry, categories: readonly Category[], categoryId: string): string | null {
  const category = categories.find((c) => String(c.id) === categoryId);
  if (!category || category.id === entry.categoryId) return null;
  const size = sizeProblemMm(category.sizeRule, entry.widthMm, entry.heightMm);
  if (size) return `It does not fit ${category.name}: ${size.message} Choose another category, or change the quilt's size first.`;
  const makers = makersProblem(category, entry.makers.length);
  if (makers) return `It does not fit ${category.name}: ${makers} Choose another category, or add the other makers first.`;
  return null;
}

const changeSchema = (entry: Entry, categories: readonly Category[]) =>
  yup.object({
    categoryId: yup
      .string()
      .required('Choose a category.')
      .test('fits', `Choose a category this quilt fits, or keep it in ${entry.categoryName}.`, (value) => !moveProblem(entry, categories, value ?? '')),
    entryNumber: yup
      .number()
      .transform((value, original) => (original === '' || original == null ? undefined : value))
      .typeError('Enter a whole number, or leave it empty.')
      .integer('Enter a whole number, or leave it empty.')
      .min(1, 'Entry numbers are whole numbers from 1 to 9999.')
      .max(9999, 'Entry numbers are whole numbers from 1 to 9999.'),
  });

function MoveWarning({ entry, categories, categoryId }: { entry: Entry; categories: Category[]; categoryId: string }) {
  const problem = moveProblem(entry, categories, categoryId);
  return (
    <div role="status">
      {problem && (
        <p className="size-warning" data-testid="move-warning">
          {problem}
        </p>
      )}
    </div>
  );
}

/** Move an entry to another category, or give it an entry number (empty to take the number away). */
export function ChangeEntryDialog({ entry, categories, onHide, onSave }: ChangeEntryDialogProps) {
  const titleId = 'change-entry-title';
  return (
    <Modal show={entry !== null} onHide={onHide} aria-labelledby={titleId} centered>
      {entry && (
        <Formik<ChangeValues>
          initialValues={{ categoryId: String(entry.categoryId), entryNumber: entry.entryNumber == null ? '' : String(entry.entryNumber) }}
          validationSchema={changeSchema(entry, categories)}
          onSubmit={async (values, helpers) => {
            helpers.setStatus(undefined);
            const input: EntryPatch = {};
            if (Number(values.categoryId) !== entry.categoryId) input.categoryId = Number(values.categoryId);
            const number = String(values.entryNumber).trim() === '' ? null : Number(values.entryNumber);
            if (number !== entry.entryNumber) input.entryNumber = number;
            if (Object.keys(input).length === 0) return onHide();
            try {
              await onSave(entry, input);
              onHide();
            } catch (error) {
              applyServerErrors(error, helpers, values);
            }
          }}
        >
          {({ values }) => (
            <Form noValidate aria-labelledby={titleId}>
              <Modal.Header closeButton closeLabel="Close without saving">
                <Modal.Title id={titleId} as="h2" className="h4">
                  “{entry.title}”
                </Modal.Title>
              </Modal.Header>
              <Modal.Body>
                <FormAlert />
                <p>
                  {entry.widthText} × {entry.heightText} in, perimeter {entry.perimeterText}.
                </p>
                <SelectField
                  name="categoryId"
                  label="Category"
                  options={categories.map((c) => ({ value: String(c.id), label: `${c.name} (${c.sizeRuleText})` }))}
                />
                <MoveWarning entry={entry} categories={categories} categoryId={values.categoryId} />
                <TextField
                  name="entryNumber"
                  type="number"
                  inputMode="numeric"
                  min={1}
                  max={9999}
                  label="Entry number"
                  optional
                  help="Printed on the hang tag and the ballot. Leave empty for none."
                />
              </Modal.Body>
              <Modal.Footer>
                <Button variant="outline-secondary" onClick={onHide}>
                  Cancel
                </Button>
                <SubmitButton busyLabel="Saving">Save</SubmitButton>
              </Modal.Footer>
            </Form>
          )}
        </Formik>
      )}
    </Modal>
  );
}
