import { useState } from 'react';
import Badge from 'react-bootstrap/Badge';
import { ConfirmAction } from '@/components/ui/confirm-action';
import { ErrorAlert } from '@/components/ui/error-alert';
import type { Bee } from '../api/get-bee';
import { useRemoveBeeMember } from '../api/remove-bee-member';
import { memberStatusLabel } from './labels';

export function BeeMembers({ guildId, bee }: { guildId: string; bee: Bee }) {
  const remove = useRemoveBeeMember(guildId, String(bee.id));
  const [removed, setRemoved] = useState('');
  const members = [...bee.members].sort((a, b) => {
    const rank = (s: string) => (s === 'organiser' ? 0 : s === 'active' ? 1 : 2);
    return rank(a.status) - rank(b.status) || a.name.localeCompare(b.name);
  });

  return (
    <>
      <ErrorAlert error={remove.error} />
      <p role="status" aria-live="polite" className={removed ? 'mb-2' : 'visually-hidden'}>
        {removed ? `${removed} is no longer in the bee. The months ahead have been re-planned.` : ''}
      </p>
      {members.length === 0 ? (
        <p>No makers yet.</p>
      ) : (
        <ul className="plain-list bee-members" aria-label="Makers in this bee">
          {members.map((member) => {
            const isOrganiser = member.membershipId === bee.organiser.membershipId || member.status === 'organiser';
            return (
              <li key={member.membershipId} className="border-bottom py-2 d-flex align-items-center gap-2">
                {/* The name wraps inside its own column, so the button keeps its place on every row. */}
                <div className="flex-grow-1" style={{ minWidth: 0 }}>
                  <strong>{member.name}</strong>{' '}
                  <Badge bg={member.status === 'invited' ? 'light' : 'primary'} text={member.status === 'invited' ? 'dark' : undefined} className="status-badge border">
                    {isOrganiser ? 'Organiser' : memberStatusLabel(member.status)}
                  </Badge>
                  {member.onPaper && (
                    <>
                      {' '}
                      <Badge bg="light" text="dark" className="status-badge border">
                        Kept on paper
                      </Badge>
                    </>
                  )}
                </div>
                {bee.isOrganiser && !isOrganiser && (
                  <ConfirmAction
                    label={
                      <>
                        Remove<span className="visually-hidden"> {member.name} from the bee</span>
                      </>
                    }
                    question={`Remove ${member.name} from ${bee.name}? Her months ahead go to the other makers; past months stay as they were.`}
                    confirmLabel={`Yes, remove ${member.name}`}
                    busy={remove.isPending}
                    onConfirm={async () => {
                      setRemoved('');
                      await remove.mutateAsync(member.membershipId);
                      setRemoved(member.name);
                    }}
                  />
                )}
              </li>
            );
          })}
        </ul>
      )}
    </>
  );
}
