/** After the n-th failed attempt, wait 30 s · 2^(n-1), at most an hour; give up after 8 tries. */
export const MAX_ATTEMPTS = 8;

export function retryDelayMs(attempt: number): number {
  const base = 30_000 * 2 ** Math.max(0, attempt - 1);
  return Math.min(base, 60 * 60 * 1000);
}
