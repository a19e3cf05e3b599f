import type { AuditEntry } from '../api/get-dues-audit';

function when(at: string, timeZone?: string): string {
  const date = new Date(at);
  if (Number.isNaN(date.getTime())) return at;
  let zone: string | undefined = timeZone;
  try {
    if (zone) new Intl.DateTimeFormat('en', { timeZone: zone });
  } catch {
    zone = undefined;
  }
  return date.toLocaleString('en-GB', { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit', timeZone: zone });
}

/** Who changed what in the dues books, newest first. */
export function AuditList({ entries, timeZone }: { entries: AuditEntry[]; timeZone?: string }) {
  if (entries.length === 0) return <p>Nothing has been recorded yet.</p>;
  return (
    <table className="table stack-table audit-table">
      <caption className="visually-hidden">Changes to the dues books, newest first</caption>
      <thead>
        <tr>
          <th scope="col">When</th>
          <th scope="col">Who</th>
          <th scope="col">What</th>
          <th scope="col">Details</th>
        </tr>
      </thead>
      <tbody>
        {entries.map((e, i) => (
          <tr key={`${e.at}-${i}`} data-testid="audit-row">
            <th scope="row" className="fw-normal">
              <time dateTime={e.at}>{when(e.at, timeZone)}</time>
            </th>
            <td data-label="Who">{e.actor}</td>
            <td data-label="What">{e.action.replace(/[._-]+/g, ' ')}</td>
            <td data-label="Details" className="break-anywhere">
              {e.summary}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
