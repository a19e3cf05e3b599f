/**
 * One entry point for running Selvage locally: `npm start`, `npm test`, `npm run dev`, `npm run bench`.
 * It starts what each needs (MariaDB, the SMTP fake, the api), stops all of it on Ctrl-C or when
 * done, and exits non-zero when a step fails.
 */
import { ChildProcess, spawn } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { connect } from 'node:net';
import { BackupError, restoreBackup, takeBackup } from '../src/database/backup';
import { ensureAptPackage, startMariaDb, type RunningMariaDb } from './mariadb';

const ROOT = resolve(__dirname, '..', '..');
const DATA = join(ROOT, '.data');
const API = join(ROOT, 'api');
const WEB = join(ROOT, 'web');

interface Ports {
  db: number;
  smtp: number;
  smtpHttp: number;
  api: number;
  /** The local payments fake (card checkout, refunds, signed webhooks). */
  payments: number;
}

const children = new Set<ChildProcess>();
const cleanups: (() => Promise<void>)[] = [];

function log(message: string) {
  console.log(`[stack] ${message}`);
}

function run(cmd: string, args: string[], env: NodeJS.ProcessEnv, cwd = ROOT): Promise<number> {
  return new Promise((resolveRun) => {
    const child = spawn(cmd, args, { cwd, env, stdio: 'inherit' });
    children.add(child);
    child.on('exit', (code, signal) => {
      children.delete(child);
      resolveRun(code ?? (signal ? 1 : 0));
    });
  });
}

async function mustRun(label: string, cmd: string, args: string[], env: NodeJS.ProcessEnv, cwd = ROOT) {
  const code = await run(cmd, args, env, cwd);
  if (code !== 0) throw new Error(`${label} failed (exit ${code})`);
}

function startBackground(label: string, cmd: string, args: string[], env: NodeJS.ProcessEnv): ChildProcess {
  const child = spawn(cmd, args, { cwd: ROOT, env, stdio: ['ignore', 'inherit', 'inherit'] });
  children.add(child);
  child.on('exit', (code, signal) => {
    children.delete(child);
    if (!shuttingDown) log(`${label} stopped (${signal ?? code})`);
  });
  cleanups.push(
    () =>
      new Promise<void>((r) => {
        if (child.exitCode !== null || child.signalCode !== null) return r();
        child.once('exit', () => r());
        child.kill('SIGTERM');
        setTimeout(() => child.kill('SIGKILL'), 10_000).unref();
      }),
  );
  return child;
}

async function waitForHttp(url: string, timeoutMs = 60_000): Promise<void> {
  const started = Date.now();
  for (;;) {
    try {
      const res = await fetch(url, { signal: AbortSignal.timeout(2000) });
      if (res.ok) return;
    } catch {
      /* not up yet */
    }
    if (Date.now() - started > timeoutMs) throw new Error(`${url} did not answer within ${timeoutMs / 1000} s`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

let shuttingDown = false;
async function shutdown(code: number): Promise<never> {
  if (!shuttingDown) {
    shuttingDown = true;
    for (const cleanup of cleanups.reverse()) await cleanup().catch(() => undefined);
  }
  process.exit(code);
}

function persistentSecret(file: string): string {
  if (existsSync(file)) return readFileSync(file, 'utf8').trim();
  const secret = randomBytes(32).toString('hex');
  writeFileSync(file, secret, { mode: 0o600 });
  return secret;
}

function apiEnv(ports: Ports, dbName: string, dbPassword: string, extra: NodeJS.ProcessEnv = {}): NodeJS.ProcessEnv {
  return {
    ...process.env,
    NODE_ENV: process.env.NODE_ENV ?? 'production',
    PORT: String(ports.api),
    APP_ORIGIN: process.env.APP_ORIGIN ?? `http://127.0.0.1:${ports.api}`,
    DB_HOST: '127.0.0.1',
    DB_PORT: String(ports.db),
    DB_NAME: dbName,
    DB_USER: 'selvage',
    DB_PASSWORD: dbPassword,
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: String(ports.smtp),
    SMTP_FAKE_INBOX_URL: `http://127.0.0.1:${ports.smtpHttp}`,
    UPLOADS_DIR: process.env.UPLOADS_DIR ?? join(dbName === 'selvage' ? DATA : join(DATA, 'test'), 'uploads'),
    MIKRO_ORM_CLI_USE_TS_NODE: '0',
    ...extra,
  };
}

async function startDatabase(dir: string, port: number, name: string, password: string, fresh: boolean) {
  const db: RunningMariaDb = await startMariaDb({ dataDir: dir, port, database: name, user: 'selvage', password, fresh });
  cleanups.push(async () => {
    log('stopping MariaDB');
    await db.stop();
  });
  log(`MariaDB is up on 127.0.0.1:${port} (database ${name})`);
  return db;
}

function startSmtpFake(ports: Ports, dir: string) {
  startBackground('SMTP fake', process.execPath, [join(API, 'dist', 'fakes', 'smtp', 'main.js')], {
    ...process.env,
    SMTP_FAKE_PORT: String(ports.smtp),
    SMTP_FAKE_HTTP_PORT: String(ports.smtpHttp),
    SMTP_FAKE_DIR: dir,
  });
  return waitForHttp(`http://127.0.0.1:${ports.smtpHttp}/health`);
}

/**
 * The payments fake, sending its signed events to this stack's api. Returns the variables the api
 * (and jest) need to use it. With PAYMENTS_SECRET_KEY already set (a real account), `start` and `dev`
 * leave the fake out and pass the caller's PAYMENTS_* through instead.
 */
async function startPaymentsFake(ports: Ports, dir: string, webhookSecret: string): Promise<NodeJS.ProcessEnv> {
  startBackground('payments fake', process.execPath, [join(API, 'dist', 'fakes', 'payments', 'main.js')], {
    ...process.env,
    PAYMENTS_FAKE_PORT: String(ports.payments),
    PAYMENTS_FAKE_DIR: dir,
    PAYMENTS_FAKE_WEBHOOK_URL: `http://127.0.0.1:${ports.api}/api/payments/webhook`,
    PAYMENTS_FAKE_WEBHOOK_SECRET: webhookSecret,
  });
  await waitForHttp(`http://127.0.0.1:${ports.payments}/_fake/health`);
  log(`payments fake on http://127.0.0.1:${ports.payments} (test cards: 4242 4242 4242 4242 pays, 4000 0000 0000 0002 is declined)`);
  return {
    PAYMENTS_SECRET_KEY: 'sk_test_selvage_local',
    PAYMENTS_WEBHOOK_SECRET: webhookSecret,
    PAYMENTS_API_URL: `http://127.0.0.1:${ports.payments}`,
  };
}

/** For start and dev: the caller's own payment-service settings, or the fake's. */
async function paymentsFor(ports: Ports): Promise<NodeJS.ProcessEnv> {
  if (process.env.PAYMENTS_SECRET_KEY) {
    log(`payments: using PAYMENTS_SECRET_KEY from the environment${process.env.PAYMENTS_API_URL ? ` at ${process.env.PAYMENTS_API_URL}` : ' (the real service)'}`);
    return {};
  }
  return startPaymentsFake(ports, join(DATA, 'payments'), `whsec_${persistentSecret(join(DATA, 'payments-webhook-secret'))}`);
}

async function migrateAndSeed(env: NodeJS.ProcessEnv, seed: boolean) {
  const cli = join(API, 'dist', 'src', 'database', 'db-cli.js');
  await mustRun('migrations', process.execPath, [cli, 'migrate'], env);
  if (seed) await mustRun('demo seed', process.execPath, [cli, 'seed-if-empty'], env);
}

function startApi(env: NodeJS.ProcessEnv) {
  startBackground('api', process.execPath, [join(API, 'dist', 'src', 'main.js')], env);
  return waitForHttp(`http://127.0.0.1:${env.PORT}/api/health`);
}

/** `npm start`: the app with its demo data, reusing .data/ between runs. */
async function start() {
  mkdirSync(DATA, { recursive: true });
  const ports: Ports = {
    db: Number(process.env.DB_PORT ?? 3407),
    smtp: Number(process.env.SMTP_FAKE_PORT ?? 2525),
    smtpHttp: Number(process.env.SMTP_FAKE_HTTP_PORT ?? 2580),
    api: Number(process.env.PORT ?? 3000),
    payments: Number(process.env.PAYMENTS_FAKE_PORT ?? 12111),
  };
  const dbPassword = persistentSecret(join(DATA, 'db-password'));
  await startDatabase(join(DATA, 'db'), ports.db, 'selvage', dbPassword, false);
  await startSmtpFake(ports, join(DATA, 'mail'));
  const payments = await paymentsFor(ports);
  const env = apiEnv(ports, 'selvage', dbPassword, {
    ...payments,
    SESSION_SECRET: process.env.SESSION_SECRET ?? persistentSecret(join(DATA, 'session-secret')),
    WEB_DIST_DIR: join(WEB, 'dist'),
    LOG_PRETTY: process.env.LOG_PRETTY ?? 'true',
  });
  await migrateAndSeed(env, true);
  await startApi(env);
  log(`Selvage is ready: ${env.APP_ORIGIN}  (demo accounts in README.md; Ctrl-C stops everything)`);
  await new Promise(() => undefined);
}

/** `npm run dev`: MariaDB and the fakes as for start, then the api in watch mode and Vite. */
async function dev() {
  mkdirSync(DATA, { recursive: true });
  const ports: Ports = { db: 3407, smtp: 2525, smtpHttp: 2580, api: Number(process.env.PORT ?? 3000), payments: 12111 };
  const dbPassword = persistentSecret(join(DATA, 'db-password'));
  await mustRun('api build', 'npm', ['run', 'build', '-w', 'api'], process.env);
  await startDatabase(join(DATA, 'db'), ports.db, 'selvage', dbPassword, false);
  await startSmtpFake(ports, join(DATA, 'mail'));
  const payments = await paymentsFor(ports);
  const env = apiEnv(ports, 'selvage', dbPassword, {
    ...payments,
    NODE_ENV: 'development',
    SESSION_SECRET: persistentSecret(join(DATA, 'session-secret')),
    EXTRA_ORIGINS: 'http://127.0.0.1:5173,http://localhost:5173',
  });
  await migrateAndSeed(env, true);
  // esbuild-based runners drop decorator metadata, which Nest's injection needs: compile with tsc
  // in watch mode and let node restart on each new build.
  startBackground('tsc (watch)', 'npx', ['tsc', '-p', join(API, 'tsconfig.build.json'), '--watch', '--preserveWatchOutput'], process.env);
  startBackground('api (watch)', process.execPath, ['--watch', join(API, 'dist', 'src', 'main.js')], env);
  startBackground('vite', 'npm', ['run', 'dev', '-w', 'web', '--', '--host', '127.0.0.1'], { ...process.env, API_PORT: String(ports.api) });
  log('api on :3000, web on http://127.0.0.1:5173 (Ctrl-C stops everything)');
  await new Promise(() => undefined);
}

/** `npm test`: its own MariaDB and ports, every test tier, then everything stopped. */
async function test() {
  ensureAptPackage('/usr/bin/chromium', 'chromium');
  ensureAptPackage('/usr/bin/pdftoppm', 'poppler-utils');
  const dir = join(DATA, 'test');
  rmSync(dir, { recursive: true, force: true });
  mkdirSync(dir, { recursive: true });
  const ports: Ports = { db: 3417, smtp: 2535, smtpHttp: 2590, api: 3100, payments: 12121 };
  const dbPassword = randomBytes(12).toString('hex');
  const db = await startDatabase(join(dir, 'db'), ports.db, 'selvage_test', dbPassword, true);
  db.sql('CREATE DATABASE IF NOT EXISTS selvage_e2e CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;');

  log('type-checking and building');
  await mustRun('api build', 'npm', ['run', 'build', '-w', 'api'], process.env);
  await mustRun('api type-check', 'npm', ['run', 'typecheck', '-w', 'api'], process.env);
  await mustRun('web build', 'npm', ['run', 'build', '-w', 'web'], process.env);
  await startSmtpFake(ports, join(dir, 'mail'));
  // Its events go to the browser tests' api; the api e2e tests start their own fake in-process.
  const payments = await startPaymentsFake(ports, join(dir, 'payments'), `whsec_${randomBytes(16).toString('hex')}`);

  const jestEnv = apiEnv(ports, 'selvage_test', dbPassword, {
    ...payments,
    NODE_ENV: 'test',
    LOG_LEVEL: 'warn',
    SESSION_SECRET: randomBytes(32).toString('hex'),
    OUTBOX_POLL_MS: '100',
    // The tests call the bees' tick with a chosen clock; a background tick holding the named lock at
    // the same moment would make theirs a no-op.
    BEES_SCHEDULER_ENABLED: 'false',
    // jimp's CommonJS build imports an ES module on demand, which jest allows only with this flag.
    NODE_OPTIONS: `${process.env.NODE_OPTIONS ?? ''} --experimental-vm-modules`.trim(),
  });
  await migrateAndSeed(jestEnv, false);
  const results: [string, number][] = [];
  log('api unit and e2e tests (jest)');
  results.push(['api (jest)', await run('npx', ['jest', '--runInBand'], jestEnv, API)]);
  log('web tests (vitest)');
  results.push(['web (vitest)', await run('npx', ['vitest', 'run'], process.env, WEB)]);

  log('browser tests (Playwright, Debian chromium) against a freshly seeded database');
  const e2eEnv = apiEnv(ports, 'selvage_e2e', dbPassword, {
    ...payments,
    NODE_ENV: 'test',
    LOG_LEVEL: 'warn',
    SESSION_SECRET: randomBytes(32).toString('hex'),
    WEB_DIST_DIR: join(WEB, 'dist'),
    OUTBOX_POLL_MS: '200',
    // The browser suite signs in many times from one address; the per-account limit still applies.
    AUTH_ADDRESS_FAILURE_LIMIT: '1000',
  });
  await migrateAndSeed(e2eEnv, true);
  await startApi(e2eEnv);
  const browserCode = await run('npx', ['playwright', 'test'], { ...process.env, E2E_BASE_URL: `http://127.0.0.1:${ports.api}` }, WEB);
  results.push(['browser (playwright)', browserCode]);
  if (browserCode !== 0) printPageSnapshots(join(WEB, 'test-results'));

  console.log('\nSummary:');
  for (const [name, code] of results) console.log(`  ${code === 0 ? 'passed' : 'FAILED'}  ${name}`);
  const failed = results.filter(([, code]) => code !== 0).length;
  console.log(`${results.length - failed} passed, ${failed} failed`);
  await shutdown(failed ? 1 : 0);
}

/**
 * A failed browser test leaves the page's accessibility snapshot beside its trace; printing it puts
 * what the page showed into the log of a machine whose files are gone once the run ends.
 */
function printPageSnapshots(resultsDir: string): void {
  if (!existsSync(resultsDir)) return;
  for (const file of readdirSync(resultsDir, { recursive: true, encoding: 'utf8' })) {
    if (!file.endsWith('error-context.md')) continue;
    console.log(`\n--- what the page showed: ${file} ---\n${readFileSync(join(resultsDir, file), 'utf8').slice(0, 12_000)}`);
  }
}

/**
 * `npm run bench`: its own MariaDB with the demo, the api on :3200, then autocannon on /api/health
 * vs the signed-in dashboard, a round fanned out to 5,000 makers, and the size check on 50
 * generated photographs.
 */
async function bench() {
  const dir = join(DATA, 'bench');
  rmSync(dir, { recursive: true, force: true });
  mkdirSync(dir, { recursive: true });
  const ports: Ports = { db: 3427, smtp: 2545, smtpHttp: 2600, api: 3200, payments: 12131 };
  const dbPassword = randomBytes(12).toString('hex');
  await mustRun('api build', 'npm', ['run', 'build', '-w', 'api'], process.env);
  await startDatabase(join(dir, 'db'), ports.db, 'selvage_bench', dbPassword, true);
  await startSmtpFake(ports, join(dir, 'mail'));
  const payments = await startPaymentsFake(ports, join(dir, 'payments'), `whsec_${randomBytes(16).toString('hex')}`);
  const env = apiEnv(ports, 'selvage_bench', dbPassword, {
    ...payments,
    SESSION_SECRET: randomBytes(32).toString('hex'),
    LOG_LEVEL: 'warn',
    UPLOADS_DIR: join(dir, 'uploads'),
  });
  await migrateAndSeed(env, true);
  await startApi(env);
  await mustRun('http bench', 'npx', ['tsx', join(API, 'scripts', 'bench.ts')], { ...env, BENCH_URL: `http://127.0.0.1:${ports.api}` });
  await mustRun('fan-out bench', process.execPath, [join(API, 'dist', 'scripts', 'bench-fanout.js')], env);
  await mustRun('12 MP photo load bench', process.execPath, [join(API, 'dist', 'scripts', 'bench-photos.js')], { ...env, BENCH_URL: `http://127.0.0.1:${ports.api}` });
  // The size check's accuracy and speed on photographs with known truth (a fixed seed).
  const photos = join(dir, 'photos');
  await mustRun('photo fixtures', process.execPath, [join(API, 'dist', 'scripts', 'generate-photo-fixtures.js'), photos], process.env);
  await mustRun('size-check accuracy', process.execPath, [join(API, 'dist', 'src', 'size-check', 'measure', 'accuracy-bench.js'), photos], process.env);
  await mustRun('dues bench', process.execPath, [join(API, 'dist', 'scripts', 'bench-dues.js')], { ...env, BENCH_URL: `http://127.0.0.1:${ports.api}` });
  await mustRun('ballot bench', process.execPath, [join(API, 'dist', 'scripts', 'bench-ballots.js')], { ...env, BENCH_URL: `http://127.0.0.1:${ports.api}` });
  await mustRun('roster import bench', process.execPath, [join(API, 'dist', 'scripts', 'bench-import.js')], { ...env, BENCH_URL: `http://127.0.0.1:${ports.api}` });
}


/** Is something listening on 127.0.0.1:port (the app's MariaDB, say)? */
function listening(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = connect({ host: '127.0.0.1', port });
    socket.once('connect', () => (socket.destroy(), resolve(true)));
    socket.once('error', () => resolve(false));
  });
}

/**
 * `npm run backup`: a consistent dump of the app's database (taken while it runs, if it does) and
 * the uploaded files, in backups/selvage-<UTC time>/ (BACKUP_DIR to put it elsewhere).
 */
async function backup() {
  const port = Number(process.env.DB_PORT ?? 3407);
  if (!existsSync(join(DATA, 'db-password'))) throw new Error('There is no Selvage data here to back up (run npm start first).');
  const password = persistentSecret(join(DATA, 'db-password'));
  if (!(await listening(port))) await startDatabase(join(DATA, 'db'), port, 'selvage', password, false);
  const outDir = process.env.BACKUP_DIR ?? join(ROOT, 'backups');
  const { folder, manifest } = await takeBackup({
    db: { host: '127.0.0.1', port, user: 'selvage', password, database: 'selvage' },
    uploadsDir: process.env.UPLOADS_DIR ?? join(DATA, 'uploads'),
    outDir,
  });
  log(`backup written: ${folder} (database ${(manifest.database.bytes / 1e6).toFixed(1)} MB, ${manifest.files.length} files)`);
}

/** `npm run restore FOLDER`: into an empty database, with Selvage stopped. */
async function restore() {
  const folder = process.argv[3] ? resolve(process.argv[3]) : '';
  if (!folder) throw new Error('usage: npm run restore -- FOLDER (a folder written by npm run backup)');
  const port = Number(process.env.DB_PORT ?? 3407);
  if (await listening(port)) throw new Error(`Something is using port ${port}: stop Selvage (Ctrl-C in its terminal) before restoring.`);
  mkdirSync(DATA, { recursive: true });
  const password = persistentSecret(join(DATA, 'db-password'));
  const db = await startDatabase(join(DATA, 'db'), port, 'selvage', password, false);
  try {
    const manifest = await restoreBackup({
      db: { host: '127.0.0.1', port, user: 'selvage', password, database: 'selvage' },
      uploadsDir: process.env.UPLOADS_DIR ?? join(DATA, 'uploads'),
      folder,
      countTables: async () => Number(db.sql("SELECT COUNT(*) FROM information_schema.tables WHERE table_schema = 'selvage'").trim()),
    });
    log(`restored the backup of ${manifest.createdAt} (${manifest.files.length} files). Start Selvage with npm start.`);
  } catch (e) {
    if (e instanceof BackupError) throw new Error(e.message);
    throw e;
  }
}

const commands: Record<string, () => Promise<void>> = { start, dev, test, bench, backup, restore };
const command = process.argv[2] ?? '';
if (!commands[command]) {
  console.error(`usage: stack.ts ${Object.keys(commands).join('|')}`);
  process.exit(2);
}
// Ctrl-C reaches us more than once (from the terminal and relayed by npm and tsx): the first
// starts an orderly shutdown, the rest are ignored so they cannot cut it short.
for (const signal of ['SIGINT', 'SIGTERM'] as const) {
  process.on(signal, () => {
    if (shuttingDown) return;
    log(`${signal}: stopping everything`);
    void shutdown(130);
  });
}
commands[command]()
  .then(() => shutdown(0))
  .catch((e: unknown) => {
    console.error(`[stack] ${e instanceof Error ? e.message : e}`);
    void shutdown(1);
  });
