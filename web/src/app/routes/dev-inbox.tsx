import Alert from 'react-bootstrap/Alert';
import Col from 'react-bootstrap/Col';
import Row from 'react-bootstrap/Row';
import { useSearchParams } from 'react-router-dom';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { usePageTitle } from '@/components/ui/page-title';
import { env } from '@/config/env';
import { useInbox } from '@/features/dev-inbox/api/get-inbox';
import { InboxList } from '@/features/dev-inbox/components/inbox-list';
import { InboxMessageView } from '@/features/dev-inbox/components/inbox-message-view';
import { useMeta } from '@/features/meta/api/get-meta';

export default function DevInboxRoute() {
  usePageTitle('Development inbox');
  const meta = useMeta();
  const enabled = meta.data?.devInbox === true;
  const inbox = useInbox({ enabled });
  const [searchParams] = useSearchParams();
  const selectedId = searchParams.get('id');

  let content;
  if (meta.isPending) {
    content = <PageSpinner />;
  } else if (!enabled) {
    content = (
      <Alert variant="secondary" className="text-body">
        The development inbox is only available when the local SMTP fake is configured.
      </Alert>
    );
  } else {
    content = (
      <Row className="g-4">
        <Col lg={4}>
          <section aria-labelledby="inbox-messages">
            <h2 id="inbox-messages" className="h4">
              Messages
            </h2>
            <p className="text-body-secondary">Checks for new mail every {Math.round(env.inboxRefreshMs / 1000)} seconds.</p>
            {inbox.isPending && <PageSpinner label="Loading messages" />}
            {inbox.isError && <ErrorAlert error={inbox.error} />}
            {inbox.data && <InboxList messages={inbox.data} selectedId={selectedId} />}
          </section>
        </Col>
        <Col lg={8}>
          {selectedId ? (
            <InboxMessageView id={selectedId} />
          ) : (
            <p className="text-body-secondary">Choose a message to read it.</p>
          )}
        </Col>
      </Row>
    );
  }

  return (
    <>
      <div className="page-header">
        <h1>Development inbox</h1>
        <p className="lead mb-0">E-mails caught by the local mail server instead of being delivered.</p>
      </div>
      {content}
    </>
  );
}
