import { client, createScenario, createTestApp, pdfText, signIn, type TestApp } from './helpers';
import { acceptedEntry, setUpShow } from './shows-helpers';

/** A member downloads everything Selvage holds about her, as JSON and as a readable PDF (real MariaDB). */
describe('my data export', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('holds her account, memberships, show entries and the shows she voted in, and nothing of anyone else', async () => {
    const s = await createScenario(t);
    const chair = await signIn(t, s.showChair.email);
    const member = await signIn(t, s.member.email);
    const show = await setUpShow(chair, s.guild.id);
    const base = `/api/guilds/${s.guild.id}/shows/${show.showId}`;
    const mine = await member.post(`${base}/entries`).send({ categoryId: show.medium, title: 'Harbour at Dawn', widthIn: '50', heightIn: '60', makers: ['Me'], story: 'For my sister.' }).expect(201);
    await chair.post(`${base}/entries/${mine.body.id}/review`).send({ decision: 'accept' }).expect(200);
    await acceptedEntry(chair, s.guild.id, show.showId, show.medium, "Someone else's quilt");
    await chair.post(`${base}/voting/open`).expect(200);
    await member.post(`${base}/ballot`).send({ choices: { categories: { [show.medium]: [mine.body.id] } } }).expect(201);
    await member.put('/api/profile/directory').send({ phone: '+1 555 0142', town: 'Wrenfield', showEmail: false, showPhone: true, showTown: false }).expect(200);

    const res = await member.get('/api/profile/export.json').expect(200);
    expect(res.headers['content-disposition']).toContain('attachment');
    const data = res.body;
    expect(data.account).toMatchObject({ email: s.member.email, name: s.member.user.name, phone: '+1 555 0142', town: 'Wrenfield' });
    expect(JSON.stringify(data)).not.toMatch(/password|\$argon2/);
    expect(data.memberships).toEqual([expect.objectContaining({ guild: s.guild.name, status: 'active' })]);
    expect(data.showEntries).toEqual([expect.objectContaining({ show_name: 'Harvest Show', title: 'Harbour at Dawn', category: 'Medium', status: 'accepted', story: 'For my sister.' })]);
    expect(data.showsVotedIn).toEqual([expect.objectContaining({ show_name: 'Harvest Show' })]);
    expect(data.officesHeld).toEqual([]);
    // The treasurer's export lists her office, from the term the guild holds.
    const treasurerAgent = await signIn(t, s.treasurer.email);
    // The scenario wrote her role without a term; her first visit to the guild records one from today.
    await treasurerAgent.get(`/api/guilds/${s.guild.id}`).expect(200);
    const treasurer = (await treasurerAgent.get('/api/profile/export.json').expect(200)).body;
    expect(treasurer.officesHeld).toEqual([expect.objectContaining({ guild: s.guild.name, role: 'treasurer', access_ends_on: null })]);
    expect(JSON.stringify(data)).not.toContain("Someone else's quilt");
    expect(JSON.stringify(data)).not.toContain(s.admin.email);

    const pdf = await member.get('/api/profile/export.pdf').buffer(true).expect(200).expect('content-type', 'application/pdf');
    const text = pdfText(pdf.body as Buffer);
    expect(text).toContain('Everything Selvage holds about you');
    expect(text).toContain('Harbour at Dawn');
    expect(text).toContain(s.member.email);
    expect(text).toContain('stored without any link to the voter');
    expect(text).toContain('Offices you held');

    await client(t).get('/api/profile/export.json').expect(401);
  });
});
