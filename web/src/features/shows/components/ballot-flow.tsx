import { useEffect, useRef, useState, type ReactNode } from 'react';
import Alert from 'react-bootstrap/Alert';
import Button from 'react-bootstrap/Button';
import Spinner from 'react-bootstrap/Spinner';
import { errorMessage } from '@/components/ui/error-alert';
import type { BallotChoicesPayload } from '../api/types';
import { ballotProblem, buildChoices, EMPTY_SELECTION, reviewLines, type Selection } from '../lib/choices';
import { BallotChoices, ballotInstructions, type BallotShape } from './ballot-choices';

type BallotFlowProps = {
  ballot: BallotShape;
  onCast: (choices: BallotChoicesPayload) => Promise<unknown>;
  /** Extra words under a refusal, e.g. a link to try another code. */
  errorExtra?: (error: unknown) => ReactNode;
};

/** Choose, check, cast: the ballot in two steps, with the warning that a cast ballot is final. */
export function BallotFlow({ ballot, onCast, errorExtra }: BallotFlowProps) {
  const [selection, setSelection] = useState<Selection>(EMPTY_SELECTION);
  const [step, setStep] = useState<'choose' | 'review'>('choose');
  const [problem, setProblem] = useState('');
  const [error, setError] = useState<unknown>(null);
  const [busy, setBusy] = useState(false);
  const reviewHeading = useRef<HTMLHeadingElement>(null);
  const problemRef = useRef<HTMLDivElement>(null);
  const chooseTop = useRef<HTMLDivElement>(null);
  const moved = useRef(false);

  // Moving between the steps puts keyboard and screen reader users at the top of the new step.
  useEffect(() => {
    if (!moved.current) return;
    if (step === 'review') reviewHeading.current?.focus();
    else chooseTop.current?.focus();
  }, [step]);

  const check = () => {
    const found = ballotProblem(ballot, selection);
    setProblem(found ?? '');
    if (found) {
      requestAnimationFrame(() => problemRef.current?.focus());
      return;
    }
    setError(null);
    moved.current = true;
    setStep('review');
  };

  const cast = async () => {
    setBusy(true);
    setError(null);
    try {
      await onCast(buildChoices(ballot, selection));
    } catch (e) {
      setError(e);
    } finally {
      setBusy(false);
    }
  };

  if (step === 'review') {
    const lines = reviewLines(ballot, selection);
    const left = lines.filter((l) => l.empty).length;
    return (
      <section aria-labelledby="ballot-review-heading" className="ballot-review" data-testid="ballot-review">
        <h2 id="ballot-review-heading" ref={reviewHeading} tabIndex={-1} className="mb-3">
          Check your ballot
        </h2>
        <dl className="facts facts-wide review-lines">
          {lines.map((line) => (
            <div key={line.label}>
              <dt>{line.label}</dt>
              <dd className={line.empty ? 'text-body-secondary' : 'fw-bold'}>{line.value}</dd>
            </div>
          ))}
        </dl>
        {ballot.show.votingKind !== 'ranked' && left > 0 && (
          <p>
            You have not voted in {left} {left === 1 ? 'category' : 'categories'}. That is fine; {left === 1 ? 'it counts' : 'they count'} as no
            vote.
          </p>
        )}
        <p className="fs-5 fw-bold final-note">Once you cast your ballot it is final: it cannot be changed.</p>
        {error != null && (
          <Alert variant="danger" className="mb-3" data-testid="cast-error">
            <p className="mb-0">{errorMessage(error)}</p>
            {errorExtra?.(error)}
          </Alert>
        )}
        <div className="d-flex flex-wrap gap-2">
          <Button variant="primary" size="lg" onClick={cast} disabled={busy}>
            {busy && <Spinner animation="border" size="sm" aria-hidden="true" className="me-2" />}
            Cast my ballot
          </Button>
          <Button variant="outline-secondary" size="lg" onClick={() => setStep('choose')} disabled={busy}>
            Change my choices
          </Button>
        </div>
      </section>
    );
  }

  return (
    <div className="ballot-flow">
      <div ref={chooseTop} tabIndex={-1}>
        <p className="fs-5">{ballotInstructions(ballot)}</p>
      </div>
      <p>You can check your choices before you cast your ballot. Once it is cast it cannot be changed.</p>
      <BallotChoices ballot={ballot} selection={selection} onChange={setSelection} />
      <div ref={problemRef} tabIndex={-1}>
        {problem && (
          <Alert variant="danger" className="mb-3" role="alert">
            {problem}
          </Alert>
        )}
      </div>
      <Button variant="primary" size="lg" className="ballot-next" onClick={check}>
        Check my ballot
      </Button>
    </div>
  );
}
