import { join } from 'node:path';
import { registerAs } from '@nestjs/config';

export const appConfig = registerAs('app', () => ({
  env: process.env.NODE_ENV ?? 'development',
  port: Number(process.env.PORT ?? 3000),
  origin: process.env.APP_ORIGIN as string,
  extraOrigins: (process.env.EXTRA_ORIGINS ?? '').split(',').map((s) => s.trim()).filter(Boolean),
  sessionSecret: process.env.SESSION_SECRET as string,
  webDistDir: process.env.WEB_DIST_DIR ?? '',
  trustProxy: process.env.TRUST_PROXY === 'true',
  uploadsDir: process.env.UPLOADS_DIR || join(process.cwd(), '.data', 'uploads'),
}));

export const authConfig = registerAs('auth', () => ({
  accountFailureLimit: Number(process.env.AUTH_ACCOUNT_FAILURE_LIMIT ?? 10),
  addressFailureLimit: Number(process.env.AUTH_ADDRESS_FAILURE_LIMIT ?? 100),
  failureWindowMinutes: Number(process.env.AUTH_FAILURE_WINDOW_MINUTES ?? 15),
}));

export const mailConfig = registerAs('mail', () => ({
  host: process.env.SMTP_HOST ?? '127.0.0.1',
  port: Number(process.env.SMTP_PORT),
  secure: process.env.SMTP_SECURE === 'true',
  user: process.env.SMTP_USER ?? '',
  password: process.env.SMTP_PASSWORD ?? '',
  from: process.env.MAIL_FROM ?? 'Selvage <no-reply@selvage.invalid>',
  fakeInboxUrl: process.env.SMTP_FAKE_INBOX_URL ?? '',
  pollMs: Number(process.env.OUTBOX_POLL_MS ?? 1000),
  workerEnabled: process.env.OUTBOX_ENABLED !== 'false',
}));

export const beesConfig = registerAs('bees', () => ({
  tickMs: Number(process.env.BEES_TICK_MS ?? 60_000),
  schedulerEnabled: process.env.BEES_SCHEDULER_ENABLED !== 'false',
}));
export type BeesConfig = ReturnType<typeof beesConfig>;

/**
 * The card-payment service. apiUrl points the official SDK at another host (the local fake, e.g.
 * http://127.0.0.1:12111); empty means the real service. No secret key: online payment is off.
 */
export const paymentsConfig = registerAs('payments', () => ({
  secretKey: process.env.PAYMENTS_SECRET_KEY ?? '',
  webhookSecret: process.env.PAYMENTS_WEBHOOK_SECRET ?? '',
  apiUrl: process.env.PAYMENTS_API_URL ?? '',
}));
export type PaymentsConfig = ReturnType<typeof paymentsConfig>;

export type AppConfig = ReturnType<typeof appConfig>;
export type AuthConfig = ReturnType<typeof authConfig>;
export type MailConfig = ReturnType<typeof mailConfig>;
