/**
 * `npm run bench` (with `npm start` running): /api/health against the signed-in dashboard,
 * side by side, with autocannon. BENCH_URL, BENCH_SECONDS and BENCH_CONNECTIONS override.
 */
import autocannon from 'autocannon';

const base = process.env.BENCH_URL ?? 'http://127.0.0.1:3000';
const seconds = Number(process.env.BENCH_SECONDS ?? 10);
const connections = Number(process.env.BENCH_CONNECTIONS ?? 10);

async function signIn(): Promise<string> {
  const res = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', Origin: base },
    body: JSON.stringify({ email: 'hazel@wrenfield.example', password: 'quilting-bee-42' }),
  });
  if (res.status !== 200) throw new Error(`sign-in for the benchmark failed: ${res.status} ${await res.text()}`);
  return res.headers.get('set-cookie')!.split(';')[0];
}

async function measure(path: string, cookie?: string) {
  const result = await autocannon({
    url: `${base}${path}`,
    connections,
    duration: seconds,
    headers: cookie ? { cookie } : {},
  });
  if (result.non2xx > 0) throw new Error(`${path}: ${result.non2xx} responses were not 2xx`);
  return { path, rps: result.requests.average, p50: result.latency.p50, p99: result.latency.p99, total: result.requests.total };
}

async function main() {
  const health = await fetch(`${base}/api/health`).catch(() => null);
  if (!health?.ok) throw new Error(`no api at ${base}: start it with npm start first`);
  const cookie = await signIn();
  const rows = [await measure('/api/health'), await measure('/api/dashboard', cookie)];
  console.log(`\n${connections} connections, ${seconds} s each, against ${base}`);
  console.log('endpoint            req/s     p50 ms   p99 ms   requests');
  for (const r of rows)
    console.log(
      `${r.path.padEnd(18)} ${r.rps.toFixed(0).padStart(7)} ${String(r.p50).padStart(9)} ${String(r.p99).padStart(8)} ${String(r.total).padStart(10)}`,
    );
  console.log(`dashboard / health throughput ratio: ${(rows[1].rps / rows[0].rps).toFixed(2)}`);
  console.log(`dashboard p99: ${rows[1].p99} ms; health p99: ${rows[0].p99} ms`);
}

main().catch((e: unknown) => {
  console.error(e instanceof Error ? e.message : e);
  process.exit(1);
});
