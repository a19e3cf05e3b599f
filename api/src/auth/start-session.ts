import type { Request } from 'express';
import { SESSION_LIMITS } from './session-limits';
import type { SessionUser } from './session-user';

/** Stamps a freshly signed-in session with its limits (idle + absolute, or remembered). */
export function stampSession(req: Request, remember: boolean): void {
  const now = Date.now();
  req.session.signedInAt = now;
  req.session.lastSeenAt = now;
  req.session.remember = remember;
  req.session.cookie.maxAge = remember ? SESSION_LIMITS.rememberMs : SESSION_LIMITS.idleMs;
}

/** Signs a user in under a new session id (passport regenerates the session on logIn). */
export async function startSession(req: Request, user: SessionUser, remember = false): Promise<void> {
  await new Promise<void>((resolve, reject) => req.logIn(user, (err) => (err ? reject(err) : resolve())));
  stampSession(req, remember);
}
