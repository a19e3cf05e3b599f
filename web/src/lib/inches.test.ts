import { describe, expect, it } from 'vitest';
import { formatInches, parseInches, unfinishedFrom } from './inches';

describe('inches', () => {
  it.each([
    ['12', 12],
    ['12.5', 12.5],
    ['12 1/2', 12.5],
    ['12½', 12.5],
    ['12 ½', 12.5],
    ['12-1/2', 12.5],
    ['12-1/2"', 12.5],
    ['12 1/2 in', 12.5],
    ['1/4', 0.25],
    ['⅛', 0.125],
    [' 9 ', 9],
  ])('reads %j as %d inches', (text, value) => {
    expect(parseInches(text)).toBeCloseTo(value, 6);
  });

  it.each(['', 'twelve', '12 1/', '1/0', '-3'])('does not read %j', (text) => {
    expect(parseInches(text)).toBeNull();
  });

  it('writes inches to the nearest 1/8 the way quilters do', () => {
    expect(formatInches(12.5)).toBe('12 1/2');
    expect(formatInches(12)).toBe('12');
    expect(formatInches(0.375)).toBe('3/8');
    expect(formatInches(9.99)).toBe('10');
    expect(formatInches(3.875)).toBe('3 7/8');
  });

  // TRADE.md §1.1 (S1, S3): 12 finished is cut 12 1/2; 9 finished is cut 9 1/2.
  it('adds two seam allowances for the unfinished size', () => {
    expect(formatInches(unfinishedFrom('12', '1/4')!)).toBe('12 1/2');
    expect(formatInches(unfinishedFrom('9', '')!)).toBe('9 1/2');
    expect(unfinishedFrom('', '1/4')).toBeNull();
  });
});
