import { useState, type FormEvent } from 'react';
import Alert from 'react-bootstrap/Alert';
import Button from 'react-bootstrap/Button';
import Col from 'react-bootstrap/Col';
import Form from 'react-bootstrap/Form';
import Row from 'react-bootstrap/Row';
import { useSearchParams } from 'react-router-dom';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { usePageTitle } from '@/components/ui/page-title';
import { env } from '@/config/env';
import { paths } from '@/config/paths';
import { useInbox } from '@/features/dev-inbox/api/get-inbox';
import { InboxList } from '@/features/dev-inbox/components/inbox-list';
import { InboxMessageView } from '@/features/dev-inbox/components/inbox-message-view';
import { useMeta } from '@/features/meta/api/get-meta';

function RecipientFilter({ value, onChange }: { value: string; onChange: (to: string) => void }) {
  const [draft, setDraft] = useState(value);
  const submit = (event: FormEvent) => {
    event.preventDefault();
    onChange(draft.trim());
  };
  return (
    <Form onSubmit={submit} role="search" aria-label="Filter messages" className="mb-3">
      <Form.Group controlId="inbox-to">
        <Form.Label>Only messages to</Form.Label>
        <div className="d-flex flex-wrap gap-2">
          <Form.Control
            type="email"
            value={draft}
            onChange={(e) => setDraft(e.currentTarget.value)}
            autoComplete="off"
            className="flex-grow-1 w-auto"
          />
          <Button type="submit" variant="outline-primary">
            Filter
          </Button>
          {value && (
            <Button
              variant="link"
              onClick={() => {
                setDraft('');
                onChange('');
              }}
            >
              Show all
            </Button>
          )}
        </div>
      </Form.Group>
    </Form>
  );
}

export default function DevInboxRoute() {
  usePageTitle('Development inbox');
  const meta = useMeta();
  const enabled = meta.data?.devInbox === true;
  const [searchParams, setSearchParams] = useSearchParams();
  const selectedId = searchParams.get('id');
  const to = searchParams.get('to') ?? '';
  const inbox = useInbox(to, { enabled });

  const hrefFor = (id: string) => {
    const href = paths.devInbox.getHref(id);
    return to ? `${href}&to=${encodeURIComponent(to)}` : href;
  };

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
            <RecipientFilter
              key={`filter:${to}`}
              value={to}
              onChange={(next) => setSearchParams(next ? { to: next } : {})}
            />
            {inbox.isPending && <PageSpinner label="Loading messages" />}
            {inbox.isError && <ErrorAlert error={inbox.error} />}
            {inbox.data && <InboxList key={`list:${to}`} messages={inbox.data} selectedId={selectedId} hrefFor={hrefFor} />}
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
