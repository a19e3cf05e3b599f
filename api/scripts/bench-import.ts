/**
 * Part of `npm run bench`: the roster import with a 10,000-row file.
 *
 * A bench guild and its admin are made straight through the entity manager; the file is built from
 * invented first and last names and towns with a seeded generator (same file every run): e-mails on
 * most rows, households, dates in mixed formats, a few roles and a sprinkling of problems. Then,
 * through the api (BENCH_URL), as the admin: preview (first page), import, and the same file again
 * (every row unchanged). Reported: the time of each, the preview's response size, the counts, and
 * the rows in MariaDB afterwards. Targets are printed beside the results; only errors fail the run.
 */
import 'reflect-metadata';
import { MikroORM } from '@mikro-orm/mariadb';
import seedrandom from 'seedrandom';
import config from '../src/mikro-orm.config';

const base = process.env.BENCH_URL ?? 'http://127.0.0.1:3000';
const origin = process.env.APP_ORIGIN ?? base;
const ROWS = Number(process.env.BENCH_IMPORT_ROWS ?? 10_000);
const PASSWORD = 'bobbin-bench-password-7';
const TARGETS = { maxPreviewMs: 5000, maxImportMs: 30_000, maxReimportMs: 10_000, maxPreviewBytes: 200_000 };

const FIRST = ['Agatha', 'Bettina', 'Clemency', 'Dorcas', 'Edwina', 'Fenella', 'Gwendolyn', 'Hester', 'Isolde', 'Jemima', 'Kezia', 'Lettice', 'Mabel', 'Nerys', 'Ottoline', 'Perpetua', 'Rosalind', 'Sabina', 'Tamsin', 'Ursula', 'Verity', 'Winifred', 'Yolanda', 'Zillah'];
const LAST = ['Pinwheel', 'Bodkin', 'Thimbleby', 'Selvedge', 'Gusset', 'Wimble', 'Quire', 'Broadcloth', 'Awl', 'Loft', 'Hatch', 'Tuck', 'Mull', 'Bias', 'Rotary', 'Fathom', 'Larkspur', 'Holloway', 'Marchbank', 'Oddington', 'Penhallow', 'Ravensworth', 'Stitchley', 'Tavistow'];
const TOWNS = ['Brackenby', 'Fallowmere', 'Upper Tansley', 'Wrenfield', 'Millbrook', 'Thornbury', 'Ditchwell', 'Hazelcombe'];

function buildCsv(tag: string): string {
  const rng = seedrandom('selvage-bench-import');
  const pick = <T>(list: T[]) => list[Math.floor(rng() * list.length)];
  const pad = (n: number) => String(n).padStart(2, '0');
  const lines = ['First name,Last name,E-mail,Phone,Town,Household,Member since,Paid through,Roles'];
  for (let i = 0; i < ROWS; i++) {
    const first = pick(FIRST);
    const last = pick(LAST);
    const withEmail = rng() < 0.85;
    const email = withEmail ? `${first}.${last}.${i}.${tag}@bench.example`.toLowerCase() : '';
    // Names without an e-mail carry the row number, so they never repeat.
    const lastName = withEmail ? last : `${last} ${i}`;
    const year = 1990 + Math.floor(rng() * 36);
    const month = 1 + Math.floor(rng() * 12);
    const day = 1 + Math.floor(rng() * 28);
    const since = [`${year}-${pad(month)}-${pad(day)}`, `${day}/${month}/${year}`, `${day} March ${year}`][i % 3];
    const paid = rng() < 0.7 ? `31/12/${2025 + Math.floor(rng() * 3)}` : '';
    const household = rng() < 0.1 ? `${last} household` : '';
    const role = i % 997 === 0 ? 'Show chair' : i % 1499 === 0 ? 'President' : '';
    const badEmail = i % 1013 === 0 && withEmail ? 'not-an-address' : email;
    lines.push([first, lastName, badEmail, `555 ${String(1000 + (i % 9000))}`, pick(TOWNS), household, since, paid, role].join(','));
  }
  return lines.join('\r\n') + '\r\n';
}

async function main() {
  const { hashPassword } = await import('../src/auth/passwords');
  const { Guild } = await import('../src/guilds/guild.entity');
  const { Membership } = await import('../src/guilds/membership.entity');
  const { User } = await import('../src/users/user.entity');

  const orm = await MikroORM.init(config);
  const em = orm.em.fork();
  const tag = Date.now().toString(36);
  const guild = em.create(Guild, { name: `Fallowmere Patchworkers (bench ${tag})`, town: 'Fallowmere', currency: 'GBP' });
  const adminUser = em.create(User, { email: `admin.${tag}@fallowmere.example`, name: 'Ottoline Marchbank', passwordHash: await hashPassword(PASSWORD) });
  em.create(Membership, { user: adminUser, guild, roles: ['admin'] });
  await em.flush();

  const csv = buildCsv(tag);
  console.log(`\nRoster import: ${ROWS.toLocaleString('en-US')} rows, ${(Buffer.byteLength(csv) / 1e6).toFixed(2)} MB of CSV`);
  const signIn = await fetch(`${base}/api/auth/sign-in`, { method: 'POST', headers: { 'Content-Type': 'application/json', Origin: origin }, body: JSON.stringify({ email: adminUser.email, password: PASSWORD }) });
  if (signIn.status !== 200) throw new Error(`admin sign-in failed: ${signIn.status}`);
  const cookie = signIn.headers.get('set-cookie')!.split(';')[0];

  const post = async (path: string) => {
    const form = new FormData();
    form.append('file', new Blob([csv], { type: 'text/csv' }), 'roster.csv');
    form.append('dateOrder', 'dmy');
    const started = performance.now();
    const res = await fetch(`${base}/api/guilds/${guild.id}/roster-import${path}`, { method: 'POST', headers: { cookie, Origin: origin }, body: form });
    const text = await res.text();
    const ms = performance.now() - started;
    if (!res.ok) throw new Error(`${path || 'import'} failed: ${res.status} ${text.slice(0, 300)}`);
    return { ms, bytes: Buffer.byteLength(text), body: JSON.parse(text) as Record<string, unknown> };
  };

  const preview = await post('/preview');
  console.log(`  preview:   ${preview.ms.toFixed(0)} ms (target ≤ ${TARGETS.maxPreviewMs}), response ${(preview.bytes / 1024).toFixed(0)} KB for one page of 100 rows (target ≤ ${TARGETS.maxPreviewBytes / 1000} KB), counts ${JSON.stringify(preview.body.counts)}`);
  const imported = await post('');
  console.log(`  import:    ${imported.ms.toFixed(0)} ms (target ≤ ${TARGETS.maxImportMs}), response ${(imported.bytes / 1024).toFixed(0)} KB, counts ${JSON.stringify(imported.body.counts)}`);
  const again = await post('');
  console.log(`  re-import: ${again.ms.toFixed(0)} ms (target ≤ ${TARGETS.maxReimportMs}), counts ${JSON.stringify(again.body.counts)}`);

  // Invitations go one by one through the ordinary invitation path (each its own transaction).
  const toInvite = (imported.body.toInvite as { membershipId: number }[]).slice(0, 200).map((m) => m.membershipId);
  const invStarted = performance.now();
  const inv = await fetch(`${base}/api/guilds/${guild.id}/roster-import/invitations`, {
    method: 'POST',
    headers: { cookie, Origin: origin, 'Content-Type': 'application/json' },
    body: JSON.stringify({ membershipIds: toInvite }),
  });
  if (!inv.ok) throw new Error(`invitations failed: ${inv.status} ${await inv.text()}`);
  const invMs = performance.now() - invStarted;
  console.log(`  invitations: ${toInvite.length} in ${invMs.toFixed(0)} ms (${(invMs / toInvite.length).toFixed(1)} ms each)`);

  const [row] = await em.getConnection().execute<{ n: number }[]>('SELECT COUNT(*) AS n FROM memberships WHERE guild_id = ?', [guild.id]);
  console.log(`  memberships in the guild afterwards: ${Number(row.n).toLocaleString('en-US')}`);
  const missed = [
    preview.ms > TARGETS.maxPreviewMs && 'preview',
    imported.ms > TARGETS.maxImportMs && 'import',
    again.ms > TARGETS.maxReimportMs && 're-import',
    preview.bytes > TARGETS.maxPreviewBytes && 'preview size',
  ].filter(Boolean);
  console.log(missed.length ? `  targets missed: ${missed.join(', ')}` : '  all targets met');
  await orm.close();
}

main().catch((e: unknown) => {
  console.error(e);
  process.exit(1);
});
