import { MikroORM } from '@mikro-orm/mariadb';
import { randomBytes } from 'node:crypto';
import { appendFileSync, mkdtempSync, readdirSync, readFileSync, rmSync, cpSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { BackupError, restoreBackup, takeBackup, verifyBackup, type DbTarget } from '../src/database/backup';
import { DemoSeeder } from '../src/database/seeders/DemoSeeder';
import config from '../src/mikro-orm.config';

/**
 * Nothing lost: the demo guild seeded into its own database, backed up while ballots are being written,
 * restored into another empty database, and compared table by table and file by file (real MariaDB).
 */
describe('backup and restore', () => {
  const tag = randomBytes(3).toString('hex');
  const source = `selvage_bk_src_${tag}`;
  const target = `selvage_bk_dst_${tag}`;
  const work = mkdtempSync(join(tmpdir(), 'selvage-backup-'));
  const uploads = join(work, 'uploads');
  const restoredUploads = join(work, 'restored-uploads');
  let src: MikroORM;
  let dst: MikroORM;
  const db = (database: string): DbTarget => ({
    host: process.env.DB_HOST ?? '127.0.0.1',
    port: Number(process.env.DB_PORT),
    user: process.env.DB_USER ?? 'selvage',
    password: process.env.DB_PASSWORD ?? '',
    database,
  });
  const tablesOf = async (orm: MikroORM, database: string) =>
    ((await orm.em.getConnection().execute(`SELECT table_name AS t FROM information_schema.tables WHERE table_schema = ? ORDER BY table_name`, [database])) as { t: string }[]).map((r) => r.t);

  beforeAll(async () => {
    const admin = await MikroORM.init({ ...config, allowGlobalContext: true });
    await admin.em.getConnection().execute(`CREATE DATABASE \`${source}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
    await admin.em.getConnection().execute(`CREATE DATABASE \`${target}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
    await admin.close(true);
    process.env.UPLOADS_DIR = uploads;
    src = await MikroORM.init({ ...config, dbName: source, allowGlobalContext: true, logger: () => undefined });
    await src.getMigrator().up();
    await src.getSeeder().seed(DemoSeeder);
    dst = await MikroORM.init({ ...config, dbName: target, allowGlobalContext: true });
  }, 180_000);

  afterAll(async () => {
    for (const name of [source, target]) await src.em.getConnection().execute(`DROP DATABASE IF EXISTS \`${name}\``);
    await src.close(true);
    await dst.close(true);
    rmSync(work, { recursive: true, force: true });
  });

  it('backs up while ballots are cast, restores into an empty database, and every table and file matches the snapshot', async () => {
    const conn = src.em.getConnection();
    const [{ id: showId }] = (await conn.execute("SELECT id FROM shows WHERE name = 'Autumn Harvest Show'")) as { id: number }[];
    const count = async (table: string) => Number(((await conn.execute(`SELECT COUNT(*) AS n FROM ${table}`)) as { n: number }[])[0].n);
    const before = await count('show_ballots');

    // Ballots keep coming while the backup runs: each a voter row and a ballot row in one transaction.
    let writing = true;
    let written = 0;
    const writer = (async () => {
      while (writing) {
        await src.em.fork().transactional(async (tx) => {
          await tx.execute('INSERT INTO show_voters (show_id, voter_key, channel, cast_at) VALUES (?, ?, ?, ?)', [showId, `backup-test:${written}`, 'member', new Date()]);
          await tx.execute('INSERT INTO show_ballots (id, show_id, choices) VALUES (?, ?, ?)', [randomBytes(16).toString('base64url'), showId, '{"categories":{}}']);
        });
        written += 1;
      }
    })();
    await new Promise((r) => setTimeout(r, 300));
    const { folder, manifest } = await takeBackup({ db: db(source), uploadsDir: uploads, outDir: join(work, 'backups') });
    const duringBackup = written;
    await new Promise((r) => setTimeout(r, 300));
    writing = false;
    await writer;
    expect(duringBackup).toBeGreaterThan(0);
    expect(written).toBeGreaterThan(duringBackup);
    expect(manifest.files.length).toBeGreaterThanOrEqual(17); // the demo's quilt pictures, display and thumbnail

    await restoreBackup({ db: db(target), uploadsDir: restoredUploads, folder, countTables: async () => (await tablesOf(dst, target)).length });

    // Every table is there, with the same rows, except the two written during the backup ...
    const tables = await tablesOf(src, source);
    expect(await tablesOf(dst, target)).toEqual(tables);
    const rows = async (orm: MikroORM, table: string) => JSON.stringify(await orm.em.getConnection().execute(`SELECT * FROM \`${table}\` ORDER BY 1`));
    for (const table of tables.filter((t) => t !== 'show_voters' && t !== 'show_ballots')) expect([table, await rows(dst, table)]).toEqual([table, await rows(src, table)]);
    // ... which hold one consistent moment: as many voters as ballots, all of them real, more than before.
    const restoredVoters = Number(((await dst.em.getConnection().execute('SELECT COUNT(*) AS n FROM show_voters')) as { n: number }[])[0].n);
    const restoredBallots = Number(((await dst.em.getConnection().execute('SELECT COUNT(*) AS n FROM show_ballots')) as { n: number }[])[0].n);
    expect(restoredBallots).toBe(restoredVoters); // the demo has a ballot per voter, and so does each write
    expect(restoredBallots).toBeGreaterThan(before);
    expect(restoredBallots).toBeLessThan(await count('show_ballots'));
    const restoredIds = (await dst.em.getConnection().execute('SELECT id FROM show_ballots')) as { id: string }[];
    const sourceIds = new Set(((await conn.execute('SELECT id FROM show_ballots')) as { id: string }[]).map((r) => r.id));
    expect(restoredIds.every((r) => sourceIds.has(r.id))).toBe(true);
    // The append-only money audit keeps its guard after a restore.
    await expect(dst.em.getConnection().execute('DELETE FROM dues_audit_log LIMIT 1')).rejects.toThrow();

    // Every uploaded file, byte for byte.
    const list = (dir: string) => readdirSync(dir, { recursive: true, withFileTypes: true }).filter((e) => e.isFile()).map((e) => join(e.parentPath, e.name).slice(dir.length)).sort();
    expect(list(restoredUploads)).toEqual(list(uploads));
    for (const f of list(uploads)) expect(readFileSync(join(restoredUploads, f)).equals(readFileSync(join(uploads, f)))).toBe(true);

    // A second restore over the now-filled database is refused; so is a damaged backup.
    await expect(restoreBackup({ db: db(target), uploadsDir: restoredUploads, folder, countTables: async () => (await tablesOf(dst, target)).length })).rejects.toThrow(/already has \d+ tables/);
    const damaged = join(work, 'damaged');
    cpSync(folder, damaged, { recursive: true });
    appendFileSync(join(damaged, 'database.sql'), '-- tampered\n');
    await expect(verifyBackup(damaged)).rejects.toThrow(BackupError);
    await expect(verifyBackup(join(work, 'nowhere'))).rejects.toThrow('not a Selvage backup folder');
  }, 180_000);
});
