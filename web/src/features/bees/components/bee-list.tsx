import Badge from 'react-bootstrap/Badge';
import Card from 'react-bootstrap/Card';
import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { formatMonth, lastMonth } from '@/lib/dates';
import type { BeeSummary } from '../api/get-bees';
import { handoverLabel, myStatusLabel } from './labels';

export function BeeList({ guildId, bees }: { guildId: string; bees: BeeSummary[] }) {
  if (bees.length === 0) return <p>This guild has no bees yet. Start one with the form on this page.</p>;
  return (
    <ul className="plain-list row row-cols-1 row-cols-md-2 g-3" aria-label="Bees">
      {bees.map((bee) => {
        const headingId = `bee-${bee.id}-name`;
        return (
          <li key={bee.id} className="col">
            <Card as="article" aria-labelledby={headingId} className="h-100" data-testid="bee-card">
              <Card.Body className="d-flex flex-column">
                <h3 id={headingId} className="h4 mb-1">
                  <Link to={paths.bee.getHref(guildId, bee.id)} className="tap-link">
                    {bee.name}
                  </Link>
                </h3>
                {bee.description && <p className="mb-2">{bee.description}</p>}
                <dl className="facts mb-2">
                  <div>
                    <dt>Hand-over</dt>
                    <dd>{handoverLabel(bee.handover)}</dd>
                  </div>
                  <div>
                    <dt>Months</dt>
                    <dd>
                      {formatMonth(bee.startMonth)} to {formatMonth(lastMonth(bee.startMonth, bee.months))} ({bee.months}{' '}
                      {bee.months === 1 ? 'month' : 'months'})
                    </dd>
                  </div>
                  <div>
                    <dt>Organiser</dt>
                    <dd>{bee.organiser.name}</dd>
                  </div>
                  <div>
                    <dt>Makers</dt>
                    <dd>{bee.memberCount}</dd>
                  </div>
                </dl>
                <p className="mb-0 mt-auto">
                  <Badge bg={bee.myStatus ? 'primary' : 'light'} text={bee.myStatus ? undefined : 'dark'} className="status-badge border">
                    {myStatusLabel(bee.myStatus)}
                  </Badge>
                </p>
              </Card.Body>
            </Card>
          </li>
        );
      })}
    </ul>
  );
}
