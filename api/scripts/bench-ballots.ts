/**
 * Part of `npm run bench`: the viewer's choice ballot under load.
 *
 * 1. 300 visitors voting at once for BENCH_SECONDS (30): autocannon with 300 connections posts
 *    ballots to the stack's api (BENCH_URL), each request with a fresh single-use code. Reported:
 *    ballots per second, latency p50/p99, and a count of the ballots in MariaDB afterwards, which must
 *    equal the 201s (none lost, none doubled).
 * 2. The count: the show topped up to 20,000 ballots, closed, and its results fetched by the show
 *    chair through the api (reading every ballot and counting in the request), plus the pure
 *    `countShow` on 20,000 ballots in-process.
 *
 * Set-up (a bench guild, its show chair, a show with 4 categories of 8 accepted quilts, open voting,
 * the codes) goes straight through the entity manager. Targets are printed beside the results;
 * nothing fails on a missed target, only on errors.
 */
import 'reflect-metadata';
import { MikroORM } from '@mikro-orm/mariadb';
import autocannon from 'autocannon';
import { randomBytes } from 'node:crypto';
import seedrandom from 'seedrandom';
import config from '../src/mikro-orm.config';

const base = process.env.BENCH_URL ?? 'http://127.0.0.1:3000';
const origin = process.env.APP_ORIGIN ?? base;
const seconds = Number(process.env.BENCH_SECONDS ?? 30);
const connections = Number(process.env.BENCH_VOTERS ?? 300);
const TALLY_BALLOTS = 20_000;
const PASSWORD = 'lupin-bench-password-3';
const TARGETS = { minBallotsPerSecond: 100, maxP99Ms: 2000, maxResultsMs: 3000, maxTallyMs: 500 };

function percentile(sorted: number[], p: number): number {
  return sorted.length ? sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)] : NaN;
}

async function main() {
  const { hashPassword } = await import('../src/auth/passwords');
  const { Guild } = await import('../src/guilds/guild.entity');
  const { Membership } = await import('../src/guilds/membership.entity');
  const { User } = await import('../src/users/user.entity');
  const { Show } = await import('../src/shows/show.entity');
  const { ShowCategory } = await import('../src/shows/show-category.entity');
  const { ShowEntry } = await import('../src/shows/show-entry.entity');
  const { generateBallotCode } = await import('../src/shows/ballot-code');
  const { countShow } = await import('../src/shows/voting');

  const orm = await MikroORM.init(config);
  const em = orm.em.fork();
  const conn = em.getConnection();
  const tag = Date.now().toString(36);
  const rng = seedrandom('selvage-bench-ballots');

  console.log(`\nBallots: setting up a show with 32 quilts and ${connections * seconds * 4} visitor codes…`);
  const guild = em.create(Guild, { name: `Thornbury Piecers (bench ${tag})`, town: 'Thornbury' });
  const chairUser = em.create(User, { email: `chair.${tag}@thornbury.example`, name: 'Maud Larkhill', passwordHash: await hashPassword(PASSWORD) });
  const chair = em.create(Membership, { user: chairUser, guild, roles: ['show_chair'] });
  const show = em.create(Show, { guild, name: 'Thornbury Midsummer Show', venue: 'Village Hall', startsOn: '2030-06-21', endsOn: '2030-06-22', makersHidden: false, createdBy: chair });
  const categories = ['Bed quilts', 'Wall quilts', 'Modern', 'Art quilts'].map((name, i) => em.create(ShowCategory, { show, name, sortOrder: i }));
  let n = 1;
  const entries = categories.flatMap((category) =>
    Array.from({ length: 8 }, (_, i) =>
      em.create(ShowEntry, { show, category, membership: chair, title: `${category.name} ${i + 1}`, widthMm: 1270, heightMm: 1524, makers: ['Maud Larkhill'], status: 'accepted', entryNumber: n++ }),
    ),
  );
  await em.flush();
  const codeCount = connections * seconds * 4;
  const codes: string[] = [];
  const seen = new Set<string>();
  while (codes.length < codeCount) {
    const c = generateBallotCode();
    if (!seen.has(c)) codes.push(c), seen.add(c);
  }
  const now = new Date();
  for (let i = 0; i < codes.length; i += 1000) {
    const chunk = codes.slice(i, i + 1000);
    await conn.execute(`INSERT INTO ballot_codes (created_at, updated_at, show_id, code, batch) VALUES ${chunk.map(() => '(?, ?, ?, ?, 1)').join(', ')}`, chunk.flatMap((c) => [now, now, show.id, c]));
  }
  show.votingOpenedAt = new Date();
  await em.flush();

  const byCategory = categories.map((c) => entries.filter((e) => e.category === c).map((e) => e.id));
  // Every ballot votes in the first category and skips each other one 15% of the time; favourites get more votes.
  const ballotBody = () =>
    JSON.stringify({
      choices: { categories: Object.fromEntries(categories.map((c, i) => [String(c.id), i > 0 && rng() < 0.15 ? [] : [byCategory[i][Math.floor(rng() * rng() * 8)]]])) },
    });

  // ---- 1. 300 voters at once -----------------------------------------------------------------------
  let next = 0;
  const statuses = new Map<number, number>();
  const result = await autocannon({
    url: base,
    connections,
    duration: seconds,
    requests: [
      {
        method: 'POST',
        setupRequest: (req) => ({
          ...req,
          path: `/api/public/ballots/${codes[next++ % codes.length]}`,
          headers: { 'content-type': 'application/json', origin },
          body: ballotBody(),
        }),
        onResponse: (status) => statuses.set(status, (statuses.get(status) ?? 0) + 1),
      },
    ],
  });
  const created = statuses.get(201) ?? 0;
  // Ballots still in flight when autocannon stopped are answered after it stops listening: wait until
  // MariaDB is quiet, then both tables must agree, and hold at least the 201s and at most one more per connection.
  const counts = async () => {
    const [{ b }] = await conn.execute<{ b: number }[]>('SELECT COUNT(*) AS b FROM show_ballots WHERE show_id = ?', [show.id]);
    const [{ v }] = await conn.execute<{ v: number }[]>('SELECT COUNT(*) AS v FROM show_voters WHERE show_id = ?', [show.id]);
    return [Number(b), Number(v)];
  };
  let [stored, voters] = await counts();
  for (let i = 0; i < 20; i++) {
    await new Promise((r) => setTimeout(r, 500));
    const [b, v] = await counts();
    if (b === stored && v === voters && b === v) break;
    [stored, voters] = [b, v];
  }
  console.log(`  ${connections} voters for ${seconds} s: ${created} ballots accepted, ${(created / seconds).toFixed(0)} ballots/s (target ≥ ${TARGETS.minBallotsPerSecond})`);
  console.log(`  latency p50 ${result.latency.p50} ms, p99 ${result.latency.p99} ms (target p99 ≤ ${TARGETS.maxP99Ms} ms); other statuses: ${JSON.stringify(Object.fromEntries([...statuses].filter(([s]) => s !== 201)))}, errors ${result.errors}, timeouts ${result.timeouts}`);
  const intact = stored === voters && stored >= created && stored - created <= connections;
  console.log(`  in MariaDB afterwards: ${stored} ballots, ${voters} voters (${stored - created} answered after the load stopped) — ${intact ? 'every ballot stored once, with its voter' : 'MISMATCH'}`);
  if (!intact) throw new Error('ballots lost or doubled under load');
  const other = [...statuses].filter(([s]) => s !== 201).reduce((n, [, k]) => n + k, 0);
  if (other > 0) throw new Error(`${other} ballots were refused under load`);

  // ---- 2. counting 20,000 ballots ------------------------------------------------------------------
  const missing = TALLY_BALLOTS - stored;
  for (let i = 0; i < missing; i += 1000) {
    const k = Math.min(1000, missing - i);
    const rows = Array.from({ length: k }, () => [randomBytes(16).toString('base64url'), show.id, JSON.parse(ballotBody()).choices]);
    await conn.execute(`INSERT INTO show_ballots (id, show_id, choices) VALUES ${rows.map(() => '(?, ?, ?)').join(', ')}`, rows.flatMap(([id, s, c]) => [id, s, JSON.stringify(c)]));
    await conn.execute(
      `INSERT INTO show_voters (show_id, voter_key, channel, cast_at) VALUES ${rows.map(() => "(?, ?, 'member', ?)").join(', ')}`,
      rows.flatMap((_, j) => [show.id, `bench:${i + j}`, now]),
    );
  }
  show.votingClosedAt = new Date();
  await em.flush();
  const signIn = await fetch(`${base}/api/auth/sign-in`, { method: 'POST', headers: { 'Content-Type': 'application/json', Origin: origin }, body: JSON.stringify({ email: chairUser.email, password: PASSWORD }) });
  if (signIn.status !== 200) throw new Error(`chair sign-in failed: ${signIn.status}`);
  const cookie = signIn.headers.get('set-cookie')!.split(';')[0];
  const timings: number[] = [];
  let body: { audit: { ballotsCast: number }; categories: { votes: number }[] } | undefined;
  for (let i = 0; i < 5; i++) {
    const t0 = performance.now();
    const res = await fetch(`${base}/api/guilds/${guild.id}/shows/${show.id}/results`, { headers: { cookie } });
    if (res.status !== 200) throw new Error(`results: ${res.status} ${await res.text()}`);
    body = (await res.json()) as typeof body;
    timings.push(performance.now() - t0);
  }
  timings.sort((a, b) => a - b);
  console.log(`  results of ${body!.audit.ballotsCast} ballots through the api (read, count, ribbons): median ${timings[2].toFixed(0)} ms, worst ${timings[4].toFixed(0)} ms (target ≤ ${TARGETS.maxResultsMs} ms)`);

  const rows = await conn.execute<{ choices: string | object }[]>('SELECT choices FROM show_ballots WHERE show_id = ?', [show.id]);
  const ballots = rows.map((r) => (typeof r.choices === 'string' ? JSON.parse(r.choices) : r.choices));
  const def = categories.map((c, i) => ({ id: c.id, name: c.name, entries: byCategory[i].map((id) => ({ id, entryNumber: entries.find((e) => e.id === id)!.entryNumber ?? null, title: '' })) }));
  const pure: number[] = [];
  for (let i = 0; i < 7; i++) {
    const t0 = performance.now();
    countShow('per_category', 'points', def, ballots);
    pure.push(performance.now() - t0);
  }
  pure.sort((a, b) => a - b);
  console.log(`  countShow on ${ballots.length} ballots in-process: median ${pure[3].toFixed(1)} ms (target ≤ ${TARGETS.maxTallyMs} ms)`);
  await orm.close(true);
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
