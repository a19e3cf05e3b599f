import Badge from 'react-bootstrap/Badge';
import Button from 'react-bootstrap/Button';
import Card from 'react-bootstrap/Card';
import { roleLabel, statusLabel } from '@/config/roles';
import type { Member } from '../api/get-members';
import { paperBadge } from '../api/paper-members';

type MemberListProps = {
  members: Member[];
  canEditRoles: boolean;
  onEditRoles: (member: Member) => void;
  emptyText?: string;
  /** Officers: change the details of a member who does not sign in. */
  onEditDetails?: (member: Member) => void;
  /** Roster officers: record that a member has left. */
  onRecordDeparture?: (member: Member) => void;
  /** Admins: erase a departed member's personal data. */
  onErase?: (member: Member) => void;
};

function formatJoined(iso: string | null | undefined) {
  if (!iso) return null;
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return null;
  return date.toLocaleDateString(undefined, { day: 'numeric', month: 'short', year: 'numeric' });
}

export function MemberList({ members, canEditRoles, onEditRoles, emptyText = 'No members yet.', onEditDetails, onRecordDeparture, onErase }: MemberListProps) {
  if (members.length === 0) return <p>{emptyText}</p>;
  return (
    <ul className="member-list row row-cols-1 row-cols-md-2 g-3" aria-label="Members">
      {members.map((member) => {
        const joined = formatJoined(member.joinedAt);
        const gone = member.status === 'left';
        const left = gone ? formatJoined(member.leftAt) : null;
        const badge = gone ? null : paperBadge(member);
        return (
          <li key={member.membershipId} className="col" data-testid="member-card">
            <Card className="h-100">
              <Card.Body className="d-flex flex-column">
                <h3 className="h5 mb-1">{member.name}</h3>
                {badge && (
                  <p className="mb-1">
                    <Badge bg="light" text="dark" className="border paper-badge fs-6 fw-normal" data-testid="paper-badge">
                      {badge}
                    </Badge>
                  </p>
                )}
                {member.email && (
                  <p className="mb-1 break-anywhere">
                    <span className="visually-hidden">E-mail: </span>
                    <a href={`mailto:${member.email}`} className="tap-link">
                      {member.email}
                    </a>
                  </p>
                )}
                {member.phone && (
                  <p className="mb-1">
                    <span className="visually-hidden">Phone: </span>
                    <a href={`tel:${member.phone.replace(/[^0-9+]/g, '')}`} className="tap-link">
                      {member.phone}
                    </a>
                  </p>
                )}
                {member.town && (
                  <p className="mb-1">
                    <span className="visually-hidden">Town: </span>
                    {member.town}
                  </p>
                )}
                <p className="mb-2">
                  <span className="visually-hidden">Roles: </span>
                  {member.roles.length === 0 ? (
                    <span className="text-body-secondary">Member</span>
                  ) : (
                    member.roles.map((role) => (
                      <Badge key={role} bg="primary" className={`role-badge role-badge-${role} me-1 mb-1`}>
                        {roleLabel(role)}
                      </Badge>
                    ))
                  )}
                </p>
                {(member.status || joined) && (
                  <p className="mb-2 text-body-secondary">
                    {member.status && <>Status: {statusLabel(member.status)}</>}
                    {member.status && joined && ' · '}
                    {joined && <>Joined {joined}</>}
                  </p>
                )}
                {gone && (
                  <p className="mb-2" data-testid="departure-note">
                    {member.erased ? 'Left; her personal data was erased.' : `Left${left ? ` on ${left}` : ''}.`}
                    {!member.erased && member.eraseRequestedAt && <strong className="d-block">She asked for her details to be erased.</strong>}
                  </p>
                )}
                {gone && onErase && !member.erased && (
                  <Button variant="outline-danger" className="mt-auto align-self-start" onClick={() => onErase(member)}>
                    Erase her personal data<span className="visually-hidden"> ({member.name})</span>
                  </Button>
                )}
                {!gone && onEditDetails && member.signsIn === false && (
                  <Button variant="outline-primary" className={`${canEditRoles ? 'mb-2' : 'mt-auto'} align-self-start`} onClick={() => onEditDetails(member)}>
                    Edit her details<span className="visually-hidden"> ({member.name})</span>
                  </Button>
                )}
                {!gone && canEditRoles && (
                  <Button variant="outline-primary" className={`${onRecordDeparture ? 'mb-2' : ''} mt-auto align-self-start`} onClick={() => onEditRoles(member)}>
                    Change roles<span className="visually-hidden"> for {member.name}</span>
                  </Button>
                )}
                {!gone && onRecordDeparture && member.roles.length === 0 && (
                  <Button variant="outline-secondary" className={`${canEditRoles ? '' : 'mt-auto'} align-self-start`} onClick={() => onRecordDeparture(member)}>
                    Record that she left<span className="visually-hidden"> ({member.name})</span>
                  </Button>
                )}
              </Card.Body>
            </Card>
          </li>
        );
      })}
    </ul>
  );
}
