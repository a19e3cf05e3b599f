/**
 * CSRF defence by origin and fetch metadata: a state-changing request must say it comes from our
 * own pages. Browsers send `Sec-Fetch-Site` (same-origin for our pages) and `Origin` on POST/PUT/
 * PATCH/DELETE; a request with neither, or from elsewhere, is refused. Pure so it can be unit-tested.
 */
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

export type OriginVerdict = { ok: true } | { ok: false; reason: string };

export function checkRequestOrigin(
  method: string,
  headers: { origin?: string; 'sec-fetch-site'?: string },
  allowedOrigins: readonly string[],
): OriginVerdict {
  if (SAFE_METHODS.has(method.toUpperCase())) return { ok: true };
  const site = headers['sec-fetch-site'];
  if (site !== undefined) {
    if (site === 'same-origin' || site === 'none') return { ok: true };
    return { ok: false, reason: `request came from a ${site} page` };
  }
  const origin = headers.origin;
  if (origin === undefined) return { ok: false, reason: 'request carried no Origin header' };
  if (allowedOrigins.includes(origin)) return { ok: true };
  return { ok: false, reason: `origin ${origin} is not ours` };
}
