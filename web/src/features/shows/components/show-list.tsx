import Card from 'react-bootstrap/Card';
import { Link } from 'react-router-dom';
import type { ShowSummary } from '../api/types';
import { formatDateRange, formatWindow } from '../lib/format';
import { ENTRY_WINDOW, VOTING_STATE } from '../lib/labels';
import { showPaths } from '../lib/paths';
import { ToneBadge } from './tone-badge';

/** The guild's shows, newest as the api sends them, each a card with its dates and where it stands. */
export function ShowList({ guildId, shows }: { guildId: string; shows: ShowSummary[] }) {
  if (shows.length === 0) return <p className="fs-5">This guild has no shows yet.</p>;
  return (
    <ul className="plain-list row row-cols-1 row-cols-md-2 g-3" aria-label="Shows">
      {shows.map((show) => {
        const headingId = `show-${show.id}-name`;
        const window = formatWindow(show.entriesOpenOn, show.entriesCloseOn);
        const entries = ENTRY_WINDOW[show.entryWindow] ?? { label: show.entryWindow, tone: 'none' as const };
        const voting = VOTING_STATE[show.votingState] ?? { label: show.votingState, tone: 'none' as const };
        return (
          <li key={show.id} className="col">
            <Card as="article" aria-labelledby={headingId} className="h-100" data-testid="show-card">
              <Card.Body>
                <h2 id={headingId} className="h4 mb-1">
                  <Link to={showPaths.show.getHref(guildId, show.id)} className="tap-link">
                    {show.name}
                  </Link>
                </h2>
                <dl className="facts mb-2">
                  <div>
                    <dt>When</dt>
                    <dd>{formatDateRange(show.startsOn, show.endsOn)}</dd>
                  </div>
                  <div>
                    <dt>Where</dt>
                    <dd>{show.venue}</dd>
                  </div>
                  {window && (
                    <div>
                      <dt>Entries</dt>
                      <dd>{window}</dd>
                    </div>
                  )}
                </dl>
                <p className="d-flex flex-wrap gap-2 mb-0">
                  <ToneBadge tone={entries.tone} label={entries.label} />
                  <ToneBadge tone={voting.tone} label={voting.label} />
                  {show.resultsPublished && <ToneBadge tone="good" label="Results published" />}
                </p>
              </Card.Body>
            </Card>
          </li>
        );
      })}
    </ul>
  );
}
