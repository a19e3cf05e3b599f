import { useState } from 'react';
import Alert from 'react-bootstrap/Alert';
import Button from 'react-bootstrap/Button';
import Form from 'react-bootstrap/Form';
import Modal from 'react-bootstrap/Modal';
import { ErrorAlert } from '@/components/ui/error-alert';
import { useDashboard, type DashboardGuild } from '@/features/dashboard/api/get-dashboard';
import { useLeaveGuild } from '../api/departures';

/** Her guilds, each with a way to leave it (and to ask for her details to be erased afterwards). */
export function LeaveGuildSection() {
  const dashboard = useDashboard();
  const [leaving, setLeaving] = useState<DashboardGuild | null>(null);
  const [left, setLeft] = useState<string | null>(null);
  const guilds = (dashboard.data?.guilds ?? []).filter((g) => g.status === 'active');
  return (
    <>
      {left && (
        <Alert variant="success" role="status">
          You have left {left}. Your account stays; you can still download your data here.
        </Alert>
      )}
      {guilds.length === 0 ? (
        <p className="mb-0">You are not a member of any guild at the moment.</p>
      ) : (
        <>
          <p>
            Leaving ends your membership: the guild's pages close to you and its bees stop counting you as a maker. Your account and
            your data download stay.
          </p>
          <ul className="list-unstyled d-grid gap-2 mb-0">
            {guilds.map((g) => (
              <li key={g.id}>
                <Button variant="outline-danger" onClick={() => setLeaving(g)}>
                  Leave {g.name}
                </Button>
              </li>
            ))}
          </ul>
        </>
      )}
      <LeaveDialog guild={leaving} onHide={() => setLeaving(null)} onLeft={(name) => setLeft(name)} />
    </>
  );
}

function LeaveDialog({ guild, onHide, onLeft }: { guild: DashboardGuild | null; onHide: () => void; onLeft: (name: string) => void }) {
  const leave = useLeaveGuild();
  const [eraseRequest, setEraseRequest] = useState(false);
  const titleId = 'leave-guild-title';
  const close = () => {
    leave.reset();
    setEraseRequest(false);
    onHide();
  };
  return (
    <Modal show={guild !== null} onHide={close} aria-labelledby={titleId} centered>
      {guild && (
        <>
          <Modal.Header closeButton closeLabel="Close without leaving">
            <Modal.Title id={titleId} as="h2" className="h4">
              Leave {guild.name}?
            </Modal.Title>
          </Modal.Header>
          <Modal.Body>
            {leave.isError && <ErrorAlert error={leave.error} />}
            <p>If you hold an office, an admin must hand it on first. Unpaid dues stay owed to the guild.</p>
            <Form.Check
              id="erase-request"
              type="checkbox"
              className="mb-2"
              checked={eraseRequest}
              onChange={(e) => setEraseRequest(e.currentTarget.checked)}
              label="Also ask the admins to erase my name and details once I have gone"
            />
            <p className="form-text mb-0">
              The treasurer keeps the records of what you paid, as the law requires; they will carry a record name instead of yours.
            </p>
          </Modal.Body>
          <Modal.Footer>
            <Button variant="outline-secondary" onClick={close}>
              Stay in the guild
            </Button>
            <Button
              variant="danger"
              disabled={leave.isPending}
              onClick={async () => {
                try {
                  await leave.mutateAsync({ guildId: Number(guild.id), eraseRequest });
                  onLeft(guild.name);
                  close();
                } catch {
                  // shown above
                }
              }}
            >
              {leave.isPending ? 'Leaving…' : `Leave ${guild.name}`}
            </Button>
          </Modal.Footer>
        </>
      )}
    </Modal>
  );
}
