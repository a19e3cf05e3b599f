import type { Turnout } from '../api/types';

/** How many have voted, and how: counts only, never who is ahead. */
export function TurnoutPanel({ turnout }: { turnout: Turnout }) {
  const figures = [
    { label: 'Ballots cast in all', value: turnout.ballotsCast, main: true },
    { label: 'Members (online)', value: turnout.memberBallots, note: `of ${turnout.eligibleMembers} members` },
    { label: 'Visitors (online, with a code)', value: turnout.codeBallots },
    { label: 'Paper ballots keyed in', value: turnout.paperBallots },
    { label: 'Visitor codes printed', value: turnout.codesIssued },
    { label: 'Visitor codes used', value: turnout.codesUsed },
  ];
  return (
    <dl className="report-totals turnout" data-testid="turnout">
      {figures.map((f) => (
        <div key={f.label} className={f.main ? 'is-net' : undefined}>
          <dt>{f.label}</dt>
          <dd>
            {f.value}
            {f.note && <span className="d-block fs-6 text-body-secondary">{f.note}</span>}
          </dd>
        </div>
      ))}
    </dl>
  );
}
