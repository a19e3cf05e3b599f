import type { Term } from '../api/get-offices';
import { formatDay } from '../lib/format';

/** Every term, newest first: who held what from when to when, and who recorded it. */
export function OfficeHistory({ terms, today }: { terms: Term[]; today: string }) {
  if (terms.length === 0) return <p>No terms recorded yet.</p>;
  return (
    <ol className="list-unstyled mb-0" aria-label="Office history">
      {terms.map((t) => (
        <li key={t.id} className="border-bottom py-2" data-testid="history-row">
          <p className="mb-1">
            <strong>{t.roleLabel}</strong>: {t.name}
          </p>
          <p className="mb-1">
            From {formatDay(t.startsOn)}
            {t.endsOn ? `, access ${t.endsOn <= today ? 'ended' : 'ends'} on ${formatDay(t.endsOn)}` : ', no end date set'}
          </p>
          {t.note && <p className="mb-1 text-body-secondary">{t.note}</p>}
          {t.recordedBy ? (
            <p className="mb-0 text-body-secondary">Recorded by {t.recordedBy.name}</p>
          ) : (
            !t.note && <p className="mb-0 text-body-secondary">Recorded from the roles list</p>
          )}
        </li>
      ))}
    </ol>
  );
}
