/**
 * Inches as quilters type them: "12", "12.5", "12 1/2", "12-1/2", "12½", "12 1/2\"", "3/8", read
 * exactly as the api reads them and refused in the api's words ("60,5" and "60 3/2" are refused),
 * so a form never sends what the api would turn away. The api has the last word all the same.
 */
export type InchReading = { ok: true; inches: number } | { ok: false; message: string };

export type InchRange = { min?: number; max?: number; allowZero?: boolean };

const EXAMPLE_FORMS = 'Write it like 12 1/2, 12.5 or 12½.';

const VULGAR_FRACTIONS: Readonly<Record<string, string>> = {
  '¼': '1/4',
  '½': '1/2',
  '¾': '3/4',
  '⅛': '1/8',
  '⅜': '3/8',
  '⅝': '5/8',
  '⅞': '7/8',
  '⅓': '1/3',
  '⅔': '2/3',
  '⅙': '1/6',
  '⅚': '5/6',
  '⅕': '1/5',
  '⅖': '2/5',
  '⅗': '3/5',
  '⅘': '4/5',
  '⅐': '1/7',
  '⅑': '1/9',
  '⅒': '1/10',
};

const UNIT_SUFFIX = /\s*(?:"|”|″|''|inches|inch|in\.?)$/i;
const DECIMAL = /^(?:\d+(?:\.\d*)?|\.\d+)$/;
const FRACTION = /^(\d+)\/(\d+)$/;
const WHOLE_AND_FRACTION = /^(\d+)(?:\s+|\s*-\s*)(\d+)\/(\d+)$/;

function normalise(input: string): string {
  let text = String(input ?? '').trim().replace(UNIT_SUFFIX, '').trim();
  text = text.replace(/\u2044/g, '/').replace(/\s*\/\s*/g, '/');
  for (const [glyph, ascii] of Object.entries(VULGAR_FRACTIONS)) text = text.split(glyph).join(` ${ascii}`);
  return text.trim();
}

const refuse = (input: string, reason?: string): InchReading => {
  const shown = input.length > 40 ? `${input.slice(0, 40)}…` : input;
  return { ok: false, message: `Could not read "${shown}" as inches.${reason ? ` ${reason}` : ''} ${EXAMPLE_FORMS}` };
};

/** 12, 12.5, 12 1/2, 12-1/2, 12½, ½, 3/8, with an optional unit; anything else is refused. */
export function readInches(input: string): InchReading {
  const text = normalise(input);
  if (text === '') return refuse(input, 'It is empty.');
  if (/^[-−–]/.test(text)) return refuse(input, 'A size cannot be negative.');
  if ((text.match(/\//g) ?? []).length > 1) return refuse(input, 'It has more than one fraction.');
  if (DECIMAL.test(text)) return { ok: true, inches: Number(text) };
  const fraction = FRACTION.exec(text);
  if (fraction) {
    if (Number(fraction[2]) === 0) return refuse(input, 'A fraction cannot have 0 below the line.');
    return { ok: true, inches: Number(fraction[1]) / Number(fraction[2]) };
  }
  const mixed = WHOLE_AND_FRACTION.exec(text);
  if (mixed) {
    if (Number(mixed[3]) === 0) return refuse(input, 'A fraction cannot have 0 below the line.');
    const part = Number(mixed[2]) / Number(mixed[3]);
    if (part >= 1) return refuse(input, 'The fraction after the whole number must be less than 1.');
    return { ok: true, inches: Number(mixed[1]) + part };
  }
  return refuse(input);
}

/** The inches, or null when the api would not read them. */
export function inchesOrNull(input: string | null | undefined): number | null {
  if (input == null || String(input).trim() === '') return null;
  const reading = readInches(input);
  return reading.ok ? reading.inches : null;
}

/** "1 inch", "12 inches": the api words its limits this way. */
export function inchesPhrase(inches: number): string {
  return `${formatInches(inches)} ${inches > 0 && inches <= 1 ? 'inch' : 'inches'}`;
}

/** The api's message for a size field, or null when it is fine. */
export function checkInches(value: string | null | undefined, range: InchRange = {}): string | null {
  if (value == null || String(value).trim() === '') return 'Enter a size in inches, like 12 1/2.';
  const reading = readInches(String(value));
  if (!reading.ok) return reading.message;
  if (reading.inches === 0 && !range.allowZero) return 'Must be more than 0 inches.';
  if (range.min !== undefined && reading.inches < range.min) return `Must be at least ${inchesPhrase(range.min)}.`;
  if (range.max !== undefined && reading.inches > range.max) return `Must be at most ${inchesPhrase(range.max)}.`;
  return null;
}

/** Millimetres as the api stores them (thousandths), so limits compare the way the api compares them. */
export const inchesToStoredMm = (inches: number) => Math.round(Number((inches * 25.4 * 1000).toPrecision(15))) / 1000;

/** The inches, or null when they cannot be read (for previews while she types). */
export function parseInches(input: string | null | undefined): number | null {
  return inchesOrNull(input);
}

function gcd(a: number, b: number): number {
  return b === 0 ? a : gcd(b, a % b);
}

/** Inches to the nearest 1/8, written as quilters write them: "12 1/2", "3/8", "12". */
export function formatInches(value: number): string {
  const eighths = Math.round(value * 8);
  const whole = Math.floor(eighths / 8);
  const rest = eighths - whole * 8;
  if (rest === 0) return String(whole);
  const d = gcd(rest, 8);
  const fraction = `${rest / d}/${8 / d}`;
  return whole === 0 ? fraction : `${whole} ${fraction}`;
}

/** Finished + two seam allowances; null when either cannot be read. */
export function unfinishedFrom(finished: string, seamAllowance: string): number | null {
  const f = parseInches(finished);
  const s = parseInches(seamAllowance || '1/4');
  if (f === null || s === null || f <= 0) return null;
  return f + 2 * s;
}
