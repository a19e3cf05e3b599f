import { isUnsubscribeToken, unsubscribeToken } from './unsubscribe-token';

describe('unsubscribe tokens', () => {
  const secret = 'a-secret-of-at-least-thirty-two-characters';
  it('accept the token made for the account, and only that one', () => {
    const t = unsubscribeToken(secret, 42);
    expect(t).toMatch(/^[A-Za-z0-9_-]{32}$/);
    expect(isUnsubscribeToken(secret, 42, t)).toBe(true);
    expect(isUnsubscribeToken(secret, 43, t)).toBe(false);
    expect(isUnsubscribeToken('another-secret-of-thirty-two-characters!', 42, t)).toBe(false);
  });
  it('refuse anything that is not a token, without throwing', () => {
    const t = unsubscribeToken(secret, 42);
    expect(isUnsubscribeToken(secret, 42, `${t.slice(0, -1)}x`)).toBe(false);
    expect(isUnsubscribeToken(secret, 42, t.slice(0, 10))).toBe(false);
    expect(isUnsubscribeToken(secret, '42', t)).toBe(false);
    expect(isUnsubscribeToken(secret, 42, null)).toBe(false);
  });
});
