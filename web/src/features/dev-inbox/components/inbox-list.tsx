import { useState } from 'react';
import Button from 'react-bootstrap/Button';
import ListGroup from 'react-bootstrap/ListGroup';
import { Link } from 'react-router-dom';
import { formatAddress, messageDate, type InboxSummary } from '../api/get-inbox';

const PAGE_SIZE = 20;

function formatDateTime(iso: string) {
  if (!iso) return '';
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : date.toLocaleString();
}

type InboxListProps = {
  messages: InboxSummary[];
  selectedId: string | null;
  hrefFor: (id: string) => string;
};

export function InboxList({ messages, selectedId, hrefFor }: InboxListProps) {
  const [shown, setShown] = useState(PAGE_SIZE);
  if (messages.length === 0) return <p>No messages yet. E-mails the app sends will show up here within a few seconds.</p>;
  const visible = messages.slice(0, shown);
  return (
    <>
      <ListGroup as="ul" className="inbox-list" aria-label="Messages, newest first">
        {visible.map((m) => {
          const selected = m.id === selectedId;
          return (
            <ListGroup.Item
              as="li"
              key={m.id}
              className={selected ? 'border-primary border-2' : undefined}
              data-testid="inbox-item"
            >
              <Link to={hrefFor(m.id)} aria-current={selected ? 'true' : undefined} className="d-block text-decoration-none py-1">
                <span className="d-block fw-bold text-decoration-underline break-anywhere">{m.subject || '(no subject)'}</span>
                <span className="d-block text-body break-anywhere">To: {formatAddress(m.to)}</span>
                <span className="d-block text-body-secondary">{formatDateTime(messageDate(m))}</span>
              </Link>
            </ListGroup.Item>
          );
        })}
      </ListGroup>
      <p className="mt-2 mb-0 text-body-secondary">
        Showing {visible.length} of {messages.length}.
      </p>
      {messages.length > shown && (
        <Button variant="outline-primary" className="mt-2" onClick={() => setShown((n) => n + PAGE_SIZE)}>
          Show {Math.min(PAGE_SIZE, messages.length - shown)} more
        </Button>
      )}
    </>
  );
}
