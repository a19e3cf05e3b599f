import { formatMoney } from '@/features/dues/lib/money';
import { formatDateTime } from '@/lib/dates';
import type { Show } from '../api/types';
import { formatDateRange, formatWindow } from '../lib/format';
import { ENTRY_WINDOW, VOTING_KIND_SHORT, VOTING_STATE } from '../lib/labels';

/** "$10.00 a quilt, at most $25.00 for all your quilts", or "Free". */
export function entryFeeText(show: Pick<Show, 'entryFeeCents' | 'entryFeeCapCents' | 'currency'>): string {
  if (!show.entryFeeCents) return 'Free to enter';
  const fee = `${formatMoney(show.entryFeeCents, show.currency)} a quilt`;
  return show.entryFeeCapCents != null ? `${fee}, at most ${formatMoney(show.entryFeeCapCents, show.currency)} for all your quilts` : fee;
}

/** When and where, the entry window, the fee and how voting works, as label–value pairs. */
export function ShowFacts({ show, timeZone }: { show: Show; timeZone?: string }) {
  const window = formatWindow(show.entriesOpenOn, show.entriesCloseOn);
  const voting = VOTING_STATE[show.votingState]?.label ?? show.votingState;
  return (
    <dl className="facts facts-wide" data-testid="show-facts">
      <div>
        <dt>When</dt>
        <dd>{formatDateRange(show.startsOn, show.endsOn)}</dd>
      </div>
      <div>
        <dt>Where</dt>
        <dd>{show.venue}</dd>
      </div>
      <div>
        <dt>Entries</dt>
        <dd>
          {ENTRY_WINDOW[show.entryWindow]?.label ?? show.entryWindow}
          {window && <>: {window}</>}
        </dd>
      </div>
      <div>
        <dt>Entry fee</dt>
        <dd>{entryFeeText(show)}</dd>
      </div>
      {show.maxEntriesPerMember != null && (
        <div>
          <dt>Quilts each</dt>
          <dd>
            Up to {show.maxEntriesPerMember} {show.maxEntriesPerMember === 1 ? 'quilt' : 'quilts'} per member
          </dd>
        </div>
      )}
      <div>
        <dt>Viewer’s choice</dt>
        <dd>
          {VOTING_KIND_SHORT[show.votingKind]}. {voting}
          {show.votingState === 'scheduled' && show.votingOpensAt && <>, from {formatDateTime(show.votingOpensAt, timeZone)}</>}
          {show.votingState === 'open' && show.votingClosesAt && <>, until {formatDateTime(show.votingClosesAt, timeZone)}</>}.
        </dd>
      </div>
    </dl>
  );
}
