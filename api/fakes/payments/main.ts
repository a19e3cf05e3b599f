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
import { portFromEnv, runFake } from '../run-fake';
import { DEFAULT_PORT, startPaymentsFake } from './payments-fake';

function optionalEnv(name: string): string | null {
  const raw = process.env[name];
  return raw === undefined || raw.trim() === '' ? null : raw.trim();
}

async function main() {
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
  return fake;
}

runFake('payments fake', main);
