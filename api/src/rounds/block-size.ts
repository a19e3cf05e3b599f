import { inchesPhrase, formatInches } from '../common/units/inches';

/** Finished sizes offered first when a round is set up; a guild can still type any size. */
export const BLOCK_PRESETS_INCHES: readonly number[] = [6, 8, 9, 10, 12, 16];

/** A quarter inch on every edge (TRADE.md §1.1, S1–S3). */
export const DEFAULT_SEAM_ALLOWANCE_IN = 0.25;

/** "Within 1/8 inch" is common practice with no published rule (TRADE.md §1.6, S14). */
export const DEFAULT_TOLERANCE_IN = 0.125;

/** A sanity cap, not a trade rule: no block, and no quilt top on a bed, is wider than this. */
export const MAX_BLOCK_SIZE_IN = 120;

/** Not a trade rule: past an inch a "seam allowance" is almost surely a typo for the block size. */
export const MAX_SEAM_ALLOWANCE_IN = 1;

export interface Size {
  width: number;
  height: number;
}

/** The size makers cut and hand in: the finished size plus a seam allowance on each side. */
export function unfinishedSize(finished: Size, seam: number = DEFAULT_SEAM_ALLOWANCE_IN): Size {
  return { width: finished.width + 2 * seam, height: finished.height + 2 * seam };
}

export interface RoundSizes {
  finishedWidth: number;
  finishedHeight: number;
  seam: number;
  tolerance: number;
}

export type RoundSizeErrors = Partial<Record<keyof RoundSizes, string>>;

/** Field → message for a round's sizes (inches); an empty object means they are usable. */
export function validateRoundSizes(sizes: RoundSizes): RoundSizeErrors {
  const errors: RoundSizeErrors = {};
  const widthProblem = finishedSizeProblem('width', sizes.finishedWidth);
  const heightProblem = finishedSizeProblem('height', sizes.finishedHeight);
  const seamProblem = seamAllowanceProblem(sizes.seam);
  const toleranceProblem = toleranceProblemFor(sizes.tolerance, seamProblem ? null : sizes.seam);
  if (widthProblem) errors.finishedWidth = widthProblem;
  if (heightProblem) errors.finishedHeight = heightProblem;
  if (seamProblem) errors.seam = seamProblem;
  if (toleranceProblem) errors.tolerance = toleranceProblem;
  return errors;
}

function finishedSizeProblem(side: 'width' | 'height', inches: number): string | null {
  if (!Number.isFinite(inches)) return `Enter the finished ${side} in inches, like 12.`;
  if (inches <= 0) return `The finished ${side} must be more than 0 inches.`;
  if (inches > MAX_BLOCK_SIZE_IN) return `The finished ${side} must be at most ${inchesPhrase(MAX_BLOCK_SIZE_IN)}.`;
  return null;
}

function seamAllowanceProblem(inches: number): string | null {
  if (!Number.isFinite(inches)) return 'Enter the seam allowance in inches, like 1/4.';
  if (inches <= 0 || inches > MAX_SEAM_ALLOWANCE_IN) {
    return `The seam allowance must be more than 0 and at most ${inchesPhrase(MAX_SEAM_ALLOWANCE_IN)}.`;
  }
  return null;
}

// Sixteenths, because a tolerance of 1/16 would print as 1/8 when rounded to eighths.
function toleranceProblemFor(tolerance: number, validSeam: number | null): string | null {
  if (!Number.isFinite(tolerance)) return 'Enter the tolerance in inches, like 1/8.';
  if (tolerance <= 0) return 'The tolerance must be more than 0 inches.';
  if (validSeam !== null && tolerance > validSeam) {
    return `The tolerance (${formatInches(tolerance, 16)}) cannot be larger than the seam allowance (${formatInches(validSeam, 16)}).`;
  }
  return null;
}
