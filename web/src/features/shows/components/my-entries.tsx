import Card from 'react-bootstrap/Card';
import { Link } from 'react-router-dom';
import { ConfirmAction } from '@/components/ui/confirm-action';
import { formatMoney } from '@/features/dues/lib/money';
import type { Entry } from '../api/types';
import { ENTRY_STATUS, joinNames } from '../lib/labels';
import { showPaths } from '../lib/paths';
import { EntryPhotoUpload } from './entry-photo-upload';
import { ToneBadge } from './tone-badge';

type MyEntriesProps = {
  guildId: string;
  showId: string;
  entries: Entry[];
  currency: string;
  onWithdraw: (entry: Entry) => Promise<unknown>;
  withdrawing?: boolean;
  onUploadPhoto: (entry: Entry, photo: Blob) => Promise<unknown>;
};

/** The sleeve strip to cut for one quilt, worked out from its width. */
export function SleeveStrip({ entry }: { entry: Pick<Entry, 'sleeve'> }) {
  return (
    <p className="sleeve-strip mb-2" data-testid="sleeve-strip">
      <strong>Your sleeve: </strong>
      {entry.sleeve.text}
    </p>
  );
}

export function EntrySize({ entry }: { entry: Pick<Entry, 'widthText' | 'heightText' | 'perimeterText'> }) {
  return (
    <>
      {entry.widthText} in wide × {entry.heightText} in high (perimeter {entry.perimeterText})
    </>
  );
}

/** Her quilts in this show: where each stands, its sleeve, its photo, and changes while it waits. */
export function MyEntries({ guildId, showId, entries, currency, onWithdraw, withdrawing, onUploadPhoto }: MyEntriesProps) {
  if (entries.length === 0) return <p>You have not entered a quilt in this show.</p>;
  return (
    <ul className="plain-list my-entries" aria-label="My entries">
      {entries.map((entry) => {
        const headingId = `entry-${entry.id}-title`;
        const status = ENTRY_STATUS[entry.status] ?? { label: entry.status, tone: 'none' as const };
        const open = entry.status === 'submitted' || entry.status === 'accepted';
        return (
          <li key={entry.id} className="mb-3">
            <Card as="article" aria-labelledby={headingId} data-testid="my-entry">
              <Card.Body>
                <h3 id={headingId} className="h4 mb-2 break-anywhere">
                  {entry.title}
                </h3>
                <p className="mb-2">
                  <ToneBadge tone={status.tone} label={status.label} testId="entry-status" />
                </p>
                {entry.status === 'declined' && entry.declineReason && (
                  <p className="decline-reason">
                    <strong>Why: </strong>
                    {entry.declineReason}
                  </p>
                )}
                <dl className="facts">
                  {entry.entryNumber != null && (
                    <div>
                      <dt>Entry number</dt>
                      <dd className="fw-bold">{entry.entryNumber}</dd>
                    </div>
                  )}
                  <div>
                    <dt>Category</dt>
                    <dd>{entry.categoryName}</dd>
                  </div>
                  <div>
                    <dt>Size</dt>
                    <dd>
                      <EntrySize entry={entry} />
                    </dd>
                  </div>
                  <div>
                    <dt>Made by</dt>
                    <dd>{joinNames(entry.makers)}</dd>
                  </div>
                  {entry.quilter.trim() && (
                    <div>
                      <dt>Quilted by</dt>
                      <dd>{entry.quilter}</dd>
                    </div>
                  )}
                  {entry.forSale && (
                    <div>
                      <dt>For sale</dt>
                      <dd>{entry.priceCents != null ? formatMoney(entry.priceCents, currency) : 'Yes'}</dd>
                    </div>
                  )}
                  {entry.enteredOnBehalf && (
                    <div>
                      <dt>Entered</dt>
                      <dd>
                        for {entry.entrant.name}
                        {entry.enteredBy && <> by {entry.enteredBy}</>}
                      </dd>
                    </div>
                  )}
                </dl>
                {entry.status !== 'withdrawn' && entry.status !== 'declined' && <SleeveStrip entry={entry} />}
                {entry.photoUrl && (
                  <figure className="entry-photo mb-2">
                    <img src={entry.photoUrl} alt={`Photo of ${entry.title}`} loading="lazy" />
                  </figure>
                )}
                {open && (
                  <div className="mt-3">
                    <EntryPhotoUpload title={entry.title} hasPhoto={entry.hasPhoto} onUpload={(photo) => onUploadPhoto(entry, photo)} />
                  </div>
                )}
                {entry.status === 'submitted' && (
                  <div className="d-flex flex-wrap gap-2 align-items-start mt-3 pt-3 border-top">
                    <Link to={showPaths.editEntry.getHref(guildId, showId, entry.id)} className="btn btn-outline-primary">
                      Change the details<span className="visually-hidden"> of {entry.title}</span>
                    </Link>
                    <ConfirmAction
                      label={
                        <>
                          Withdraw<span className="visually-hidden"> {entry.title}</span>
                        </>
                      }
                      question={`Withdraw “${entry.title}” from the show? You would need to enter it again to bring it back.`}
                      confirmLabel="Yes, withdraw it"
                      cancelLabel="Keep it entered"
                      busy={withdrawing}
                      onConfirm={() => onWithdraw(entry)}
                    />
                  </div>
                )}
              </Card.Body>
            </Card>
          </li>
        );
      })}
    </ul>
  );
}
