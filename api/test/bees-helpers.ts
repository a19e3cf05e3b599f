import { monthOf, monthsFrom } from '../src/bees/rotation';
import { createScenario, signIn, TestApp } from './helpers';

export type Scenario = Awaited<ReturnType<typeof createScenario>>;

export interface BeeSetup {
  beeId: number;
  current: string;
  next: string;
  organiser: Awaited<ReturnType<typeof signIn>>;
  agents: Map<number, Awaited<ReturnType<typeof signIn>>>;
  emails: Map<number, string>;
  queenOf: (month: string) => number;
  makersOf: (month: string) => number[];
}

/**
 * A bee in the scenario's guild run through the api as people would: the plain member starts it,
 * invites the officers, they accept, and she shuffles the rotation.
 */
export async function createBee(t: TestApp, s: Scenario, opts: { handover?: 'mail' | 'meeting' } = {}): Promise<BeeSetup> {
  const current = monthOf(new Date(), s.guild.timeZone);
  const people = [s.member, s.admin, s.treasurer, s.membershipChair, s.showChair];
  const agents = new Map<number, Awaited<ReturnType<typeof signIn>>>();
  const emails = new Map<number, string>();
  for (const p of people) {
    agents.set(p.membership!.id, await signIn(t, p.email));
    emails.set(p.membership!.id, p.email);
  }
  const organiser = agents.get(s.member.membership!.id)!;
  const base = `/api/guilds/${s.guild.id}/bees`;
  // The bee began last month, so it already has a month in the past that re-plans must keep.
  const [y, m] = current.split('-').map(Number);
  const previous = m === 1 ? `${y - 1}-12` : `${y}-${String(m - 1).padStart(2, '0')}`;
  const created = await organiser
    .post(base)
    .send({ name: `Bee ${s.tag}`, description: 'Test bee', handover: opts.handover ?? 'mail', startMonth: previous, months: 6 });
  if (created.status !== 201) throw new Error(`create bee: ${created.status} ${JSON.stringify(created.body)}`);
  const beeId = created.body.id as number;
  const others = people.slice(1).map((p) => p.membership!.id);
  const invited = await organiser.post(`${base}/${beeId}/invitations`).send({ membershipIds: others });
  if (invited.status !== 201) throw new Error(`invite: ${invited.status} ${JSON.stringify(invited.body)}`);
  for (const id of others) {
    const joined = await agents.get(id)!.post(`${base}/${beeId}/join`).send({});
    if (joined.status !== 200) throw new Error(`join: ${joined.status} ${JSON.stringify(joined.body)}`);
  }
  const plan = await organiser.post(`${base}/${beeId}/rotation`).send({ mode: 'shuffle', seed: 'test-seed' });
  if (plan.status !== 200) throw new Error(`rotation: ${plan.status} ${JSON.stringify(plan.body)}`);
  const rotation = plan.body.rotation as { month: string; queen: { membershipId: number } | null }[];
  const queenOf = (month: string) => rotation.find((r) => r.month === month)!.queen!.membershipId;
  return {
    beeId,
    current,
    next: monthsFrom(current, 2)[1],
    organiser,
    agents,
    emails,
    queenOf,
    makersOf: (month) => [s.member, s.admin, s.treasurer, s.membershipChair, s.showChair].map((p) => p.membership!.id).filter((id) => id !== queenOf(month)),
  };
}

export function roundInput(overrides: Record<string, unknown> = {}) {
  return {
    title: 'Test star',
    instructions: 'Use **bright** solids.',
    finishedWidth: '12',
    finishedHeight: '12',
    trimMode: 'trim',
    swatches: [
      { name: 'Marigold', hex: '#E8A33D' },
      { name: 'Lagoon', hex: '#2A8C82' },
    ],
    background: { name: 'Cream', hex: '#F6EFD9' },
    fabricSource: 'stash',
    deliveryMethod: 'mail',
    deliveryAddress: '1 Test Lane\nTestville',
    ...overrides,
  };
}
