import { useEffect, useId, useRef, useState, type FormEvent } from 'react';
import Button from 'react-bootstrap/Button';
import Form from 'react-bootstrap/Form';
import { ConfirmAction } from '@/components/ui/confirm-action';
import { ErrorAlert } from '@/components/ui/error-alert';
import { formatDateTime } from '@/lib/dates';
import type { DecisionInput } from '../api/results';
import type { ResultCategory, Results } from '../api/types';
import { entryNumberText, ordinal } from '../lib/labels';

type TieDecisionsProps = {
  results: Results;
  timeZone?: string;
  /** Published results are final: ties and decisions are shown, not changed. */
  published?: boolean;
  onDecide: (input: DecisionInput) => Promise<unknown>;
  onRemove: (decisionId: number) => Promise<unknown>;
  busy?: boolean;
  error?: unknown;
};

function titleOf(category: ResultCategory, entryId: number): string {
  const s = category.standings.find((x) => x.entryId === entryId);
  if (!s) return `Entry ${entryId}`;
  const number = entryNumberText(s.entryNumber);
  return number ? `${number}, ${s.title}` : s.title;
}

type TieFormProps = {
  category: ResultCategory;
  tie: ResultCategory['ties'][number];
  onDecide: TieDecisionsProps['onDecide'];
  busy?: boolean;
};

function TieForm({ category, tie, onDecide, busy }: TieFormProps) {
  const id = useId();
  const [order, setOrder] = useState(tie.entryIds);
  const [note, setNote] = useState('');
  const [problem, setProblem] = useState('');
  const listRef = useRef<HTMLOListElement>(null);
  const [moved, setMoved] = useState<{ entryId: number; dir: 'up' | 'down' } | null>(null);
  const move = (from: number, to: number) => {
    const next = [...order];
    const [item] = next.splice(from, 1);
    next.splice(to, 0, item);
    setOrder(next);
    setMoved({ entryId: item, dir: to < from ? 'up' : 'down' });
  };

  // Keep focus on the quilt that moved; at the top or bottom its button in that direction is disabled, so use the other.
  useEffect(() => {
    if (!moved) return;
    const find = (dir: string) => listRef.current?.querySelector<HTMLButtonElement>(`[data-move="${moved.entryId}-${dir}"]:not(:disabled)`);
    (find(moved.dir) ?? find(moved.dir === 'up' ? 'down' : 'up'))?.focus();
  }, [moved]);
  const submit = async (event: FormEvent) => {
    event.preventDefault();
    if (!note.trim()) {
      setProblem('Say how the tie was decided, for the record.');
      return;
    }
    setProblem('');
    try {
      await onDecide({ categoryId: category.categoryId, order, note: note.trim() });
    } catch {
      // Shown by the caller.
    }
  };
  const label = `Tie for ${ordinal(tie.rank)} place in ${category.name}`;
  return (
    <Form onSubmit={submit} noValidate aria-label={label} className="tie-form swatch-row mb-3" data-testid="tie-form">
      <p className="fw-bold mb-2">{label}</p>
      <p className="mb-2">Put them in the order you decided, best first.</p>
      <ol ref={listRef} className="manual-order mb-3">
        {order.map((entryId, i) => (
          <li key={entryId} className="py-1">
            <p className="mb-1 break-anywhere">
              <strong>{ordinal(tie.rank + i)}:</strong> {titleOf(category, entryId)}
            </p>
            <div className="d-flex flex-wrap gap-2">
              <Button variant="outline-primary" disabled={i === 0} data-move={`${entryId}-up`} onClick={() => move(i, i - 1)}>
                Move up<span className="visually-hidden"> {titleOf(category, entryId)}</span>
              </Button>
              <Button variant="outline-primary" disabled={i === order.length - 1} data-move={`${entryId}-down`} onClick={() => move(i, i + 1)}>
                Move down<span className="visually-hidden"> {titleOf(category, entryId)}</span>
              </Button>
            </div>
          </li>
        ))}
      </ol>
      <Form.Group controlId={`${id}-note`} className="mb-3">
        <Form.Label>How it was decided</Form.Label>
        <Form.Control
          as="textarea"
          rows={2}
          value={note}
          onChange={(e) => setNote(e.currentTarget.value)}
          isInvalid={Boolean(problem)}
          aria-invalid={problem ? true : undefined}
          aria-describedby={`${id}-note-help${problem ? ` ${id}-note-problem` : ''}`}
        />
        {problem && (
          <Form.Control.Feedback type="invalid" id={`${id}-note-problem`}>
            {problem}
          </Form.Control.Feedback>
        )}
        <Form.Text id={`${id}-note-help`} className="d-block">
          For example: the judges chose, or a draw at the committee meeting. It is kept with the results.
        </Form.Text>
      </Form.Group>
      <Button type="submit" variant="primary" disabled={busy}>
        Record this decision
      </Button>
    </Form>
  );
}

/** Ties that touch a ribbon: the chair puts the tied quilts in order and says why; decisions can be taken back. */
export function TieDecisions({ results, timeZone, published = false, onDecide, onRemove, busy, error }: TieDecisionsProps) {
  const relevant = results.categories.filter((c) => c.ties.length > 0 || c.decisions.length > 0);
  if (relevant.length === 0) return <p>No ties for a ribbon. Nothing to decide.</p>;
  return (
    <>
      <ErrorAlert error={error} />
      {published && <p>The results are published, so ties and decisions stay as they are.</p>}
      {relevant.map((category) => (
        <div key={category.categoryId ?? 'overall'} className="mb-3">
          <h3 className="h5">{category.name}</h3>
          {category.ties.map((tie) =>
            published ? (
              <p key={`${tie.rank}-${tie.entryIds.join('-')}`} data-testid="shared-place">
                Shared {ordinal(tie.rank)} place: {tie.entryIds.map((entryId) => titleOf(category, entryId)).join(' and ')}.
              </p>
            ) : (
              <TieForm key={`${tie.rank}-${tie.entryIds.join('-')}`} category={category} tie={tie} onDecide={onDecide} busy={busy} />
            ),
          )}
          {category.decisions.map((d) => (
            <div key={d.id} className="d-flex flex-wrap align-items-start gap-2 mb-2" data-testid="decision">
              <p className="mb-0 flex-grow-1 min-w-0">
                Decided: {d.order.map((entryId) => titleOf(category, entryId)).join(', then ')}. “{d.note}” ({d.decidedBy},{' '}
                {formatDateTime(d.decidedAt, timeZone)})
              </p>
              {!published && (
                <ConfirmAction
                  label="Remove this decision"
                  question="Remove this tie decision? The tie comes back and can be decided again."
                  confirmLabel="Yes, remove it"
                  cancelLabel="Keep it"
                  busy={busy}
                  onConfirm={() => onRemove(d.id)}
                />
              )}
            </div>
          ))}
        </div>
      ))}
    </>
  );
}
