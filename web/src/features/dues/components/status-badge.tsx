import type { DuesStatus } from '../api/get-my-dues';
import { DUES_STATUS, NOT_PAID_YET, type Tone } from '../lib/labels';

function StatusIcon({ tone, special }: { tone: Tone; special: boolean }) {
  const common = { width: 22, height: 22, viewBox: '0 0 24 24', 'aria-hidden': true, focusable: false, className: 'tone-icon' } as const;
  if (special) {
    // Lifetime and honorary: a star.
    return (
      <svg {...common}>
        <path d="M12 2.5l2.9 6.1 6.6.8-4.9 4.6 1.3 6.6L12 17.3l-5.9 3.3 1.3-6.6-4.9-4.6 6.6-.8z" fill="currentColor" opacity="0.85" />
      </svg>
    );
  }
  switch (tone) {
    case 'good':
      return (
        <svg {...common}>
          <circle cx="12" cy="12" r="10" fill="none" stroke="currentColor" strokeWidth="2.5" />
          <path d="M7 12.5l3.2 3.2L17 9" fill="none" stroke="currentColor" strokeWidth="2.5" strokeLinecap="round" strokeLinejoin="round" />
        </svg>
      );
    case 'warn':
      // A clock: time to pay.
      return (
        <svg {...common}>
          <circle cx="12" cy="12" r="10" fill="none" stroke="currentColor" strokeWidth="2.5" />
          <path d="M12 6.5V12l3.5 2.5" fill="none" stroke="currentColor" strokeWidth="2.5" strokeLinecap="round" strokeLinejoin="round" />
        </svg>
      );
    default:
      return (
        <svg {...common}>
          <circle cx="12" cy="12" r="10" fill="none" stroke="currentColor" strokeWidth="2.5" />
          <path d="M12 6.5v7" stroke="currentColor" strokeWidth="2.5" strokeLinecap="round" />
          <circle cx="12" cy="17.2" r="1.5" fill="currentColor" />
        </svg>
      );
  }
}

/** Her dues status in words, with a colour and an icon beside them (never colour alone). */
export function DuesStatusBadge({ status, neverPaid = false, className }: { status: DuesStatus; neverPaid?: boolean; className?: string }) {
  // Someone who has never paid (a new member) is not "overdue" in her own eyes: she has not paid yet.
  const words = neverPaid && status === 'lapsed' ? NOT_PAID_YET : (DUES_STATUS[status] ?? { label: status, tone: 'none' as Tone });
  return (
    <span className={`verdict-badge tone-${words.tone} ${className ?? ''}`} data-testid="dues-status">
      <StatusIcon tone={words.tone} special={status === 'lifetime' || status === 'honorary'} />
      <span>{words.label}</span>
    </span>
  );
}
