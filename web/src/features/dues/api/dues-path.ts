import { env } from '@/config/env';

/** The api path of a guild's dues, e.g. /guilds/4/dues. */
export const duesPath = (guildId: string) => `/guilds/${encodeURIComponent(guildId)}/dues`;

/** The prefix of every dues query's key; invalidate it after anything that moves money. */
export const duesQueryKey = (guildId: string) => ['guilds', guildId, 'dues'] as const;

/** A link the browser follows itself (receipts, CSV and PDF downloads). */
export const duesHref = (guildId: string, rest: string) => `${env.apiBaseUrl}${duesPath(guildId)}${rest}`;

/** Query string from the filled-in filters, in the order given; empty values are left out. */
export function toQueryString(params: Record<string, string | number | null | undefined>): string {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(params)) {
    if (value !== null && value !== undefined && String(value) !== '') search.set(key, String(value));
  }
  const text = search.toString();
  return text ? `?${text}` : '';
}
