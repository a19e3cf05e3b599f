/** What a signed-in request carries as `req.user`: small, no secrets. */
export interface SessionUser {
  id: number;
  email: string;
  name: string;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SessionUser {}
  }
}

declare module 'express-session' {
  interface SessionData {
    /** Sign-in time and last activity, for the idle and absolute limits. */
    signedInAt?: number;
    lastSeenAt?: number;
    remember?: boolean;
  }
}
