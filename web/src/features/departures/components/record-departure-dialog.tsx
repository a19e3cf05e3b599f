import Button from 'react-bootstrap/Button';
import Modal from 'react-bootstrap/Modal';
import { ErrorAlert } from '@/components/ui/error-alert';
import { useRecordDeparture } from '../api/departures';

type RecordDepartureDialogProps = {
  guildId: string;
  member: { membershipId: number; name: string } | null;
  onHide: () => void;
};

/** An officer records that a member has left the guild (she told them, or did not renew). */
export function RecordDepartureDialog({ guildId, member, onHide }: RecordDepartureDialogProps) {
  const record = useRecordDeparture(guildId);
  const titleId = 'record-departure-title';
  const close = () => {
    record.reset();
    onHide();
  };
  return (
    <Modal show={member !== null} onHide={close} aria-labelledby={titleId} centered>
      {member && (
        <>
          <Modal.Header closeButton closeLabel="Close">
            <Modal.Title id={titleId} as="h2" className="h4">
              {member.name} has left the guild?
            </Modal.Title>
          </Modal.Header>
          <Modal.Body>
            {record.isError && <ErrorAlert error={record.error} />}
            <p className="mb-0">
              Her membership ends today and she stops being a maker in the guild's bees. Her dues, blocks and show entries stay on
              record. She can be invited back later.
            </p>
          </Modal.Body>
          <Modal.Footer>
            <Button variant="outline-secondary" onClick={close}>
              Cancel
            </Button>
            <Button
              variant="danger"
              disabled={record.isPending}
              onClick={async () => {
                try {
                  await record.mutateAsync(member.membershipId);
                  close();
                } catch {
                  // shown above
                }
              }}
            >
              {record.isPending ? 'Saving…' : 'Yes, she has left'}
            </Button>
          </Modal.Footer>
        </>
      )}
    </Modal>
  );
}
