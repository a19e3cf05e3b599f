import { Link } from 'react-router-dom';
import { rosterPlanName, type RosterRow } from '../api/get-roster';
import { formatDay } from '../lib/format';
import { DuesStatusBadge } from './status-badge';

type RosterTableProps = {
  rows: RosterRow[];
  /** Link to record a payment for this member. */
  recordHref: (membershipId: number) => string;
};

/** Who is paid up, who is due, who is overdue. */
export function RosterTable({ rows, recordHref }: RosterTableProps) {
  if (rows.length === 0) return <p className="fs-5">Nobody here. Everyone in this list is paid up.</p>;
  return (
    <table className="table stack-table stack-table-wide roster-table">
      <caption className="visually-hidden">Members and their dues status</caption>
      <thead>
        <tr>
          <th scope="col">Member</th>
          <th scope="col">E-mail</th>
          <th scope="col">Plan</th>
          <th scope="col">Status</th>
          <th scope="col">Paid through</th>
          <th scope="col">Status changes</th>
          <th scope="col">
            <span className="visually-hidden">Actions</span>
          </th>
        </tr>
      </thead>
      <tbody>
        {rows.map((row) => (
          <tr key={row.membershipId} data-testid="roster-row">
            <th scope="row">{row.name}</th>
            <td data-label="E-mail" className="break-anywhere">
              {row.email ? <a href={`mailto:${row.email}`}>{row.email}</a> : <span className="text-body-secondary">No e-mail (kept on paper)</span>}
            </td>
            <td data-label="Plan">{rosterPlanName(row) ?? 'No plan'}</td>
            <td data-label="Status">
              <DuesStatusBadge status={row.status} />
            </td>
            <td data-label="Paid through">{row.paidThrough ? formatDay(row.paidThrough) : 'Never paid'}</td>
            <td data-label="Status changes">{row.statusEndsOn ? `after ${formatDay(row.statusEndsOn)}` : '—'}</td>
            <td data-label="Actions" className="no-label">
              {row.status !== 'lifetime' && row.status !== 'honorary' && (
                <Link to={recordHref(row.membershipId)} className="tap-link">
                  Record a payment<span className="visually-hidden"> from {row.name}</span>
                </Link>
              )}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
