import Alert from 'react-bootstrap/Alert';
import Button from 'react-bootstrap/Button';
import { Link, useLocation, useNavigate, useParams } from 'react-router-dom';
import { CentredLayout } from '@/components/layouts/centred-layout';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { usePageTitle } from '@/components/ui/page-title';
import { paths } from '@/config/paths';
import { useAcceptInvitation } from '@/features/invitations/api/accept-invitation';
import { useInvitation, type InvitationDetails } from '@/features/invitations/api/get-invitation';
import { AcceptInvitationForm } from '@/features/invitations/components/accept-invitation-form';
import { isApiError } from '@/lib/api-client';
import { useSignOut, useUser } from '@/lib/auth';

function formatDate(iso: string) {
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return null;
  return date.toLocaleDateString(undefined, { day: 'numeric', month: 'long', year: 'numeric' });
}

function ExistingAccountJoin({ token, invitation }: { token: string; invitation: InvitationDetails }) {
  const navigate = useNavigate();
  const location = useLocation();
  const { data: user, isPending } = useUser();
  const accept = useAcceptInvitation(token);
  const signOut = useSignOut();
  const here = `${location.pathname}${location.search}`;

  if (isPending) return <PageSpinner />;

  if (!user) {
    return (
      <>
        <p>
          You already have a Selvage account. Sign in as <strong className="break-anywhere">{invitation.email}</strong>{' '}
          to accept.
        </p>
        <Link to={paths.signIn.getHref(here)} className="btn btn-primary">
          Sign in to accept
        </Link>
      </>
    );
  }

  if (user.email.toLowerCase() !== invitation.email.toLowerCase()) {
    return (
      <>
        <Alert variant="warning" className="text-body">
          This invitation is for <strong className="break-anywhere">{invitation.email}</strong>, but you are signed in as{' '}
          <strong className="break-anywhere">{user.email}</strong>.
        </Alert>
        <Button
          variant="primary"
          disabled={signOut.isPending}
          onClick={() => signOut.mutate(undefined, { onSettled: () => navigate(paths.signIn.getHref(here)) })}
        >
          Sign out and sign in as {invitation.email}
        </Button>
      </>
    );
  }

  return (
    <>
      <p>
        You are signed in as <strong className="break-anywhere">{user.email}</strong>.
      </p>
      <ErrorAlert error={accept.error} />
      <Button
        variant="primary"
        disabled={accept.isPending}
        onClick={() => accept.mutate({}, { onSuccess: () => navigate(paths.home.getHref(), { replace: true }) })}
      >
        {accept.isPending ? 'Joining…' : 'Accept and join'}
      </Button>
    </>
  );
}

export default function InvitationRoute() {
  const { token = '' } = useParams();
  const navigate = useNavigate();
  const invitation = useInvitation(token);
  usePageTitle(invitation.data ? `Join ${invitation.data.guildName}` : 'Invitation');

  let body;
  if (invitation.isPending) {
    body = <PageSpinner label="Opening your invitation" />;
  } else if (invitation.isError) {
    const gone = isApiError(invitation.error) && invitation.error.status === 404;
    body = (
      <>
        <h1 className="mb-3">{gone ? 'This invitation cannot be used' : 'We could not open this invitation'}</h1>
        {gone ? (
          <p>
            The link is not valid any more: it may have expired, been used already, or been withdrawn. Ask the person who
            invited you to send a new invitation.
          </p>
        ) : (
          <ErrorAlert error={invitation.error} />
        )}
        <Link to={paths.home.getHref()} className="tap-link">
          Go to Selvage
        </Link>
      </>
    );
  } else {
    const data = invitation.data;
    const expires = formatDate(data.expiresAt);
    body = (
      <>
        <h1 className="mb-3">
          {data.invitedByName
            ? `${data.invitedByName} invited you to join ${data.guildName}`
            : `You are invited to join ${data.guildName}`}
        </h1>
        {data.guildTown && <p className="mb-1">A quilt guild in {data.guildTown}.</p>}
        {expires && <p className="text-body-secondary">This invitation is open until {expires}.</p>}
        {data.hasAccount ? (
          <ExistingAccountJoin token={token} invitation={data} />
        ) : (
          <AcceptInvitationForm
            token={token}
            email={data.email}
            onAccepted={() => navigate(paths.home.getHref(), { replace: true })}
          />
        )}
      </>
    );
  }

  return <CentredLayout>{body}</CentredLayout>;
}
