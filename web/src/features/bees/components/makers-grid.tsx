import { useId, useState, type ReactNode } from 'react';
import Badge from 'react-bootstrap/Badge';
import Button from 'react-bootstrap/Button';
import Card from 'react-bootstrap/Card';
import Form from 'react-bootstrap/Form';
import { ErrorAlert } from '@/components/ui/error-alert';
import { blockStatusLabel, BLOCK_STATUS_LABELS, type Block, type BlockStatus } from '../api/get-round';
import type { UpdateBlockInput } from '../api/update-block';

type MakersGridProps = {
  blocks: Block[];
  /** The queen (and the organiser) can mark blocks received. */
  canMarkReceived: boolean;
  /** The organiser can set any status on a maker's behalf (the queen too, for a maker who does not sign in). */
  canSetOnBehalf: boolean;
  onUpdate: (membershipId: number, input: UpdateBlockInput) => Promise<unknown>;
  onNudge?: () => Promise<{ nudged: number }>;
  /** Extra content under a maker's status, such as her block's latest size check. */
  renderExtra?: (block: Block) => ReactNode;
};

function OnBehalfForm({ block, onUpdate }: { block: Block; onUpdate: MakersGridProps['onUpdate'] }) {
  const id = useId();
  const [status, setStatus] = useState<BlockStatus>(block.status);
  const [tracking, setTracking] = useState(block.trackingNumber ?? '');
  const [busy, setBusy] = useState(false);
  return (
    <Form
      className="mt-2 on-behalf"
      aria-label={`Set ${block.name}'s status on her behalf`}
      onSubmit={async (e) => {
        e.preventDefault();
        setBusy(true);
        try {
          await onUpdate(block.membershipId, {
            status,
            ...(status === 'mailed' && tracking.trim() ? { trackingNumber: tracking.trim() } : {}),
          });
        } catch {
          // The grid shows the error.
        } finally {
          setBusy(false);
        }
      }}
    >
      <Form.Group controlId={`${id}-status`} className="mb-2">
        <Form.Label>
          Status, on her behalf<span className="visually-hidden"> ({block.name})</span>
        </Form.Label>
        <Form.Select value={status} onChange={(e) => setStatus(e.currentTarget.value as BlockStatus)}>
          {(Object.keys(BLOCK_STATUS_LABELS) as BlockStatus[]).map((s) => (
            <option key={s} value={s}>
              {BLOCK_STATUS_LABELS[s]}
            </option>
          ))}
        </Form.Select>
      </Form.Group>
      {status === 'mailed' && (
        <Form.Group controlId={`${id}-tracking`} className="mb-2">
          <Form.Label>
            Tracking number <span className="fw-normal text-body-secondary">(optional)</span>
          </Form.Label>
          <Form.Control value={tracking} onChange={(e) => setTracking(e.currentTarget.value)} autoComplete="off" />
        </Form.Group>
      )}
      <Button type="submit" variant="outline-primary" disabled={busy}>
        Save on her behalf<span className="visually-hidden"> ({block.name})</span>
      </Button>
    </Form>
  );
}

export function MakersGrid({ blocks, canMarkReceived, canSetOnBehalf, onUpdate, onNudge, renderExtra }: MakersGridProps) {
  const [error, setError] = useState<unknown>(null);
  const [message, setMessage] = useState('');
  const [nudging, setNudging] = useState(false);
  const lateCount = blocks.filter((b) => b.late).length;
  const received = blocks.filter((b) => b.status === 'received').length;

  const update = async (membershipId: number, input: UpdateBlockInput, name: string) => {
    setError(null);
    setMessage('');
    try {
      await onUpdate(membershipId, input);
      setMessage(`${name}: ${blockStatusLabel(input.status).toLowerCase()}.`);
    } catch (e) {
      setError(e);
      throw e;
    }
  };

  return (
    <>
      <p className="mb-2">
        {received} of {blocks.length} blocks received{lateCount > 0 && <>, {lateCount} late</>}.
      </p>
      {onNudge && (
        <div className="d-flex flex-wrap align-items-center gap-3 mb-3">
          <Button
            variant="outline-primary"
            disabled={nudging}
            onClick={async () => {
              setError(null);
              setMessage('');
              setNudging(true);
              try {
                const { nudged } = await onNudge();
                setMessage(
                  nudged === 0
                    ? 'Nobody was nudged: no maker is late, or the late ones were already reminded today.'
                    : `${nudged} late ${nudged === 1 ? 'maker was' : 'makers were'} sent a friendly reminder.`,
                );
              } catch (e) {
                setError(e);
              } finally {
                setNudging(false);
              }
            }}
          >
            Nudge late makers
          </Button>
          <span className="text-body-secondary">Each late maker gets at most one reminder a day.</span>
        </div>
      )}
      <div role="status" aria-live="polite" className={message ? 'alert alert-success' : 'visually-hidden'}>
        {message}
      </div>
      {error ? <ErrorAlert error={error} /> : null}
      {blocks.length === 0 ? (
        <p>No makers this month.</p>
      ) : (
        <ul className="plain-list row row-cols-1 row-cols-md-2 row-cols-xl-3 g-3" aria-label="Makers and their blocks">
          {blocks.map((block) => (
            <li key={block.membershipId} className="col" data-testid="maker-card">
              <Card className={`h-100 maker-card${block.late ? ' is-late' : ''}`}>
                <Card.Body className="d-flex flex-column">
                  <h3 className="h5 mb-1">{block.name}</h3>
                  {block.onPaper && (
                    <p className="mb-1">
                      <Badge bg="light" text="dark" className="border status-badge">
                        Kept on paper
                      </Badge>
                    </p>
                  )}
                  <p className="mb-1">
                    <span className="visually-hidden">Block status: </span>
                    <strong>{blockStatusLabel(block.status)}</strong>{' '}
                    {block.late && (
                      <Badge bg="danger" className="status-badge">
                        Late
                      </Badge>
                    )}
                  </p>
                  {block.trackingNumber && (
                    <p className="mb-1 break-anywhere">
                      Tracking number: <span className="font-monospace">{block.trackingNumber}</span>
                    </p>
                  )}
                  {block.updatedOnBehalf && (
                    <p className="mb-1 text-body-secondary small">
                      Marked by {block.updatedByName ?? 'the organiser'} on her behalf.
                    </p>
                  )}
                  {renderExtra?.(block)}
                  {canMarkReceived && block.status !== 'received' && (
                    <Button
                      variant="primary"
                      className="mt-2 align-self-start"
                      onClick={() => update(block.membershipId, { status: 'received' }, block.name).catch(() => undefined)}
                    >
                      Mark received<span className="visually-hidden"> from {block.name}</span>
                    </Button>
                  )}
                  {(canSetOnBehalf || (canMarkReceived && block.onPaper)) && (
                    <OnBehalfForm
                      key={`${block.status}-${block.trackingNumber ?? ''}`}
                      block={block}
                      onUpdate={(membershipId, input) => update(membershipId, input, block.name)}
                    />
                  )}
                </Card.Body>
              </Card>
            </li>
          ))}
        </ul>
      )}
    </>
  );
}
