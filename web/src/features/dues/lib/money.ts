/**
 * Money arrives from the api as whole minor units (cents; yen for JPY) and goes back the same way.
 * Nothing here divides by 100: amounts become exact decimal strings by moving the point in the text,
 * and Intl formats that string as it is.
 */

export const MONEY_LOCALE = 'en-US';

const digitsCache = new Map<string, number>();

/** Digits after the point for a currency, as Intl knows them: USD 2, JPY 0, KWD 3. */
export function minorDigits(currency: string): number {
  const code = currency.trim().toUpperCase();
  let digits = digitsCache.get(code);
  if (digits === undefined) {
    digits = new Intl.NumberFormat(MONEY_LOCALE, { style: 'currency', currency: code }).resolvedOptions().maximumFractionDigits ?? 2;
    digitsCache.set(code, digits);
  }
  return digits;
}

/** (2550, 2) → "25.50", (5, 2) → "0.05", (-1999, 2) → "-19.99", (3000, 0) → "3000". */
export function centsToDecimalString(cents: number, digits: number): string {
  if (!Number.isSafeInteger(cents)) throw new RangeError(`Expected whole cents, got ${String(cents)}`);
  const negative = cents < 0;
  const abs = String(Math.abs(cents));
  if (digits === 0) return `${negative ? '-' : ''}${abs}`;
  const padded = abs.padStart(digits + 1, '0');
  return `${negative ? '-' : ''}${padded.slice(0, -digits)}.${padded.slice(-digits)}`;
}

/** 2550 USD → "$25.50"; 3000 JPY → "¥3,000". */
export function formatMoney(cents: number, currency: string, locale: string = MONEY_LOCALE): string {
  const digits = minorDigits(currency);
  const formatter = new Intl.NumberFormat(locale, {
    style: 'currency',
    currency,
    minimumFractionDigits: digits,
    maximumFractionDigits: digits,
  });
  // Intl formats a decimal string exactly (ES2023); the older lib typings only name number | bigint.
  return formatter.format(centsToDecimalString(cents, digits) as unknown as number);
}

/** Cents as a plain amount for a text box: 2550 USD → "25.50", 4000 JPY → "4000". */
export function centsToInput(cents: number | null | undefined, currency: string): string {
  if (cents === null || cents === undefined) return '';
  return centsToDecimalString(cents, minorDigits(currency));
}

export type ParsedMoney = { ok: true; cents: number } | { ok: false; message: string };

/** The currency's symbols a typed amount may carry: "$", "US$", "USD" for USD. */
function symbolsFor(code: string): string[] {
  const found = new Set<string>([code]);
  for (const currencyDisplay of ['symbol', 'narrowSymbol'] as const) {
    const part = new Intl.NumberFormat(MONEY_LOCALE, { style: 'currency', currency: code, currencyDisplay })
      .formatToParts(1)
      .find((p) => p.type === 'currency');
    if (part) found.add(part.value.toUpperCase());
  }
  return [...found].sort((a, b) => b.length - a.length);
}

/**
 * What she typed, as whole cents: "25", "25.5", "$25.50", "1,234.50" → 2500, 2550, 2550, 123450 (USD).
 * Commas only group thousands; the point is the decimal point. Refuses negatives, more decimals than
 * the currency has, and anything that is not a plain amount, with a sentence saying what to type.
 */
export function parseMoney(input: string, currency: string): ParsedMoney {
  const code = currency.trim().toUpperCase();
  const digits = minorDigits(code);
  const example = digits === 0 ? '25' : `25 or 25.${'0'.repeat(digits)}`;
  const typeAnAmount = `Type an amount like ${example}.`;
  let text = input.replace(/\s+/g, ' ').trim();
  if (!text) return { ok: false, message: 'Enter an amount.' };
  if (/^[-−]/.test(text)) return { ok: false, message: 'The amount cannot be negative.' };

  const upper = text.toUpperCase();
  const symbols = symbolsFor(code);
  const prefix = symbols.find((s) => upper.startsWith(s));
  if (prefix) text = text.slice(prefix.length).trim();
  else {
    const suffix = symbols.find((s) => upper.endsWith(s));
    if (suffix) text = text.slice(0, text.length - suffix.length).trim();
  }
  if (/^[-−]/.test(text)) return { ok: false, message: 'The amount cannot be negative.' };

  const match = /^(?:(\d{1,3}(?:,\d{3})+|\d+)(?:\.(\d*))?|\.(\d+))$/.exec(text);
  if (!match) return { ok: false, message: typeAnAmount };
  const whole = (match[1] ?? '0').replace(/,/g, '');
  const hasPoint = match[2] !== undefined || match[3] !== undefined;
  const fraction = match[2] ?? match[3] ?? '';
  if (digits === 0 && hasPoint) return { ok: false, message: `${code} amounts are whole numbers, with no decimal point.` };
  if (fraction.length > digits)
    return { ok: false, message: `Use at most ${digits} digit${digits === 1 ? '' : 's'} after the point, like ${example}.` };

  const cents = BigInt(whole + fraction.padEnd(digits, '0'));
  if (cents > BigInt(Number.MAX_SAFE_INTEGER)) return { ok: false, message: 'That amount is too large.' };
  return { ok: true, cents: Number(cents) };
}

/** parseMoney for code that has already validated the text (e.g. after yup): throws on bad input. */
export function moneyToCents(input: string, currency: string): number {
  const parsed = parseMoney(input, currency);
  if (!parsed.ok) throw new RangeError(parsed.message);
  return parsed.cents;
}
