import type { Tone } from '../lib/labels';

function ToneIcon({ tone }: { tone: Tone }) {
  const common = { width: 22, height: 22, viewBox: '0 0 24 24', 'aria-hidden': true, focusable: false, className: 'tone-icon' } as const;
  switch (tone) {
    case 'good':
      return (
        <svg {...common}>
          <circle cx="12" cy="12" r="10" fill="none" stroke="currentColor" strokeWidth="2.5" />
          <path d="M7 12.5l3.2 3.2L17 9" fill="none" stroke="currentColor" strokeWidth="2.5" strokeLinecap="round" strokeLinejoin="round" />
        </svg>
      );
    case 'warn':
      return (
        <svg {...common}>
          <circle cx="12" cy="12" r="10" fill="none" stroke="currentColor" strokeWidth="2.5" />
          <path d="M12 6.5V12l3.5 2.5" fill="none" stroke="currentColor" strokeWidth="2.5" strokeLinecap="round" strokeLinejoin="round" />
        </svg>
      );
    case 'bad':
      return (
        <svg {...common}>
          <circle cx="12" cy="12" r="10" fill="none" stroke="currentColor" strokeWidth="2.5" />
          <path d="M8.5 8.5l7 7M15.5 8.5l-7 7" stroke="currentColor" strokeWidth="2.5" strokeLinecap="round" />
        </svg>
      );
    default:
      return (
        <svg {...common}>
          <circle cx="12" cy="12" r="10" fill="none" stroke="currentColor" strokeWidth="2.5" />
          <path d="M7.5 12h9" stroke="currentColor" strokeWidth="2.5" strokeLinecap="round" />
        </svg>
      );
  }
}

/** A state in words with an icon and a colour beside them (never colour alone). */
export function ToneBadge({ tone, label, className, testId }: { tone: Tone; label: string; className?: string; testId?: string }) {
  return (
    <span className={`verdict-badge tone-${tone} ${className ?? ''}`} data-testid={testId}>
      <ToneIcon tone={tone} />
      <span>{label}</span>
    </span>
  );
}
