/**
 * Backups of a Selvage installation: the MariaDB database dumped inside one consistent snapshot
 * (`--single-transaction`, so the app keeps running and writing) and the uploaded files, in one dated
 * folder with a manifest of checksums; and the restore of such a folder into an empty database.
 * Used by `npm run backup` / `npm run restore FOLDER` (api/scripts/stack.ts) and by the e2e test.
 */
import { spawn } from 'node:child_process';
import { createHash } from 'node:crypto';
import { createReadStream, createWriteStream } from 'node:fs';
import { copyFile, mkdir, readdir, readFile, stat, writeFile } from 'node:fs/promises';
import { dirname, join, relative } from 'node:path';

export interface DbTarget {
  host: string;
  port: number;
  user: string;
  password: string;
  database: string;
}

export interface BackupManifest {
  format: 'selvage-backup-1';
  createdAt: string;
  database: { name: string; file: 'database.sql'; bytes: number; sha256: string };
  files: { path: string; bytes: number; sha256: string }[];
}

/** Thrown for problems a person can fix (an unreachable database, a non-empty target, a damaged folder). */
export class BackupError extends Error {}

function clientArgs(db: DbTarget): string[] {
  return ['--no-defaults', `--host=${db.host}`, `--port=${db.port}`, `--user=${db.user}`, '--protocol=TCP', '--default-character-set=utf8mb4'];
}

/** Runs a MariaDB client program with the password in its environment (never on the command line). */
function runClient(program: string, args: string[], db: DbTarget, io: { stdin?: string; stdout?: string }): Promise<void> {
  return new Promise((resolve, reject) => {
    const child = spawn(program, args, { env: { ...process.env, MYSQL_PWD: db.password }, stdio: ['pipe', io.stdout ? 'pipe' : 'ignore', 'pipe'] });
    let stderr = '';
    child.stderr!.on('data', (c: Buffer) => (stderr += c.toString()));
    const done: Promise<void>[] = [];
    if (io.stdout) {
      const out = createWriteStream(io.stdout);
      child.stdout!.pipe(out);
      done.push(new Promise((r, j) => out.on('finish', r).on('error', j)));
    }
    if (io.stdin) createReadStream(io.stdin).pipe(child.stdin!);
    else child.stdin!.end();
    child.on('error', (e) => reject(new BackupError(`${program} could not start: ${e.message}`)));
    child.on('close', async (code) => {
      await Promise.all(done).catch(() => undefined);
      if (code === 0) resolve();
      else reject(new BackupError(`${program} failed (exit ${code}): ${stderr.trim().split('\n').slice(-3).join(' ')}`));
    });
  });
}

async function sha256Of(path: string): Promise<{ sha256: string; bytes: number }> {
  const hash = createHash('sha256');
  let bytes = 0;
  for await (const chunk of createReadStream(path)) {
    hash.update(chunk as Buffer);
    bytes += (chunk as Buffer).length;
  }
  return { sha256: hash.digest('hex'), bytes };
}

async function filesUnder(dir: string): Promise<string[]> {
  const out: string[] = [];
  const walk = async (d: string) => {
    let entries;
    try {
      entries = await readdir(d, { withFileTypes: true });
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code === 'ENOENT') return;
      throw e;
    }
    for (const e of entries) {
      if (e.isDirectory()) await walk(join(d, e.name));
      else if (e.isFile()) out.push(join(d, e.name));
    }
  };
  await walk(dir);
  return out.sort();
}

/** "2026-12-02T04-52-19Z": a folder name that sorts by time and is valid everywhere. */
export function backupFolderName(now: Date): string {
  return `selvage-${now.toISOString().replace(/\.\d{3}Z$/, 'Z').replace(/:/g, '-')}`;
}

/**
 * Dumps the database in one snapshot, then copies the uploaded files. Uploads are written under new
 * random names before the rows that name them commit, so every file the dump refers to is already on
 * disk when the copy starts.
 */
export async function takeBackup(opts: { db: DbTarget; uploadsDir: string; outDir: string; now?: Date }): Promise<{ folder: string; manifest: BackupManifest }> {
  const now = opts.now ?? new Date();
  const folder = join(opts.outDir, backupFolderName(now));
  await mkdir(join(folder, 'files'), { recursive: true });
  const sqlPath = join(folder, 'database.sql');
  await runClient(
    'mariadb-dump',
    [...clientArgs(opts.db), '--single-transaction', '--quick', '--routines', '--triggers', '--hex-blob', '--skip-comments', '--no-tablespaces', opts.db.database],
    opts.db,
    { stdout: sqlPath },
  );
  const files: BackupManifest['files'] = [];
  for (const source of await filesUnder(opts.uploadsDir)) {
    const path = relative(opts.uploadsDir, source);
    const target = join(folder, 'files', path);
    await mkdir(dirname(target), { recursive: true });
    await copyFile(source, target);
    files.push({ path, ...(await sha256Of(target)) });
  }
  const manifest: BackupManifest = {
    format: 'selvage-backup-1',
    createdAt: now.toISOString(),
    database: { name: opts.db.database, file: 'database.sql', ...(await sha256Of(sqlPath)) },
    files,
  };
  await writeFile(join(folder, 'manifest.json'), `${JSON.stringify(manifest, null, 2)}\n`);
  return { folder, manifest };
}

/** Checks a backup folder against its manifest: every checksum, before anything is restored. */
export async function verifyBackup(folder: string): Promise<BackupManifest> {
  let manifest: BackupManifest;
  try {
    manifest = JSON.parse(await readFile(join(folder, 'manifest.json'), 'utf8')) as BackupManifest;
  } catch {
    throw new BackupError(`${folder} is not a Selvage backup folder (no readable manifest.json).`);
  }
  if (manifest.format !== 'selvage-backup-1') throw new BackupError(`${folder} holds a backup in a format this Selvage does not know.`);
  const check = async (path: string, want: { sha256: string; bytes: number }) => {
    const got = await sha256Of(path).catch(() => null);
    if (!got || got.sha256 !== want.sha256 || got.bytes !== want.bytes) throw new BackupError(`${relative(folder, path)} is missing or damaged; this backup cannot be restored safely.`);
  };
  await check(join(folder, manifest.database.file), manifest.database);
  for (const f of manifest.files) {
    if (f.path.includes('..')) throw new BackupError(`The manifest names a file outside the backup: ${f.path}`);
    await check(join(folder, 'files', f.path), f);
  }
  return manifest;
}

/**
 * Restores a checked backup into an empty database (no tables at all) and the uploads folder. A
 * database that already has tables is refused: restoring over live data would mix two histories.
 */
export async function restoreBackup(opts: { db: DbTarget; uploadsDir: string; folder: string; countTables: () => Promise<number> }): Promise<BackupManifest> {
  const manifest = await verifyBackup(opts.folder);
  const tables = await opts.countTables();
  if (tables > 0)
    throw new BackupError(`The database ${opts.db.database} already has ${tables} tables. Restore goes into an empty database: start from a fresh data folder.`);
  await runClient('mariadb', [...clientArgs(opts.db), opts.db.database], opts.db, { stdin: join(opts.folder, manifest.database.file) });
  for (const f of manifest.files) {
    const target = join(opts.uploadsDir, f.path);
    await mkdir(dirname(target), { recursive: true });
    const existing = await stat(target).catch(() => null);
    if (existing) {
      if ((await sha256Of(target)).sha256 !== f.sha256) throw new BackupError(`${target} exists with other content; move the uploads folder aside and try again.`);
      continue;
    }
    await copyFile(join(opts.folder, 'files', f.path), target);
  }
  return manifest;
}
