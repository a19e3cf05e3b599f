/**
 * Runs the local mail fake on its own.
 *
 *   SMTP_FAKE_PORT       SMTP port (default 2525)
 *   SMTP_FAKE_HTTP_PORT  inbox HTTP API port (default 2580)
 *   SMTP_FAKE_DIR        where messages are kept (default .data/mail, relative to the working folder)
 */
import * as path from 'node:path';
import { portFromEnv, runFake } from '../run-fake';
import { startSmtpFake } from './smtp-fake';

async function main() {
  const dataDir = path.resolve(process.cwd(), process.env.SMTP_FAKE_DIR || path.join('.data', 'mail'));
  const fake = await startSmtpFake({
    smtpPort: portFromEnv('SMTP_FAKE_PORT', 2525),
    httpPort: portFromEnv('SMTP_FAKE_HTTP_PORT', 2580),
    dataDir,
  });
  console.log(
    `smtp fake: SMTP on 127.0.0.1:${fake.smtpPort}, inbox API on http://127.0.0.1:${fake.httpPort}, storing in ${dataDir}`,
  );
  return fake;
}

runFake('smtp fake', main);
