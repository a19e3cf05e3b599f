import Badge from 'react-bootstrap/Badge';
import Card from 'react-bootstrap/Card';
import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { roleLabel, statusLabel } from '@/config/roles';
import type { DashboardGuild } from '../api/get-dashboard';

export function GuildCard({ guild }: { guild: DashboardGuild }) {
  const headingId = `guild-${guild.id}-name`;
  return (
    <Card as="article" aria-labelledby={headingId} className="h-100">
      <Card.Body className="d-flex flex-column">
        <h3 id={headingId} className="h4 mb-1">
          {guild.name}
        </h3>
        <p className="text-body-secondary mb-2">{guild.town}</p>
        <p className="mb-2">
          <span className="visually-hidden">My roles: </span>
          <Badge bg="light" text="dark" className="role-badge border me-1 mb-1">
            Member
          </Badge>
          {guild.roles.map((role) => (
            <Badge key={role} bg="primary" className={`role-badge role-badge-${role} me-1 mb-1`}>
              {roleLabel(role)}
            </Badge>
          ))}
        </p>
        <p className="mb-3">
          {guild.memberCount === 1 ? '1 member' : `${guild.memberCount} members`}
          {guild.status && guild.status !== 'active' && <> · Membership {statusLabel(guild.status).toLowerCase()}</>}
        </p>
        {guild.bees && guild.bees.length > 0 && (
          <div className="mb-3">
            <h4 className="h6 mb-1">My bees</h4>
            <ul className="list-unstyled mb-0">
              {guild.bees.map((bee) => (
                <li key={bee.id} className="mb-1">
                  <Link to={paths.bee.getHref(guild.id, bee.id)} className="fw-bold tap-link">
                    {bee.name}
                  </Link>
                  {bee.description && <span className="d-block text-body-secondary small">{bee.description}</span>}
                </li>
              ))}
            </ul>
          </div>
        )}
        <div className="d-flex flex-wrap gap-2 mt-auto">
          <Link to={paths.members.getHref(guild.id)} className="btn btn-outline-primary">
            Member directory<span className="visually-hidden"> for {guild.name}</span>
          </Link>
          <Link to={paths.bees.getHref(guild.id)} className="btn btn-outline-primary">
            Bees<span className="visually-hidden"> in {guild.name}</span>
          </Link>
        </div>
      </Card.Body>
    </Card>
  );
}
