import { useId, useState, type FormEvent } from 'react';
import Button from 'react-bootstrap/Button';
import Form from 'react-bootstrap/Form';
import { ErrorAlert } from '@/components/ui/error-alert';
import { formatDateTime } from '@/lib/dates';
import { CODES_MAX } from '../api/ballot-codes';
import { codesPdfHref } from '../api/downloads';
import type { CodeBatch } from '../api/types';

type CodesPanelProps = {
  guildId: string;
  showId: string;
  batches: CodeBatch[] | undefined;
  timeZone?: string;
  onCreate: (count: number) => Promise<{ batch: number; count: number }>;
  busy?: boolean;
  error?: unknown;
};

/** Print visitor ballot cards: make a batch of codes, then print its sheet of cards. */
export function CodesPanel({ guildId, showId, batches, timeZone, onCreate, busy, error }: CodesPanelProps) {
  const id = useId();
  const [count, setCount] = useState('100');
  const [problem, setProblem] = useState('');
  const [made, setMade] = useState('');

  const submit = async (event: FormEvent) => {
    event.preventDefault();
    setMade('');
    const n = Number(count.trim());
    if (!/^\d+$/.test(count.trim()) || n < 1 || n > CODES_MAX) {
      setProblem(`Enter a whole number from 1 to ${CODES_MAX}.`);
      return;
    }
    setProblem('');
    try {
      const created = await onCreate(n);
      setMade(`Batch ${created.batch} is ready: ${created.count} codes. Print it from the list below.`);
    } catch {
      // The mutation's error is shown below.
    }
  };

  return (
    <>
      <p>
        Each card has its own code and can be used once, on a phone or on paper at the desk. Print them at 100% on plain paper and cut them
        apart.
      </p>
      <Form onSubmit={submit} noValidate aria-label="Make visitor ballot codes" className="mb-3">
        <Form.Group controlId={id} className="mb-3">
          <Form.Label>How many cards</Form.Label>
          <Form.Control
            type="number"
            inputMode="numeric"
            min={1}
            max={CODES_MAX}
            value={count}
            onChange={(e) => setCount(e.currentTarget.value)}
            isInvalid={Boolean(problem)}
            aria-invalid={problem ? true : undefined}
            aria-describedby={`${id}-help${problem ? ` ${id}-problem` : ''}`}
            className="codes-count"
          />
          {problem && (
            <Form.Control.Feedback type="invalid" id={`${id}-problem`}>
              {problem}
            </Form.Control.Feedback>
          )}
          <Form.Text id={`${id}-help`} className="d-block">
            From 1 to {CODES_MAX}.
          </Form.Text>
        </Form.Group>
        <ErrorAlert error={error} />
        <p role="status" className={made ? 'alert alert-success' : 'visually-hidden'}>
          {made}
        </p>
        <Button type="submit" variant="primary" disabled={busy}>
          {busy ? 'Making the codes…' : 'Make the codes'}
        </Button>
      </Form>
      {batches && batches.length > 0 && (
        <ul className="plain-list code-batches" aria-label="Batches of ballot cards">
          {batches.map((b) => (
            <li key={b.batch} className="d-flex flex-wrap align-items-center gap-2 py-1" data-testid="code-batch">
              <a href={codesPdfHref(guildId, showId, b.batch)} className="tap-link" download>
                Print batch {b.batch} ({b.count} cards, PDF)
              </a>
              <a href={codesPdfHref(guildId, showId, b.batch, 'paper')} className="tap-link" download>
                The same codes as paper ballots (PDF)
              </a>
              <span className="text-body-secondary">
                {b.used} used · made {formatDateTime(b.createdAt, timeZone)}
              </span>
            </li>
          ))}
        </ul>
      )}
    </>
  );
}
