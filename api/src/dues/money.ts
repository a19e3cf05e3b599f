/**
 * Money as whole minor units (cents for USD and EUR, yen for JPY) held in ordinary JS numbers that are
 * safe integers. Nothing here passes an amount through floating point: typed amounts are parsed as
 * text, formatting hands Intl an exact decimal string, and rounding is integer arithmetic (BigInt where a
 * product could pass 2^53).
 */

/** Thrown for amounts that cannot be used; the message can be shown to the person who typed it. */
export class MoneyError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'MoneyError';
  }
}

const TYPE_AN_AMOUNT = 'Type an amount like 25 or 25.00.';

/** How the currency is shown: its symbol ("$"), its code ("USD 25.00") or its narrow symbol. */
export type CurrencyDisplay = 'symbol' | 'narrowSymbol' | 'code';

const digitsCache = new Map<string, number>();

/** Normalises and checks an ISO 4217 code; throws MoneyError for anything Intl does not accept. */
function currencyCode(currency: string): string {
  const code = typeof currency === 'string' ? currency.trim().toUpperCase() : '';
  if (!/^[A-Z]{3}$/.test(code)) throw new MoneyError(`"${String(currency)}" is not a currency code; use three letters like USD.`);
  return code;
}

let known: Set<string> | undefined;
/** The ISO 4217 codes the runtime's Intl data has (about 160 in use today). */
function knownCurrencies(): Set<string> {
  known ??= new Set(Intl.supportedValuesOf('currency'));
  return known;
}

/**
 * Digits after the decimal point for a currency (USD 2, JPY 0, KWD 3), as Intl knows them. ECMA-402 takes
 * these from the ISO 4217 table for the currency alone, so they do not depend on the locale; the fixed
 * locale here just makes that explicit.
 */
export function minorUnitDigits(currency: string): number {
  const code = currencyCode(currency);
  let digits = digitsCache.get(code);
  if (digits === undefined) {
    // Intl formats any three letters (XYZ gets 2 decimals), so check the code against ISO 4217 first.
    if (!knownCurrencies().has(code)) throw new MoneyError(`"${code}" is not a currency this system knows.`);
    try {
      digits = new Intl.NumberFormat('en-US', { style: 'currency', currency: code }).resolvedOptions().maximumFractionDigits;
    } catch {
      throw new MoneyError(`"${code}" is not a currency this system knows.`);
    }
    if (digits === undefined || !Number.isInteger(digits) || digits < 0 || digits > 6)
      throw new MoneyError(`Cannot tell how many decimal places ${code} has.`);
    digitsCache.set(code, digits);
  }
  return digits;
}

/** Throws unless `cents` is a safe integer (any sign). `what` names the value in the message. */
export function assertCents(cents: number, what = 'Amount'): void {
  if (typeof cents !== 'number' || !Number.isSafeInteger(cents))
    throw new MoneyError(`${what} must be a whole number of minor units (cents), got ${String(cents)}.`);
}

/** The symbols a typed amount may carry for this currency: "$" for USD, "€" for EUR, "USD", "US$"... */
function acceptedSymbols(code: string): string[] {
  const symbols = new Set<string>([code]);
  for (const currencyDisplay of ['symbol', 'narrowSymbol'] as const) {
    const parts = new Intl.NumberFormat('en-US', { style: 'currency', currency: code, currencyDisplay }).formatToParts(1);
    const symbol = parts.find((p) => p.type === 'currency')?.value;
    if (symbol) symbols.add(symbol.toUpperCase());
  }
  return [...symbols];
}

/**
 * A typed amount to minor units: "25", "25.00", "$25", "1,234.50", "  30.5 " (USD) → 2500, 2500, 2500,
 * 123450, 3050. Commas group thousands only (groups of three); the point is the decimal separator. A
 * currency symbol or code may stand before or after the number, but only the given currency's.
 * Throws MoneyError for anything else, for negative amounts, and for more decimals than the currency has.
 */
export function parseMoney(input: string, currency: string): number {
  const code = currencyCode(currency);
  const digits = minorUnitDigits(code);
  if (typeof input !== 'string') throw new MoneyError(TYPE_AN_AMOUNT);
  let text = input.replace(/\s+/g, ' ').trim();
  if (text === '') throw new MoneyError(TYPE_AN_AMOUNT);
  if (/^[-−]/.test(text)) throw new MoneyError('Amounts cannot be negative.');

  // Strip one currency symbol or code, before or after the number; longest first so "US$" beats "$".
  const upper = text.toUpperCase();
  const symbols = acceptedSymbols(code).sort((a, b) => b.length - a.length);
  const prefix = symbols.find((s) => upper.startsWith(s));
  if (prefix) text = text.slice(prefix.length).trim();
  else {
    const suffix = symbols.find((s) => upper.endsWith(s));
    if (suffix) text = text.slice(0, text.length - suffix.length).trim();
  }
  if (text.startsWith('-') || text.startsWith('−')) throw new MoneyError('Amounts cannot be negative.');

  const match = /^(?:(\d{1,3}(?:,\d{3})+|\d+)(?:\.(\d*))?|\.(\d+))$/.exec(text);
  if (!match) throw new MoneyError(TYPE_AN_AMOUNT);
  const whole = (match[1] ?? '0').replace(/,/g, '');
  const hasPoint = match[2] !== undefined || match[3] !== undefined;
  const fraction = match[2] ?? match[3] ?? '';
  if (digits === 0 && hasPoint) throw new MoneyError(`${code} amounts are whole numbers, with no decimal point.`);
  if (fraction.length > digits)
    throw new MoneyError(`${code} amounts have at most ${digits} decimal place${digits === 1 ? '' : 's'}.`);

  const minor = BigInt(whole + fraction.padEnd(digits, '0'));
  if (minor > BigInt(Number.MAX_SAFE_INTEGER)) throw new MoneyError('That amount is too large.');
  return Number(minor);
}

/** Minor units as an exact decimal string for this many digits: (123450, 2) → "1234.50", (-5, 2) → "-0.05". */
export function centsToDecimalString(cents: number, digits: number): string {
  assertCents(cents);
  const negative = cents < 0;
  const abs = String(Math.abs(cents));
  if (digits === 0) return (negative ? '-' : '') + abs;
  const padded = abs.padStart(digits + 1, '0');
  return `${negative ? '-' : ''}${padded.slice(0, -digits)}.${padded.slice(-digits)}`;
}

/**
 * Minor units for display: formatMoney(123450, 'USD') → "$1,234.50"; formatMoney(3000, 'JPY') → "¥3,000".
 * Intl receives a decimal string, which it formats exactly (no float rounding, even past 2^53 / 100).
 */
export function formatMoney(cents: number, currency: string, locale = 'en-US', display: CurrencyDisplay = 'symbol'): string {
  assertCents(cents);
  const code = currencyCode(currency);
  const digits = minorUnitDigits(code);
  const formatter = new Intl.NumberFormat(locale, {
    style: 'currency',
    currency: code,
    currencyDisplay: display,
    minimumFractionDigits: digits,
    maximumFractionDigits: digits,
  });
  return formatter.format(centsToDecimalString(cents, digits) as Intl.StringNumericLiteral);
}

/** a / b for BigInt with ties rounded away from zero ("half-up" on the size of the amount). */
function divideHalfUp(a: bigint, b: bigint): bigint {
  if (b === 0n) throw new MoneyError('Cannot divide by zero.');
  const negative = a < 0n !== b < 0n;
  const absA = a < 0n ? -a : a;
  const absB = b < 0n ? -b : b;
  const q = (absA * 2n + absB) / (absB * 2n);
  return negative ? -q : q;
}

function toSafeNumber(value: bigint): number {
  if (value > BigInt(Number.MAX_SAFE_INTEGER) || value < BigInt(Number.MIN_SAFE_INTEGER))
    throw new MoneyError('That amount is too large.');
  return Number(value);
}

/**
 * `basisPoints` hundredths of a percent of `cents` (10000 = 100%, 250 = 2.5%), rounded half-up: an
 * exact half cent goes to the larger amount (away from zero for negatives, so refunds mirror charges).
 * percentOfCents(1001, 5000) = 501; percentOfCents(999, 250) = 25 (24.975 → 25).
 */
export function percentOfCents(cents: number, basisPoints: number): number {
  assertCents(cents);
  if (typeof basisPoints !== 'number' || !Number.isSafeInteger(basisPoints))
    throw new MoneyError(`A percentage must be a whole number of basis points (1% = 100), got ${String(basisPoints)}.`);
  return toSafeNumber(divideHalfUp(BigInt(cents) * BigInt(basisPoints), 10000n));
}

/**
 * Half an amount, rounded half-up: an odd number of cents gives the guild the extra cent
 * (2501 → 1251, i.e. $25.01 → $12.51). Same rule as percentOfCents(cents, 5000).
 */
export function halfOfCents(cents: number): number {
  return percentOfCents(cents, 5000);
}

/** Sum of amounts, checked to stay a safe integer. */
export function sumCents(amounts: readonly number[]): number {
  let total = 0n;
  for (const a of amounts) {
    assertCents(a);
    total += BigInt(a);
  }
  return toSafeNumber(total);
}
