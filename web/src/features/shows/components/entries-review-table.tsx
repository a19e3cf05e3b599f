import Button from 'react-bootstrap/Button';
import { Link } from 'react-router-dom';
import { formatMoney } from '@/features/dues/lib/money';
import type { Entry } from '../api/types';
import { ENTRY_STATUS, joinNames } from '../lib/labels';
import { showPaths } from '../lib/paths';
import { ToneBadge } from './tone-badge';

type EntriesReviewTableProps = {
  guildId: string;
  showId: string;
  entries: Entry[];
  currency: string;
  busy?: boolean;
  /** Voting has opened: the ballot's quilts, their categories and numbers can no longer change. */
  ballotFixed?: boolean;
  onAccept: (entry: Entry) => void;
  onDecline: (entry: Entry) => void;
  onChange: (entry: Entry) => void;
};

/** Every entry with what the chair can do to it; one card per entry on a phone. */
export function EntriesReviewTable({ guildId, showId, entries, currency, busy, ballotFixed = false, onAccept, onDecline, onChange }: EntriesReviewTableProps) {
  if (entries.length === 0) return <p className="fs-5">No entries here.</p>;
  return (
    <table className="table stack-table stack-table-wide entries-table">
      <caption className="visually-hidden">Entries, with their status and actions</caption>
      <thead>
        <tr>
          <th scope="col">Quilt</th>
          <th scope="col">Number</th>
          <th scope="col">Entrant</th>
          <th scope="col">Category</th>
          <th scope="col">Size</th>
          <th scope="col">Status</th>
          <th scope="col">
            <span className="visually-hidden">Actions</span>
          </th>
        </tr>
      </thead>
      <tbody>
        {entries.map((entry) => {
          const status = ENTRY_STATUS[entry.status] ?? { label: entry.status, tone: 'none' as const };
          return (
            <tr key={entry.id} data-testid="review-row">
              <th scope="row" className="break-anywhere">
                {entry.title}
                <span className="d-block fw-normal small">Made by {joinNames(entry.makers)}</span>
                {entry.forSale && (
                  <span className="d-block fw-normal small">For sale{entry.priceCents != null && `: ${formatMoney(entry.priceCents, currency)}`}</span>
                )}
              </th>
              <td data-label="Number">{entry.entryNumber ?? 'None yet'}</td>
              <td data-label="Entrant">
                {entry.entrant.name}
                {entry.enteredOnBehalf && entry.enteredBy && <span className="d-block small">Entered by {entry.enteredBy}</span>}
              </td>
              <td data-label="Category">
                {entry.categoryName}
                {entry.sizeProblem && (
                  <span className="d-block size-problem" data-testid="size-problem">
                    <strong>Does not fit: </strong>
                    {entry.sizeProblem}
                  </span>
                )}
              </td>
              <td data-label="Size">
                {entry.widthText} × {entry.heightText} in
                <span className="d-block small">perimeter {entry.perimeterText}</span>
              </td>
              <td data-label="Status">
                <ToneBadge tone={status.tone} label={status.label} />
                {entry.status === 'declined' && entry.declineReason && <span className="d-block small">Why: {entry.declineReason}</span>}
              </td>
              <td data-label="Actions" className="no-label">
                <div className="d-flex flex-wrap gap-2">
                  {!ballotFixed && (entry.status === 'submitted' || entry.status === 'declined') && (
                    <Button variant="primary" disabled={busy} onClick={() => onAccept(entry)}>
                      Accept<span className="visually-hidden"> {entry.title}</span>
                    </Button>
                  )}
                  {!ballotFixed && (entry.status === 'submitted' || entry.status === 'accepted') && (
                    <Button variant="outline-danger" disabled={busy} onClick={() => onDecline(entry)}>
                      Decline…<span className="visually-hidden"> {entry.title}</span>
                    </Button>
                  )}
                  {!ballotFixed && entry.status !== 'withdrawn' && (
                    <Button variant="outline-primary" onClick={() => onChange(entry)}>
                      Category or number…<span className="visually-hidden"> of {entry.title}</span>
                    </Button>
                  )}
                  {entry.status !== 'withdrawn' && (
                    <Link to={showPaths.editEntry.getHref(guildId, showId, entry.id)} className="btn btn-outline-secondary">
                      Edit details<span className="visually-hidden"> of {entry.title}</span>
                    </Link>
                  )}
                </div>
              </td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}
