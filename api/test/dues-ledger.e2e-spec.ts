import { parse } from 'csv-parse/sync';
import { DuesInvoice } from '../src/dues/dues-invoice.entity';
import { DuesRefund } from '../src/dues/dues-refund.entity';
import { todayIn } from '../src/dues/dues-rules';
import { Membership } from '../src/guilds/membership.entity';
import { User } from '../src/users/user.entity';
import {
  createScenario,
  createTestApp,
  eventually,
  signIn,
  startPaymentsHarness,
  unique,
  waitForMail,
  type PaymentsHarness,
  type TestApp,
  pdfText,
} from './helpers';

type Agent = Awaited<ReturnType<typeof signIn>>;

const SETTINGS = { yearStartMonth: 1, dueMonth: 1, dueDay: 1, graceDays: 31, lateFeeCents: 500, earlyRenewalDays: 0, proration: [] };


describe("dues: the treasurer's ledger — cash, cheques, households, receipt numbers (real MariaDB)", () => {
  let h: PaymentsHarness;
  let t: TestApp;
  let s: Awaited<ReturnType<typeof createScenario>>;
  let treasurer: Agent;
  let url: string;
  let year: number;
  let today: string;
  const plans: Record<string, number> = {};
  const db = () => t.orm.em.fork();

  async function setUpGuild(agent: Agent, guildId: number) {
    expect((await agent.put(`/api/guilds/${guildId}/dues/settings`).send(SETTINGS)).status).toBe(200);
    const made: Record<string, number> = {};
    for (const body of [
      { name: 'Regular', kind: 'standard', yearlyCents: 3000 },
      { name: 'Household', kind: 'household', yearlyCents: 4500 },
      { name: 'Honorary', kind: 'honorary', yearlyCents: 0 },
    ]) {
      const res = await agent.post(`/api/guilds/${guildId}/dues/plans`).send(body);
      expect(res.status).toBe(201);
      made[body.name] = res.body.id;
    }
    return made;
  }

  beforeAll(async () => {
    h = await startPaymentsHarness();
    t = await createTestApp();
    h.attach(t);
    s = await createScenario(t);
    treasurer = await signIn(t, s.treasurer.email);
    url = `/api/guilds/${s.guild.id}/dues`;
    today = todayIn(s.guild.timeZone);
    year = Number(today.slice(0, 4));
    Object.assign(plans, await setUpGuild(treasurer, s.guild.id));
  });
  afterAll(async () => {
    await h.close();
    await t.close();
  });

  const cash = (over: Record<string, unknown> = {}) => ({
    membershipId: s.member.membership!.id,
    planId: plans.Regular,
    method: 'cash',
    amountCents: 3000,
    receivedOn: today,
    ...over,
  });

  it('refuses bad cash and cheque entries with a clear 4xx, recording nothing', async () => {
    const outsider = await signIn(t, s.outsider.email);
    const foreignPlan = await outsider.post(`/api/guilds/${s.otherGuild.id}/dues/plans`).send({ name: 'Theirs', kind: 'standard', yearlyCents: 2500 });
    const cases: [Record<string, unknown>, number, string | RegExp][] = [
      [{ amountCents: 0 }, 400, 'amountCents'],
      [{ amountCents: -3000 }, 400, 'amountCents'],
      [{ amountCents: 30.5 }, 400, 'amountCents'],
      [{ amountCents: '30.00' }, 400, 'amountCents'],
      [{ method: 'card' }, 400, 'method'],
      [{ method: 'cheque' }, 400, 'chequeNumber'],
      [{ method: 'cheque', chequeNumber: '  ' }, 400, 'chequeNumber'],
      [{ receivedOn: `${year}-02-30` }, 400, 'receivedOn'],
      [{ receivedOn: '31/12/2026' }, 400, 'receivedOn'],
      [{ receivedOn: `${year + 1}-12-31` }, 400, 'receivedOn'],
      [{ membershipId: s.outsider.membership!.id }, 404, /not in this guild/],
      [{ planId: foreignPlan.body.id }, 404, /No such plan/],
      [{ planId: plans.Honorary }, 409, /pay no dues/],
      [{ planId: plans.Household }, 409, /not in a household/],
      [{ surprise: true }, 400, 'surprise'],
    ];
    for (const [over, status, expected] of cases) {
      const res = await treasurer.post(`${url}/payments`).send(cash(over));
      expect([over, res.status]).toEqual([over, status]);
      if (typeof expected === 'string') expect(Object.keys(res.body.errors ?? {})).toContain(expected);
      else expect(res.body.message).toMatch(expected);
    }
    const member = await signIn(t, s.member.email);
    expect((await member.post(`${url}/payments`).send(cash())).status).toBe(403);
    expect(await db().count(DuesInvoice, { guild: s.guild.id })).toBe(0);
  });

  it('records cash with a receipt number, an e-mail and a PDF; refunds cash by hand', async () => {
    const res = await treasurer.post(`${url}/payments`).send(cash());
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ invoiceId: res.body.id, status: 'paid', method: 'cash', receiptNumber: `${year}-0001`, totalCents: 3000, paidOn: today, memberName: s.member.user.name });
    const mail = await waitForMail(s.member.email, (m) => m.subject.includes(`${year}-0001`));
    const text = pdfText(Buffer.from(mail.attachments![0].contentBase64, 'base64'));
    for (const expected of ['Cash', '$30.00', `No. ${year}-0001`, s.member.user.name]) expect(text).toContain(expected);

    const again = await treasurer.post(`${url}/payments`).send(cash());
    expect(again.status).toBe(409);
    expect(again.body.message).toBe(`${s.member.user.name}'s dues are paid through 31 December ${year}. Renewal for ${year + 1} opens on 1 January ${year + 1}.`);

    const part = await treasurer.post(`${url}/invoices/${res.body.id}/refunds`).send({ amountCents: 1000, reason: 'Paid twice by mistake' });
    expect(part.status).toBe(201);
    expect(part.body).toMatchObject({ status: 'partially_refunded', refundedCents: 1000 });
    const refunds = await db().find(DuesRefund, { guild: s.guild.id });
    expect(refunds).toEqual([expect.objectContaining({ amountCents: 1000, providerRefundId: null, reason: 'Paid twice by mistake' })]);
  });

  it('records a cheque for less than is due as an adjustment the receipt shows', async () => {
    const res = await treasurer
      .post(`${url}/payments`)
      .send(cash({ membershipId: s.showChair.membership!.id, method: 'cheque', chequeNumber: '311', amountCents: 2500 }));
    expect(res.status).toBe(201);
    expect(res.body).toMatchObject({ method: 'cheque', chequeNumber: '311', totalCents: 2500, receiptNumber: `${year}-0002` });
    expect(res.body.lines).toEqual([
      expect.objectContaining({ kind: 'dues', amountCents: 3000 }),
      { kind: 'adjustment', label: 'Paid under the amount due', amountCents: -500 },
    ]);
    const pdf = await treasurer.get(`${url}/invoices/${res.body.id}/receipt.pdf`).buffer(true).parse((r, cb) => {
      const chunks: Buffer[] = [];
      r.on('data', (c: Buffer) => chunks.push(c));
      r.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    const text = pdfText(pdf.body as Buffer);
    expect(text).toContain('Cheque no. 311');
    expect(text).toContain('$25.00');
    expect(text).toContain('-$5.00');
  });

  it('lets one household payment cover everyone in the household', async () => {
    const home = await treasurer.post(`${url}/households`).send({ name: 'Bobbin Lane household' });
    expect(home.status).toBe(201);
    expect((await treasurer.post(`${url}/households`).send({ name: 'Bobbin Lane household' })).status).toBe(409);
    for (const p of [s.admin, s.membershipChair]) {
      const res = await treasurer.patch(`${url}/members/${p.membership!.id}`).send({ householdId: home.body.id });
      expect(res.status).toBe(200);
      expect(res.body.household).toEqual({ id: home.body.id, name: 'Bobbin Lane household' });
    }
    expect((await treasurer.patch(`${url}/members/${s.admin.membership!.id}`).send({ householdId: 999999 })).status).toBe(400);
    expect((await treasurer.patch(`${url}/members/${s.outsider.membership!.id}`).send({ householdId: null })).status).toBe(404);
    const paid = await treasurer.post(`${url}/payments`).send(cash({ membershipId: s.admin.membership!.id, planId: plans.Household, amountCents: 4500 }));
    expect(paid.status).toBe(201);
    const roster = await treasurer.get(`${url}/roster`);
    const row = (id: number) => roster.body.find((r: { membershipId: number }) => r.membershipId === id);
    for (const p of [s.admin, s.membershipChair])
      expect(row(p.membership!.id)).toMatchObject({ status: 'current', paidThrough: `${year}-12-31`, plan: { name: 'Household' } });
    expect(row(s.member.membership!.id)).toMatchObject({ status: 'current', plan: { name: 'Regular' } });
    expect(row(s.treasurer.membership!.id)).toMatchObject({ status: 'lapsed', paidThrough: null, plan: null });
    const chair = await signIn(t, s.membershipChair.email);
    const me = await chair.get(`${url}/me`);
    expect(me.body.household.members.sort()).toEqual([s.admin.user.name, s.membershipChair.user.name].sort());
    expect(me.body.history).toEqual([]);
    const households = await treasurer.get(`${url}/households`);
    expect(households.body[0].members).toHaveLength(2);
  });

  it('lists the ledger and the roster for the treasurer, as JSON and CSV', async () => {
    const ledger = await treasurer.get(`${url}/ledger`);
    expect(ledger.status).toBe(200);
    expect(ledger.body.rows.map((r: { receiptNumber: string }) => r.receiptNumber)).toEqual([`${year}-0003`, `${year}-0002`, `${year}-0001`]);
    expect(ledger.body.rows[2]).toMatchObject({ grossCents: 3000, feeCents: 0, refundedCents: 1000, netCents: 2000, method: 'cash', status: 'partially_refunded' });
    expect(ledger.body.rows[1]).toMatchObject({ grossCents: 2500, reference: 'Cheque no. 311' });
    expect(ledger.body.totals).toEqual({ count: 3, grossCents: 10000, feeCents: 0, refundedCents: 1000, netCents: 9000 });
    expect(ledger.body.years).toEqual([String(year)]);
    const cheques = await treasurer.get(`${url}/ledger?method=cheque&year=${year}`);
    expect(cheques.body.rows).toHaveLength(1);
    expect((await treasurer.get(`${url}/ledger?status=nonsense`)).status).toBe(400);

    const csv = await treasurer.get(`${url}/ledger.csv?year=${year}`);
    expect(csv.status).toBe(200);
    expect(csv.headers['content-type']).toMatch(/^text\/csv/);
    expect(csv.headers['content-disposition']).toBe(`attachment; filename="ledger-${year}.csv"`);
    // Read back with a maintained CSV parser, as a spreadsheet would (UTF-8 with a byte-order mark).
    expect(csv.text.startsWith('\uFEFF')).toBe(true);
    const table: string[][] = parse(csv.text, { bom: true });
    expect(table[0]).toEqual(['Receipt', 'Paid on', 'Member', 'Plan', 'Year', 'Status', 'Method', 'Reference', 'Invoiced', 'Received', 'Fee', 'Refunded', 'Net', 'Currency', 'Invoice', 'Issued on']);
    expect(table).toHaveLength(4);
    expect(table[2].slice(7, 14)).toEqual(['Cheque no. 311', '25.00', '25.00', '0.00', '0.00', '25.00', 'USD']);

    const behind = await treasurer.get(`${url}/roster?status=grace,lapsed`);
    expect(behind.status).toBe(200);
    expect(behind.body.map((r: { name: string }) => r.name)).toEqual([s.treasurer.user.name]);
    expect(behind.body[0]).toMatchObject({ email: s.treasurer.email, planName: null, status: 'lapsed', paidThrough: null });
    expect((await treasurer.get(`${url}/roster?status=late`)).status).toBe(400);
    const rosterCsv = await treasurer.get(`${url}/roster.csv`);
    expect(rosterCsv.text).toContain(`${s.admin.user.name},${s.admin.email},Household,Bobbin Lane household,current,`);

    const member = await signIn(t, s.member.email);
    for (const path of ['ledger', 'ledger.csv', 'roster', 'roster.csv']) expect((await member.get(`${url}/${path}`)).status).toBe(403);
  });

  it("adds up the year-end report by month and plan, as a page, a CSV and a PDF", async () => {
    const report = await treasurer.get(`${url}/report?year=${year}`);
    expect(report.status).toBe(200);
    // The three entries above: cash 30.00 (10.00 refunded), a 25.00 cheque, a 45.00 household payment; no card fees.
    expect(report.body.totals).toEqual({ count: 3, grossCents: 10000, feeCents: 0, refundedCents: 1000, netCents: 9000 });
    expect(report.body.incomeByMonth).toHaveLength(12);
    const month = report.body.incomeByMonth.find((m: { month: string }) => m.month === today.slice(0, 7));
    expect(month).toEqual({ month: today.slice(0, 7), count: 3, grossCents: 10000, feeCents: 0, refundedCents: 1000, netCents: 9000 });
    expect(report.body.incomeByPlan.map((p: { planName: string; grossCents: number }) => [p.planName, p.grossCents])).toEqual([
      ['Household', 4500],
      ['Regular', 5500],
    ].sort((a, b) => (b[1] as number) - (a[1] as number)));
    const byStatus = report.body.membersByStatus;
    expect(Object.keys(byStatus).sort()).toEqual(['current', 'grace', 'honorary', 'lapsed', 'lifetime']);
    expect(Object.values(byStatus).reduce((a: number, b) => a + (b as number), 0)).toBe((await treasurer.get(`${url}/roster`)).body.length);

    const csv = await treasurer.get(`${url}/report.csv?year=${year}`);
    expect(csv.status).toBe(200);
    const rows: string[][] = parse(csv.text, { bom: true });
    expect(rows[0]).toEqual(['Section', 'Month or plan', 'Payments', 'Received', 'Fees', 'Refunded', 'Net', 'Currency']);
    expect(rows.find((r) => r[0] === 'Total')!.slice(2, 8)).toEqual(['3', '100.00', '0.00', '10.00', '90.00', 'USD']);

    const pdf = await treasurer.get(`${url}/report.pdf?year=${year}`).buffer(true).parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => done(null, Buffer.concat(chunks)));
    });
    expect(pdf.status).toBe(200);
    const text = pdfText(pdf.body as Buffer);
    expect(text).toContain(`Dues report for ${year}`);
    expect(text).toMatch(/Total\s+3\s+\$100\.00\s+\$0\.00\s+\$10\.00\s+\$90\.00/);

    expect((await treasurer.get(`${url}/report?year=last%20year`)).status).toBe(400);
    const member = await signIn(t, s.member.email);
    for (const path of ['report', 'report.csv', 'report.pdf']) expect((await member.get(`${url}/${path}`)).status).toBe(403);
  });

  it('gives ten payments at once receipt numbers 1 to 10, no gaps and no repeats', async () => {
    const g = await createScenario(t);
    const gTreasurer = await signIn(t, g.treasurer.email);
    const gPlans = await setUpGuild(gTreasurer, g.guild.id);
    const em = db();
    const extra: Membership[] = [];
    for (let i = 0; i < 7; i++) {
      const user = em.create(User, { email: `${unique('payer')}@test.example`, name: `Payer ${i}`, passwordHash: 'x' });
      extra.push(em.create(Membership, { user, guild: g.guild.id, roles: [] }));
    }
    await em.flush();
    const base = `/api/guilds/${g.guild.id}/dues`;
    // Three members start card payments, seven pay cash; all ten land at the same moment.
    const payers = [g.member, g.admin, g.showChair];
    const sessions: string[] = [];
    for (const p of payers) {
      const agent = await signIn(t, p.email);
      const res = await agent.post(`${base}/checkout`).send({ planId: gPlans.Regular });
      expect(res.status).toBe(201);
      sessions.push(res.body.url.split('/pay/')[1]);
    }
    const results = await Promise.all([
      ...sessions.map((id) => h.pay(id)),
      ...extra.map((m) =>
        gTreasurer.post(`${base}/payments`).send({ membershipId: m.id, planId: gPlans.Regular, method: 'cash', amountCents: 3000, receivedOn: today }),
      ),
    ]);
    expect(results.map((r) => r.status).sort()).toEqual([200, 200, 200, 201, 201, 201, 201, 201, 201, 201]);
    const numbers = await eventually(async () => {
      const rows = await db().find(DuesInvoice, { guild: g.guild.id, status: 'paid' });
      return rows.length === 10 ? rows.map((r) => r.receiptNumber!).sort() : undefined;
    }, 30_000, 'ten paid invoices');
    expect(numbers).toEqual(Array.from({ length: 10 }, (_, i) => `${year}-${String(i + 1).padStart(4, '0')}`));
    const counter = await db().execute('SELECT next_number FROM dues_receipt_counters WHERE guild_id = ? AND year = ?', [g.guild.id, year]);
    expect(Number(counter[0].next_number)).toBe(11);
  });
});
