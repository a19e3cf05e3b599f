import Badge from 'react-bootstrap/Badge';
import Card from 'react-bootstrap/Card';
import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { formatDate, formatMonth } from '@/lib/dates';
import type { OwedBlock } from '../api/get-dashboard';

const STATUS: Record<string, string> = {
  not_started: 'Not started',
  made: 'Made, not sent yet',
  mailed: 'Mailed',
  handed_over: 'Handed over',
  received: 'Received by the queen',
};

export function OwedBlocks({ owed }: { owed: OwedBlock[] }) {
  if (owed.length === 0) {
    return <p>You owe no blocks right now. When a queen in one of your bees publishes her block, it appears here.</p>;
  }
  return (
    <ul className="plain-list row row-cols-1 row-cols-md-2 row-cols-xl-3 g-3" aria-label="Blocks I owe">
      {owed.map((item) => {
        const month = formatMonth(item.month);
        return (
          <li key={`${item.beeId}-${item.month}`} className="col" data-testid="owed-block">
            <Card className={`h-100 maker-card${item.late ? ' is-late' : ''}`}>
              <Card.Body className="d-flex flex-column">
                <h3 className="h5 mb-1">{item.title || `${month} block`}</h3>
                <p className="mb-1">
                  {item.beeName} · {month}
                </p>
                {item.queenName && <p className="mb-1">For queen {item.queenName}</p>}
                {item.dueDate && <p className="mb-1">Due {formatDate(item.dueDate)}</p>}
                <p className="mb-2">
                  <span className="visually-hidden">Status: </span>
                  <strong>{STATUS[item.status] ?? item.status}</strong>{' '}
                  {item.late && (
                    <Badge bg="danger" className="status-badge">
                      Late
                    </Badge>
                  )}
                </p>
                <Link to={paths.round.getHref(item.guildId, item.beeId, item.month)} className="btn btn-outline-primary mt-auto align-self-start">
                  Open the round<span className="visually-hidden"> for {item.beeName}, {month}</span>
                </Link>
              </Card.Body>
            </Card>
          </li>
        );
      })}
    </ul>
  );
}
