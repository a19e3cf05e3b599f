import ListGroup from 'react-bootstrap/ListGroup';
import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { formatAddress, messageDate, type InboxSummary } from '../api/get-inbox';

function formatDateTime(iso: string) {
  if (!iso) return '';
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : date.toLocaleString();
}

export function InboxList({ messages, selectedId }: { messages: InboxSummary[]; selectedId: string | null }) {
  if (messages.length === 0) return <p>No messages yet. E-mails the app sends will show up here within a few seconds.</p>;
  return (
    <ListGroup as="ul" className="inbox-list" aria-label="Messages, newest first">
      {messages.map((m) => {
        const selected = m.id === selectedId;
        return (
          <ListGroup.Item
            as="li"
            key={m.id}
            className={selected ? 'border-primary border-2' : undefined}
            data-testid="inbox-item"
          >
            <Link
              to={paths.devInbox.getHref(m.id)}
              aria-current={selected ? 'true' : undefined}
              className="d-block text-decoration-none py-1"
            >
              <span className="d-block fw-bold text-decoration-underline break-anywhere">{m.subject || '(no subject)'}</span>
              <span className="d-block text-body break-anywhere">To: {formatAddress(m.to)}</span>
              <span className="d-block text-body-secondary">{formatDateTime(messageDate(m))}</span>
            </Link>
          </ListGroup.Item>
        );
      })}
    </ListGroup>
  );
}
