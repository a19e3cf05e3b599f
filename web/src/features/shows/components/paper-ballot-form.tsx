import { useId, useRef, useState, type FormEvent } from 'react';
import Alert from 'react-bootstrap/Alert';
import Button from 'react-bootstrap/Button';
import Form from 'react-bootstrap/Form';
import Spinner from 'react-bootstrap/Spinner';
import { errorMessage } from '@/components/ui/error-alert';
import { isApiError } from '@/lib/api-client';
import type { BallotChoicesPayload } from '../api/types';
import { normaliseBallotCode } from '../lib/ballot-code';
import { ballotProblem, buildChoices, EMPTY_SELECTION, type Selection } from '../lib/choices';
import { BallotChoices, type BallotShape } from './ballot-choices';

type PaperBallotFormProps = {
  ballot: BallotShape;
  onRecord: (code: string, choices: BallotChoicesPayload) => Promise<{ ballotsCast: number }>;
};

/** A used or unknown code said plainly, even when the server sends no sentence of its own. */
export function paperBallotMessage(error: unknown): string {
  if (isApiError(error) && error.status === 409 && error.message === 'That clashes with something that already exists.') return 'That code has already been used.';
  return errorMessage(error);
}

/** Key in a paper ballot: the code on the card, then the choices marked on it. Ready for the next one after. */
export function PaperBallotForm({ ballot, onRecord }: PaperBallotFormProps) {
  const id = useId();
  const codeRef = useRef<HTMLInputElement>(null);
  const [code, setCode] = useState('');
  const [selection, setSelection] = useState<Selection>(EMPTY_SELECTION);
  const [codeProblem, setCodeProblem] = useState('');
  const [problem, setProblem] = useState('');
  const [done, setDone] = useState('');
  const [busy, setBusy] = useState(false);
  // A new key clears the choice cards after each ballot.
  const [round, setRound] = useState(0);

  const submit = async (event: FormEvent) => {
    event.preventDefault();
    setDone('');
    setProblem('');
    const normalised = normaliseBallotCode(code);
    if (!normalised) {
      setCodeProblem('Type the code printed on the ballot card.');
      codeRef.current?.focus();
      return;
    }
    setCodeProblem('');
    const found = ballotProblem(ballot, selection);
    if (found) {
      setProblem(found === 'Choose at least one quilt first.' ? 'Mark the choices written on the card first.' : found);
      return;
    }
    setBusy(true);
    try {
      const result = await onRecord(normalised, buildChoices(ballot, selection));
      setCode('');
      setSelection(EMPTY_SELECTION);
      setRound((r) => r + 1);
      setDone(`Paper ballot recorded. ${result.ballotsCast} ballots cast so far. Type the next code.`);
      codeRef.current?.focus();
    } catch (error) {
      if (isApiError(error) && error.errors.code?.length) setCodeProblem(error.errors.code.join(' '));
      else setProblem(paperBallotMessage(error));
      if (isApiError(error) && (error.status === 409 || error.status === 404)) codeRef.current?.focus();
    } finally {
      setBusy(false);
    }
  };

  return (
    <Form onSubmit={submit} noValidate aria-label="Record a paper ballot" className="paper-ballot-form">
      <p role="status" className={done ? 'alert alert-success' : 'visually-hidden'}>
        {done}
      </p>
      <Form.Group controlId={`${id}-code`} className="mb-3">
        <Form.Label>Code on the ballot card</Form.Label>
        <Form.Control
          ref={codeRef}
          value={code}
          onChange={(e) => setCode(e.currentTarget.value)}
          autoComplete="off"
          autoCapitalize="characters"
          spellCheck={false}
          className="code-input"
          isInvalid={Boolean(codeProblem)}
          aria-invalid={codeProblem ? true : undefined}
          aria-describedby={`${id}-code-help${codeProblem ? ` ${id}-code-problem` : ''}`}
        />
        {codeProblem && (
          <Form.Control.Feedback type="invalid" id={`${id}-code-problem`}>
            {codeProblem}
          </Form.Control.Feedback>
        )}
        <Form.Text id={`${id}-code-help`} className="d-block">
          Capitals, small letters, spaces and dashes are all fine.
        </Form.Text>
      </Form.Group>
      <BallotChoices key={round} ballot={ballot} selection={selection} onChange={setSelection} headingLevel={3} />
      {problem && (
        <Alert variant="danger" className="mb-3" role="alert" data-testid="paper-error">
          {problem}
        </Alert>
      )}
      <Button type="submit" variant="primary" size="lg" disabled={busy}>
        {busy && <Spinner animation="border" size="sm" aria-hidden="true" className="me-2" />}
        Record this paper ballot
      </Button>
    </Form>
  );
}
