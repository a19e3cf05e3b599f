import {
  BLOCK_PRESETS_INCHES,
  DEFAULT_SEAM_ALLOWANCE_IN,
  DEFAULT_TOLERANCE_IN,
  unfinishedSize,
  validateRoundSizes,
} from './block-size';
import { formatInches } from '../common/units/inches';

const valid = { finishedWidth: 12, finishedHeight: 12, seam: 0.25, tolerance: 0.125 };

describe('block sizes', () => {
  it('has the trade defaults', () => {
    expect(DEFAULT_SEAM_ALLOWANCE_IN).toBe(0.25); // TRADE.md §1.1, S1–S3
    expect(DEFAULT_TOLERANCE_IN).toBe(0.125); // TRADE.md §1.6, S14 (common practice)
    expect(BLOCK_PRESETS_INCHES).toEqual([6, 8, 9, 10, 12, 16]);
  });

  it('adds a seam allowance on each side', () => {
    const twelve = unfinishedSize({ width: 12, height: 12 }, DEFAULT_SEAM_ALLOWANCE_IN);
    expect(formatInches(twelve.width)).toBe('12 1/2'); // TRADE.md §1.1, S1, S3
    const nine = unfinishedSize({ width: 9, height: 9 }, DEFAULT_SEAM_ALLOWANCE_IN);
    expect(formatInches(nine.height)).toBe('9 1/2'); // TRADE.md §1.1, S1, S3
    expect(unfinishedSize({ width: 12, height: 6 }, 0.25)).toEqual({ width: 12.5, height: 6.5 }); // TRADE.md §1.1, S1
  });

  it('defaults to a quarter inch seam', () => {
    expect(unfinishedSize({ width: 6, height: 6 })).toEqual({ width: 6.5, height: 6.5 }); // TRADE.md §1.1, S1 (finished + 1/2)
  });
});

describe('validateRoundSizes', () => {
  it('accepts the usual round', () => {
    expect(validateRoundSizes(valid)).toEqual({});
    expect(validateRoundSizes({ ...valid, finishedWidth: 120, seam: 1, tolerance: 1 })).toEqual({});
  });

  it('refuses non-positive and oversized blocks', () => {
    expect(validateRoundSizes({ ...valid, finishedWidth: 0, finishedHeight: -2 })).toEqual({
      finishedWidth: 'The finished width must be more than 0 inches.',
      finishedHeight: 'The finished height must be more than 0 inches.',
    });
    expect(validateRoundSizes({ ...valid, finishedHeight: 120.5 })).toEqual({
      finishedHeight: 'The finished height must be at most 120 inches.',
    });
    expect(validateRoundSizes({ ...valid, finishedWidth: Number.NaN }).finishedWidth).toMatch(/Enter the finished width/);
  });

  it('keeps the seam allowance within (0, 1] inch', () => {
    const message = 'The seam allowance must be more than 0 and at most 1 inch.';
    expect(validateRoundSizes({ ...valid, seam: 0 })).toEqual({ seam: message });
    expect(validateRoundSizes({ ...valid, seam: 1.125 })).toEqual({ seam: message });
  });

  it('needs a positive tolerance no larger than the seam allowance', () => {
    expect(validateRoundSizes({ ...valid, tolerance: 0 })).toEqual({
      tolerance: 'The tolerance must be more than 0 inches.',
    });
    expect(validateRoundSizes({ ...valid, tolerance: 0.375 })).toEqual({
      tolerance: 'The tolerance (3/8) cannot be larger than the seam allowance (1/4).',
    });
    expect(validateRoundSizes({ ...valid, seam: 0.0625, tolerance: 0.125 }).tolerance).toBe(
      'The tolerance (1/8) cannot be larger than the seam allowance (1/16).',
    );
  });

  it('does not compare the tolerance with a seam allowance that is itself wrong', () => {
    expect(validateRoundSizes({ ...valid, seam: 0, tolerance: 0.5 })).toEqual({
      seam: 'The seam allowance must be more than 0 and at most 1 inch.',
    });
  });
});
