import { useState } from 'react';
import Button from 'react-bootstrap/Button';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { roleLabel } from '@/config/roles';
import { useGuildInvitations } from '../api/get-guild-invitations';
import { useRevokeInvitation } from '../api/revoke-invitation';

function formatDate(iso: string | undefined) {
  if (!iso) return null;
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return null;
  return date.toLocaleDateString(undefined, { day: 'numeric', month: 'short', year: 'numeric' });
}

export function PendingInvitations({ guildId }: { guildId: string }) {
  const invitations = useGuildInvitations(guildId);
  const revoke = useRevokeInvitation(guildId);
  const [revoked, setRevoked] = useState<string | null>(null);

  if (invitations.isPending) return <PageSpinner label="Loading invitations" />;
  if (invitations.isError) return <ErrorAlert error={invitations.error} />;

  return (
    <>
      <ErrorAlert error={revoke.error} />
      <p role="status" className={revoked ? 'mb-2' : 'visually-hidden'}>
        {revoked ? `Invitation for ${revoked} revoked.` : ''}
      </p>
      {invitations.data.length === 0 ? (
        <p className="text-body-secondary">No invitations are waiting for an answer.</p>
      ) : (
        <ul className="invitation-list" aria-label="Pending invitations">
          {invitations.data.map((invitation) => {
            const expires = formatDate(invitation.expiresAt);
            return (
              <li key={invitation.id} className="border-bottom py-2 d-flex flex-wrap align-items-center gap-2">
                <div className="flex-grow-1 break-anywhere">
                  <strong>{invitation.email}</strong>
                  <div className="text-body-secondary">
                    {invitation.roles && invitation.roles.length > 0 && <>{invitation.roles.map(roleLabel).join(', ')} · </>}
                    {expires ? `open until ${expires}` : 'waiting'}
                  </div>
                </div>
                <Button
                  variant="outline-danger"
                  size="sm"
                  disabled={revoke.isPending && revoke.variables === invitation.id}
                  onClick={() =>
                    revoke.mutate(invitation.id, { onSuccess: () => setRevoked(invitation.email) })
                  }
                >
                  Revoke<span className="visually-hidden"> the invitation for {invitation.email}</span>
                </Button>
              </li>
            );
          })}
        </ul>
      )}
    </>
  );
}
