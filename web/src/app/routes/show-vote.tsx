import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { usePageTitle } from '@/components/ui/page-title';
import type { Guild } from '@/features/members/api/get-guild';
import { useBallot, useCastBallot } from '@/features/shows/api/ballot';
import type { Show } from '@/features/shows/api/types';
import { BallotFlow } from '@/features/shows/components/ballot-flow';
import { ShowGate } from '@/features/shows/components/show-gate';
import { showPaths } from '@/features/shows/lib/paths';
import { formatDateTime } from '@/lib/dates';

function VotePage({ guild, show }: { guild: Guild; show: Show }) {
  const guildId = String(guild.id);
  const showId = String(show.id);
  const ballot = useBallot(guildId, showId);
  const cast = useCastBallot(guildId, showId);
  const [done, setDone] = useState(false);
  usePageTitle(`Vote, ${show.name}`);

  const back = (
    <Link to={showPaths.show.getHref(guildId, showId)} className="btn btn-outline-primary">
      Back to the show
    </Link>
  );
  const header = (
    <div className="page-header">
      <h1>Viewer’s choice</h1>
      <p className="lead mb-0">{show.name}</p>
    </div>
  );

  if (done) {
    return (
      <>
        {header}
        <p className="fs-4 fw-bold" role="status" data-testid="thank-you">
          Your vote is in. Thank you.
        </p>
        {back}
      </>
    );
  }
  if (ballot.isPending) return <PageSpinner label="Opening your ballot" />;
  if (ballot.isError) {
    return (
      <>
        {header}
        <ErrorAlert error={ballot.error} />
        {back}
      </>
    );
  }
  if (ballot.data.hasVoted) {
    return (
      <>
        {header}
        <p className="fs-4" data-testid="has-voted">
          You have voted — thank you.
        </p>
        {back}
      </>
    );
  }
  if (ballot.data.show.votingState !== 'open') {
    return (
      <>
        {header}
        <p className="fs-5">{ballot.data.show.votingState === 'closed' ? 'Voting has closed.' : 'Voting is not open yet.'}</p>
        {back}
      </>
    );
  }
  return (
    <>
      {header}
      {ballot.data.show.votingClosesAt && <p>Voting closes {formatDateTime(ballot.data.show.votingClosesAt, guild.timeZone)}.</p>}
      <BallotFlow
        ballot={ballot.data}
        onCast={async (choices) => {
          await cast.mutateAsync(choices);
          setDone(true);
        }}
      />
    </>
  );
}

export default function ShowVoteRoute() {
  const { guildId = '', showId = '' } = useParams();
  return (
    <ShowGate guildId={guildId} showId={showId} title="Viewer’s choice">
      {({ guild, show }) => <VotePage guild={guild} show={show} />}
    </ShowGate>
  );
}
