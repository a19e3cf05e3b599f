import request from 'supertest';
import { Membership } from '../src/guilds/membership.entity';
import { Invitation } from '../src/invitations/invitation.entity';
import { client, createScenario, createTestApp, signIn, TestApp } from './helpers';

/**
 * Who may call what. Every route the router holds must appear here; a new route without an entry
 * fails this test, so access is decided on purpose, never by accident.
 * - public: anyone; signed-in: any account; member: any member of the route's guild;
 * - a list of roles: members holding one of them (admins hold every right in their guild).
 */
type Access = 'public' | 'signed-in' | 'member' | readonly ('admin' | 'treasurer' | 'membership_chair' | 'show_chair')[];

const ACCESS: Record<string, Access> = {
  'GET /api/health': 'public',
  'GET /api/meta': 'public',
  'GET /api/docs': 'public',
  'GET /api/docs/*': 'public', // the documentation page's own scripts and styles
  'GET /api/docs-json': 'public',
  'GET /api/docs-yaml': 'public',
  'GET /api/auth/me': 'public',
  'POST /api/auth/sign-in': 'public',
  'POST /api/auth/sign-out': 'signed-in',
  'POST /api/auth/forgot-password': 'public',
  'POST /api/auth/reset-password': 'public',
  'GET /api/invitations/:token': 'public',
  'POST /api/invitations/:token/accept': 'public',
  'GET /api/dev/inbox': 'public',
  'GET /api/dev/inbox/:id': 'public',
  'GET /api/dashboard': 'signed-in',
  'GET /api/profile': 'signed-in',
  'PATCH /api/profile': 'signed-in',
  'POST /api/profile/email': 'signed-in',
  'POST /api/profile/password': 'signed-in',
  'GET /api/guilds/:guildId': 'member',
  'GET /api/guilds/:guildId/members': 'member',
  'PATCH /api/guilds/:guildId/members/:membershipId/roles': ['admin'],
  // Members kept on paper (paper-members.e2e-spec.ts); the printed roster shows each reader what listMembers does.
  'POST /api/guilds/:guildId/members': ['admin', 'membership_chair'],
  'PATCH /api/guilds/:guildId/members/:membershipId/details': ['admin', 'membership_chair'],
  'GET /api/guilds/:guildId/roster.pdf': 'member',
  // Offices: every member may see who her officers are and the handovers; admins record terms.
  'GET /api/guilds/:guildId/offices': 'member',
  'GET /api/guilds/:guildId/offices/history': 'member',
  'POST /api/guilds/:guildId/offices/terms': ['admin'],
  'PATCH /api/guilds/:guildId/offices/terms/:termId': ['admin'],
  'POST /api/guilds/:guildId/offices/handover': ['admin'],
  'GET /api/guilds/:guildId/invitations': ['admin', 'membership_chair'],
  'POST /api/guilds/:guildId/invitations': ['admin', 'membership_chair'],
  'DELETE /api/guilds/:guildId/invitations/:invitationId': ['admin', 'membership_chair'],
  'POST /api/guilds/:guildId/roster-import/preview': ['admin', 'membership_chair'],
  'POST /api/guilds/:guildId/roster-import': ['admin', 'membership_chair'],
  'POST /api/guilds/:guildId/roster-import/invitations': ['admin', 'membership_chair'],
  // Leaving and erasure: the rules (left first, no unpaid invoices, not a member elsewhere) in departures.e2e-spec.ts.
  'POST /api/guilds/:guildId/leave': 'member',
  'POST /api/guilds/:guildId/members/:membershipId/departure': ['admin', 'membership_chair'],
  'GET /api/guilds/:guildId/members/:membershipId/erasure': ['admin'],
  'POST /api/guilds/:guildId/members/:membershipId/erasure': ['admin'],
  // Bees are open to every member; organiser, queen and maker rights are checked per bee in
  // bees.e2e-spec.ts and rounds.e2e-spec.ts.
  'GET /api/guilds/:guildId/bees': 'member',
  'POST /api/guilds/:guildId/bees': 'member',
  'GET /api/guilds/:guildId/bees/:beeId': 'member',
  'PATCH /api/guilds/:guildId/bees/:beeId': 'member',
  'POST /api/guilds/:guildId/bees/:beeId/invitations': 'member',
  'POST /api/guilds/:guildId/bees/:beeId/join': 'member',
  'POST /api/guilds/:guildId/bees/:beeId/members': 'member',
  'GET /api/guilds/:guildId/bees/:beeId/schedule.pdf': 'member',
  'POST /api/guilds/:guildId/bees/:beeId/leave': 'member',
  'DELETE /api/guilds/:guildId/bees/:beeId/members/:membershipId': 'member',
  'POST /api/guilds/:guildId/bees/:beeId/rotation': 'member',
  'POST /api/guilds/:guildId/bees/:beeId/rotation/skip': 'member',
  'POST /api/guilds/:guildId/bees/:beeId/rotation/swap': 'member',
  'GET /api/guilds/:guildId/bees/:beeId/rounds/:month': 'member',
  'PUT /api/guilds/:guildId/bees/:beeId/rounds/:month': 'member',
  'POST /api/guilds/:guildId/bees/:beeId/rounds/:month/publish': 'member',
  'POST /api/guilds/:guildId/bees/:beeId/rounds/:month/files': 'member',
  'GET /api/guilds/:guildId/bees/:beeId/rounds/:month/files/:fileId': 'member',
  'DELETE /api/guilds/:guildId/bees/:beeId/rounds/:month/files/:fileId': 'member',
  'PATCH /api/guilds/:guildId/bees/:beeId/rounds/:month/blocks/:membershipId': 'member',
  'POST /api/guilds/:guildId/bees/:beeId/rounds/:month/nudges': 'member',
  'POST /api/layout-plans': 'signed-in',
  // Size checks: maker, queen and organiser rights are checked per block in size-checks.e2e-spec.ts.
  'POST /api/guilds/:guildId/bees/:beeId/rounds/:month/blocks/:membershipId/photos': 'member',
  'POST /api/guilds/:guildId/bees/:beeId/rounds/:month/blocks/:membershipId/manual-size': 'member',
  'GET /api/guilds/:guildId/bees/:beeId/rounds/:month/blocks/:membershipId/size-checks': 'member',
  'GET /api/guilds/:guildId/size-checks/:checkId/images/:kind': 'member',
  'GET /api/size-check/card.pdf': 'signed-in',
  // Dues: a member sees the rules, the plans on offer and her own dues and invoices (another
  // member's invoice is a 404, checked in dues.e2e-spec.ts); the treasurer keeps the books.
  'GET /api/guilds/:guildId/dues/settings': 'member',
  'PUT /api/guilds/:guildId/dues/settings': ['treasurer'],
  'GET /api/guilds/:guildId/dues/plans': 'member',
  'POST /api/guilds/:guildId/dues/plans': ['treasurer'],
  'PATCH /api/guilds/:guildId/dues/plans/:planId': ['treasurer'],
  'GET /api/guilds/:guildId/dues/me': 'member',
  'POST /api/guilds/:guildId/dues/checkout': 'member',
  'GET /api/guilds/:guildId/dues/ledger': ['treasurer'],
  'GET /api/guilds/:guildId/dues/ledger.csv': ['treasurer'],
  'GET /api/guilds/:guildId/dues/report': ['treasurer'],
  'GET /api/guilds/:guildId/dues/report.csv': ['treasurer'],
  'GET /api/guilds/:guildId/dues/report.pdf': ['treasurer'],
  'GET /api/guilds/:guildId/dues/invoices/:invoiceId': 'member',
  'GET /api/guilds/:guildId/dues/invoices/:invoiceId/receipt.pdf': 'member',
  'POST /api/guilds/:guildId/dues/payments': ['treasurer'],
  'POST /api/guilds/:guildId/dues/invoices/:invoiceId/refunds': ['treasurer'],
  'POST /api/guilds/:guildId/dues/invoices/:invoiceId/void': ['treasurer'],
  'GET /api/guilds/:guildId/dues/roster': ['treasurer'],
  'GET /api/guilds/:guildId/dues/roster.csv': ['treasurer'],
  'PATCH /api/guilds/:guildId/dues/members/:membershipId': ['treasurer'],
  'GET /api/guilds/:guildId/dues/households': ['treasurer'],
  'POST /api/guilds/:guildId/dues/households': ['treasurer'],
  'GET /api/guilds/:guildId/dues/audit': ['treasurer'],
  'POST /api/guilds': 'signed-in',
  'GET /api/profile/export.json': 'signed-in',
  'GET /api/profile/export.pdf': 'signed-in',
  'GET /api/profile/directory': 'signed-in',
  'PUT /api/profile/directory': 'signed-in',
  'GET /api/profile/mail-preferences': 'signed-in',
  'PUT /api/profile/mail-preferences': 'signed-in',
  // A one-click link from an e-mail: the signed token is the key (a bad one is a 400).
  'GET /api/unsubscribe': 'public',
  'POST /api/unsubscribe': 'public',
  'GET /api/guilds/:guildId/shows': 'member',
  'POST /api/guilds/:guildId/shows': ['show_chair'],
  'GET /api/guilds/:guildId/shows/:showId': 'member',
  'PATCH /api/guilds/:guildId/shows/:showId': ['show_chair'],
  'POST /api/guilds/:guildId/shows/:showId/categories': ['show_chair'],
  'PATCH /api/guilds/:guildId/shows/:showId/categories/:categoryId': ['show_chair'],
  'DELETE /api/guilds/:guildId/shows/:showId/categories/:categoryId': ['show_chair'],
  'GET /api/guilds/:guildId/shows/:showId/entries/mine': 'member',
  'GET /api/guilds/:guildId/shows/:showId/entries': ['show_chair'],
  'POST /api/guilds/:guildId/shows/:showId/entries': 'member',
  'POST /api/guilds/:guildId/shows/:showId/entries/number': ['show_chair'],
  'PATCH /api/guilds/:guildId/shows/:showId/entries/:entryId': 'member',
  'POST /api/guilds/:guildId/shows/:showId/entries/:entryId/withdraw': 'member',
  'POST /api/guilds/:guildId/shows/:showId/entries/:entryId/review': ['show_chair'],
  'POST /api/guilds/:guildId/shows/:showId/entries/:entryId/photo': 'member',
  'GET /api/guilds/:guildId/shows/:showId/entries/:entryId/photo': 'member',
  'GET /api/guilds/:guildId/shows/:showId/hang-tags.pdf': ['show_chair'],
  'GET /api/guilds/:guildId/shows/:showId/entries.pdf': ['show_chair'],
  'GET /api/guilds/:guildId/shows/:showId/entries.csv': ['show_chair'],
  'GET /api/guilds/:guildId/shows/:showId/fees/mine': 'member',
  'POST /api/guilds/:guildId/shows/:showId/fees/checkout': 'member',
  'GET /api/guilds/:guildId/shows/:showId/ballot': 'member',
  'POST /api/guilds/:guildId/shows/:showId/ballot': 'member',
  'POST /api/guilds/:guildId/shows/:showId/voting/open': ['show_chair'],
  'POST /api/guilds/:guildId/shows/:showId/voting/close': ['show_chair'],
  'GET /api/guilds/:guildId/shows/:showId/voting/turnout': ['show_chair'],
  'POST /api/guilds/:guildId/shows/:showId/voting/codes': ['show_chair'],
  'GET /api/guilds/:guildId/shows/:showId/voting/codes': ['show_chair'],
  'GET /api/guilds/:guildId/shows/:showId/voting/codes.pdf': ['show_chair'],
  'POST /api/guilds/:guildId/shows/:showId/voting/paper': ['show_chair'],
  'GET /api/guilds/:guildId/shows/:showId/results': 'member',
  'POST /api/guilds/:guildId/shows/:showId/results/decisions': ['show_chair'],
  'DELETE /api/guilds/:guildId/shows/:showId/results/decisions/:decisionId': ['show_chair'],
  'POST /api/guilds/:guildId/shows/:showId/results/publish': ['show_chair'],
  'GET /api/guilds/:guildId/shows/:showId/results.csv': ['show_chair'],
  'GET /api/guilds/:guildId/shows/:showId/results.pdf': ['show_chair'],
  'GET /api/guilds/:guildId/shows/:showId/ballots.csv': ['show_chair'],
  // A visitor's ballot card is her key; photos and results only once the show makes them public.
  'GET /api/public/ballots/:code': 'public',
  'POST /api/public/ballots/:code': 'public',
  'GET /api/public/shows/:showId/entries/:entryId/photo': 'public',
  'GET /api/public/shows/:showId/results': 'public',
  // Signed by the payment service instead of a session (a bad signature is a 400).
  'POST /api/payments/webhook': 'public',
};

interface Layer {
  route?: { path: string; methods: Record<string, boolean> };
}

/** Reads the routes from Express itself, not from a list someone keeps by hand. */
function registeredRoutes(t: TestApp): string[] {
  const express = t.app.getHttpAdapter().getInstance() as { router: { stack: Layer[] } };
  const out = new Set<string>();
  for (const layer of express.router.stack) {
    if (!layer.route) continue;
    // Nest's catch-all (every method on /api/{*path}) answers unknown paths with a JSON 404.
    if (Object.keys(layer.route.methods).length > 5) continue;
    for (const [method, on] of Object.entries(layer.route.methods))
      if (on && method !== '_all') out.add(`${method.toUpperCase()} ${layer.route.path}`);
  }
  return [...out]
    .filter((r) => r.split(' ')[1].startsWith('/api'))
    .map((r) => (r.startsWith('GET /api/docs/') ? 'GET /api/docs/*' : r))
    .filter((r, i, all) => all.indexOf(r) === i)
    .sort();
}

/** Routes that act even with an empty body; the walk skips them and they are checked one by one below. */
const STATE_CHANGING = [
  'POST /api/auth/sign-out',
  'DELETE /api/guilds/:guildId/invitations/:invitationId',
  'POST /api/guilds/:guildId/leave',
  'POST /api/guilds/:guildId/members/:membershipId/departure',
];

describe('every route against the access table (real MariaDB)', () => {
  let t: TestApp;
  let s: Awaited<ReturnType<typeof createScenario>>;
  let invitationId: number;

  beforeAll(async () => {
    t = await createTestApp();
    s = await createScenario(t);
    const admin = await signIn(t, s.admin.email);
    const inv = await admin.post(`/api/guilds/${s.guild.id}/invitations`).send({ email: `walk.${s.tag}@test.example` });
    invitationId = inv.body.id;
  });
  afterAll(() => t.close());

  it('has an entry for every registered route, and no stale entries', () => {
    const routes = registeredRoutes(t);
    expect(routes.length).toBeGreaterThan(15);
    expect(routes.filter((r) => !(r in ACCESS))).toEqual([]);
    expect(Object.keys(ACCESS).filter((r) => !routes.includes(r))).toEqual([]);
  });

  it('lets each kind of caller through only where the table says', async () => {
    const callers = {
      signedOut: () => client(t),
      outsider: () => signIn(t, s.outsider.email),
      member: () => signIn(t, s.member.email),
      treasurer: () => signIn(t, s.treasurer.email),
      membershipChair: () => signIn(t, s.membershipChair.email),
      showChair: () => signIn(t, s.showChair.email),
      admin: () => signIn(t, s.admin.email),
    };
    const roleOf: Record<string, string | null> = {
      member: null,
      treasurer: 'treasurer',
      membershipChair: 'membership_chair',
      showChair: 'show_chair',
      admin: 'admin',
    };
    const agents = Object.fromEntries(
      await Promise.all(Object.entries(callers).map(async ([k, f]) => [k, await f()] as const)),
    );
    const failures: string[] = [];
    for (const route of registeredRoutes(t)) {
      const [method, path] = route.split(' ');
      // Mutations get an empty body: guards run before validation, so an allowed caller sees a
      // 400 (nothing written) and a refused one sees 401/403/404 from the guards.
      const url = path
        .replace(':guildId', String(s.guild.id))
        .replace(':membershipId', String(s.member.membership!.id))
        .replace(':invitationId', String(invitationId))
        .replace(':beeId', '999999')
        .replace(':month', '2027-01')
        .replace(':fileId', '1')
        .replace(':checkId', '999999')
        .replace(':planId', '999999')
        .replace(':invoiceId', '999999')
        .replace(':termId', '999999')
        .replace(':kind', 'display')
        .replace(':token', 'no-such-token-000000000000')
        .replace(':id', 'none')
        .replace('/*', '/index.html');
      if (STATE_CHANGING.includes(route)) continue;
      const access = ACCESS[route];
      for (const [who, agent] of Object.entries(agents)) {
        const res = await (agent as ReturnType<typeof client>)[method.toLowerCase() as 'get'](url).send({});
        let expected: 'allowed' | 401 | 403 | 404;
        if (access === 'public') expected = 'allowed';
        else if (who === 'signedOut') expected = 401;
        else if (access === 'signed-in') expected = 'allowed';
        else if (who === 'outsider') expected = 404;
        else if (access === 'member') expected = 'allowed';
        else expected = roleOf[who] === 'admin' || access.includes(roleOf[who] as never) ? 'allowed' : 403;
        const ok =
          expected === 'allowed'
            ? ![401, 403].includes(res.status) && !(res.status === 404 && /not a member/.test(res.body?.message ?? ''))
            : res.status === expected;
        if (!ok) failures.push(`${route} as ${who}: got ${res.status}, expected ${expected}`);
      }
    }
    expect(failures).toEqual([]);
  });

  it('checks sign-out and withdrawing an invitation separately, since they change state', async () => {
    expect((await client(t).post('/api/auth/sign-out')).status).toBe(401);
    const url = `/api/guilds/${s.guild.id}/invitations/${invitationId}`;
    expect((await client(t).delete(url)).status).toBe(401);
    expect((await (await signIn(t, s.outsider.email)).delete(url)).status).toBe(404);
    expect((await (await signIn(t, s.treasurer.email)).delete(url)).status).toBe(403);
    expect((await (await signIn(t, s.member.email)).delete(url)).status).toBe(403);
    expect(await t.orm.em.fork().count(Invitation, { id: invitationId, revokedAt: null })).toBe(1);
    expect((await (await signIn(t, s.membershipChair.email)).delete(url)).status).toBe(204);
    const signedIn = await signIn(t, s.member.email);
    expect((await signedIn.post('/api/auth/sign-out')).status).toBe(204);
  });

  it('checks leaving and recording a departure separately, since they change state', async () => {
    const leave = `/api/guilds/${s.guild.id}/leave`;
    const departure = `/api/guilds/${s.guild.id}/members/${s.member.membership!.id}/departure`;
    expect((await client(t).post(leave).send({})).status).toBe(401);
    expect((await client(t).post(departure).send({})).status).toBe(401);
    expect((await (await signIn(t, s.outsider.email)).post(leave).send({})).status).toBe(404);
    expect((await (await signIn(t, s.outsider.email)).post(departure).send({})).status).toBe(404);
    for (const who of [s.member, s.treasurer, s.showChair]) expect((await (await signIn(t, who.email)).post(departure).send({})).status).toBe(403);
    expect((await t.orm.em.fork().findOneOrFail(Membership, { id: s.member.membership!.id })).status).toBe('active');
    expect((await (await signIn(t, s.membershipChair.email)).post(departure).send({})).status).toBe(200);
    expect((await (await signIn(t, s.member.email)).post(leave).send({})).status).toBe(404);
  });

  it('treats a guild id that is not a number like any guild she is not in', async () => {
    const member = await signIn(t, s.member.email);
    for (const id of ['abc', '-1', '1.5', '99999999999', '0']) {
      const res = await member.get(`/api/guilds/${id}/members`);
      expect(res.status).toBe(404);
    }
    expect((await request(t.http).get('/api/guilds/abc/members')).status).toBe(401);
  });
});
