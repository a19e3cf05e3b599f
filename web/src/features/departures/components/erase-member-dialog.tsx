import { useState } from 'react';
import Alert from 'react-bootstrap/Alert';
import Button from 'react-bootstrap/Button';
import Form from 'react-bootstrap/Form';
import Modal from 'react-bootstrap/Modal';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { useEraseMember, useErasurePlan, type Erased } from '../api/departures';

type EraseMemberDialogProps = {
  guildId: string;
  member: { membershipId: number; name: string } | null;
  onHide: () => void;
};

/** The admin reads what goes and what stays, ticks that she understands, and erases. */
export function EraseMemberDialog({ guildId, member, onHide }: EraseMemberDialogProps) {
  const plan = useErasurePlan(guildId, member?.membershipId ?? null);
  const erase = useEraseMember(guildId);
  const [understood, setUnderstood] = useState(false);
  const [done, setDone] = useState<Erased | null>(null);
  const titleId = 'erase-member-title';
  const close = () => {
    erase.reset();
    setUnderstood(false);
    setDone(null);
    onHide();
  };
  const p = plan.data;
  return (
    <Modal show={member !== null} onHide={close} aria-labelledby={titleId} centered scrollable>
      {member && (
        <>
          <Modal.Header closeButton closeLabel="Close">
            <Modal.Title id={titleId} as="h2" className="h4">
              Erase {member.name}'s personal data
            </Modal.Title>
          </Modal.Header>
          <Modal.Body>
            {plan.isPending && <PageSpinner label="Checking what can be erased" />}
            {plan.isError && <ErrorAlert error={plan.error} />}
            {done ? (
              <Alert variant="success" role="status" className="mb-0">
                Erased. Her records now read “{done.name}”.
                {done.photosRemoved > 0 && ` ${done.photosRemoved} ${done.photosRemoved === 1 ? 'photo was' : 'photos were'} removed.`}
              </Alert>
            ) : (
              p && (
                <>
                  {p.refusals.length > 0 ? (
                    <Alert variant="warning" data-testid="erase-refusals">
                      <strong className="d-block mb-1">This cannot be done yet.</strong>
                      <ul className="mb-0 ps-3">
                        {p.refusals.map((r) => (
                          <li key={r.code}>{r.message}</li>
                        ))}
                      </ul>
                    </Alert>
                  ) : (
                    <>
                      {p.eraseRequestedAt && <p className="fw-bold">She asked for this when she left.</p>}
                      <h3 className="h5">Erased for good</h3>
                      <ul>
                        {p.erases.map((line) => (
                          <li key={line}>{line}</li>
                        ))}
                      </ul>
                      <h3 className="h5">Kept</h3>
                      <ul>
                        {p.keeps.map((line) => (
                          <li key={line}>{line}</li>
                        ))}
                      </ul>
                      <p>
                        Her records will read <strong>“{p.newName}”</strong>.
                      </p>
                      {erase.isError && <ErrorAlert error={erase.error} />}
                      <Form.Check
                        id="erase-understood"
                        type="checkbox"
                        checked={understood}
                        onChange={(e) => setUnderstood(e.currentTarget.checked)}
                        label="I understand this cannot be undone"
                      />
                    </>
                  )}
                </>
              )
            )}
          </Modal.Body>
          <Modal.Footer>
            <Button variant="outline-secondary" onClick={close}>
              {done ? 'Close' : 'Cancel'}
            </Button>
            {p && p.refusals.length === 0 && !done && (
              <Button
                variant="danger"
                disabled={!understood || erase.isPending}
                onClick={async () => {
                  try {
                    setDone(await erase.mutateAsync(member.membershipId));
                  } catch {
                    // shown above
                  }
                }}
              >
                {erase.isPending ? 'Erasing…' : 'Erase her details'}
              </Button>
            )}
          </Modal.Footer>
        </>
      )}
    </Modal>
  );
}
