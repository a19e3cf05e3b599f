import { useState } from 'react';
import Alert from 'react-bootstrap/Alert';
import { Link } from 'react-router-dom';
import { CentredLayout } from '@/components/layouts/centred-layout';
import { usePageTitle } from '@/components/ui/page-title';
import { paths } from '@/config/paths';
import { ForgotPasswordForm } from '@/features/auth/components/forgot-password-form';

export default function ForgotPasswordRoute() {
  usePageTitle('Forgot your password?');
  const [sentTo, setSentTo] = useState<string | null>(null);
  return (
    <CentredLayout>
      <h1 className="mb-3">Forgot your password?</h1>
      {sentTo ? (
        <Alert variant="success" role="status">
          <h2 className="h5">Check your e-mail</h2>
          <p className="mb-0">
            If <strong className="break-anywhere">{sentTo}</strong> belongs to a Selvage account, a link to choose a new
            password is on its way. The link works for a limited time.
          </p>
        </Alert>
      ) : (
        <>
          <p>Tell us the e-mail address you sign in with and we will send you a link to choose a new password.</p>
          <ForgotPasswordForm onSent={setSentTo} />
        </>
      )}
      <p className="mt-4 mb-0">
        <Link to={paths.signIn.getHref()} className="tap-link">
          Back to sign in
        </Link>
      </p>
    </CentredLayout>
  );
}
