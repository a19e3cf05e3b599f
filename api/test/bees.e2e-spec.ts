import { monthsFrom } from '../src/bees/rotation';
import { OutboxMessage } from '../src/outbox/outbox-message.entity';
import { createBee, type BeeSetup, type Scenario } from './bees-helpers';
import { createScenario, createTestApp, signIn, TestApp, waitForMail } from './helpers';

type Rotation = { month: string; skipped: boolean; queen: { membershipId: number } | null; editable: boolean }[];

describe('bees and their rotation (real MariaDB)', () => {
  let t: TestApp;
  let s: Scenario;
  let bee: BeeSetup;
  let base: string;

  beforeAll(async () => {
    t = await createTestApp();
    s = await createScenario(t);
    bee = await createBee(t, s);
    base = `/api/guilds/${s.guild.id}/bees/${bee.beeId}`;
  });
  afterAll(() => t.close());

  const rotation = async (): Promise<Rotation> => (await bee.organiser.get(base)).body.rotation;

  it('e-mails the invitation, and gives every member a month before anyone is queen twice', async () => {
    await waitForMail(s.treasurer.email, (m) => m.subject.includes(`Bee ${s.tag}`));
    const r = await rotation();
    expect(r).toHaveLength(6);
    const queens = r.map((x) => x.queen!.membershipId);
    // Five members, six months: everyone is queen once before anyone is queen twice.
    expect(new Set(queens.slice(0, 5)).size).toBe(5);
    const again = await bee.organiser.post(`${base}/rotation`).send({ mode: 'shuffle', seed: 'test-seed' });
    expect(again.body.rotation.map((x: Rotation[0]) => x.queen!.membershipId)).toEqual(queens); // same seed, same order
  });

  it('skips a month and re-plans the months after it', async () => {
    const month = monthsFrom(bee.current, 4)[3];
    const res = await bee.organiser.post(`${base}/rotation/skip`).send({ month, skipped: true });
    expect(res.status).toBe(200);
    const r: Rotation = res.body.rotation;
    expect(r.find((x) => x.month === month)).toMatchObject({ skipped: true, queen: null });
    expect(r.filter((x) => !x.skipped).every((x) => x.queen)).toBe(true);
    const past = await bee.organiser.post(`${base}/rotation/skip`).send({ month: bee.current, skipped: true });
    expect(past.status).toBe(400);
    const outside = await bee.organiser.post(`${base}/rotation/skip`).send({ month: '2099-01', skipped: true });
    expect(outside.status).toBe(400);
    await bee.organiser.post(`${base}/rotation/skip`).send({ month, skipped: false });
  });

  it('swaps two future months and keeps the swap when someone joins later', async () => {
    const [m2, m3] = [monthsFrom(bee.current, 3)[1], monthsFrom(bee.current, 3)[2]];
    const before = await rotation();
    const q2 = before.find((x) => x.month === m2)!.queen!.membershipId;
    const q3 = before.find((x) => x.month === m3)!.queen!.membershipId;
    const res = await bee.organiser.post(`${base}/rotation/swap`).send({ monthA: m2, monthB: m3 });
    expect(res.status).toBe(200);
    const after: Rotation = res.body.rotation;
    expect(after.find((x) => x.month === m2)!.queen!.membershipId).toBe(q3);
    expect(after.find((x) => x.month === m3)!.queen!.membershipId).toBe(q2);
    const intoThePast = await bee.organiser.post(`${base}/rotation/swap`).send({ monthA: bee.current, monthB: m3 });
    expect(intoThePast.status).toBe(400);
  });

  it('re-plans only future months when a maker leaves', async () => {
    const before = await rotation();
    const leaver = before.find((x) => x.month === monthsFrom(bee.current, 3)[2])!.queen!.membershipId;
    const agent = bee.agents.get(leaver)!;
    if (leaver === s.member.membership!.id) return; // the organiser cannot leave; covered below
    expect((await agent.post(`${base}/leave`).send({})).status).toBe(200);
    const after = await rotation();
    expect(after[0]).toEqual(before[0]); // this month is kept as it was
    expect(after.filter((x) => x.editable).some((x) => x.queen?.membershipId === leaver)).toBe(false);
    expect(after.filter((x) => !x.skipped).every((x) => x.queen)).toBe(true);
    // She can come back only by a new invitation.
    expect((await agent.post(`${base}/join`).send({})).status).toBe(403);
    expect((await bee.organiser.post(`${base}/invitations`).send({ membershipIds: [leaver] })).status).toBe(201);
    expect((await agent.post(`${base}/join`).send({})).status).toBe(200);
  });

  it('keeps organiser powers with the organiser', async () => {
    const someone = bee.agents.get(s.admin.membership!.id)!; // a guild admin, but not the organiser
    expect((await someone.post(`${base}/rotation`).send({ mode: 'shuffle' })).status).toBe(403);
    expect((await someone.post(`${base}/invitations`).send({ membershipIds: [s.member.membership!.id] })).status).toBe(403);
    expect((await someone.patch(base).send({ name: 'Taken over' })).status).toBe(403);
    expect((await bee.organiser.post(`${base}/leave`).send({})).status).toBe(409);
    const outsider = await signIn(t, s.outsider.email);
    expect((await outsider.get(base)).status).toBe(404);
  });

  it('validates the bee form and the hand-set order', async () => {
    const bad = await bee.organiser
      .post(`/api/guilds/${s.guild.id}/bees`)
      .send({ name: '', handover: 'pigeon', startMonth: '2027-13', months: 0 });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.errors).sort()).toEqual(['handover', 'months', 'name', 'startMonth']);
    const wrongOrder = await bee.organiser.post(`${base}/rotation`).send({ mode: 'manual', order: [s.member.membership!.id] });
    expect(wrongOrder.status).toBe(400);
    expect(wrongOrder.body.errors.order[0]).toMatch(/every maker/);
    const foreign = await bee.organiser.post(`${base}/invitations`).send({ membershipIds: [s.outsider.membership!.id] });
    expect(foreign.status).toBe(400);
    expect(await t.orm.em.fork().count(OutboxMessage, { toAddress: s.outsider.email })).toBe(0);
  });

  it('sets the order by hand', async () => {
    const members: number[] = (await bee.organiser.get(base)).body.members
      .filter((m: { status: string }) => m.status === 'active')
      .map((m: { membershipId: number }) => m.membershipId)
      .sort((x: number, y: number) => y - x);
    const res = await bee.organiser.post(`${base}/rotation`).send({ mode: 'manual', order: members });
    expect(res.status).toBe(200);
    const r = res.body.rotation as Rotation;
    const turns = new Map<number, number>();
    for (const x of r) if (x.queen) turns.set(x.queen.membershipId, (turns.get(x.queen.membershipId) ?? 0) + 1);
    // Every maker is queen at least once and nobody more than twice in six months.
    expect([...turns.keys()].sort()).toEqual([...members].sort());
    expect(Math.max(...turns.values())).toBeLessThanOrEqual(2);
    // The first month not yet begun goes to the first of the hand-set order who has not been queen.
    const kept = r.filter((x) => !x.editable).map((x) => x.queen?.membershipId);
    const firstFuture = r.find((x) => x.editable && !x.skipped)!.queen!.membershipId;
    expect(firstFuture).toBe(members.find((id) => !kept.includes(id)));
    expect(res.body.seed).toBeNull();
  });
});
