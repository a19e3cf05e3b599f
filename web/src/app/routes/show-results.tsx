import Alert from 'react-bootstrap/Alert';
import { Link, useParams } from 'react-router-dom';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { usePageTitle } from '@/components/ui/page-title';
import type { Guild } from '@/features/members/api/get-guild';
import { resultsCsvHref, resultsPdfHref } from '@/features/shows/api/downloads';
import { useResults } from '@/features/shows/api/results';
import type { Show } from '@/features/shows/api/types';
import { ResultsView } from '@/features/shows/components/results-view';
import { ShowChairNav } from '@/features/shows/components/show-chair-nav';
import { ShowGate } from '@/features/shows/components/show-gate';
import { showPaths } from '@/features/shows/lib/paths';

function ResultsPage({ guild, show }: { guild: Guild; show: Show }) {
  const guildId = String(guild.id);
  const showId = String(show.id);
  const visible = show.resultsPublished || (show.canManage && show.votingState === 'closed');
  const results = useResults(guildId, showId, { enabled: visible });
  usePageTitle(`Results, ${show.name}`);

  return (
    <>
      <div className="page-header">
        <h1>Viewer’s choice results</h1>
        <p className="lead mb-0">{show.name}</p>
      </div>
      {show.canManage && <ShowChairNav guildId={guildId} showId={showId} />}
      {!visible ? (
        <>
          <p className="fs-5">
            {show.canManage ? 'Results can be seen once voting has closed.' : 'The results are not published yet. Please look again later.'}
          </p>
          <Link to={showPaths.show.getHref(guildId, showId)} className="btn btn-outline-primary">
            Back to the show
          </Link>
        </>
      ) : results.isPending ? (
        <PageSpinner label="Loading the results" />
      ) : results.isError ? (
        <ErrorAlert error={results.error} />
      ) : (
        <>
          {!results.data.show.published && (
            <Alert variant="info" className="text-body" data-testid="not-published">
              Not published yet: only the show chair and admins can see these. Publish them from the ballot desk.
            </Alert>
          )}
          <ResultsView results={results.data} timeZone={guild.timeZone} />
          {show.canManage && (
            <ul className="plain-list d-flex flex-wrap column-gap-4 mt-3">
              <li>
                <a href={resultsPdfHref(guildId, showId)} className="tap-link" download>
                  Download the results (PDF)
                </a>
              </li>
              <li>
                <a href={resultsCsvHref(guildId, showId)} className="tap-link" download>
                  Download the results (CSV)
                </a>
              </li>
            </ul>
          )}
        </>
      )}
    </>
  );
}

export default function ShowResultsRoute() {
  const { guildId = '', showId = '' } = useParams();
  return (
    <ShowGate guildId={guildId} showId={showId} title="Results">
      {({ guild, show }) => <ResultsPage guild={guild} show={show} />}
    </ShowGate>
  );
}
