import { isRouteErrorResponse, useRouteError } from 'react-router-dom';
import { CentredLayout } from '@/components/layouts/centred-layout';
import { ErrorFallback } from './error-fallback';
import { NotFound } from './not-found';

export function RouteError() {
  const error = useRouteError();
  if (isRouteErrorResponse(error) && error.status === 404) {
    return (
      <CentredLayout>
        <NotFound />
      </CentredLayout>
    );
  }
  console.error(error);
  return <ErrorFallback />;
}
