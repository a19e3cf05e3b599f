import { formatDay } from '@/lib/dates';

export { formatDay };

/** "since 1 January 2026, access ends on 1 January 2027" (or "no end date set"). */
export function describeTerm(term: { startsOn: string; endsOn: string | null }, today: string): string {
  const start = term.startsOn > today ? `from ${formatDay(term.startsOn)}` : `since ${formatDay(term.startsOn)}`;
  return `${start}, ${term.endsOn ? `access ends on ${formatDay(term.endsOn)}` : 'no end date set'}`;
}
