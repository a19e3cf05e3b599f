import { useEffect, useId, useRef, useState, type ReactNode } from 'react';
import Button from 'react-bootstrap/Button';
import Spinner from 'react-bootstrap/Spinner';

type ConfirmActionProps = {
  /** The first button, e.g. "Leave this bee". */
  label: ReactNode;
  /** The question shown after the first press. */
  question: ReactNode;
  /** The button that really does it, e.g. "Yes, leave". */
  confirmLabel: ReactNode;
  cancelLabel?: ReactNode;
  onConfirm: () => Promise<unknown> | void;
  busy?: boolean;
  variant?: string;
  className?: string;
};

/** A destructive action in two steps: press, read the question, then confirm or cancel. */
export function ConfirmAction({
  label,
  question,
  confirmLabel,
  cancelLabel = 'Cancel',
  onConfirm,
  busy = false,
  variant = 'outline-danger',
  className,
}: ConfirmActionProps) {
  const [asking, setAsking] = useState(false);
  const questionId = useId();
  const confirmRef = useRef<HTMLButtonElement>(null);
  const startRef = useRef<HTMLButtonElement>(null);
  const returnFocus = useRef(false);

  useEffect(() => {
    if (asking) confirmRef.current?.focus();
    else if (returnFocus.current) {
      returnFocus.current = false;
      startRef.current?.focus();
    }
  }, [asking]);

  if (!asking) {
    return (
      <Button ref={startRef} variant={variant} className={className} onClick={() => setAsking(true)}>
        {label}
      </Button>
    );
  }
  return (
    <div className={`confirm-step ${className ?? ''}`} role="group" aria-labelledby={questionId}>
      <p id={questionId} className="mb-2 fw-bold">
        {question}
      </p>
      <div className="d-flex flex-wrap gap-2">
        <Button
          ref={confirmRef}
          variant="danger"
          disabled={busy}
          aria-describedby={questionId}
          onClick={async () => {
            try {
              await onConfirm();
            } catch {
              // The caller shows the error (its mutation's state); the step closes either way.
            } finally {
              setAsking(false);
            }
          }}
        >
          {busy && <Spinner animation="border" size="sm" aria-hidden="true" className="me-2" />}
          {confirmLabel}
        </Button>
        <Button
          variant="outline-secondary"
          disabled={busy}
          onClick={() => {
            returnFocus.current = true;
            setAsking(false);
          }}
        >
          {cancelLabel}
        </Button>
      </div>
    </div>
  );
}
