import { createScenario, createTestApp, signIn, type TestApp } from './helpers';

/** Each member chooses what the directory shows other members; roster officers see what their office needs. */
describe('member directory privacy', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('shows members only the details each person chose, and officers all of them', async () => {
    const s = await createScenario(t);
    const member = await signIn(t, s.member.email);
    const treasurer = await signIn(t, s.treasurer.email);
    const chair = await signIn(t, s.membershipChair.email);
    const url = `/api/guilds/${s.guild.id}/members`;
    expect((await member.get('/api/profile/directory').expect(200)).body).toEqual({ phone: null, town: null, showEmail: false, showPhone: false, showTown: false });
    await member.put('/api/profile/directory').send({ phone: '+1 (555) 014-2000', town: 'Wrenfield', showEmail: false, showPhone: true, showTown: false }).expect(200);

    const seenBy = async (agent: typeof member) => (await agent.get(url).expect(200)).body.find((r: { membershipId: number }) => r.membershipId === s.member.membership!.id);
    // Another member (the treasurer holds no roster office): the phone only.
    expect(await seenBy(treasurer)).toEqual({ membershipId: s.member.membership!.id, name: s.member.user.name, roles: [], phone: '+1 (555) 014-2000' });
    // The membership chair keeps the roster: everything.
    expect(await seenBy(chair)).toMatchObject({ email: s.member.email, phone: '+1 (555) 014-2000', town: 'Wrenfield', status: 'active' });
    // Nobody shows anything by default.
    const someoneElse = (await member.get(url).expect(200)).body.find((r: { membershipId: number }) => r.membershipId === s.treasurer.membership!.id);
    expect(Object.keys(someoneElse).sort()).toEqual(['membershipId', 'name', 'roles']);

    await member.put('/api/profile/directory').send({ phone: null, town: '', showEmail: true, showPhone: true, showTown: true }).expect(200);
    expect(await seenBy(treasurer)).toEqual({ membershipId: s.member.membership!.id, name: s.member.user.name, roles: [], email: s.member.email });
  });

  it('refuses a phone number that is not one, and half-filled choices', async () => {
    const s = await createScenario(t);
    const member = await signIn(t, s.member.email);
    const bad = await member.put('/api/profile/directory').send({ phone: 'call me maybe', showEmail: true, showPhone: 'yes' }).expect(400);
    expect(Object.keys(bad.body.errors).sort()).toEqual(['phone', 'showPhone', 'showTown']);
    expect((await member.get('/api/profile/directory').expect(200)).body.phone).toBeNull();
  });
});
