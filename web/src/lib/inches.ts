/**
 * Inches as quilters type them: "12", "12.5", "12 1/2", "12-1/2", "12½", "12 1/2\"", "1/4".
 * The api parses sizes itself and has the last word; this is for previews on the client.
 */
const VULGAR: Record<string, string> = {
  '½': '1/2',
  '⅓': '1/3',
  '⅔': '2/3',
  '¼': '1/4',
  '¾': '3/4',
  '⅛': '1/8',
  '⅜': '3/8',
  '⅝': '5/8',
  '⅞': '7/8',
  '⅙': '1/6',
  '⅚': '5/6',
  '⅕': '1/5',
};

export function parseInches(input: string | null | undefined): number | null {
  if (input == null) return null;
  let text = String(input).trim().toLowerCase();
  if (!text) return null;
  text = text
    .replace(/\s*(inches|inch|in\.?|"|″|”)\s*$/u, '')
    .replace(/[½⅓⅔¼¾⅛⅜⅝⅞⅙⅚⅕]/gu, (c) => ` ${VULGAR[c]}`)
    .replace(/⁄/gu, '/')
    .replace(/,/g, '.')
    .trim();
  // "12-1/2" and "12 - 1/2" mean twelve and a half.
  text = text.replace(/^(\d+)\s*-\s*(\d+\s*\/\s*\d+)$/, '$1 $2').replace(/\s*\/\s*/g, '/').replace(/\s+/g, ' ');

  let value: number | null = null;
  let m: RegExpMatchArray | null;
  if ((m = text.match(/^(\d+(?:\.\d+)?|\.\d+)$/))) value = Number(m[1]);
  else if ((m = text.match(/^(\d+) (\d+)\/(\d+)$/))) value = Number(m[1]) + Number(m[2]) / Number(m[3]);
  else if ((m = text.match(/^(\d+)\/(\d+)$/))) value = Number(m[1]) / Number(m[2]);
  if (value === null || !Number.isFinite(value)) return null;
  return value;
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
