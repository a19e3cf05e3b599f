import { SESSION_LIMITS, sessionExpired } from './session-limits';

const H = 60 * 60 * 1000;

describe('sessionExpired', () => {
  const t0 = Date.UTC(2026, 11, 1, 8);
  it('ends after 2 hours idle', () => {
    expect(sessionExpired({ signedInAt: t0, lastSeenAt: t0 + H }, t0 + 3 * H - 1)).toBe(false);
    expect(sessionExpired({ signedInAt: t0, lastSeenAt: t0 + H }, t0 + 3 * H + 1)).toBe(true);
  });
  it('ends after 12 hours in all even when active', () => {
    expect(sessionExpired({ signedInAt: t0, lastSeenAt: t0 + 12 * H }, t0 + 12 * H + 1)).toBe(true);
  });
  it('lasts 30 days when remembered, idle or not', () => {
    expect(sessionExpired({ signedInAt: t0, lastSeenAt: t0, remember: true }, t0 + 29 * 24 * H)).toBe(false);
    expect(sessionExpired({ signedInAt: t0, remember: true }, t0 + SESSION_LIMITS.rememberMs + 1)).toBe(true);
  });
  it('treats a session without a sign-in time as expired', () => {
    expect(sessionExpired({}, t0)).toBe(true);
  });
});
