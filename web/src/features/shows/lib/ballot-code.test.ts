import { describe, expect, it } from 'vitest';
import { formatBallotCode, normaliseBallotCode } from './ballot-code';

describe('ballot codes', () => {
  it('ignore case, spaces and dashes', () => {
    expect(normaliseBallotCode(' k7qm 3xhd-9prw ')).toBe('K7QM3XHD9PRW');
    expect(normaliseBallotCode('K7QM–3XHD–9PRW')).toBe('K7QM3XHD9PRW');
    expect(normaliseBallotCode('')).toBe('');
  });

  it('print in groups of four', () => {
    expect(formatBallotCode('k7qm3xhd9prw')).toBe('K7QM-3XHD-9PRW');
    expect(formatBallotCode('K7Q')).toBe('K7Q');
  });
});
