/**
 * Runs Debian's MariaDB server as a child of our own scripts: a private data directory under
 * `.data/`, loopback only, its own port and socket, never the system's /etc/mysql settings.
 */
import { ChildProcess, execFileSync, spawn } from 'node:child_process';
import { existsSync, mkdirSync, openSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export interface MariaDbOptions {
  dataDir: string;
  port: number;
  database: string;
  user: string;
  password: string;
  fresh?: boolean;
}

export interface RunningMariaDb {
  socket: string;
  stop(): Promise<void>;
  sql(statement: string): string;
}

const SERVER = '/usr/sbin/mariadbd';

export function ensureAptPackage(binary: string, pkg: string): void {
  if (existsSync(binary)) return;
  console.log(`[stack] ${binary} is missing: installing ${pkg} from Debian's packages…`);
  execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit' });
  execFileSync('apt-get', ['install', '-y', '-qq', pkg], {
    stdio: 'inherit',
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  });
}

function sleep(ms: number) {
  return new Promise((r) => setTimeout(r, ms));
}

function isAlive(child: ChildProcess): boolean {
  if (child.exitCode !== null || child.signalCode !== null) return false;
  try {
    // Stopped children can linger as zombies here; `ps` tells a zombie from a live process.
    const stat = execFileSync('ps', ['-o', 'stat=', '-p', String(child.pid)], { encoding: 'utf8' }).trim();
    return stat !== '' && !stat.startsWith('Z');
  } catch {
    return false;
  }
}

export async function startMariaDb(opts: MariaDbOptions): Promise<RunningMariaDb> {
  ensureAptPackage(SERVER, 'mariadb-server');
  // A socket path over 107 characters aborts the server, so it lives in the short temp folder.
  const socket = join(tmpdir(), `selvage-db-${opts.port}.sock`);
  if (opts.fresh) rmSync(opts.dataDir, { recursive: true, force: true });
  mkdirSync(opts.dataDir, { recursive: true });
  if (!existsSync(join(opts.dataDir, 'mysql'))) {
    execFileSync(
      'mariadb-install-db',
      [
        '--no-defaults',
        '--user=root',
        `--datadir=${opts.dataDir}`,
        '--auth-root-authentication-method=socket',
        '--skip-test-db',
        '--skip-name-resolve',
      ],
      { stdio: 'ignore' },
    );
  }
  const sql = (statement: string) =>
    execFileSync('mariadb', ['--no-defaults', `--socket=${socket}`, '-uroot', '-N', '-B', '-e', statement], {
      encoding: 'utf8',
    });
  const ping = () => {
    try {
      execFileSync('mariadb-admin', ['--no-defaults', `--socket=${socket}`, '-uroot', 'ping'], { stdio: 'ignore' });
      return true;
    } catch {
      return false;
    }
  };
  if (ping())
    throw new Error(
      `a MariaDB server already answers on ${socket}: is another npm start or npm test running? Stop it first.`,
    );
  const log = openSync(join(opts.dataDir, '..', `mariadb-${opts.port}.log`), 'a');
  const child = spawn(
    SERVER,
    [
      '--no-defaults',
      '--user=root',
      `--datadir=${opts.dataDir}`,
      '--bind-address=127.0.0.1',
      `--port=${opts.port}`,
      `--socket=${socket}`,
      `--pid-file=${join(opts.dataDir, 'mariadbd.pid')}`,
      '--skip-name-resolve',
      '--character-set-server=utf8mb4',
      '--collation-server=utf8mb4_unicode_ci',
      '--innodb-buffer-pool-size=64M',
      '--innodb-log-file-size=16M',
      '--max-connections=300',
    ],
    // Its own process group: Ctrl-C reaches our script, which stops the api first and the
    // database last, instead of every process at once.
    { stdio: ['ignore', log, log], detached: true },
  );
  const started = Date.now();
  while (!ping()) {
    if (!isAlive(child)) throw new Error(`MariaDB did not start; see ${join(opts.dataDir, '..', `mariadb-${opts.port}.log`)}`);
    if (Date.now() - started > 60_000) throw new Error('MariaDB did not answer within 60 s');
    await sleep(100);
  }
  const q = (s: string) => s.replace(/'/g, "''");
  sql(
    `CREATE DATABASE IF NOT EXISTS \`${opts.database}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;` +
      `CREATE USER IF NOT EXISTS '${q(opts.user)}'@'127.0.0.1' IDENTIFIED BY '${q(opts.password)}';` +
      `GRANT ALL PRIVILEGES ON \`${opts.database.replace(/_[a-z0-9]*$/, '')}%\`.* TO '${q(opts.user)}'@'127.0.0.1';` +
      `FLUSH PRIVILEGES;`,
  );
  let stopped = false;
  return {
    socket,
    sql,
    async stop() {
      if (stopped) return;
      stopped = true;
      try {
        execFileSync('mariadb-admin', ['--no-defaults', `--socket=${socket}`, '-uroot', 'shutdown'], { stdio: 'ignore' });
      } catch {
        child.kill('SIGTERM');
      }
      const t = Date.now();
      while (isAlive(child) && Date.now() - t < 30_000) await sleep(100);
    },
  };
}
