import { createHmac, timingSafeEqual } from 'node:crypto';

/**
 * The token in a one-click unsubscribe link: an HMAC of the account and what she stops, keyed by
 * the server's secret, so the link works without signing in and cannot be made for someone else.
 */
export function unsubscribeToken(secret: string, userId: number): string {
  return createHmac('sha256', secret).update(`selvage:unsubscribe:reminders:${userId}`).digest('base64url').slice(0, 32);
}

export function isUnsubscribeToken(secret: string, userId: unknown, token: unknown): userId is number {
  if (typeof userId !== 'number' || !Number.isSafeInteger(userId) || userId <= 0) return false;
  if (typeof token !== 'string' || !/^[A-Za-z0-9_-]{32}$/.test(token)) return false;
  return timingSafeEqual(Buffer.from(token), Buffer.from(unsubscribeToken(secret, userId)));
}

/** Mail that can be turned off; receipts, invitations, resets and her own bee assignments always go. */
export const OPTIONAL_TEMPLATES = ['due-reminder', 'block-nudge', 'round-reminder', 'dues-renewal-soon', 'dues-lapsed'] as const;
