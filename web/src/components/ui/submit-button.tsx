import { useFormikContext } from 'formik';
import type { ReactNode } from 'react';
import Button from 'react-bootstrap/Button';
import Spinner from 'react-bootstrap/Spinner';

export function SubmitButton({ children, busyLabel, className }: { children: ReactNode; busyLabel?: string; className?: string }) {
  const { isSubmitting } = useFormikContext();
  return (
    <Button type="submit" variant="primary" disabled={isSubmitting} className={className}>
      {isSubmitting ? (
        <>
          <Spinner animation="border" size="sm" aria-hidden="true" className="me-2" />
          {busyLabel ?? 'Working'}…
        </>
      ) : (
        children
      )}
    </Button>
  );
}
