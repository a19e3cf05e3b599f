import { useState } from 'react';
import Form from 'react-bootstrap/Form';
import { Link } from 'react-router-dom';
import { ErrorAlert } from '@/components/ui/error-alert';
import { paths } from '@/config/paths';
import { formatMonth } from '@/lib/dates';
import { isEditableMonth, isPastMonth, type Bee, type RotationMonth } from '../api/get-bee';
import { useSkipMonth } from '../api/skip-month';

export function roundStatusLabel(row: RotationMonth): string {
  if (!row.round) return 'Not started';
  return row.round.status === 'published' ? 'Published' : 'Draft';
}

type RotationTableProps = {
  guildId: string;
  bee: Bee;
  /** This month in the guild's time zone; it and the months before it can no longer change. */
  thisMonth: string;
};

export function RotationTable({ guildId, bee, thisMonth }: RotationTableProps) {
  const skip = useSkipMonth(guildId, String(bee.id));
  const [announcement, setAnnouncement] = useState('');

  return (
    <>
      <ErrorAlert error={skip.error} />
      <p role="status" aria-live="polite" className="visually-hidden">
        {announcement}
      </p>
      <table className="table stack-table rotation-table">
        <caption className="visually-hidden">Queen for each month, and the state of her round</caption>
        <thead>
          <tr>
            <th scope="col">Month</th>
            <th scope="col">Queen</th>
            <th scope="col">Round</th>
            {bee.isOrganiser && <th scope="col">Skip</th>}
          </tr>
        </thead>
        <tbody>
          {bee.rotation.map((row) => {
            const past = isPastMonth(row, thisMonth);
            const editable = bee.isOrganiser && isEditableMonth(row, thisMonth);
            const current = row.month === thisMonth;
            return (
              <tr key={row.month} className={current ? 'is-current' : past ? 'is-past' : undefined} data-testid="rotation-row">
                <th scope="row" data-label="Month">
                  {formatMonth(row.month)}
                  {current && <span className="d-block small fw-normal">This month</span>}
                  {past && <span className="d-block small fw-normal text-body-secondary">Past month</span>}
                </th>
                <td data-label="Queen">{row.skipped ? <em>Skipped</em> : (row.queen?.name ?? 'No queen yet')}</td>
                <td data-label="Round">
                  {row.skipped ? (
                    <span className="text-body-secondary">No round</span>
                  ) : (
                    <>
                      <span className="me-3">
                        {roundStatusLabel(row)}
                        {row.round?.title && <> · {row.round.title}</>}
                      </span>
                      <Link to={paths.round.getHref(guildId, bee.id, row.month)} className="tap-link">
                        Open the round<span className="visually-hidden"> for {formatMonth(row.month)}</span>
                      </Link>
                    </>
                  )}
                </td>
                {bee.isOrganiser && (
                  <td data-label={editable ? 'Skip' : undefined} className="no-label">
                    {editable ? (
                      <Form.Check id={`skip-${row.month}`}>
                        <Form.Check.Input
                          type="checkbox"
                          checked={row.skipped}
                          disabled={skip.isPending}
                          onChange={(e) => {
                            const skipped = e.currentTarget.checked;
                            setAnnouncement('');
                            skip.mutate(
                              { month: row.month, skipped },
                              {
                                onSuccess: () =>
                                  setAnnouncement(
                                    skipped
                                      ? `${formatMonth(row.month)} is skipped. The queens after it move along.`
                                      : `${formatMonth(row.month)} has a queen again.`,
                                  ),
                              },
                            );
                          }}
                        />
                        <Form.Check.Label>
                          Skip this month<span className="visually-hidden"> ({formatMonth(row.month)})</span>
                        </Form.Check.Label>
                      </Form.Check>
                    ) : (
                      <span className="visually-hidden">{current ? 'This month has begun and cannot change.' : 'A past month cannot change.'}</span>
                    )}
                  </td>
                )}
              </tr>
            );
          })}
        </tbody>
      </table>
    </>
  );
}
