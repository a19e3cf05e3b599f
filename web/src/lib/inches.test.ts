import { describe, expect, it } from 'vitest';
import { checkInches, formatInches, parseInches, readInches, unfinishedFrom } from './inches';

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

describe('inch text as the api reads it', () => {
  it('reads the ways quilters write inches', () => {
    for (const [text, inches] of [
      ['60', 60],
      ['60.5', 60.5],
      ['60 1/2', 60.5],
      ['60-1/2', 60.5],
      ['60½', 60.5],
      ['60 1/2"', 60.5],
      ['3/8', 0.375],
      ['12 in', 12],
    ] as const)
      expect(readInches(text)).toEqual({ ok: true, inches });
  });

  it('refuses a decimal comma and a fraction of 1 or more, in the api’s words', () => {
    expect(checkInches('60,5')).toBe('Could not read "60,5" as inches. Write it like 12 1/2, 12.5 or 12½.');
    expect(checkInches('60 3/2')).toBe(
      'Could not read "60 3/2" as inches. The fraction after the whole number must be less than 1. Write it like 12 1/2, 12.5 or 12½.',
    );
    expect(checkInches('1/2/3')).toBe('Could not read "1/2/3" as inches. It has more than one fraction. Write it like 12 1/2, 12.5 or 12½.');
    expect(checkInches('60 1/0')).toMatch(/A fraction cannot have 0 below the line./);
    expect(checkInches('-4')).toMatch(/A size cannot be negative./);
  });

  it('holds a size to the api’s range', () => {
    expect(checkInches('0')).toBe('Must be more than 0 inches.');
    expect(checkInches('3 7/8', { min: 4, max: 200 })).toBe('Must be at least 4 inches.');
    expect(checkInches('200 1/8', { min: 4, max: 200 })).toBe('Must be at most 200 inches.');
    expect(checkInches('200', { min: 4, max: 200 })).toBeNull();
    expect(checkInches('1/2', { max: 1 })).toBeNull();
  });
});
