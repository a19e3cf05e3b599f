import Alert from 'react-bootstrap/Alert';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { CentredLayout } from '@/components/layouts/centred-layout';
import { usePageTitle } from '@/components/ui/page-title';
import { paths } from '@/config/paths';
import { ResetPasswordForm } from '@/features/auth/components/reset-password-form';

export default function ResetPasswordRoute() {
  usePageTitle('Choose a new password');
  const [searchParams] = useSearchParams();
  const navigate = useNavigate();
  const token = searchParams.get('token');

  return (
    <CentredLayout>
      <h1 className="mb-3">Choose a new password</h1>
      {token ? (
        <ResetPasswordForm
          token={token}
          onDone={() =>
            navigate(paths.signIn.getHref(), {
              replace: true,
              state: { notice: 'Your password has been changed. Sign in with your new password.' },
            })
          }
        />
      ) : (
        <Alert variant="danger">
          This page needs the link from your password reset e-mail. Open the link in the e-mail again, or ask for a new
          one.
        </Alert>
      )}
      <p className="mt-4 mb-0">
        <Link to={paths.forgotPassword.getHref()} className="tap-link">
          Ask for a new reset link
        </Link>
      </p>
    </CentredLayout>
  );
}
