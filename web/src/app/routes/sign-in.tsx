import Alert from 'react-bootstrap/Alert';
import { Navigate, useLocation, useNavigate, useSearchParams } from 'react-router-dom';
import { CentredLayout } from '@/components/layouts/centred-layout';
import { PageSpinner } from '@/components/ui/page-spinner';
import { usePageTitle } from '@/components/ui/page-title';
import { safeRedirect } from '@/config/paths';
import { SignInForm } from '@/features/auth/components/sign-in-form';
import { useUser } from '@/lib/auth';

export type SignInNotice = { notice?: string };

export default function SignInRoute() {
  usePageTitle('Sign in');
  const [searchParams] = useSearchParams();
  const location = useLocation();
  const navigate = useNavigate();
  const redirectTo = safeRedirect(searchParams.get('redirectTo'));
  const notice = (location.state as SignInNotice | null)?.notice;
  const { data: user, isPending } = useUser();

  if (isPending) {
    return (
      <CentredLayout>
        <PageSpinner />
      </CentredLayout>
    );
  }
  if (user) return <Navigate to={redirectTo} replace />;

  return (
    <CentredLayout>
      <h1 className="mb-3">Sign in</h1>
      {notice && (
        <Alert variant="success" role="status">
          {notice}
        </Alert>
      )}
      <p>Sign in with the e-mail address your guild has for you.</p>
      <SignInForm onSuccess={() => navigate(redirectTo, { replace: true })} />
    </CentredLayout>
  );
}
