import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { CentredLayout } from '@/components/layouts/centred-layout';
import { errorMessage } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { usePageTitle } from '@/components/ui/page-title';
import { useCastPublicBallot, usePublicBallot } from '@/features/shows/api/public-ballot';
import { BallotFlow } from '@/features/shows/components/ballot-flow';
import { formatBallotCode, normaliseBallotCode } from '@/features/shows/lib/ballot-code';
import { showPaths } from '@/features/shows/lib/paths';
import { formatDateTime } from '@/lib/dates';

/** Back to the code box with her code still in it, to mend a letter rather than type all 12 again. */
function TryAnother({ code }: { code: string }) {
  const href = `${showPaths.visitorVote.getHref()}?${new URLSearchParams({ code: formatBallotCode(code) })}`;
  return (
    <Link to={href} className="tap-link">
      Try another code
    </Link>
  );
}

/** A visitor's ballot, opened by the code on her card. Works signed out. */
export default function VoteBallotRoute() {
  const { code: raw = '' } = useParams();
  const code = normaliseBallotCode(raw);
  const ballot = usePublicBallot(code);
  const cast = useCastPublicBallot(code);
  const [done, setDone] = useState(false);
  usePageTitle(ballot.data ? `Vote, ${ballot.data.show.name}` : 'Vote');

  let body;
  if (done && ballot.data) {
    body = (
      <div role="status" data-testid="thank-you">
        <h1 className="mb-3">Your vote is in. Thank you for visiting {ballot.data.show.name}.</h1>
        <p>{ballot.data.show.guildName} is glad you came.</p>
      </div>
    );
  } else if (ballot.isPending) {
    body = <PageSpinner label="Opening your ballot" />;
  } else if (ballot.isError) {
    body = (
      <>
        <h1 className="mb-3">We could not open this ballot</h1>
        <p className="fs-5" data-testid="ballot-problem">
          {errorMessage(ballot.error)}
        </p>
        <p className="fs-5" data-testid="typed-code">
          You typed <strong className="code-input">{formatBallotCode(code)}</strong>.
        </p>
        <TryAnother code={code} />
      </>
    );
  } else {
    const data = ballot.data;
    body = (
      <>
        <div className="mb-3">
          <h1 className="mb-1">{data.show.name}</h1>
          <p className="lead mb-1">
            {data.show.guildName}
            {data.show.venue && <> · {data.show.venue}</>}
          </p>
          <p className="text-body-secondary mb-0">Ballot card {data.code ?? formatBallotCode(code)}</p>
          {data.show.votingClosesAt && <p className="mb-0">Voting closes {formatDateTime(data.show.votingClosesAt)}.</p>}
        </div>
        {data.show.votingState === 'open' ? (
          <BallotFlow
            ballot={data}
            onCast={async (choices) => {
              await cast.mutateAsync(choices);
              setDone(true);
            }}
            errorExtra={() => (
              <p className="mb-0 mt-2">
                <TryAnother code={code} />
              </p>
            )}
          />
        ) : (
          <>
            <p className="fs-5">{data.show.votingState === 'closed' ? 'Voting has closed. Thank you for coming.' : 'Voting is not open yet.'}</p>
            <TryAnother code={code} />
          </>
        )}
      </>
    );
  }

  return <CentredLayout>{body}</CentredLayout>;
}
