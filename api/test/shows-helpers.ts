import type TestAgent from 'supertest/lib/agent';
import { Membership } from '../src/guilds/membership.entity';
import { User } from '../src/users/user.entity';
import { hashPassword } from '../src/auth/passwords';
import { PASSWORD, signIn, type TestApp } from './helpers';

/** A show with three categories: medium and large perimeter bands, and a group category (3+ makers). */
export async function setUpShow(chair: TestAgent, guildId: number, overrides: Record<string, unknown> = {}) {
  const show = await chair
    .post(`/api/guilds/${guildId}/shows`)
    .send({ name: 'Harvest Show', venue: 'Grange Hall', startsOn: '2030-05-14', endsOn: '2030-05-15', ...overrides });
  if (show.status !== 201) throw new Error(`show set-up: ${show.status} ${JSON.stringify(show.body)}`);
  const s = show.body.id as number;
  const medium = await chair
    .post(`/api/guilds/${guildId}/shows/${s}/categories`)
    .send({ name: 'Medium', sizeRule: { kind: 'perimeter', minIn: '160', minInclusive: true, maxIn: '240', maxInclusive: true } })
    .expect(201);
  const large = await chair
    .post(`/api/guilds/${guildId}/shows/${s}/categories`)
    .send({ name: 'Large', sizeRule: { kind: 'perimeter', minIn: '240', minInclusive: false, maxIn: '320', maxInclusive: true } })
    .expect(201);
  const group = await chair
    .post(`/api/guilds/${guildId}/shows/${s}/categories`)
    .send({ name: 'Group quilts', judged: false, minMakers: 3 })
    .expect(201);
  return { showId: s, medium: medium.body.id as number, large: large.body.id as number, group: group.body.id as number };
}

/** Enters and accepts a quilt; returns its id. */
export async function acceptedEntry(chair: TestAgent, guildId: number, showId: number, categoryId: number, title: string, size = ['50', '60'], makers = ['A. Maker']) {
  const e = await chair
    .post(`/api/guilds/${guildId}/shows/${showId}/entries`)
    .send({ categoryId, title, widthIn: size[0], heightIn: size[1], makers, quilter: makers[0] })
    .expect(201);
  await chair.post(`/api/guilds/${guildId}/shows/${showId}/entries/${e.body.id}/review`).send({ decision: 'accept' }).expect(200);
  return e.body.id as number;
}

/** `n` more members of the guild, each signed in. */
export async function signedInMembers(t: TestApp, guildId: number, tag: string, n: number) {
  const em = t.orm.em.fork();
  const passwordHash = await hashPassword(PASSWORD);
  const users = Array.from({ length: n }, (_, i) => em.create(User, { email: `voter${i}.${tag}@test.example`, name: `Voter ${i} ${tag}`, passwordHash }));
  for (const user of users) em.create(Membership, { user, guild: guildId, roles: [] });
  await em.flush();
  const agents: TestAgent[] = [];
  for (const u of users) agents.push(await signIn(t, u.email!));
  return agents;
}
