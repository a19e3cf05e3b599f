import Spinner from 'react-bootstrap/Spinner';

export function PageSpinner({ label = 'Loading' }: { label?: string }) {
  return (
    <div className="d-flex align-items-center gap-3 py-5" role="status" aria-live="polite">
      <Spinner animation="border" variant="primary" aria-hidden="true" />
      <span>{label}…</span>
    </div>
  );
}
