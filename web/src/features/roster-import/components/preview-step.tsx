import { formatDay } from '@/lib/dates';
import { Form as FormikForm, Formik, useFormikContext } from 'formik';
import { useEffect, useId, useRef } from 'react';
import Badge from 'react-bootstrap/Badge';
import Button from 'react-bootstrap/Button';
import Card from 'react-bootstrap/Card';
import Form from 'react-bootstrap/Form';
import Table from 'react-bootstrap/Table';
import { ErrorAlert } from '@/components/ui/error-alert';
import { FormAlert } from '@/components/ui/form-alert';
import { RadioGroupField, SelectField } from '@/components/ui/form-fields';
import { applyServerErrors } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import { roleLabel } from '@/config/roles';
import type { PreviewRow, RosterPreview, RowAction } from '../api/preview-roster';
import { FIELD_LABELS, ROSTER_FIELDS, type ColumnUse, type DateOrder } from '../api/roster-body';

export type PreviewChoices = { mapping: ColumnUse[]; dateOrder: DateOrder };

const COLUMN_OPTIONS = [...ROSTER_FIELDS, 'ignore' as const].map((value) => ({ value, label: FIELD_LABELS[value] }));
const DATE_ORDER_OPTIONS = [
  { value: 'dmy', label: 'Day first: 3/4/2026 is 3 April 2026' },
  { value: 'mdy', label: 'Month first: 3/4/2026 is March 4, 2026' },
];

const ACTION_TEXT: Record<RowAction, string> = {
  new: 'New member',
  update: 'Update',
  unchanged: 'No change',
  skip: 'Skipped: has problems',
};
const ACTION_VARIANT: Record<RowAction, string> = { new: 'success', update: 'primary', unchanged: 'secondary', skip: 'danger' };
const CHANGE_LABELS: Record<string, string> = {
  name: 'name',
  phone: 'phone',
  town: 'town',
  memberSince: 'member since',
  paidThrough: 'paid through',
  household: 'household',
  roles: 'roles',
  status: 'back as a member',
};

const plural = (n: number, one: string, many = `${one}s`) => `${n.toLocaleString('en-US')} ${n === 1 ? one : many}`;

export function countsText(c: RosterPreview['counts']): string {
  return `${c.new.toLocaleString('en-US')} new, ${c.update.toLocaleString('en-US')} to update, ${c.unchanged.toLocaleString('en-US')} unchanged, ${c.problems.toLocaleString('en-US')} with problems (will be skipped)`;
}

/** Sends the new choices for a fresh preview whenever a column or the date order changes. */
function AutoPreview({ onChange }: { onChange: (choices: PreviewChoices) => void }) {
  const { values } = useFormikContext<PreviewChoices>();
  const last = useRef(JSON.stringify(values));
  useEffect(() => {
    const now = JSON.stringify(values);
    if (now === last.current) return;
    last.current = now;
    onChange(values);
  }, [values, onChange]);
  return null;
}

function RowDetails({ row }: { row: PreviewRow }) {
  const v = row.values;
  const facts = [
    v.email ?? 'no e-mail',
    v.phone,
    v.town,
    v.household && `household ${v.household}`,
    v.memberSince && `member since ${formatDay(v.memberSince)}`,
    v.paidThrough && `paid through ${formatDay(v.paidThrough)}`,
    v.roles.length ? v.roles.map(roleLabel).join(', ') : null,
  ].filter(Boolean);
  return (
    <>
      <div className="text-break">{facts.join(' · ')}</div>
      {row.existingAccount && <div className="text-body-secondary">She already has a Selvage account: her own details are kept.</div>}
      {row.changes.length > 0 && (
        <div>Changes: {row.changes.map((c) => `${CHANGE_LABELS[c.field] ?? c.field} ${c.from ?? '(none)'} → ${c.to}`).join('; ')}</div>
      )}
      {row.problems.length > 0 && (
        <ul className="text-danger fw-bold mb-0 ps-3" aria-label={`Problems on row ${row.rowNumber}`}>
          {row.problems.map((p) => (
            <li key={p}>{p}</li>
          ))}
        </ul>
      )}
    </>
  );
}

function ActionBadge({ action }: { action: RowAction }) {
  return (
    <Badge bg={ACTION_VARIANT[action]} className="fs-6 fw-normal text-wrap">
      {ACTION_TEXT[action]}
    </Badge>
  );
}

type Props = {
  preview: RosterPreview;
  busy: boolean;
  error: unknown;
  onChoicesChange: (choices: PreviewChoices) => void;
  onPage: (page: number) => void;
  onOnlyProblems: (only: boolean) => void;
  onImport: (choices: PreviewChoices) => Promise<unknown>;
  onStartOver: () => void;
};

/** Step 2: how each column is read, the date order, and what importing each row would do. */
export function PreviewStep({ preview, busy, error, onChoicesChange, onPage, onOnlyProblems, onImport, onStartOver }: Props) {
  const id = useId();
  const c = preview.counts;
  const toImport = c.new + c.update;
  return (
    <Formik<PreviewChoices>
      initialValues={{ mapping: preview.mapping, dateOrder: preview.dateOrder }}
      onSubmit={async (values, helpers) => {
        helpers.setStatus(undefined);
        try {
          await onImport(values);
        } catch (e) {
          applyServerErrors(e, helpers, values);
        }
      }}
    >
      <FormikForm noValidate>
        <AutoPreview onChange={onChoicesChange} />
        <section aria-labelledby={`${id}-columns`} className="mb-4">
          <h2 id={`${id}-columns`} className="h4">What each column holds</h2>
          <p>
            Selvage guessed from the column names; change any that are wrong. The columns are separated by {preview.delimiter === 'tab' ? 'tabs' : `${preview.delimiter}s`}.
          </p>
          <div className="row g-3">
            {preview.header.map((h, i) => (
              <div className="col-12 col-md-6 col-lg-4" key={i}>
                <SelectField name={`mapping.${i}`} label={`Column ${i + 1}: “${h || '(no name)'}”`} options={COLUMN_OPTIONS} />
              </div>
            ))}
          </div>
          <RadioGroupField
            name="dateOrder"
            legend="How are dates like 3/4/2026 written in your file?"
            options={DATE_ORDER_OPTIONS}
            help="Dates written like 2026-03-01, 1 March 2026, 1 Mar 2026 or March 1, 2026 are read either way, and so are a spreadsheet's own date numbers. Slashes, dots and dashes all work. Two-digit years 00–49 mean 2000–2049, 50–99 mean 1950–1999. A date that does not exist, like 31/02/2026, is shown as a problem."
          />
        </section>

        {error ? <ErrorAlert error={error} /> : null}
        {preview.mappingProblem && (
          <p className="alert alert-warning fs-5" role="alert">
            {preview.mappingProblem}
          </p>
        )}

        {!preview.mappingProblem && (
          <section aria-labelledby={`${id}-rows`} aria-busy={busy}>
            <h2 id={`${id}-rows`} className="h4">What will happen</h2>
            <p className="fs-5 fw-bold" role="status" data-testid="roster-counts">
              {countsText(c)}
            </p>
            <Form.Check
              type="switch"
              id={`${id}-only`}
              className="mb-3 fs-5"
              label="Show only the rows with problems"
              checked={preview.onlyProblems}
              onChange={(e) => onOnlyProblems(e.currentTarget.checked)}
            />
            <Table responsive className="d-none d-md-table align-top">
              <thead>
                <tr>
                  <th scope="col">Row</th>
                  <th scope="col">Name</th>
                  <th scope="col">Details</th>
                  <th scope="col">Importing will</th>
                </tr>
              </thead>
              <tbody>
                {preview.rows.map((row) => (
                  <tr key={row.rowNumber} className={row.problems.length ? 'table-danger' : undefined}>
                    <td>{row.rowNumber}</td>
                    <td>{row.values.name || <em>(no name)</em>}</td>
                    <td>
                      <RowDetails row={row} />
                    </td>
                    <td>
                      <ActionBadge action={row.action} />
                    </td>
                  </tr>
                ))}
              </tbody>
            </Table>
            <ul className="list-unstyled d-md-none" aria-label="Rows of the file">
              {preview.rows.map((row) => (
                <li key={row.rowNumber} className="mb-3">
                  <Card border={row.problems.length ? 'danger' : undefined} className={row.problems.length ? 'border-3' : undefined}>
                    <Card.Body>
                      <div className="d-flex justify-content-between gap-2 flex-wrap">
                        <strong className="fs-5">
                          Row {row.rowNumber}: {row.values.name || '(no name)'}
                        </strong>
                        <ActionBadge action={row.action} />
                      </div>
                      <RowDetails row={row} />
                    </Card.Body>
                  </Card>
                </li>
              ))}
            </ul>
            {preview.pageCount > 1 && (
              <nav aria-label="Pages of rows" className="d-flex gap-2 align-items-center flex-wrap mb-4">
                <Button variant="outline-primary" disabled={busy || preview.page <= 1} onClick={() => onPage(preview.page - 1)}>
                  Previous {preview.pageSize} rows
                </Button>
                <span>
                  Page {preview.page} of {preview.pageCount}
                </span>
                <Button variant="outline-primary" disabled={busy || preview.page >= preview.pageCount} onClick={() => onPage(preview.page + 1)}>
                  Next {preview.pageSize} rows
                </Button>
              </nav>
            )}
          </section>
        )}

        <FormAlert />
        <div className="d-flex gap-3 flex-wrap">
          {toImport > 0 && !preview.mappingProblem ? (
            <SubmitButton busyLabel="Importing" className="btn-lg">
              Import {plural(toImport, 'member')}
            </SubmitButton>
          ) : (
            !preview.mappingProblem && <p className="fs-5 mb-0">There is nothing new to import.</p>
          )}
          <Button variant="outline-secondary" size="lg" onClick={onStartOver}>
            Choose another file
          </Button>
        </div>
      </FormikForm>
    </Formik>
  );
}
