/** Choices for a new guild's settings, from the browser's own lists (Intl), so nothing is hand-kept. */

export type Option = { value: string; label: string };

const MONTHS = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];

export const MONTH_OPTIONS: Option[] = MONTHS.map((label, i) => ({ value: String(i + 1), label }));

/** Every IANA time zone the browser knows, "America/Chicago" shown as "America / Chicago". */
export function timeZoneOptions(zones: readonly string[] = Intl.supportedValuesOf('timeZone')): Option[] {
  return [...zones].sort().map((z) => ({ value: z, label: z.replace(/_/g, ' ').replace(/\//g, ' / ') }));
}

/** The common currencies of quilt guilds first, then every other ISO 4217 code with its name. */
export function currencyOptions(codes: readonly string[] = Intl.supportedValuesOf('currency'), locale = 'en'): Option[] {
  const names = new Intl.DisplayNames([locale], { type: 'currency' });
  const first = ['USD', 'CAD', 'GBP', 'EUR', 'AUD', 'NZD'];
  const label = (c: string) => `${names.of(c) ?? c} (${c})`;
  const rest = codes.filter((c) => !first.includes(c)).sort();
  return [...first.filter((c) => codes.includes(c)), ...rest].map((c) => ({ value: c, label: label(c) }));
}

/** The browser's own time zone, if it names one we can offer. */
export function guessTimeZone(zones: readonly string[] = Intl.supportedValuesOf('timeZone')): string {
  const own = Intl.DateTimeFormat().resolvedOptions().timeZone;
  return zones.includes(own) ? own : 'America/Chicago';
}
