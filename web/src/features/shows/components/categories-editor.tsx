import { Form, Formik } from 'formik';
import { useState } from 'react';
import Badge from 'react-bootstrap/Badge';
import Button from 'react-bootstrap/Button';
import Col from 'react-bootstrap/Col';
import Modal from 'react-bootstrap/Modal';
import Row from 'react-bootstrap/Row';
import { ConfirmAction } from '@/components/ui/confirm-action';
import { ErrorAlert } from '@/components/ui/error-alert';
import { RadioGroupField, SelectField, TextareaField, TextField } from '@/components/ui/form-fields';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import type { Category } from '../api/types';
import {
  CATEGORY_FIELD_MAP,
  categorySchema,
  EMPTY_CATEGORY_VALUES,
  JUDGED_OPTIONS,
  MAX_BOUND_OPTIONS,
  MIN_BOUND_OPTIONS,
  missingUsualCategories,
  RULE_KIND_OPTIONS,
  toCategoryInput,
  toCategoryValues,
  type CategoryInput,
  type CategoryValues,
} from '../lib/category-form';
import { joinNames } from '../lib/labels';
import { judgedLabel } from './category-list';

type CategoriesEditorProps = {
  categories: Category[];
  onSave: (categoryId: number | null, input: CategoryInput) => Promise<unknown>;
  onDelete: (category: Category) => Promise<unknown>;
  deleting?: boolean;
  deleteError?: unknown;
  onAddMany: (inputs: CategoryInput[]) => Promise<unknown>;
};

function SizeRuleFields({ kind }: { kind: CategoryValues['ruleKind'] }) {
  if (kind === 'dimensions') {
    return (
      <fieldset className="swatch-row">
        <legend className="h6 mb-0">Width and height</legend>
        <p className="text-body-secondary mb-2">Fill in only the limits you need; leave the others empty.</p>
        <Row xs={1} sm={2} className="g-0 gx-sm-3">
          <Col>
            <TextField name="minWidthIn" label="Narrowest (inches)" inputMode="decimal" autoComplete="off" optional />
          </Col>
          <Col>
            <TextField name="maxWidthIn" label="Widest (inches)" inputMode="decimal" autoComplete="off" optional />
          </Col>
          <Col>
            <TextField name="minHeightIn" label="Shortest (inches)" inputMode="decimal" autoComplete="off" optional />
          </Col>
          <Col>
            <TextField name="maxHeightIn" label="Longest (inches)" inputMode="decimal" autoComplete="off" optional />
          </Col>
        </Row>
      </fieldset>
    );
  }
  if (kind === 'perimeter') {
    return (
      <fieldset className="swatch-row">
        <legend className="h6 mb-0">Perimeter band</legend>
        <p className="text-body-secondary mb-2">The perimeter is twice the width plus twice the height. Leave a limit empty for none.</p>
        <Row xs={1} sm={2} className="g-0 gx-sm-3">
          <Col>
            <SelectField name="minInclusive" label="Lower limit" options={MIN_BOUND_OPTIONS} />
          </Col>
          <Col>
            <TextField name="minIn" label="Lower limit (inches)" inputMode="decimal" autoComplete="off" optional />
          </Col>
          <Col>
            <SelectField name="maxInclusive" label="Upper limit" options={MAX_BOUND_OPTIONS} />
          </Col>
          <Col>
            <TextField name="maxIn" label="Upper limit (inches)" inputMode="decimal" autoComplete="off" optional />
          </Col>
        </Row>
      </fieldset>
    );
  }
  return null;
}

/** The show's categories, a dialog to add or change one, and the four usual size bands in one go. */
export function CategoriesEditor({ categories, onSave, onDelete, deleting, deleteError, onAddMany }: CategoriesEditorProps) {
  const [editing, setEditing] = useState<Category | 'new' | null>(null);
  const [saved, setSaved] = useState('');
  const [adding, setAdding] = useState(false);
  const [addError, setAddError] = useState<unknown>(null);
  const titleId = 'category-dialog-title';
  const category = editing === 'new' ? null : editing;
  const missing = missingUsualCategories(categories);
  const nextSort = categories.reduce((max, c) => Math.max(max, c.sortOrder), 0) + 1;

  const addUsual = async () => {
    setSaved('');
    setAddError(null);
    setAdding(true);
    try {
      await onAddMany(missing);
      setSaved(`Added ${joinNames(missing.map((c) => c.name))}.`);
    } catch (error) {
      setAddError(error);
    } finally {
      setAdding(false);
    }
  };

  return (
    <>
      <p role="status" className={saved ? 'alert alert-success' : 'visually-hidden'}>
        {saved}
      </p>
      <ErrorAlert error={deleteError} />
      {categories.length === 0 ? (
        <p>No categories yet. Members cannot enter until there is at least one.</p>
      ) : (
        <table className="table stack-table categories-table">
          <caption className="visually-hidden">Categories of this show</caption>
          <thead>
            <tr>
              <th scope="col">Category</th>
              <th scope="col">Size</th>
              <th scope="col">Makers</th>
              <th scope="col">Quilts per member</th>
              <th scope="col">Entries</th>
              <th scope="col">
                <span className="visually-hidden">Actions</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {categories.map((c) => (
              <tr key={c.id} data-testid="category-row">
                <th scope="row">
                  {c.name}{' '}
                  <Badge bg={c.judged ? 'primary' : 'light'} text={c.judged ? undefined : 'dark'} className="status-badge border">
                    {judgedLabel(c.judged)}
                  </Badge>
                </th>
                <td data-label="Size">{c.sizeRuleText}</td>
                <td data-label="Makers">{c.minMakers != null && c.minMakers > 1 ? `At least ${c.minMakers}` : 'Any'}</td>
                <td data-label="Quilts per member">{c.maxEntriesPerMember ?? 'No limit'}</td>
                <td data-label="Entries">
                  {c.entryCount === c.acceptedCount ? c.entryCount : `${c.entryCount} (${c.acceptedCount} accepted)`}
                </td>
                <td data-label="Actions" className="no-label">
                  <div className="d-flex flex-wrap gap-2">
                    <Button variant="outline-primary" onClick={() => setEditing(c)}>
                      Change<span className="visually-hidden"> {c.name}</span>
                    </Button>
                    {c.entryCount > 0 ? (
                      <p className="small mb-0 align-self-center" data-testid="cannot-delete">
                        To delete it, first move its {c.entryCount === 1 ? 'entry' : `${c.entryCount} entries`} to another category.
                      </p>
                    ) : (
                      <ConfirmAction
                        label={
                          <>
                            Delete<span className="visually-hidden"> {c.name}</span>
                          </>
                        }
                        question={`Delete the category ${c.name}?`}
                        confirmLabel="Yes, delete it"
                        cancelLabel="Keep it"
                        busy={deleting}
                        onConfirm={() => onDelete(c)}
                      />
                    )}
                  </div>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      <div className="d-flex flex-wrap gap-2 mb-2">
        <Button variant="outline-primary" onClick={() => setEditing('new')}>
          Add a category
        </Button>
        <Button variant="outline-primary" onClick={addUsual} disabled={adding || missing.length === 0} aria-describedby="usual-bands-help">
          {adding ? 'Adding…' : 'Add the usual size categories'}
        </Button>
      </div>
      <p id="usual-bands-help" className="form-text">
        Small (less than 160 in), Medium (at least 160, at most 240), Large (more than 240, at most 320) and Extra large (more than 320), by
        perimeter. Published bands leave 240–241 in undecided; Selvage puts anything over 240 in Large.
        {missing.length === 0 && ' This show has all four already.'}
      </p>
      <ErrorAlert error={addError} />

      <Modal show={editing !== null} onHide={() => setEditing(null)} aria-labelledby={titleId} centered size="lg">
        {editing !== null && (
          <Formik<CategoryValues>
            initialValues={category ? toCategoryValues(category) : EMPTY_CATEGORY_VALUES}
            validationSchema={categorySchema}
            onSubmit={async (values, helpers) => {
              helpers.setStatus(undefined);
              try {
                await onSave(category?.id ?? null, toCategoryInput(values, { create: !category, sortOrder: category ? undefined : nextSort }));
                setSaved(category ? `${values.name.trim()} is saved.` : `${values.name.trim()} is added.`);
                setEditing(null);
              } catch (error) {
                applyServerErrors(error, helpers, values, CATEGORY_FIELD_MAP);
              }
            }}
          >
            {({ values }) => (
              <Form noValidate aria-labelledby={titleId}>
                <Modal.Header closeButton closeLabel="Close without saving">
                  <Modal.Title id={titleId} as="h2" className="h4">
                    {category ? `Change ${category.name}` : 'Add a category'}
                  </Modal.Title>
                </Modal.Header>
                <Modal.Body>
                  <FormAlert />
                  <TextField name="name" label="Name" autoComplete="off" help="For example Small, Art quilts or Group quilts." />
                  <TextareaField name="description" label="Description" optional rows={2} />
                  <RadioGroupField name="judged" legend="Judging" options={JUDGED_OPTIONS} inline />
                  <Row xs={1} sm={2} className="g-0 gx-sm-3">
                    <Col>
                      <TextField
                        name="minMakers"
                        type="number"
                        inputMode="numeric"
                        min={2}
                        max={50}
                        label="Fewest makers"
                        optional
                        help="For group quilts: 2 to 50, for example 3. Leave empty for any number."
                      />
                    </Col>
                    <Col>
                      <TextField
                        name="maxEntriesPerMember"
                        type="number"
                        inputMode="numeric"
                        min={1}
                        max={50}
                        label="Most quilts per member"
                        optional
                        help="1 to 50. Leave empty for no limit."
                      />
                    </Col>
                  </Row>
                  <RadioGroupField name="ruleKind" legend="Size rule" options={RULE_KIND_OPTIONS} />
                  <SizeRuleFields kind={values.ruleKind} />
                </Modal.Body>
                <Modal.Footer>
                  <Button variant="outline-secondary" onClick={() => setEditing(null)}>
                    Cancel
                  </Button>
                  <SubmitButton busyLabel="Saving">{category ? 'Save the category' : 'Add the category'}</SubmitButton>
                </Modal.Footer>
              </Form>
            )}
          </Formik>
        )}
      </Modal>
    </>
  );
}
