/** How long a session may live: 2 hours idle and 12 hours in all, or 30 days when remembered. */
export const SESSION_LIMITS = {
  idleMs: 2 * 60 * 60 * 1000,
  absoluteMs: 12 * 60 * 60 * 1000,
  rememberMs: 30 * 24 * 60 * 60 * 1000,
};

export function sessionExpired(
  meta: { signedInAt?: number; lastSeenAt?: number; remember?: boolean },
  now: number,
  limits = SESSION_LIMITS,
): boolean {
  if (meta.signedInAt === undefined) return true;
  if (meta.remember) return now - meta.signedInAt > limits.rememberMs;
  if (now - meta.signedInAt > limits.absoluteMs) return true;
  return now - (meta.lastSeenAt ?? meta.signedInAt) > limits.idleMs;
}
