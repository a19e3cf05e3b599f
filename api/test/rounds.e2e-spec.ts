import ICAL from 'ical.js';
import request from 'supertest';
import { monthsFrom } from '../src/bees/rotation';
import { OutboxMessage } from '../src/outbox/outbox-message.entity';
import { BeesScheduler, CHANGE_BATCH_MS } from '../src/rounds/bees-scheduler.service';
import { RoundMailer } from '../src/rounds/round-mailer.service';
import { Round } from '../src/rounds/round.entity';
import { createBee, roundInput, type BeeSetup, type Scenario } from './bees-helpers';
import { client, createScenario, createTestApp, signIn, TestApp, waitForMail } from './helpers';

const DAY = 24 * 60 * 60 * 1000;

describe('bee rounds: the queen sets it, the job sends it once, makers track it (real MariaDB)', () => {
  let a: TestApp;
  let b: TestApp;
  let s: Scenario;
  let bee: BeeSetup;
  let url: (month: string) => string;

  beforeAll(async () => {
    a = await createTestApp();
    b = await createTestApp();
    s = await createScenario(a);
    bee = await createBee(a, s);
    url = (month) => `/api/guilds/${s.guild.id}/bees/${bee.beeId}/rounds/${month}`;
  });
  afterAll(async () => {
    await a.close();
    await b.close();
  });

  const queenAgent = (month: string) => bee.agents.get(bee.queenOf(month))!;
  const outboxFor = (roundId: number, template = 'round-assignment') =>
    a.orm.em.fork().find(OutboxMessage, { template, idempotencyKey: { $like: `${template}:${roundId}:%` } });

  it('lets only the month\'s queen or the organiser set the round', async () => {
    const month = bee.next;
    const makerId = bee.makersOf(month).find((id) => id !== s.member.membership!.id)!;
    const maker = bee.agents.get(makerId)!;
    const refused = await maker.put(url(month)).send(roundInput({ dueDate: `${monthsFrom(month, 2)[1]}-15` }));
    expect(refused.status).toBe(403);
    expect(refused.body.message).toMatch(/queen or the bee's organiser/);
    const outsider = await signIn(a, s.outsider.email);
    expect((await outsider.put(url(month)).send(roundInput())).status).toBe(404);
  });

  it('computes the unfinished size from the finished size and seam allowance', async () => {
    const month = bee.next;
    const res = await queenAgent(month)
      .put(url(month))
      .send(roundInput({ finishedWidth: '12', finishedHeight: '6 1/2', seamAllowance: '1/4', dueDate: `${monthsFrom(month, 2)[1]}-15` }));
    expect(res.status).toBe(200);
    // TRADE.md §1.1 (S1, S3): unfinished = finished + 1/2 inch for a 1/4 inch seam allowance.
    expect(res.body.round.finished).toMatchObject({ widthText: '12', heightText: '6 1/2', widthMm: 304.8 });
    expect(res.body.round.unfinished).toMatchObject({ widthText: '12 1/2', heightText: '7', widthMm: 317.5 });
    expect(res.body.round.instructionsHtml).toContain('<strong>bright</strong>');
    expect(res.body.round.status).toBe('draft');
  });

  it('refuses bad sizes, dates and files with messages keyed by field, saving nothing', async () => {
    const month = bee.next;
    const q = queenAgent(month);
    const cases: [Record<string, unknown>, string, RegExp][] = [
      [{ dueDate: `${month}-01` }, 'dueDate', /must come after/],
      [{ finishedWidth: '0' }, 'finishedWidth', /more than 0/],
      [{ finishedWidth: '-12' }, 'finishedWidth', /./],
      [{ finishedHeight: '12 1/' }, 'finishedHeight', /Could not read/],
      [{ tolerance: '3/8' }, 'tolerance', /cannot be larger than the seam allowance/],
      [{ dueDate: '2027-02-30' }, 'dueDate', /does not exist/],
      [{ swatches: [{ name: 'Red', hex: 'red' }] }, 'swatches.0.hex', /colour picker/],
      [{ deliveryAddress: '' }, 'deliveryAddress', /address/],
    ];
    for (const [override, field, message] of cases) {
      const res = await q.put(url(month)).send(roundInput({ dueDate: `${monthsFrom(month, 2)[1]}-15`, ...override }));
      expect(res.status).toBe(400);
      expect(res.body.errors[field]?.join(' ')).toMatch(message);
    }
    const round = await a.orm.em.fork().findOneOrFail(Round, { bee: bee.beeId, month });
    expect(round.title).toBe('Test star');
    const html = await q.post(`${url(month)}/files`).attach('file', Buffer.from('<html><script>alert(1)</script></html>'), 'pattern.pdf');
    expect(html.status).toBe(415);
    expect(html.body.message).toMatch(/not a PDF or an image/);
    const pdf = await q.post(`${url(month)}/files`).attach('file', Buffer.from('%PDF-1.4\n1 0 obj\n<<>>\nendobj\n%%EOF\n'), 'geese.pdf');
    expect(pdf.status).toBe(201);
    const fetched = await q.get(`${url(month)}/files/${pdf.body.id}`);
    expect(fetched.status).toBe(200);
    expect(fetched.headers['content-type']).toBe('application/pdf');
    expect(fetched.headers['x-content-type-options']).toBe('nosniff');
  });

  it('sends the round once per maker when two api instances run the same tick, with a valid .ics', async () => {
    const month = bee.next;
    const q = queenAgent(month);
    const published = await q.post(`${url(month)}/publish`).send({});
    expect(published.status).toBe(200);
    const round = await a.orm.em.fork().findOneOrFail(Round, { bee: bee.beeId, month });
    expect(round.sentAt).toBeNull(); // its send date has not come
    const at = new Date(round.sendAt.getTime() + 60_000);
    const reports = await Promise.all([a.app.get(BeesScheduler).tick(at), b.app.get(BeesScheduler).tick(at)]);
    // One instance held the named lock; the other skipped, or ran after and found nothing to do.
    expect(reports.reduce((n, r) => n + (r?.sent ?? 0), 0)).toBe(bee.makersOf(month).length);
    const rows = await outboxFor(round.id);
    expect(rows.map((r) => r.toAddress).sort()).toEqual(bee.makersOf(month).map((id) => bee.emails.get(id)!).sort());

    for (const id of bee.makersOf(month)) {
      const mail = await waitForMail(bee.emails.get(id)!, (m) => m.subject.includes('Test star'));
      expect(mail.text).toMatch(/finished/i);
      expect(mail.text).toMatch(/12 1\/2 x 7 inches/);
      expect(mail.html).toContain('Marigold');
      const ics = (mail as unknown as { attachments: { filename: string; contentBase64: string }[] }).attachments.find((x) =>
        x.filename.endsWith('.ics'),
      )!;
      // Parsed with ical.js, a maintained iCalendar (RFC 5545) parser.
      const vevent = new ICAL.Component(ICAL.parse(Buffer.from(ics.contentBase64, 'base64').toString('utf8'))).getFirstSubcomponent('vevent')!;
      const event = new ICAL.Event(vevent);
      expect(event.startDate.isDate).toBe(true);
      expect(event.startDate.toString()).toBe(round.dueDate);
      expect(event.summary).toContain('Test star');
    }
    // A later tick finds nothing more to send.
    const again = await a.app.get(BeesScheduler).tick(new Date(at.getTime() + 60_000));
    expect(again?.sent).toBe(0);
    expect(await outboxFor(round.id)).toHaveLength(bee.makersOf(month).length);
  });

  it('starts again from nothing when the sender dies half-way, and still sends each maker one e-mail', async () => {
    const month = monthsFrom(bee.current, 3)[2];
    const q = queenAgent(month);
    expect((await q.put(url(month)).send(roundInput({ title: 'Crash test', dueDate: `${monthsFrom(month, 2)[1]}-15` }))).status).toBe(200);
    expect((await q.post(`${url(month)}/publish`).send({})).status).toBe(200);
    const round = await a.orm.em.fork().findOneOrFail(Round, { bee: bee.beeId, month });
    const mailer = a.app.get(RoundMailer);
    mailer.afterEachQueued = (i) => {
      if (i === 1) throw new Error('sender killed');
    };
    const at = new Date(round.sendAt.getTime() + 1000);
    await expect(a.app.get(BeesScheduler).tick(at)).rejects.toThrow('sender killed');
    expect(await outboxFor(round.id)).toHaveLength(0);
    expect((await a.orm.em.fork().findOneOrFail(Round, { id: round.id })).sentAt).toBeNull();
    mailer.afterEachQueued = undefined;
    const report = await b.app.get(BeesScheduler).tick(at);
    expect(report?.sent).toBe(bee.makersOf(month).length);
    const rows = await outboxFor(round.id);
    expect(new Set(rows.map((r) => r.toAddress)).size).toBe(rows.length);
    expect(rows).toHaveLength(bee.makersOf(month).length);
  });

  it('reminds the queen 7 and 2 days before her send date while the round is unpublished', async () => {
    const month = monthsFrom(bee.current, 5)[4];
    const queenId = bee.queenOf(month);
    const view = await bee.organiser.get(url(month));
    const sendAt = new Date(view.body.defaultSendAt);
    const scheduler = a.app.get(BeesScheduler);
    await scheduler.tick(new Date(sendAt.getTime() - 8 * DAY));
    const keys = async () =>
      (await a.orm.em.fork().find(OutboxMessage, { idempotencyKey: { $like: `round-reminder:${bee.beeId}:${month}:%` } })).map(
        (m) => m.idempotencyKey,
      );
    expect(await keys()).toEqual([]);
    await scheduler.tick(new Date(sendAt.getTime() - 6 * DAY));
    await scheduler.tick(new Date(sendAt.getTime() - 5 * DAY));
    const organiserId = s.member.membership!.id;
    const expected7 = [...new Set([queenId, organiserId])].map((id) => `round-reminder:${bee.beeId}:${month}:7:${id}`);
    expect((await keys()).sort()).toEqual(expected7.sort());
    await scheduler.tick(new Date(sendAt.getTime() - 1 * DAY));
    expect(await keys()).toHaveLength(expected7.length * 2);
    // Published: no more reminders, and since its time has passed it goes at once.
    const q = queenAgent(month);
    await q.put(url(month)).send(roundInput({ title: 'Late queen', dueDate: `${monthsFrom(month, 2)[1]}-15` }));
    expect((await q.post(`${url(month)}/publish`).send({})).status).toBe(200);
    const report = await scheduler.tick(new Date(sendAt.getTime() + DAY));
    expect(report?.sent).toBe(bee.makersOf(month).length);
    expect(await keys()).toHaveLength(expected7.length * 2);
  });

  it('reminds makers a week before the due date, except those whose block is on its way', async () => {
    const month = bee.next;
    const round = await a.orm.em.fork().findOneOrFail(Round, { bee: bee.beeId, month });
    const [first, second] = bee.makersOf(month);
    expect((await bee.agents.get(first)!.patch(`${url(month)}/blocks/${first}`).send({ status: 'mailed', trackingNumber: 'LZ123' })).status).toBe(200);
    expect((await bee.agents.get(second)!.patch(`${url(month)}/blocks/${second}`).send({ status: 'made' })).status).toBe(200);
    const dueStart = new Date(`${round.dueDate}T12:00:00Z`).getTime();
    await a.app.get(BeesScheduler).tick(new Date(dueStart - 6 * DAY));
    const reminded = await outboxFor(round.id, 'due-reminder');
    expect(reminded.map((r) => r.toAddress).sort()).toEqual(
      bee.makersOf(month).filter((id) => id !== first).map((id) => bee.emails.get(id)!).sort(),
    );
  });

  it('batches edits to a sent round into one "changed" notice after 30 quiet minutes', async () => {
    const month = bee.next;
    const q = queenAgent(month);
    const dueDate = `${monthsFrom(month, 2)[1]}-20`;
    expect((await q.put(url(month)).send(roundInput({ dueDate }))).status).toBe(200);
    expect((await q.put(url(month)).send(roundInput({ dueDate, swatches: [{ name: 'Plum', hex: '#6B3A6B' }] }))).status).toBe(200);
    const round = await a.orm.em.fork().findOneOrFail(Round, { bee: bee.beeId, month });
    expect(round.changedFields).toEqual(expect.arrayContaining(['the due date', 'the colours']));
    const scheduler = a.app.get(BeesScheduler);
    await scheduler.tick(new Date(round.lastEditedAt!.getTime() + CHANGE_BATCH_MS - 60_000));
    expect(await outboxFor(round.id, 'round-changed')).toHaveLength(0);
    await scheduler.tick(new Date(round.lastEditedAt!.getTime() + CHANGE_BATCH_MS + 1000));
    await scheduler.tick(new Date(round.lastEditedAt!.getTime() + CHANGE_BATCH_MS + 120_000));
    const notices = await outboxFor(round.id, 'round-changed');
    expect(notices).toHaveLength(bee.makersOf(month).length);
    expect(notices[0].text).toMatch(/due date/);
  });

  it('tracks blocks: makers mark their own, the queen marks received, the organiser acts on behalf', async () => {
    const month = bee.next;
    const queenId = bee.queenOf(month);
    const [first, second, third] = bee.makersOf(month);
    const own = bee.agents.get(second)!;
    expect((await own.patch(`${url(month)}/blocks/${second}`).send({ status: 'received' })).status).toBe(403);
    expect((await own.patch(`${url(month)}/blocks/${third}`).send({ status: 'made' })).status).toBe(403);
    const received = await bee.agents.get(queenId)!.patch(`${url(month)}/blocks/${first}`).send({ status: 'received' });
    expect(received.status).toBe(200);
    expect(received.body).toMatchObject({ status: 'received', updatedOnBehalf: false });
    if (third !== s.member.membership!.id) {
      const behalf = await bee.organiser.patch(`${url(month)}/blocks/${third}`).send({ status: 'handed_over' });
      expect(behalf.body).toMatchObject({ status: 'handed_over', updatedOnBehalf: true });
    }
    const bad = await own.patch(`${url(month)}/blocks/${second}`).send({ status: 'lost' });
    expect(bad.status).toBe(400);
    const grid = await bee.agents.get(queenId)!.get(url(month));
    expect(grid.body.blocks).toHaveLength(bee.makersOf(month).length);
    const mine = await own.get(url(month));
    expect(mine.body.blocks).toHaveLength(1);
    const dash = await own.get('/api/dashboard');
    expect(dash.body.owed).toEqual(expect.arrayContaining([expect.objectContaining({ beeId: bee.beeId, month, status: 'made' })]));
  });

  it('nudges late makers once a day', async () => {
    const month = bee.next;
    const em = a.orm.em.fork();
    const round = await em.findOneOrFail(Round, { bee: bee.beeId, month });
    round.dueDate = '2020-01-01';
    await em.flush();
    const q = queenAgent(month);
    const first = await q.post(`${url(month)}/nudges`).send({});
    expect(first.status).toBe(200);
    expect(first.body.nudged).toBeGreaterThan(0);
    const again = await q.post(`${url(month)}/nudges`).send({});
    expect(again.body.nudged).toBe(0);
    const maker = bee.agents.get(bee.makersOf(month).find((id) => id !== s.member.membership!.id)!)!;
    expect((await maker.post(`${url(month)}/nudges`).send({})).status).toBe(403);
  });

  it('shows the delivery address to the bee\'s members only', async () => {
    const month = bee.next;
    const inBee = await bee.agents.get(bee.makersOf(month)[0])!.get(url(month));
    expect(inBee.body.round.deliveryAddress).toBe('1 Test Lane\nTestville');
    const other = await createScenario(a);
    // A guild member outside the bee: same guild, different person.
    const em = a.orm.em.fork();
    const { Membership } = await import('../src/guilds/membership.entity');
    em.create(Membership, { user: other.member.user.id, guild: s.guild.id, roles: [] });
    await em.flush();
    const outsiderInGuild = await signIn(a, other.member.email);
    const seen = await outsiderInGuild.get(url(month));
    expect(seen.status).toBe(200);
    expect(seen.body.round.title).toBe('Test star');
    expect(seen.body.round.deliveryAddress).toBeUndefined();
    expect(JSON.stringify(seen.body)).not.toContain('Test Lane');
    expect((await request(a.http).get(url(month))).status).toBe(401);
    expect((await client(a).get(url(month))).status).toBe(401);
  });
});
