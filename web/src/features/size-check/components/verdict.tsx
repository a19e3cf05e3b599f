import type { ReactNode } from 'react';
import type { CheckedSize, SizeCheck, SizeVerdict } from '../api/get-size-checks';

export type Tone = 'good' | 'warn' | 'bad' | 'none';

type VerdictWords = { label: string; tone: Tone };

export const VERDICT_WORDS: Record<SizeVerdict, VerdictWords> = {
  in_size: { label: 'In size', tone: 'good' },
  big_enough: { label: 'Big enough', tone: 'good' },
  too_big: { label: 'Too big: trim it', tone: 'warn' },
  too_small: { label: 'Too small', tone: 'bad' },
};

/** "12 1/2 x 12 9/16" from a checked size (inches, to 1/16). */
export function checkedSizeText(size: CheckedSize | null | undefined): string | null {
  if (!size?.widthText || !size.heightText) return null;
  return `${size.widthText} x ${size.heightText}`;
}

/** The headline of a check in words, whatever its state. */
export function verdictWords(check: SizeCheck): VerdictWords {
  if (check.verdict && VERDICT_WORDS[check.verdict]) return VERDICT_WORDS[check.verdict];
  if (check.status === 'failed') return { label: 'Could not measure', tone: 'none' };
  return { label: 'Not judged yet', tone: 'none' };
}

/** Small pictograms beside the words (never instead of them). */
export function ToneIcon({ tone }: { tone: Tone }) {
  const common = { width: 22, height: 22, viewBox: '0 0 24 24', 'aria-hidden': true, focusable: false, className: 'tone-icon' } as const;
  switch (tone) {
    case 'good':
      return (
        <svg {...common}>
          <circle cx="12" cy="12" r="11" fill="currentColor" opacity="0.18" />
          <path d="M6 12.5l4 4 8-9" fill="none" stroke="currentColor" strokeWidth="3" strokeLinecap="round" strokeLinejoin="round" />
        </svg>
      );
    case 'warn':
      return (
        <svg {...common}>
          <path d="M12 2L23 21H1z" fill="none" stroke="currentColor" strokeWidth="2.5" strokeLinejoin="round" />
          <path d="M12 9v5" stroke="currentColor" strokeWidth="2.5" strokeLinecap="round" />
          <circle cx="12" cy="17.5" r="1.5" fill="currentColor" />
        </svg>
      );
    case 'bad':
      return (
        <svg {...common}>
          <circle cx="12" cy="12" r="10" fill="none" stroke="currentColor" strokeWidth="2.5" />
          <path d="M8 8l8 8M16 8l-8 8" stroke="currentColor" strokeWidth="2.5" strokeLinecap="round" />
        </svg>
      );
    default:
      return (
        <svg {...common}>
          <circle cx="12" cy="12" r="10" fill="none" stroke="currentColor" strokeWidth="2.5" />
          <path d="M9.2 9.2a3 3 0 1 1 3.8 2.9c-.6.2-1 .7-1 1.3v.6" fill="none" stroke="currentColor" strokeWidth="2.5" strokeLinecap="round" />
          <circle cx="12" cy="17.6" r="1.5" fill="currentColor" />
        </svg>
      );
  }
}

/** A verdict as a badge: icon, words and colour together, so colour never carries it alone. */
export function VerdictBadge({ tone, children }: { tone: Tone; children: ReactNode }) {
  return (
    <span className={`verdict-badge tone-${tone}`}>
      <ToneIcon tone={tone} />
      <span>{children}</span>
    </span>
  );
}

/** The badges for one check: its verdict, and "out of square" when the diagonals disagree. */
export function CheckBadges({ check }: { check: SizeCheck }) {
  const words = verdictWords(check);
  return (
    <span className="d-inline-flex flex-wrap gap-2 align-items-center">
      <VerdictBadge tone={words.tone}>{words.label}</VerdictBadge>
      {check.outOfSquare && <VerdictBadge tone="warn">Out of square</VerdictBadge>}
    </span>
  );
}
