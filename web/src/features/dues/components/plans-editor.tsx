import { Form, Formik } from 'formik';
import { useState } from 'react';
import Badge from 'react-bootstrap/Badge';
import Button from 'react-bootstrap/Button';
import Modal from 'react-bootstrap/Modal';
import { CheckboxField, RadioGroupField, TextField } from '@/components/ui/form-fields';
import { FormAlert } from '@/components/ui/form-alert';
import { applyServerErrors } from '@/components/ui/server-errors';
import { SubmitButton } from '@/components/ui/submit-button';
import { EMPTY_PLAN_VALUES, PLAN_FIELD_MAP, planSchema, toPlanInput, toPlanValues, type PlanInput, type PlanValues } from '../api/create-dues-plan';
import type { DuesPlan } from '../api/get-dues-plans';
import { isFreeKind, PLAN_KIND_OPTIONS, PLAN_KIND_SHORT } from '../lib/labels';
import { formatMoney } from '../lib/money';

type PlansEditorProps = {
  plans: DuesPlan[];
  currency: string;
  onSave: (planId: number | null, input: PlanInput) => Promise<unknown>;
};

function ages(plan: DuesPlan): string {
  if (plan.minAge != null && plan.maxAge != null) return `${plan.minAge} to ${plan.maxAge}`;
  if (plan.minAge != null) return `${plan.minAge} and over`;
  if (plan.maxAge != null) return `up to ${plan.maxAge}`;
  return 'Any age';
}

/** The plans members choose from, and a dialog to add or change one. */
export function PlansEditor({ plans, currency, onSave }: PlansEditorProps) {
  const [editing, setEditing] = useState<DuesPlan | 'new' | null>(null);
  const [saved, setSaved] = useState('');
  const titleId = 'plan-dialog-title';
  const plan = editing === 'new' ? null : editing;

  return (
    <>
      <p role="status" className={saved ? 'alert alert-success' : 'visually-hidden'}>
        {saved}
      </p>
      {plans.length === 0 ? (
        <p>No plans yet. Add one so members can pay.</p>
      ) : (
        <table className="table stack-table plans-table">
          <caption className="visually-hidden">Membership plans</caption>
          <thead>
            <tr>
              <th scope="col">Plan</th>
              <th scope="col">Kind</th>
              <th scope="col" className="amount">
                Dues a year
              </th>
              <th scope="col">Ages</th>
              <th scope="col">
                <span className="visually-hidden">Actions</span>
              </th>
            </tr>
          </thead>
          <tbody>
            {plans.map((p) => (
              <tr key={p.id} data-testid="plan-row">
                <th scope="row">
                  {p.name}{' '}
                  {!p.active && (
                    <Badge bg="light" text="dark" className="border status-badge">
                      Not offered
                    </Badge>
                  )}
                </th>
                <td data-label="Kind">{PLAN_KIND_SHORT[p.kind] ?? p.kind}</td>
                <td data-label="Dues a year" className="amount">
                  {isFreeKind(p.kind) ? 'No dues' : formatMoney(p.yearlyCents, currency)}
                </td>
                <td data-label="Ages">{ages(p)}</td>
                <td data-label="Actions" className="no-label">
                  <Button variant="outline-primary" onClick={() => setEditing(p)}>
                    Change<span className="visually-hidden"> {p.name}</span>
                  </Button>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      <Button variant="outline-primary" onClick={() => setEditing('new')}>
        Add a plan
      </Button>

      <Modal show={editing !== null} onHide={() => setEditing(null)} aria-labelledby={titleId} centered>
        {editing !== null && (
          <Formik<PlanValues>
            initialValues={plan ? toPlanValues(plan, currency) : EMPTY_PLAN_VALUES}
            validationSchema={planSchema(currency)}
            onSubmit={async (values, helpers) => {
              helpers.setStatus(undefined);
              try {
                await onSave(plan?.id ?? null, toPlanInput(values, currency));
                setSaved(plan ? `${values.name.trim()} is saved.` : `${values.name.trim()} is added.`);
                setEditing(null);
              } catch (error) {
                applyServerErrors(error, helpers, values, PLAN_FIELD_MAP);
              }
            }}
          >
            {({ values }) => (
              <Form noValidate aria-labelledby={titleId}>
                <Modal.Header closeButton closeLabel="Close without saving">
                  <Modal.Title id={titleId} as="h2" className="h4">
                    {plan ? `Change ${plan.name}` : 'Add a plan'}
                  </Modal.Title>
                </Modal.Header>
                <Modal.Body>
                  <FormAlert />
                  <TextField name="name" label="Name" autoComplete="off" help="For example Standard, Junior or Household." />
                  <RadioGroupField name="kind" legend="Kind of plan" options={PLAN_KIND_OPTIONS} />
                  {!isFreeKind(values.kind) && (
                    <TextField name="yearly" label={`Dues for one year (${currency})`} inputMode="decimal" autoComplete="off" />
                  )}
                  <TextField name="minAge" type="number" inputMode="numeric" min={0} max={150} label="Lowest age" optional />
                  <TextField name="maxAge" type="number" inputMode="numeric" min={0} max={150} label="Highest age" optional />
                  <CheckboxField name="active" label="Offered to members" help="Untick to stop offering it; people on it keep it." />
                </Modal.Body>
                <Modal.Footer>
                  <Button variant="outline-secondary" onClick={() => setEditing(null)}>
                    Cancel
                  </Button>
                  <SubmitButton busyLabel="Saving">{plan ? 'Save the plan' : 'Add the plan'}</SubmitButton>
                </Modal.Footer>
              </Form>
            )}
          </Formik>
        )}
      </Modal>
    </>
  );
}
