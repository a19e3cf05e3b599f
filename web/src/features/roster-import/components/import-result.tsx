import Alert from 'react-bootstrap/Alert';
import type { RosterImportResult } from '../api/import-roster';

const n = (x: number) => x.toLocaleString('en-US');

/** Step 3: what the import did, and the rows it left out with their reasons. */
export function ImportResult({ result }: { result: RosterImportResult }) {
  const c = result.counts;
  return (
    <section aria-labelledby="import-result-heading" className="mb-4">
      <h2 id="import-result-heading" className="h4">The import is done</h2>
      <Alert variant="success" role="status" className="fs-5">
        {n(c.created)} new {c.created === 1 ? 'member' : 'members'} added, {n(c.updated)} updated, {n(c.unchanged)} already up to date.
        {c.skipped > 0 && ` ${n(c.skipped)} ${c.skipped === 1 ? 'row was' : 'rows were'} skipped.`}
      </Alert>
      {result.skipped.length > 0 && (
        <>
          <p className="fs-5">
            These rows were not imported. Correct them in your spreadsheet and import the file again: the members already imported
            will not be added twice.
          </p>
          <ul aria-label="Rows not imported">
            {result.skipped.map((r) => (
              <li key={r.rowNumber} className="mb-2">
                <strong>
                  Row {r.rowNumber}
                  {r.name ? `, ${r.name}` : ''}:
                </strong>{' '}
                <span className="text-danger">{r.problems.join(' ')}</span>
              </li>
            ))}
          </ul>
        </>
      )}
    </section>
  );
}
