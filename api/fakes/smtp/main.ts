/**
 * Runs the local mail fake on its own.
 *
 *   SMTP_FAKE_PORT       SMTP port (default 2525)
 *   SMTP_FAKE_HTTP_PORT  inbox HTTP API port (default 2580)
 *   SMTP_FAKE_DIR        where messages are kept (default .data/mail, relative to the working folder)
 */
import * as path from 'node:path';
import { startSmtpFake } from './smtp-fake';

function portFromEnv(name: string, fallback: number): number {
  const raw = process.env[name];
  if (raw === undefined || raw.trim() === '') return fallback;
  const port = Number(raw);
  if (!Number.isInteger(port) || port < 0 || port > 65535) {
    throw new Error(`${name} must be a port number from 0 to 65535, got "${raw}"`);
  }
  return port;
}

async function main(): Promise<void> {
  const dataDir = path.resolve(process.cwd(), process.env.SMTP_FAKE_DIR || path.join('.data', 'mail'));
  const fake = await startSmtpFake({
    smtpPort: portFromEnv('SMTP_FAKE_PORT', 2525),
    httpPort: portFromEnv('SMTP_FAKE_HTTP_PORT', 2580),
    dataDir,
  });
  console.log(
    `smtp fake: SMTP on 127.0.0.1:${fake.smtpPort}, inbox API on http://127.0.0.1:${fake.httpPort}, storing in ${dataDir}`,
  );

  let stopping = false;
  const stop = (signal: NodeJS.Signals): void => {
    if (stopping) return;
    stopping = true;
    fake.close().then(
      () => {
        console.log(`smtp fake: stopped (${signal})`);
        process.exit(0);
      },
      (err: unknown) => {
        console.error('smtp fake: error while stopping', err);
        process.exit(1);
      },
    );
  };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}

main().catch((err: unknown) => {
  console.error('smtp fake: could not start:', err instanceof Error ? err.message : err);
  process.exit(1);
});
