import Button from 'react-bootstrap/Button';
import { Link, useLocation } from 'react-router-dom';
import { CentredLayout } from '@/components/layouts/centred-layout';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { usePageTitle } from '@/components/ui/page-title';
import { paths } from '@/config/paths';
import { useUnsubscribe, useUnsubscribeLink } from '@/features/mail-preferences/api/mail-preferences';

/** Where the "stop reminder e-mails" link in a reminder leads: one button, no sign-in. */
export default function UnsubscribeRoute() {
  usePageTitle('Stop reminder e-mails');
  const { search } = useLocation();
  const link = useUnsubscribeLink(search);
  const stop = useUnsubscribe(search);
  const done = stop.isSuccess || link.data?.remindersOff;
  return (
    <CentredLayout>
      <h1 className="h2 mb-3">Stop reminder e-mails</h1>
      {link.isPending && <PageSpinner label="Checking the link" />}
      {link.isError && (
        <>
          <ErrorAlert error={link.error} />
          <Link to={paths.signIn.getHref(paths.profile.getHref())} className="btn btn-outline-primary">
            Sign in to choose your e-mails
          </Link>
        </>
      )}
      {link.data &&
        (done ? (
          <p className="fs-5" role="status">
            Done: Selvage will send you no more reminders. Receipts, invitations, password resets and your own bee assignments still come. You can turn
            reminders back on from your profile page.
          </p>
        ) : (
          <>
            <p className="fs-5">
              Reminders are the notes about blocks coming due, setting your month's block and dues to renew. Receipts, invitations, password resets and
              your own bee assignments will still come.
            </p>
            <Button size="lg" onClick={() => stop.mutate()} disabled={stop.isPending}>
              Stop reminder e-mails
            </Button>
            <ErrorAlert error={stop.error} />
          </>
        ))}
    </CentredLayout>
  );
}
