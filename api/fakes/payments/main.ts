/**
 * Runs the local payments fake on its own.
 *
 *   PAYMENTS_FAKE_PORT             HTTP port (default 12111)
 *   PAYMENTS_FAKE_DIR              where state is kept (default .data/payments, relative to the working folder)
 *   PAYMENTS_FAKE_WEBHOOK_URL      where events are POSTed (optional; without it events are only kept)
 *   PAYMENTS_FAKE_WEBHOOK_SECRET   signing secret for those events (required with the URL), e.g. whsec_local_dev
 *   PAYMENTS_FAKE_PUBLIC_URL       base URL browsers reach the fake at (optional; default http://127.0.0.1:<port>)
 */
import * as path from 'node:path';
import { DEFAULT_PORT, startPaymentsFake } from './payments-fake';

function portFromEnv(name: string, fallback: number): number {
  const raw = process.env[name];
  if (raw === undefined || raw.trim() === '') return fallback;
  const port = Number(raw);
  if (!Number.isInteger(port) || port < 0 || port > 65535) {
    throw new Error(`${name} must be a port number from 0 to 65535, got "${raw}"`);
  }
  return port;
}

function optionalEnv(name: string): string | null {
  const raw = process.env[name];
  return raw === undefined || raw.trim() === '' ? null : raw.trim();
}

async function main(): Promise<void> {
  const dataDir = path.resolve(process.cwd(), process.env.PAYMENTS_FAKE_DIR || path.join('.data', 'payments'));
  const webhookUrl = optionalEnv('PAYMENTS_FAKE_WEBHOOK_URL');
  const webhookSecret = optionalEnv('PAYMENTS_FAKE_WEBHOOK_SECRET');
  if (webhookUrl && !webhookSecret) {
    throw new Error('PAYMENTS_FAKE_WEBHOOK_SECRET is required when PAYMENTS_FAKE_WEBHOOK_URL is set');
  }
  const fake = await startPaymentsFake({
    port: portFromEnv('PAYMENTS_FAKE_PORT', DEFAULT_PORT),
    dataDir,
    webhookUrl,
    webhookSecret,
    publicUrl: optionalEnv('PAYMENTS_FAKE_PUBLIC_URL'),
  });
  console.log(
    `payments fake: API on ${fake.url}, ` +
      (webhookUrl ? `events to ${webhookUrl}` : 'no webhook endpoint (events only kept)') +
      `, storing in ${dataDir}`,
  );

  let stopping = false;
  const stop = (signal: NodeJS.Signals): void => {
    if (stopping) return;
    stopping = true;
    fake.close().then(
      () => {
        console.log(`payments fake: stopped (${signal})`);
        process.exit(0);
      },
      (err: unknown) => {
        console.error('payments fake: error while stopping', err);
        process.exit(1);
      },
    );
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

main().catch((err: unknown) => {
  console.error('payments fake: could not start:', err instanceof Error ? err.message : err);
  process.exit(1);
});
