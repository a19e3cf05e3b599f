const DATE_RE = /^(\d{4})-(\d{2})-(\d{2})$/;

/** "2026-01-01" → "1 January 2026": a term's dates, short enough for a phone. */
export function formatDay(value: string | null | undefined): string {
  if (!value) return '';
  const m = value.match(DATE_RE);
  if (!m) return value;
  const date = new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3])));
  return date.toLocaleDateString('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });
}

/** "since 1 January 2026, access ends on 1 January 2027" (or "no end date set"). */
export function describeTerm(term: { startsOn: string; endsOn: string | null }, today: string): string {
  const start = term.startsOn > today ? `from ${formatDay(term.startsOn)}` : `since ${formatDay(term.startsOn)}`;
  return `${start}, ${term.endsOn ? `access ends on ${formatDay(term.endsOn)}` : 'no end date set'}`;
}
