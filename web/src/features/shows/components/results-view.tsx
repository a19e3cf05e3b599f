import { formatDateTime } from '@/lib/dates';
import type { RankedMethod, ResultCategory, Results, VotingKind } from '../api/types';
import { entryNumberText, joinNames, ordinal } from '../lib/labels';

export function scoreLabel(kind: VotingKind, method: RankedMethod): string {
  if (kind !== 'ranked') return 'Votes';
  return method === 'points' ? 'Points' : 'Votes in the last round';
}

/** A quilt nobody chose has no place to speak of (under instant runoff a 0 is only the last round, so it keeps its place). */
function noVotes(results: Results, score: number): boolean {
  return score === 0 && !(results.show.votingKind === 'ranked' && results.show.rankedMethod === 'instant_runoff');
}

/** A ribbon place in words, with a rosette beside it; its colour is never the only sign. */
export function Ribbon({ place }: { place: 1 | 2 | 3 }) {
  return (
    <span className={`ribbon ribbon-${place}`} data-testid="ribbon">
      <svg width="20" height="26" viewBox="0 0 20 26" aria-hidden="true" focusable="false">
        <path d="M6 14 L3 25 L8 22 L10 26 L11 15 Z M14 14 L17 25 L12 22 L10 26 L9 15 Z" fill="currentColor" opacity="0.75" />
        <circle cx="10" cy="9" r="8" fill="currentColor" />
        <circle cx="10" cy="9" r="4.5" fill="#fff" />
      </svg>
      {ordinal(place)} place
    </span>
  );
}

function Rounds({ category, titles }: { category: ResultCategory; titles: Map<number, string> }) {
  if (!category.rounds?.length) return null;
  return (
    <details className="runoff-rounds mb-3">
      <summary className="tap-link">Round by round</summary>
      <ol>
        {category.rounds.map((round, i) => (
          <li key={i} className="mb-2">
            {Object.entries(round.counts)
              .sort((a, b) => b[1] - a[1])
              .map(([entryId, votes]) => `${titles.get(Number(entryId)) ?? `Entry ${entryId}`}: ${votes}`)
              .join('; ')}
            {round.eliminated.length > 0 && <>. Out: {round.eliminated.map((id) => titles.get(id) ?? `Entry ${id}`).join(', ')}</>}
            {round.exhausted > 0 && <>. Ballots with no choices left: {round.exhausted}</>}.
          </li>
        ))}
      </ol>
    </details>
  );
}

function CategoryResults({ category, results, timeZone }: { category: ResultCategory; results: Results; timeZone?: string }) {
  const headingId = `results-${category.categoryId ?? 'overall'}`;
  const titles = new Map(category.standings.map((s) => [s.entryId, s.title]));
  const score = scoreLabel(results.show.votingKind, results.show.rankedMethod);
  return (
    <section aria-labelledby={headingId} className="mb-4" data-testid="result-category">
      <h2 id={headingId} className="h3 mb-1">
        {category.name}
      </h2>
      <p className="text-body-secondary mb-2">
        {category.entryCount} {category.entryCount === 1 ? 'quilt' : 'quilts'} · {category.ballots} {category.ballots === 1 ? 'ballot' : 'ballots'}
        {category.blank > 0 && <> · {category.blank} left blank</>}
        {category.spoiled > 0 && <> · {category.spoiled} spoiled</>}
      </p>
      {category.standings.length === 0 ? (
        <p>No votes in this category.</p>
      ) : (
        <table className="table stack-table results-table">
          <caption className="visually-hidden">Standings in {category.name}</caption>
          <thead>
            <tr>
              <th scope="col">Quilt</th>
              <th scope="col">Place</th>
              <th scope="col">Entry number</th>
              <th scope="col">Made by</th>
              <th scope="col" className="amount">
                {score}
              </th>
            </tr>
          </thead>
          <tbody>
            {category.standings.map((s) => (
              <tr key={s.entryId} className={s.ribbon ? 'has-ribbon' : undefined} data-testid="standing">
                <th scope="row" className="break-anywhere">
                  {s.title}
                </th>
                <td data-label="Place">
                  {s.ribbon ? <Ribbon place={s.ribbon} /> : noVotes(results, s.score) ? <>No votes</> : <>{ordinal(s.rank)}, no ribbon</>}
                  {s.byDecision && <span className="d-block small">Placed by the show chair’s tie decision</span>}
                </td>
                <td data-label="Entry number">{entryNumberText(s.entryNumber) || '—'}</td>
                <td data-label="Made by">{joinNames(s.makers) || '—'}</td>
                <td data-label={score} className="amount">
                  {s.score}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      <Rounds category={category} titles={titles} />
      {category.decisions.length > 0 && (
        <ul className="plain-list decisions">
          {category.decisions.map((d) => (
            <li key={d.id} className="mb-1">
              <strong>Tie decided</strong> by {d.decidedBy}, {formatDateTime(d.decidedAt, timeZone)}: {d.note}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}

/** The standings of every category with ribbons, and the audit line that says how the count went. */
export function ResultsView({ results, timeZone }: { results: Results; timeZone?: string }) {
  return (
    <>
      {results.categories.map((category) => (
        <CategoryResults key={category.categoryId ?? 'overall'} category={category} results={results} timeZone={timeZone} />
      ))}
      <section aria-labelledby="audit-heading" className="audit-line">
        <h2 id="audit-heading" className="h4">
          How the votes were counted
        </h2>
        <p className="mb-0" data-testid="audit-text">
          {results.audit.text}
        </p>
      </section>
    </>
  );
}
