import { useState, type FormEvent } from 'react';
import Button from 'react-bootstrap/Button';
import Col from 'react-bootstrap/Col';
import Form from 'react-bootstrap/Form';
import Row from 'react-bootstrap/Row';
import type { DuesPlan } from '../api/get-dues-plans';
import { EMPTY_LEDGER_FILTERS, ledgerQueryString, type LedgerFilters as Filters } from '../api/get-ledger';
import { INVOICE_STATUS_OPTIONS, METHOD_OPTIONS } from '../lib/labels';

type LedgerFiltersProps = {
  filters: Filters;
  years: string[];
  plans: DuesPlan[];
  onApply: (filters: Filters) => void;
};

type SelectProps = {
  id: string;
  label: string;
  value: string;
  allLabel: string;
  options: readonly { value: string; label: string }[];
  onChange: (value: string) => void;
};

function FilterSelect({ id, label, value, allLabel, options, onChange }: SelectProps) {
  return (
    <Form.Group controlId={id}>
      <Form.Label>{label}</Form.Label>
      <Form.Select value={value} onChange={(e) => onChange(e.currentTarget.value)}>
        <option value="">{allLabel}</option>
        {options.map((o) => (
          <option key={o.value} value={o.value}>
            {o.label}
          </option>
        ))}
      </Form.Select>
    </Form.Group>
  );
}

/** Year, plan, status and payment method; nothing changes until she presses "Show payments". */
export function LedgerFilters({ filters, years, plans, onApply }: LedgerFiltersProps) {
  const [draft, setDraft] = useState<Filters>(filters);
  const current = ledgerQueryString(filters);
  const [applied, setApplied] = useState(current);
  // When the address changes (back button, a link), start again from what it says.
  if (applied !== current) {
    setApplied(current);
    setDraft(filters);
  }
  const set = (key: keyof Filters) => (value: string) => setDraft((d) => ({ ...d, [key]: value }));
  const anySet = Object.values(filters).some(Boolean);
  const yearOptions = [...new Set([...(filters.year ? [filters.year] : []), ...years])].map((y) => ({ value: y, label: y }));
  const planOptions = plans.map((p) => ({ value: String(p.id), label: p.name }));

  const submit = (event: FormEvent) => {
    event.preventDefault();
    onApply(draft);
  };

  return (
    <Form onSubmit={submit} aria-label="Choose which payments to show" className="ledger-filters mb-3">
      <Row xs={1} sm={2} xl={4} className="g-3 mb-3">
        <Col>
          <FilterSelect id="ledger-year" label="Membership year" value={draft.year} allLabel="All years" options={yearOptions} onChange={set('year')} />
        </Col>
        <Col>
          <FilterSelect id="ledger-plan" label="Plan" value={draft.planId} allLabel="All plans" options={planOptions} onChange={set('planId')} />
        </Col>
        <Col>
          <FilterSelect
            id="ledger-status"
            label="Status"
            value={draft.status}
            allLabel="Any status"
            options={INVOICE_STATUS_OPTIONS}
            onChange={set('status')}
          />
        </Col>
        <Col>
          <FilterSelect id="ledger-method" label="Paid by" value={draft.method} allLabel="Any way" options={METHOD_OPTIONS} onChange={set('method')} />
        </Col>
      </Row>
      <div className="d-flex flex-wrap gap-2">
        <Button type="submit" variant="primary">
          Show payments
        </Button>
        {anySet && (
          <Button variant="outline-secondary" onClick={() => onApply(EMPTY_LEDGER_FILTERS)}>
            Show all payments
          </Button>
        )}
      </div>
    </Form>
  );
}
