import { formatDay } from '@/features/dues/lib/format';
import { formatDate } from '@/lib/dates';

/** "2026-10-02" + "2026-10-04" → "Friday 2 October 2026 to Sunday 4 October 2026"; one day once. */
export function formatDateRange(startsOn: string, endsOn: string | null | undefined): string {
  if (!endsOn || endsOn === startsOn) return formatDate(startsOn);
  return `${formatDate(startsOn)} to ${formatDate(endsOn)}`;
}

/** The entry window in words, e.g. "1 September 2026 to 20 September 2026"; empty when no dates are set. */
export function formatWindow(opensOn: string | null, closesOn: string | null): string {
  if (opensOn && closesOn) return `${formatDay(opensOn)} to ${formatDay(closesOn)}`;
  if (opensOn) return `from ${formatDay(opensOn)}`;
  if (closesOn) return `until ${formatDay(closesOn)}`;
  return '';
}
