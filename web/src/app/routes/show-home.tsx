import Alert from 'react-bootstrap/Alert';
import Card from 'react-bootstrap/Card';
import Col from 'react-bootstrap/Col';
import Row from 'react-bootstrap/Row';
import { Link, useLocation, useParams } from 'react-router-dom';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { usePageTitle } from '@/components/ui/page-title';
import type { Guild } from '@/features/members/api/get-guild';
import { useBallot } from '@/features/shows/api/ballot';
import { useWithdrawEntry } from '@/features/shows/api/entry-actions';
import { useMyEntries } from '@/features/shows/api/get-entries';
import type { Show } from '@/features/shows/api/types';
import { useUploadEntryPhoto } from '@/features/shows/api/upload-entry-photo';
import { CategoryList } from '@/features/shows/components/category-list';
import { EntryFeesPanel } from '@/features/shows/components/entry-fees-panel';
import { MyEntries } from '@/features/shows/components/my-entries';
import { ShowChairNav } from '@/features/shows/components/show-chair-nav';
import { ShowFacts } from '@/features/shows/components/show-facts';
import { ShowGate } from '@/features/shows/components/show-gate';
import { SleeveNote } from '@/features/shows/components/sleeve-note';
import { formatDay } from '@/features/dues/lib/format';
import { showPaths } from '@/features/shows/lib/paths';

/** Viewer's choice: vote while it is open, see the results once they are out. */
function VotingCallout({ guildId, show }: { guildId: string; show: Show }) {
  const showId = String(show.id);
  const ballot = useBallot(guildId, showId, { enabled: show.votingState === 'open' });
  if (show.votingState !== 'open' && !show.resultsPublished) return null;
  return (
    <Card as="section" aria-labelledby="voting-heading" className="voting-callout mb-4">
      <Card.Body>
        <h2 id="voting-heading" className="h3 mb-2">
          Viewer’s choice
        </h2>
        {show.votingState === 'open' &&
          (ballot.isPending ? (
            <PageSpinner label="Looking up your ballot" />
          ) : ballot.data?.hasVoted ? (
            <p className="fs-5 mb-0" data-testid="has-voted">
              You have voted — thank you.
            </p>
          ) : (
            <>
              <p>Voting is open. Choose the quilts you like best.</p>
              <Link to={showPaths.vote.getHref(guildId, showId)} className="btn btn-primary btn-lg">
                Vote for viewer’s choice
              </Link>
            </>
          ))}
        {show.resultsPublished && (
          <p className="mb-0 mt-2">
            <Link to={showPaths.results.getHref(guildId, showId)} className="btn btn-outline-primary">
              See the results
            </Link>
          </p>
        )}
      </Card.Body>
    </Card>
  );
}

function EnterButton({ guildId, show }: { guildId: string; show: Show }) {
  const href = showPaths.enter.getHref(guildId, show.id);
  if (show.entryWindow === 'open')
    return (
      <Link to={href} className="btn btn-primary btn-lg mb-3">
        Enter a quilt
      </Link>
    );
  return (
    <>
      <p className="fs-5">
        {show.entryWindow === 'not_yet'
          ? `Entries are not open yet${show.entriesOpenOn ? `. They open on ${formatDay(show.entriesOpenOn)}` : ''}.`
          : show.votingState === 'open'
            ? 'Entries are closed: voting has opened.'
            : 'Entries are closed.'}
      </p>
      {show.canManage && show.votingState !== 'open' && show.votingState !== 'closed' && (
        <Link to={href} className="btn btn-outline-primary mb-3">
          Enter a quilt for a member
        </Link>
      )}
    </>
  );
}

function ShowPage({ guild, show }: { guild: Guild; show: Show }) {
  const guildId = String(guild.id);
  const showId = String(show.id);
  const location = useLocation();
  const notice = (location.state as { notice?: string } | null)?.notice;
  const entries = useMyEntries(guildId, showId);
  const withdraw = useWithdrawEntry(guildId, showId);
  const upload = useUploadEntryPhoto(guildId, showId);
  usePageTitle(show.name);

  return (
    <>
      <div className="page-header">
        <h1>{show.name}</h1>
        <p className="lead mb-0">{guild.name}</p>
      </div>
      {show.canManage && <ShowChairNav guildId={guildId} showId={showId} />}
      {notice && (
        <Alert variant="success" role="status" className="fs-5">
          {notice}
        </Alert>
      )}
      <VotingCallout guildId={guildId} show={show} />
      <Row className="g-4">
        <Col lg={7}>
          <section aria-labelledby="about-heading" className="mb-4">
            <h2 id="about-heading" className="mb-3">
              About the show
            </h2>
            <ShowFacts show={show} timeZone={guild.timeZone} />
            {show.description && <p className="pre-wrap">{show.description}</p>}
          </section>
          <SleeveNote text={show.sleeve.text} />
          <section aria-labelledby="entries-heading" className="mb-4">
            <h2 id="entries-heading" className="mb-3">
              My entries
            </h2>
            <EnterButton guildId={guildId} show={show} />
            {entries.isPending && <PageSpinner label="Loading your entries" />}
            {entries.isError && <ErrorAlert error={entries.error} />}
            <ErrorAlert error={withdraw.error} />
            {entries.data && (
              <MyEntries
                guildId={guildId}
                showId={showId}
                entries={entries.data}
                currency={show.currency}
                withdrawing={withdraw.isPending}
                onWithdraw={(entry) => withdraw.mutateAsync(entry.id)}
                onUploadPhoto={(entry, photo) => upload.mutateAsync({ entryId: entry.id, photo })}
              />
            )}
            {show.entryFeeCents > 0 && (
              <EntryFeesPanel guildId={guildId} showId={showId} hasEntries={(entries.data ?? []).some((e) => e.status === 'submitted' || e.status === 'accepted')} />
            )}
          </section>
        </Col>
        <Col lg={5}>
          <section aria-labelledby="categories-heading">
            <h2 id="categories-heading" className="mb-3">
              Categories
            </h2>
            <CategoryList categories={show.categories} />
          </section>
        </Col>
      </Row>
    </>
  );
}

export default function ShowRoute() {
  const { guildId = '', showId = '' } = useParams();
  return (
    <ShowGate guildId={guildId} showId={showId} title="Quilt show">
      {({ guild, show }) => <ShowPage guild={guild} show={show} />}
    </ShowGate>
  );
}
