import { useEffect, useRef, useState, type FormEvent } from 'react';
import Button from 'react-bootstrap/Button';
import Form from 'react-bootstrap/Form';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { CentredLayout } from '@/components/layouts/centred-layout';
import { usePageTitle } from '@/components/ui/page-title';
import { BALLOT_CODE_LENGTH, normaliseBallotCode } from '@/features/shows/lib/ballot-code';
import { showPaths } from '@/features/shows/lib/paths';

/** Visitors at a show: type the code from the ballot card (no account needed). */
export default function VoteRoute() {
  const navigate = useNavigate();
  // "Try another code" brings back what she typed, so a wrong letter is mended, not all 12 typed again.
  const [params] = useSearchParams();
  const typed = params.get('code') ?? '';
  const [code, setCode] = useState(typed);
  const [problem, setProblem] = useState('');
  const inputRef = useRef<HTMLInputElement>(null);
  usePageTitle('Vote for your favourite quilt');

  useEffect(() => {
    const input = inputRef.current;
    if (!typed || !input) return;
    input.focus();
    input.setSelectionRange(input.value.length, input.value.length);
  }, [typed]);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const normalised = normaliseBallotCode(code);
    if (!normalised) {
      setProblem('Type the code printed on your ballot card.');
      return;
    }
    if (normalised.length !== BALLOT_CODE_LENGTH) {
      const what = normalised.length === 1 ? 'letter or digit' : 'letters and digits';
      setProblem(`That is ${normalised.length} ${what}; a ballot code has ${BALLOT_CODE_LENGTH}, like K7QM-3XHD-9PRW.`);
      inputRef.current?.focus();
      return;
    }
    navigate(showPaths.visitorBallot.getHref(normalised));
  };

  return (
    <CentredLayout>
      <h1 className="mb-3">Vote for your favourite quilt</h1>
      <p>Your ballot card has a code on it. Type it here to vote on your phone. Each card can vote once.</p>
      <Form onSubmit={submit} noValidate aria-label="Open my ballot">
        <Form.Group controlId="ballot-code" className="mb-3">
          <Form.Label className="fs-5">Type the code from your ballot card</Form.Label>
          <Form.Control
            ref={inputRef}
            size="lg"
            value={code}
            onChange={(e) => setCode(e.currentTarget.value)}
            autoComplete="off"
            autoCapitalize="characters"
            autoCorrect="off"
            spellCheck={false}
            className="code-input code-input-big"
            isInvalid={Boolean(problem)}
            aria-invalid={problem ? true : undefined}
            aria-describedby={`ballot-code-help${problem ? ' ballot-code-problem' : ''}`}
          />
          {problem && (
            <Form.Control.Feedback type="invalid" id="ballot-code-problem">
              {problem}
            </Form.Control.Feedback>
          )}
          <Form.Text id="ballot-code-help" className="d-block">
            For example K7QM-3XHD-9PRW. Capitals or small letters, with or without the dashes.
          </Form.Text>
        </Form.Group>
        <Button type="submit" variant="primary" size="lg" className="w-100">
          Open my ballot
        </Button>
      </Form>
    </CentredLayout>
  );
}
