/**
 * Money helpers for the payments fake. Amounts are integers in the currency's smallest unit
 * (cents for USD), exactly as the card-payment API sends them; nothing here uses fractional numbers.
 */

/**
 * The processing fee kept on a successful card charge: 2.9 % of the amount plus 30 cents.
 *
 * That is the service's published standard rate for domestic cards, quoted from memory; the fake
 * only needs a plausible, stable number so fee and net can be shown and reconciled.
 *
 * Rounding: the percentage part is rounded half-up to the whole cent, using integers only
 * (per-mille arithmetic: amount × 29 / 1000, adding 500 before the integer division). So
 * 2500 → 72.5 → 73, plus 30 = 103; 1000 → 29 + 30 = 59; 50 → 1.45 → 1, plus 30 = 31.
 */
export const FEE_PER_MILLE = 29;
export const FEE_FIXED = 30;

export function processingFee(amount: number): number {
  if (!Number.isSafeInteger(amount) || amount < 0) throw new RangeError(`Amount must be a whole number of minor units, got ${amount}`);
  const scaled = amount * FEE_PER_MILLE + 500; // thousandths of a cent, plus half a cent
  const percentPart = (scaled - (scaled % 1000)) / 1000; // exact: the numerator is a multiple of 1000
  return percentPart + FEE_FIXED;
}

/** How many minor-unit digits a currency has (2 for USD, 0 for JPY); 2 when the code is unknown. */
export function currencyDigits(currency: string): number {
  try {
    return new Intl.NumberFormat('en', { style: 'currency', currency: currency.toUpperCase() }).resolvedOptions()
      .maximumFractionDigits ?? 2;
  } catch {
    return 2;
  }
}

/** The amount as an exact decimal string, e.g. 2500 usd → "25.00", -5 usd → "-0.05", 500 jpy → "500". */
export function decimalString(amount: number, currency: string): string {
  const digits = currencyDigits(currency);
  const sign = amount < 0 ? '-' : '';
  const abs = String(Math.abs(amount));
  if (digits === 0) return sign + abs;
  const padded = abs.padStart(digits + 1, '0');
  return `${sign}${padded.slice(0, -digits)}.${padded.slice(-digits)}`;
}

/** A human amount such as "$25.00" or "CA$1,234.50". Intl formats the exact decimal string. */
export function formatAmount(amount: number, currency: string): string {
  const text = decimalString(amount, currency);
  try {
    const format = new Intl.NumberFormat('en', { style: 'currency', currency: currency.toUpperCase() }) as Intl.NumberFormat & {
      format(value: string): string;
    };
    return format.format(text);
  } catch {
    return `${text} ${currency.toUpperCase()}`;
  }
}
