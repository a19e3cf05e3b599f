import { registerDecorator, ValidationArguments, ValidationOptions } from 'class-validator';

/** Exact by definition of the international inch (TRADE.md §2.3, S39). */
export const MM_PER_INCH = 25.4;

/** 1/8 for sizes people cut, 1/16 for photo measurements; 1/32 only to prove storage round-trips. */
export type InchDenominator = 8 | 16 | 32;

/** Thrown when text cannot be read as inches; the message is meant to be shown to the person who typed it. */
export class InchParseError extends Error {
  constructor(
    readonly input: string,
    reason?: string,
  ) {
    const shown = input.length > 40 ? `${input.slice(0, 40)}…` : input;
    super(`Could not read "${shown}" as inches.${reason ? ` ${reason}` : ''} ${EXAMPLE_FORMS}`);
    this.name = 'InchParseError';
  }
}

const EXAMPLE_FORMS = 'Write it like 12 1/2, 12.5 or 12½.';

const VULGAR_FRACTIONS: Readonly<Record<string, string>> = {
  '¼': '1/4', '½': '1/2', '¾': '3/4',
  '⅛': '1/8', '⅜': '3/8', '⅝': '5/8', '⅞': '7/8',
  '⅓': '1/3', '⅔': '2/3', '⅙': '1/6', '⅚': '5/6',
  '⅕': '1/5', '⅖': '2/5', '⅗': '3/5', '⅘': '4/5',
  '⅐': '1/7', '⅑': '1/9', '⅒': '1/10',
};

// Phones turn a typed " into a curly quote, and some keyboards offer the double prime.
const UNIT_SUFFIX = /\s*(?:"|”|″|''|inches|inch|in\.?)$/i;
const DECIMAL = /^(?:\d+(?:\.\d*)?|\.\d+)$/;
const FRACTION = /^(\d+)\/(\d+)$/;
const WHOLE_AND_FRACTION = /^(\d+)(?:\s+|\s*-\s*)(\d+)\/(\d+)$/;

/** Reads the ways quilters write inches: 12, 12.5, 12 1/2, 12-1/2, 12½, ½, 3/8, with an optional unit. */
export function parseInches(input: string): number {
  const text = normaliseInchText(input);
  if (text === '') throw new InchParseError(input, 'It is empty.');
  if (/^[-−–]/.test(text)) throw new InchParseError(input, 'A size cannot be negative.');
  if ((text.match(/\//g) ?? []).length > 1) throw new InchParseError(input, 'It has more than one fraction.');

  if (DECIMAL.test(text)) return Number(text);
  const fraction = FRACTION.exec(text);
  if (fraction) return divide(input, fraction[1], fraction[2]);
  const mixed = WHOLE_AND_FRACTION.exec(text);
  if (mixed) {
    const part = divide(input, mixed[2], mixed[3]);
    if (part >= 1) throw new InchParseError(input, 'The fraction after the whole number must be less than 1.');
    return Number(mixed[1]) + part;
  }
  throw new InchParseError(input);
}

/** Services receive validated DTO strings; this names the conversion at the call site. */
export function inchesField(value: string): number {
  return parseInches(value);
}

function normaliseInchText(input: string): string {
  let text = String(input ?? '').trim().replace(UNIT_SUFFIX, '').trim();
  // U+2044 FRACTION SLASH comes from some keyboards' fraction autocorrect.
  text = text.replace(/\u2044/g, '/').replace(/\s*\/\s*/g, '/');
  for (const [glyph, ascii] of Object.entries(VULGAR_FRACTIONS)) text = text.split(glyph).join(` ${ascii}`);
  return text.trim();
}

function divide(input: string, numerator: string, denominator: string): number {
  const bottom = Number(denominator);
  if (bottom === 0) throw new InchParseError(input, 'A fraction cannot have 0 below the line.');
  return Number(numerator) / bottom;
}

/** Prints inches the way a ruler reads: nearest 1/denominator, reduced, e.g. "12 1/2", "3 7/8", "1/4". */
export function formatInches(inches: number, denominator: InchDenominator = 8): string {
  if (!Number.isFinite(inches)) throw new RangeError(`Cannot print ${inches} as inches.`);
  // Round the magnitude so -0.5/8 and 0.5/8 round alike, and clean float noise (12.4999999 eighths).
  const steps = Math.round(Number((Math.abs(inches) * denominator).toPrecision(12)));
  if (steps === 0) return '0';
  const sign = inches < 0 ? '-' : '';
  const whole = Math.floor(steps / denominator);
  const remainder = steps % denominator;
  if (remainder === 0) return `${sign}${whole}`;
  const common = greatestCommonDivisor(remainder, denominator);
  const fraction = `${remainder / common}/${denominator / common}`;
  return whole === 0 ? `${sign}${fraction}` : `${sign}${whole} ${fraction}`;
}

/** "1/4 inch", "1 inch", "12 1/2 inches": English takes the singular up to one. */
export function inchesPhrase(inches: number, denominator: InchDenominator = 8): string {
  const text = formatInches(inches, denominator);
  const shown = Math.round(Math.abs(inches) * denominator) / denominator;
  return `${text} ${shown > 0 && shown <= 1 ? 'inch' : 'inches'}`;
}

function greatestCommonDivisor(a: number, b: number): number {
  return b === 0 ? a : greatestCommonDivisor(b, a % b);
}

export function inchesToMm(inches: number): number {
  return inches * MM_PER_INCH;
}

/**
 * Twelve significant figures drop the binary noise of the division (76.2 mm is 3 in, not
 * 3.0000000000000004) while keeping far more precision than the stored thousandths of a millimetre.
 */
export function mmToInches(mm: number): number {
  return Number((mm / MM_PER_INCH).toPrecision(12));
}

/** Matches DECIMAL(10,3) storage, so what we compute equals what we later read back. */
export function roundMm(mm: number): number {
  if (!Number.isFinite(mm)) throw new RangeError(`Cannot store ${mm} as millimetres.`);
  const thousandths = Math.round(Number((Math.abs(mm) * 1000).toPrecision(15)));
  return thousandths === 0 ? 0 : (Math.sign(mm) * thousandths) / 1000;
}

export interface InchRange {
  min?: number;
  max?: number;
  allowZero?: boolean;
}

/** The message for a size field, or null when it is fine; shared by the decorator and by services. */
export function checkInches(value: unknown, range: InchRange = {}): string | null {
  if (typeof value !== 'string' || value.trim() === '') return 'Enter a size in inches, like 12 1/2.';
  let inches: number;
  try {
    inches = parseInches(value);
  } catch (error) {
    if (error instanceof InchParseError) return error.message;
    throw error;
  }
  if (inches === 0 && !range.allowZero) return 'Must be more than 0 inches.';
  if (range.min !== undefined && inches < range.min) return `Must be at least ${inchesPhrase(range.min, 16)}.`;
  if (range.max !== undefined && inches > range.max) return `Must be at most ${inchesPhrase(range.max, 16)}.`;
  return null;
}

/** Validates a DTO string field as inches in quilters' notation, within a range in inches. */
export function IsInches(range: InchRange = {}, validationOptions?: ValidationOptions): PropertyDecorator {
  return (target: object, propertyName: string | symbol) => {
    registerDecorator({
      name: 'isInches',
      target: target.constructor,
      propertyName: String(propertyName),
      options: validationOptions,
      validator: {
        validate: (value: unknown) => checkInches(value, range) === null,
        defaultMessage: (args?: ValidationArguments) =>
          checkInches(args?.value, range) ?? 'Enter a size in inches, like 12 1/2.',
      },
    });
  };
}
