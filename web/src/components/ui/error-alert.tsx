import Alert from 'react-bootstrap/Alert';
import { isApiError } from '@/lib/api-client';

export function errorMessage(error: unknown): string {
  if (isApiError(error)) return error.message;
  return 'Something went wrong. Please try again.';
}

export function ErrorAlert({ error, className = 'mb-3' }: { error: unknown; className?: string }) {
  if (!error) return null;
  return (
    <Alert variant="danger" className={className}>
      {errorMessage(error)}
    </Alert>
  );
}
