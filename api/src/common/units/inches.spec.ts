import { validateSync } from 'class-validator';
import {
  checkInches,
  formatInches,
  InchParseError,
  inchesField,
  inchesPhrase,
  inchesToMm,
  IsInches,
  MM_PER_INCH,
  mmToInches,
  parseInches,
  roundMm,
} from './inches';

describe('parseInches', () => {
  it.each([
    ['12', 12],
    ['12.5', 12.5],
    ['12 1/2', 12.5],
    ['12-1/2', 12.5],
    ['12 - 1/2', 12.5],
    ['12½', 12.5],
    ['12 ½', 12.5],
    ['½', 0.5],
    ['1/4', 0.25],
    ['3/8', 0.375],
    ['0.25', 0.25],
    ['.5', 0.5],
    ['0', 0],
    ['  12 1/2"  ', 12.5],
    ['12-1/2"', 12.5],
    ['12½”', 12.5],
    ['9 1/2 in', 9.5],
    ['9in', 9],
    ['9 in.', 9],
    ['6 inch', 6],
    ['6 INCHES', 6],
    ['3⅞', 3.875],
    ['⅛', 0.125],
    ['2¾', 2.75],
    ['1⅜', 1.375],
    ['4⅝', 4.625],
    ['12 1 / 2', 12.5],
    ['12 1⁄2', 12.5],
    ['25/2', 12.5],
  ])('reads %j as %d', (input, expected) => {
    expect(parseInches(input)).toBeCloseTo(expected, 12);
  });

  it('reads thirds, sixths and fifths', () => {
    expect(parseInches('7⅓')).toBeCloseTo(7 + 1 / 3, 12);
    expect(parseInches('⅚')).toBeCloseTo(5 / 6, 12);
    expect(parseInches('2⅗')).toBeCloseTo(2.6, 12);
  });

  it.each([
    ['', 'empty'],
    ['   ', 'empty'],
    ['"', 'empty'],
    ['-3', 'negative'],
    ['−1/2', 'negative'],
    ['1/0', '0 below the line'],
    ['12 3/0', '0 below the line'],
    ['twelve', ''],
    ['12 1/', ''],
    ['12..5', ''],
    ['12,5', ''],
    ['1e3', ''],
    ['1/2 1/4', 'more than one fraction'],
    ['12½½', 'more than one fraction'],
    ['12 3/2', 'less than 1'],
    ['12 2/2', 'less than 1'],
    ['12.5 1/2', ''],
  ])('refuses %j', (input, reason) => {
    expect(() => parseInches(input)).toThrow(InchParseError);
    expect(() => parseInches(input)).toThrow(reason);
  });

  it('explains how to write it', () => {
    expect(() => parseInches('12 1/')).toThrow('Could not read "12 1/" as inches. Write it like 12 1/2, 12.5 or 12½.');
  });

  it('inchesField is parseInches for services', () => {
    expect(inchesField('12 1/2')).toBe(12.5);
    expect(() => inchesField('x')).toThrow(InchParseError);
  });
});

describe('formatInches', () => {
  it.each([
    [12.5, '12 1/2'],
    [0.25, '1/4'],
    [3.875, '3 7/8'],
    [12, '12'],
    [12.9999, '13'],
    [0.03, '0'],
    [0, '0'],
    [-0.01, '0'],
    [9.5, '9 1/2'],
    [0.375, '3/8'],
    [12.3, '12 1/4'],
    [-2.5, '-2 1/2'],
    [0.0625, '1/8'], // half an eighth rounds up
  ])('prints %d as %j to the eighth', (inches, text) => {
    expect(formatInches(inches)).toBe(text);
  });

  it('prints sixteenths for photo measurements', () => {
    expect(formatInches(0.0625, 16)).toBe('1/16');
    expect(formatInches(12.31, 16)).toBe('12 5/16');
    expect(formatInches(6.5, 16)).toBe('6 1/2');
  });

  it('refuses non-numbers', () => {
    expect(() => formatInches(Number.NaN)).toThrow(RangeError);
    expect(() => formatInches(Infinity)).toThrow(RangeError);
  });
});

describe('inchesPhrase', () => {
  it('takes the singular up to one inch', () => {
    expect(inchesPhrase(0.25)).toBe('1/4 inch');
    expect(inchesPhrase(1)).toBe('1 inch');
    expect(inchesPhrase(0)).toBe('0 inches');
    expect(inchesPhrase(120)).toBe('120 inches');
    expect(inchesPhrase(12.5)).toBe('12 1/2 inches');
  });
});

describe('millimetres', () => {
  it('uses the exact inch', () => {
    expect(MM_PER_INCH).toBe(25.4); // TRADE.md §2.3, S39
    expect(inchesToMm(1)).toBe(25.4); // TRADE.md §2.3, S39
    expect(mmToInches(25.4)).toBe(1);
    // 76.2 / 25.4 is 3.0000000000000004 in binary floating point; the api must say 3.
    expect(mmToInches(76.2)).toBe(3);
    expect(mmToInches(roundMm(inchesToMm(60.5)))).toBe(60.5);
  });

  it('rounds to thousandths like DECIMAL(10,3)', () => {
    expect(roundMm(inchesToMm(1 / 32))).toBe(0.794); // DESIGN.md §4
    expect(roundMm(1.0005)).toBe(1.001);
    expect(roundMm(-1.0005)).toBe(-1.001);
    expect(roundMm(317.5)).toBe(317.5);
    expect(Object.is(roundMm(-0.0001), 0)).toBe(true);
  });

  it('round-trips every 1/32 inch from 0 to 24 inches through stored millimetres', () => {
    for (let thirtySeconds = 0; thirtySeconds <= 24 * 32; thirtySeconds++) {
      const inches = thirtySeconds / 32;
      const stored = roundMm(inchesToMm(inches));
      expect(formatInches(mmToInches(stored), 32)).toBe(formatInches(inches, 32));
      expect(Math.round(mmToInches(stored) * 32)).toBe(thirtySeconds);
    }
  });
});

describe('IsInches', () => {
  class RoundForm {
    @IsInches({ max: 120 })
    finished!: unknown;

    @IsInches({ allowZero: true, min: 0, max: 1 })
    seam!: unknown;
  }

  function errorsFor(finished: unknown, seam: unknown = '1/4'): Record<string, string[]> {
    const form = Object.assign(new RoundForm(), { finished, seam });
    return Object.fromEntries(validateSync(form).map((e) => [e.property, Object.values(e.constraints ?? {})]));
  }

  it('accepts quilters’ notation within range', () => {
    expect(errorsFor('12 1/2"')).toEqual({});
    expect(errorsFor('120', '0')).toEqual({});
  });

  it('explains what is wrong', () => {
    expect(errorsFor('')).toEqual({ finished: ['Enter a size in inches, like 12 1/2.'] });
    expect(errorsFor(12)).toEqual({ finished: ['Enter a size in inches, like 12 1/2.'] });
    expect(errorsFor('0')).toEqual({ finished: ['Must be more than 0 inches.'] });
    expect(errorsFor('121')).toEqual({ finished: ['Must be at most 120 inches.'] });
    expect(errorsFor('12', '1 1/8')).toEqual({ seam: ['Must be at most 1 inch.'] });
    expect(errorsFor('12 1/')).toEqual({
      finished: ['Could not read "12 1/" as inches. Write it like 12 1/2, 12.5 or 12½.'],
    });
  });

  it('checks minimums', () => {
    expect(checkInches('1/8', { min: 0.25 })).toBe('Must be at least 1/4 inch.');
    expect(checkInches('1/4', { min: 0.25 })).toBeNull();
  });
});
