import Card from 'react-bootstrap/Card';
import { Link, useParams } from 'react-router-dom';
import { ConfirmAction } from '@/components/ui/confirm-action';
import { ErrorAlert } from '@/components/ui/error-alert';
import { PageSpinner } from '@/components/ui/page-spinner';
import { usePageTitle } from '@/components/ui/page-title';
import type { Guild } from '@/features/members/api/get-guild';
import { useBallot, useRecordPaperBallot } from '@/features/shows/api/ballot';
import { useCodeBatches, useCreateCodes } from '@/features/shows/api/ballot-codes';
import { useEntries } from '@/features/shows/api/get-entries';
import { ballotsCsvHref, resultsCsvHref, resultsPdfHref } from '@/features/shows/api/downloads';
import { usePublishResults, useRecordDecision, useRemoveDecision, useResults } from '@/features/shows/api/results';
import { useTurnout } from '@/features/shows/api/get-turnout';
import type { Results, Show, VotingState } from '@/features/shows/api/types';
import { useSetVoting } from '@/features/shows/api/voting';
import { CodesPanel } from '@/features/shows/components/codes-panel';
import { PaperBallotForm } from '@/features/shows/components/paper-ballot-form';
import { ChairPageHeader, ShowGate } from '@/features/shows/components/show-gate';
import { TieDecisions } from '@/features/shows/components/tie-decisions';
import { ToneBadge } from '@/features/shows/components/tone-badge';
import { TurnoutPanel } from '@/features/shows/components/turnout-panel';
import { VOTING_STATE } from '@/features/shows/lib/labels';
import { showPaths } from '@/features/shows/lib/paths';
import { formatDateTime } from '@/lib/dates';

type VotingControlsProps = {
  show: Show;
  state: VotingState;
  timeZone?: string;
  onSet: (action: 'open' | 'close') => Promise<unknown>;
  busy: boolean;
  error: unknown;
  /** Quilts entered but not yet accepted or declined: they stay off the ballot. */
  waitingForReview: number;
};

/** What opening voting leaves behind, said before the chair confirms. */
function openingQuestion(show: Show, waitingForReview: number) {
  const left: string[] = [];
  if (waitingForReview > 0) {
    left.push(
      `${waitingForReview} ${waitingForReview === 1 ? 'quilt is' : 'quilts are'} still waiting for your review and will not be on the ballot.`,
    );
  }
  if (show.entryWindow === 'open') left.push('Entries are still open: once voting opens, the show takes no more entries.');
  return (
    <>
      Open voting now? Members and visitors can vote straight away, and how people vote can no longer be changed.
      {left.map((line) => (
        <strong key={line} className="d-block mt-2">
          {line}
        </strong>
      ))}
    </>
  );
}

function VotingControls({ show, state, timeZone, onSet, busy, error, waitingForReview }: VotingControlsProps) {
  const words = VOTING_STATE[state] ?? { label: state, tone: 'none' as const };
  return (
    <>
      <p className="fs-5" data-testid="voting-state">
        <ToneBadge tone={words.tone} label={words.label} />
      </p>
      {state === 'scheduled' && show.votingOpensAt && <p>Voting opens by itself {formatDateTime(show.votingOpensAt, timeZone)}.</p>}
      {show.votingOpenedAt && <p className="mb-1">Opened {formatDateTime(show.votingOpenedAt, timeZone)}.</p>}
      {state === 'open' && show.votingClosesAt && <p>Voting closes by itself {formatDateTime(show.votingClosesAt, timeZone)}.</p>}
      {show.votingClosedAt && <p>Closed {formatDateTime(show.votingClosedAt, timeZone)}.</p>}
      <ErrorAlert error={error} />
      {(state === 'not_open' || state === 'scheduled') && (
        <ConfirmAction
          label="Open voting now"
          variant="primary"
          question={openingQuestion(show, waitingForReview)}
          confirmLabel="Yes, open voting"
          busy={busy}
          onConfirm={() => onSet('open')}
        />
      )}
      {state === 'open' && (
        <ConfirmAction
          label="Close voting"
          question="Close voting now? Closing is final: nobody can vote after this, and voting cannot be opened again."
          confirmLabel="Yes, close voting"
          cancelLabel="Keep voting open"
          busy={busy}
          onConfirm={() => onSet('close')}
        />
      )}
    </>
  );
}

/** Ties still standing for a ribbon: the default rule shares the place, unless the chair decides first. */
function unsettledTies(results: Results): number {
  return results.categories.reduce((n, c) => n + c.ties.length, 0);
}

function publishQuestion(ties: number) {
  return (
    <>
      Publish the results now? Every member will be able to see them, and they can no longer change.
      {ties > 0 && (
        <strong className="d-block mt-2">
          {ties === 1 ? '1 tie is' : `${ties} ties are`} not settled by a decision: the tied quilts will share the place under the guild’s ribbon
          rule.
        </strong>
      )}
    </>
  );
}

function DeskPage({ guild, show }: { guild: Guild; show: Show }) {
  const guildId = String(guild.id);
  const showId = String(show.id);
  const turnout = useTurnout(guildId, showId);
  const state: VotingState = turnout.data?.state ?? show.votingState;
  const setVoting = useSetVoting(guildId, showId);
  const beforeOpening = state === 'not_open' || state === 'scheduled';
  const waiting = useEntries(guildId, showId, 'submitted', { enabled: beforeOpening });
  const batches = useCodeBatches(guildId, showId);
  const createCodes = useCreateCodes(guildId, showId);
  const ballot = useBallot(guildId, showId, { enabled: state === 'open' });
  const paper = useRecordPaperBallot(guildId, showId);
  // Standings exist only after voting has closed; nothing here asks for them before.
  const results = useResults(guildId, showId, { enabled: state === 'closed' });
  const decide = useRecordDecision(guildId, showId);
  const removeDecision = useRemoveDecision(guildId, showId);
  const publish = usePublishResults(guildId, showId);
  usePageTitle(`Ballot desk, ${show.name}`);

  return (
    <>
      <ChairPageHeader guildId={guildId} show={show} title="Ballot desk" />
      <section aria-labelledby="state-heading" className="mb-4">
        <h2 id="state-heading">Voting</h2>
        <VotingControls
          show={show}
          state={state}
          timeZone={guild.timeZone}
          onSet={(action) => setVoting.mutateAsync(action).then(() => turnout.refetch())}
          busy={setVoting.isPending}
          error={setVoting.error}
          waitingForReview={beforeOpening ? (waiting.data?.length ?? 0) : 0}
        />
      </section>

      <section aria-labelledby="turnout-heading" className="mb-4">
        <h2 id="turnout-heading">Turnout</h2>
        <p>How many have voted, never who is ahead.{state === 'open' && ' Updated every 10 seconds.'}</p>
        {turnout.isPending && <PageSpinner label="Counting ballots" />}
        {turnout.isError && <ErrorAlert error={turnout.error} />}
        {turnout.data && <TurnoutPanel turnout={turnout.data} />}
      </section>

      {state !== 'closed' && (
        <section aria-labelledby="cards-heading" className="mb-4">
          <h2 id="cards-heading">Print visitor ballot cards</h2>
          <CodesPanel
            guildId={guildId}
            showId={showId}
            batches={batches.data?.batches}
            timeZone={guild.timeZone}
            onCreate={(count) => createCodes.mutateAsync(count)}
            busy={createCodes.isPending}
            error={createCodes.error ?? batches.error}
          />
        </section>
      )}

      {state === 'open' && (
        <Card as="section" aria-labelledby="paper-heading" className="mb-4">
          <Card.Body>
            <h2 id="paper-heading">Paper ballots</h2>
            <p>
              For visitors without a phone, print a batch of codes as paper ballots (beside the batch above). Key in each one here: its code,
              then the quilts written on it. Each code counts once.
            </p>
            {ballot.isPending && <PageSpinner label="Loading the ballot" />}
            {ballot.isError && <ErrorAlert error={ballot.error} />}
            {ballot.data && <PaperBallotForm ballot={ballot.data} onRecord={(code, choices) => paper.mutateAsync({ code, choices })} />}
          </Card.Body>
        </Card>
      )}

      {state === 'closed' && (
        <section aria-labelledby="results-heading" className="mb-4">
          <h2 id="results-heading">Results</h2>
          {results.isPending && <PageSpinner label="Counting the votes" />}
          {results.isError && <ErrorAlert error={results.error} />}
          {results.data && (
            <>
              <p>
                <Link to={showPaths.results.getHref(guildId, showId)} className="btn btn-outline-primary">
                  See the results
                </Link>
              </p>
              <h3 className="h4 mt-4">Ties</h3>
              <TieDecisions
                results={results.data}
                timeZone={guild.timeZone}
                published={results.data.show.published}
                onDecide={(input) => decide.mutateAsync(input)}
                onRemove={(decisionId) => removeDecision.mutateAsync(decisionId)}
                busy={decide.isPending || removeDecision.isPending}
                error={decide.error ?? removeDecision.error}
              />
              <h3 className="h4 mt-4">Publish</h3>
              <ErrorAlert error={publish.error} />
              {results.data.show.published ? (
                <p className="fs-5" data-testid="published">
                  The results are published. Members can see them.
                </p>
              ) : (
                <div className="mb-3">
                  <p>To settle a tie by a decision, do it above before publishing: once published, the results cannot change.</p>
                  <ConfirmAction
                    label="Publish the results"
                    variant="primary"
                    question={publishQuestion(unsettledTies(results.data))}
                    confirmLabel="Yes, publish them"
                    busy={publish.isPending}
                    onConfirm={() => publish.mutateAsync()}
                  />
                </div>
              )}
              <h3 className="h4 mt-4">Downloads</h3>
              <ul className="plain-list d-flex flex-wrap column-gap-4">
                <li>
                  <a href={resultsCsvHref(guildId, showId)} className="tap-link" download>
                    Results (CSV)
                  </a>
                </li>
                <li>
                  <a href={resultsPdfHref(guildId, showId)} className="tap-link" download>
                    Results (PDF)
                  </a>
                </li>
                <li>
                  <a href={ballotsCsvHref(guildId, showId)} className="tap-link" download>
                    Every ballot (CSV)
                  </a>
                </li>
              </ul>
            </>
          )}
        </section>
      )}
    </>
  );
}

export default function ShowVotingRoute() {
  const { guildId = '', showId = '' } = useParams();
  return (
    <ShowGate guildId={guildId} showId={showId} title="Ballot desk" chairOnly>
      {({ guild, show }) => <DeskPage guild={guild} show={show} />}
    </ShowGate>
  );
}
