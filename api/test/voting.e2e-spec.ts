import { parse } from 'csv-parse/sync';
import { client, createScenario, createTestApp, pdfText, signIn, type TestApp } from './helpers';
import { acceptedEntry, setUpShow, signedInMembers } from './shows-helpers';

/** The viewer's choice ballot against the real database: members, visitor codes, paper ballots, the count. */
describe('quilt show: the viewer\'s choice ballot', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => {
    await t.close();
  });

  async function world(overrides: Record<string, unknown> = {}) {
    const s = await createScenario(t);
    const chair = await signIn(t, s.showChair.email);
    const member = await signIn(t, s.member.email);
    const g = s.guild.id;
    const show = await setUpShow(chair, g, overrides);
    const base = `/api/guilds/${g}/shows/${show.showId}`;
    const m = [
      await acceptedEntry(chair, g, show.showId, show.medium, 'Cedar Path'),
      await acceptedEntry(chair, g, show.showId, show.medium, 'Lantern Glow'),
      await acceptedEntry(chair, g, show.showId, show.medium, 'River Stones'),
    ];
    const l = [await acceptedEntry(chair, g, show.showId, show.large, 'Night Garden', ['70', '80']), await acceptedEntry(chair, g, show.showId, show.large, 'Orchard Row', ['70', '80'])];
    await chair.post(`${base}/entries/number`).send({ startAt: 1 }).expect(200);
    return { s, chair, member, g, base, ...show, m, l };
  }
  const codesOf = async (showId: number): Promise<string[]> =>
    ((await t.orm.em.fork().execute('SELECT code FROM ballot_codes WHERE show_id = ? ORDER BY id', [showId])) as { code: string }[]).map((r) => r.code);
  const count = async (table: string, showId: number) =>
    Number(((await t.orm.em.fork().execute(`SELECT COUNT(*) AS n FROM ${table} WHERE show_id = ?`, [showId])) as { n: number }[])[0].n);

  it('runs a whole ballot: open, member and visitor votes, paper keying, turnout without standings, close, count, ribbons, publish', async () => {
    const { s, chair, member, base, showId, medium, large, m, l } = await world();
    await member.get(`${base}/ballot`).expect(200);
    await member.post(`${base}/ballot`).send({ choices: { categories: { [medium]: [m[0]] } } }).expect(409);
    await member.post(`${base}/voting/open`).expect(403);
    const opened = await chair.post(`${base}/voting/open`).expect(200);
    expect(opened.body.votingState).toBe('open');
    await chair.post(`${base}/voting/open`).expect(409);
    const kind = await chair.patch(base).send({ votingKind: 'approval' }).expect(409);
    expect(kind.body.message).toContain('can no longer change');
    await chair.post(`${base}/categories`).send({ name: 'Late category' }).expect(409);
    await chair.post(`${base}/entries/${m[0]}/review`).send({ decision: 'decline', reason: 'x' }).expect(409);
    // The numbers are on the hang tags and paper ballots now; entries have closed whatever the dates say.
    const renumber = await chair.patch(`${base}/entries/${m[0]}`).send({ entryNumber: 99 }).expect(409);
    expect(renumber.body.message).toContain('entry numbers stay as they are');
    expect((await chair.patch(`${base}/entries/${m[0]}`).send({ title: 'Corrected title' }).expect(200)).body.title).toBe('Corrected title');
    await chair.patch(`${base}/entries/${m[0]}`).send({ title: 'Cedar Path' }).expect(200);
    expect((await member.get(base).expect(200)).body.entryWindow).toBe('closed');

    const ballot = (await member.get(`${base}/ballot`).expect(200)).body;
    expect(ballot.hasVoted).toBe(false);
    expect(ballot.categories.map((c: { name: string; entries: unknown[] }) => [c.name, c.entries.length])).toEqual([['Medium', 3], ['Large', 2]]);
    expect(ballot.categories[0].entries[0].makers).toBeNull(); // hidden until judging is done
    await member.post(`${base}/ballot`).send({ choices: { categories: { [medium]: [m[0]], [large]: [l[1]] } } }).expect(201);
    const again = await member.post(`${base}/ballot`).send({ choices: { categories: { [medium]: [m[1]] } } }).expect(409);
    expect(again.body.message).toBe('You have already voted in this show. A cast ballot is final.');
    expect((await member.get(`${base}/ballot`).expect(200)).body.hasVoted).toBe(true);

    // Visitor cards: 12 codes, voted by phone and keyed from paper.
    const issued = (await chair.post(`${base}/voting/codes`).send({ count: 12 }).expect(201)).body;
    expect(issued).toEqual({ batch: 1, count: 12, codesIssued: 12 });
    const codes = await codesOf(showId);
    expect(codes).toHaveLength(12);
    const cards = pdfText((await chair.get(`${base}/voting/codes.pdf?batch=1`).buffer(true).expect(200)).body as Buffer);
    for (const c of codes) expect(cards).toContain(`${c.slice(0, 4)}-${c.slice(4, 8)}-${c.slice(8)}`);
    await chair.get(`${base}/voting/codes.pdf?batch=2`).expect(404);
    expect((await chair.get(`${base}/voting/codes`).expect(200)).body.batches).toEqual([expect.objectContaining({ batch: 1, count: 12, used: 0 })]);
    const visitor = client(t);
    const typed = `${codes[0].slice(0, 4).toLowerCase()} ${codes[0].slice(4, 8)}-${codes[0].slice(8)}`;
    const page = (await visitor.get(`/api/public/ballots/${encodeURIComponent(typed)}`).expect(200)).body;
    expect(page.code).toBe(`${codes[0].slice(0, 4)}-${codes[0].slice(4, 8)}-${codes[0].slice(8)}`);
    expect(page.show.guildName).toBe(s.guild.name);
    const votes: [number, number][] = [
      [m[1], l[0]], [m[1], l[0]], [m[1], l[1]], [m[0], l[1]], [m[2], l[0]],
    ];
    for (const [i, [a, b]] of votes.entries())
      await visitor.post(`/api/public/ballots/${codes[i]}`).send({ choices: { categories: { [medium]: [a], [large]: [b] } } }).expect(201);
    const reused = await visitor.post(`/api/public/ballots/${codes[0]}`).send({ choices: { categories: { [medium]: [m[0]] } } }).expect(409);
    expect(reused.body.message).toContain('already been used');
    await visitor.get(`/api/public/ballots/${codes[0]}`).expect(409);
    const unknown = await visitor.get('/api/public/ballots/ZZZZ-ZZZZ-ZZZZ').expect(404);
    expect(unknown.body.message).toContain('We do not know that code');
    await visitor.get('/api/public/ballots/nonsense').expect(404);

    // Paper: the volunteer keys codes 6 and 7; code 1 (voted by phone) is refused as a duplicate.
    await chair.post(`${base}/voting/paper`).send({ code: codes[5].toLowerCase(), choices: { categories: { [medium]: [m[2]] } } }).expect(201);
    const keyed = await chair.post(`${base}/voting/paper`).send({ code: codes[6], choices: { categories: { [large]: [l[1]] } } }).expect(201);
    expect(keyed.body).toMatchObject({ ok: true, ballotsCast: 8 }); // 1 member, 5 phones, 2 paper
    const dupPaper = await chair.post(`${base}/voting/paper`).send({ code: codes[0], choices: { categories: { [medium]: [m[2]] } } }).expect(409);
    expect(dupPaper.body.message).toContain('already voted');
    await chair.post(`${base}/voting/paper`).send({ code: 'bad', choices: {} }).expect(400);

    // During voting: turnout, never standings.
    const turnout = (await chair.get(`${base}/voting/turnout`).expect(200)).body;
    expect(turnout).toMatchObject({ state: 'open', codesIssued: 12, codesUsed: 7, memberBallots: 1, codeBallots: 5, paperBallots: 2, ballotsCast: 8 });
    expect(JSON.stringify(turnout)).not.toMatch(/standings|score|rank/);
    await chair.get(`${base}/results`).expect(409);
    await member.get(`${base}/results`).expect(403);
    await chair.get(`${base}/ballots.csv`).expect(409);

    await member.post(`${base}/voting/close`).expect(403);
    await chair.post(`${base}/voting/close`).expect(200);
    await chair.post(`${base}/voting/close`).expect(409);
    const late = await visitor.post(`/api/public/ballots/${codes[9]}`).send({ choices: { categories: { [medium]: [m[0]] } } }).expect(409);
    expect(late.body.message).toContain('has closed');
    await member.get(`${base}/results`).expect(403);

    // Medium: Lantern Glow 3 (visitors 1–3), Cedar Path 2 (member, visitor 4), River Stones 2 (visitor 5, paper).
    // 3 entries → 1st only (TRADE.md §6.6).
    const r = (await chair.get(`${base}/results`).expect(200)).body;
    const med = r.categories.find((c: { name: string }) => c.name === 'Medium');
    expect(med.standings.map((x: { title: string; score: number; rank: number; ribbon: number | null }) => [x.title, x.score, x.rank, x.ribbon])).toEqual([
      ['Lantern Glow', 3, 1, 1],
      ['Cedar Path', 2, 2, null],
      ['River Stones', 2, 2, null],
    ]);
    expect(med).toMatchObject({ ballots: 8, blank: 1, spoiled: 0, votes: 7 });
    // Large: Night Garden 3, Orchard Row 4 (member, visitor 3, 4, paper).
    const lg = r.categories.find((c: { name: string }) => c.name === 'Large');
    expect(lg.standings.map((x: { title: string; score: number }) => [x.title, x.score])).toEqual([['Orchard Row', 4], ['Night Garden', 3]]);
    expect(r.audit).toMatchObject({ codesIssued: 12, codesUsed: 7, memberBallots: 1, codeBallots: 5, paperBallots: 2, ballotsCast: 8 });
    expect(r.audit.text).toContain('Votes: Medium 7; Large 7.');
    // No voter identity anywhere in the results or the ballot export.
    const ballotsCsv = (await chair.get(`${base}/ballots.csv`).expect(200)).text;
    for (const who of [s.member.user.name, s.member.email, ...codes]) expect(JSON.stringify(r) + ballotsCsv).not.toContain(who);
    // Ids are short numbers that turn up anywhere, so look for the keys that would carry them instead.
    expect(JSON.stringify(r)).not.toMatch(/"(membershipId|userId|voter\w*|code)"\s*:/i);
    expect(ballotsCsv.replace(/^\uFEFF/, '').split(/\r?\n/)[0]).toBe('Ballot,Category,Entry numbers marked');
    const rows = parse(ballotsCsv.replace(/^\uFEFF/, ''), { columns: true }) as Record<string, string>[];
    expect(rows.filter((x) => x.Category === 'Medium')).toHaveLength(7);

    const csv = parse((await chair.get(`${base}/results.csv`).expect(200)).text.replace(/^\uFEFF/, ''), { columns: true }) as Record<string, string>[];
    expect(csv.find((x) => x.Title === 'Lantern Glow')).toMatchObject({ Category: 'Medium', Rank: '1', Votes: '3', Ribbon: '1st' });

    const unpublished = pdfText((await chair.get(`${base}/results.pdf`).buffer(true).expect(200)).body as Buffer);
    expect(unpublished).toContain('keep confidential');
    expect(unpublished).toMatch(/Lantern Glow[^\n]*1st/);
    await chair.post(`${base}/results/publish`).expect(200);
    await chair.post(`${base}/results/publish`).expect(409);
    expect(pdfText((await chair.get(`${base}/results.pdf`).buffer(true).expect(200)).body as Buffer)).not.toContain('keep confidential');
    expect((await member.get(`${base}/results`).expect(200)).body.show.published).toBe(true);
    const pub = (await client(t).get(`/api/public/shows/${showId}/results`).expect(200)).body;
    expect(pub.categories).toHaveLength(2);
  });

  it('refuses ballots that break the rules and writes nothing for them', async () => {
    const { s, chair, member, base, showId, medium, large, group, m, l } = await world();
    const visitor = client(t);
    // Not open yet.
    await chair.post(`${base}/voting/codes`).send({ count: 2 }).expect(201);
    const [code] = await codesOf(showId);
    const early = await visitor.get(`/api/public/ballots/${code}`).expect(409);
    expect(early.body.message).toContain('has not opened yet');
    await chair.post(`${base}/voting/open`).expect(200);

    const tries: [unknown, string][] = [
      [{ categories: { [medium]: [m[0], m[1]] } }, 'Vote for one quilt in Medium; you chose 2.'],
      [{ categories: { [medium]: [l[0]] } }, 'is in Large, not Medium.'],
      [{ categories: { [group]: [m[0]] } }, 'names a category that has no quilts on this ballot'], // no accepted entries, not on the ballot
      [{ categories: { 999999: [m[0]] } }, 'names a category that has no quilts on this ballot'],
      [{ categories: { [medium]: [123456789] } }, "not on this show's ballot"],
      [{ categories: { [medium]: ['x'] } }, 'lists something that is not a quilt'],
      [{ categories: {} }, 'Choose at least one quilt'],
      [{ ranked: [m[0]] }, 'Choose the quilts you vote for in each category.'],
      ['nonsense', 'Choose the quilts you vote for.'],
    ];
    for (const [choices, message] of tries) {
      const res = await member.post(`${base}/ballot`).send({ choices });
      expect([res.status, `${res.body.message} ${JSON.stringify(res.body.errors ?? {})}`]).toEqual([400, expect.stringContaining(message)]);
      const viaCode = await visitor.post(`/api/public/ballots/${code}`).send({ choices });
      expect(viaCode.status).toBe(400);
    }
    // Another show's entry.
    const other = await world();
    await other.chair.post(`${other.base}/voting/open`).expect(200);
    const cross = await other.member.post(`${other.base}/ballot`).send({ choices: { categories: { [other.medium]: [m[0]] } } }).expect(400);
    expect(cross.body.message).toContain("not on this show's ballot");
    await member.post(`${base}/ballot`).send({}).expect(400);
    // Nothing was written: the member and the code can still vote.
    expect(await count('show_ballots', showId)).toBe(0);
    expect(await count('show_voters', showId)).toBe(0);
    await member.post(`${base}/ballot`).send({ choices: { categories: { [medium]: [m[0]] } } }).expect(201);
    await visitor.post(`/api/public/ballots/${code}`).send({ choices: { categories: { [large]: [l[0]] } } }).expect(201);
    expect(await count('show_ballots', showId)).toBe(2);
    expect(s).toBeDefined();
  });

  it('counts approval ballots, settles a tie for 1st by a recorded decision, and keeps the decision off a published result', async () => {
    const { chair, base, showId, medium, m } = await world({ votingKind: 'approval' });
    await chair.post(`${base}/voting/codes`).send({ count: 4 }).expect(201);
    const codes = await codesOf(showId);
    await chair.post(`${base}/voting/open`).expect(200);
    const v = client(t);
    await v.post(`/api/public/ballots/${codes[0]}`).send({ choices: { categories: { [medium]: [m[0], m[1]] } } }).expect(201);
    await v.post(`/api/public/ballots/${codes[1]}`).send({ choices: { categories: { [medium]: [m[0], m[1], m[2]] } } }).expect(201);
    const twice = await v.post(`/api/public/ballots/${codes[2]}`).send({ choices: { categories: { [medium]: [m[0], m[0]] } } }).expect(400);
    expect(twice.body.message).toContain('names the same quilt twice');
    await chair.post(`${base}/voting/close`).expect(200);
    let r = (await chair.get(`${base}/results`).expect(200)).body;
    let med = r.categories[0];
    expect(med.standings.map((x: { score: number; rank: number; ribbon: number | null }) => [x.score, x.rank, x.ribbon])).toEqual([[2, 1, 1], [2, 1, 1], [1, 3, null]]);
    expect(med.ties).toEqual([{ rank: 1, entryIds: [m[0], m[1]] }]);
    const wrong = await chair.post(`${base}/results/decisions`).send({ categoryId: medium, order: [m[0], m[2]] }).expect(400);
    expect(wrong.body.message).toContain('not tied');
    r = (await chair.post(`${base}/results/decisions`).send({ categoryId: medium, order: [m[1], m[0]], note: 'Coin toss at the close, two witnesses' }).expect(201)).body;
    med = r.categories[0];
    expect(med.standings.map((x: { entryId: number; rank: number; ribbon: number | null; byDecision: boolean }) => [x.entryId, x.rank, x.ribbon, x.byDecision])).toEqual([
      [m[1], 1, 1, true],
      [m[0], 2, null, true], // 3 entries: 1st only
      [m[2], 3, null, false],
    ]);
    expect(med.decisions[0]).toMatchObject({ note: 'Coin toss at the close, two witnesses', stale: false });
    await chair.post(`${base}/results/publish`).expect(200);
    await chair.delete(`${base}/results/decisions/${med.decisions[0].id}`).expect(409);
  });

  it('counts a ranked overall award by instant runoff: the four-city ballots elect Knoxville in three rounds', async () => {
    // The four-city example of the public articles on instant-runoff voting and the Borda count:
    // 42% Memphis > Nashville > Chattanooga > Knoxville; 26% Nashville > Chattanooga > Knoxville > Memphis;
    // 15% Chattanooga > Knoxville > Nashville > Memphis; 17% Knoxville > Chattanooga > Nashville > Memphis.
    // Instant runoff elects Knoxville: Chattanooga goes out first (15), then Nashville (26).
    const s = await createScenario(t);
    const chair = await signIn(t, s.showChair.email);
    const g = s.guild.id;
    const show = await setUpShow(chair, g, { votingKind: 'ranked', rankedMethod: 'instant_runoff', rankDepth: 4 });
    const base = `/api/guilds/${g}/shows/${show.showId}`;
    const [memphis, nashville] = [await acceptedEntry(chair, g, show.showId, show.medium, 'Memphis'), await acceptedEntry(chair, g, show.showId, show.medium, 'Nashville')];
    const [chattanooga, knoxville] = [await acceptedEntry(chair, g, show.showId, show.large, 'Chattanooga', ['70', '80']), await acceptedEntry(chair, g, show.showId, show.large, 'Knoxville', ['70', '80'])];
    await chair.post(`${base}/voting/codes`).send({ count: 100 }).expect(201);
    const codes = await codesOf(show.showId);
    await chair.post(`${base}/voting/open`).expect(200);
    // Opening numbered the quilts that had no number yet, in category order.
    const numbers = (await chair.get(`${base}/entries?status=accepted`).expect(200)).body.map((e: { title: string; entryNumber: number }) => [e.title, e.entryNumber]);
    expect(numbers).toEqual([['Memphis', 1], ['Nashville', 2], ['Chattanooga', 3], ['Knoxville', 4]]);
    const orders: [number, number[]][] = [
      [42, [memphis, nashville, chattanooga, knoxville]],
      [26, [nashville, chattanooga, knoxville, memphis]],
      [15, [chattanooga, knoxville, nashville, memphis]],
      [17, [knoxville, chattanooga, nashville, memphis]],
    ];
    const v = client(t);
    let i = 0;
    for (const [n, order] of orders) for (let k = 0; k < n; k++) await v.post(`/api/public/ballots/${codes[i++]}`).send({ choices: { ranked: order } }).expect(201);
    const tooMany = await signIn(t, s.member.email);
    const five = await tooMany.post(`${base}/ballot`).send({ choices: { ranked: [memphis, nashville, chattanooga, knoxville, memphis] } }).expect(400);
    expect(five.body.message).toBe('Rank at most 4 quilts.');
    await chair.post(`${base}/voting/close`).expect(200);
    const r = (await chair.get(`${base}/results`).expect(200)).body;
    expect(r.categories).toHaveLength(1);
    const overall = r.categories[0];
    expect(overall.standings[0]).toMatchObject({ title: 'Knoxville', rank: 1, ribbon: 1 });
    const names = new Map([[memphis, 'Memphis'], [nashville, 'Nashville'], [chattanooga, 'Chattanooga'], [knoxville, 'Knoxville']]);
    expect(overall.rounds.map((x: { counts: Record<string, number>; eliminated: number[] }) => [Object.fromEntries(Object.entries(x.counts).map(([k, c]) => [names.get(Number(k)), c])), x.eliminated.map((e) => names.get(e))])).toEqual([
      [{ Memphis: 42, Nashville: 26, Chattanooga: 15, Knoxville: 17 }, ['Chattanooga']],
      [{ Memphis: 42, Nashville: 26, Knoxville: 32 }, ['Nashville']],
      [{ Memphis: 42, Knoxville: 58 }, []],
    ]);
  });

  it('opens and closes by the schedule: the first ballot page numbers the quilts, and ballots after the closing time are refused', async () => {
    const s = await createScenario(t);
    const chair = await signIn(t, s.showChair.email);
    const member = await signIn(t, s.member.email);
    const g = s.guild.id;
    const show = await setUpShow(chair, g);
    const base = `/api/guilds/${g}/shows/${show.showId}`;
    const a = await acceptedEntry(chair, g, show.showId, show.medium, 'Dawn Chorus');
    const soon = new Date(Date.now() + 60_000).toISOString();
    const bad = await chair.patch(base).send({ votingOpensAt: soon, votingClosesAt: new Date(Date.now() + 30_000).toISOString() }).expect(400);
    expect(bad.body.errors.votingClosesAt).toEqual(['Voting must close after it opens.']);
    expect((await chair.patch(base).send({ votingOpensAt: soon }).expect(200)).body.votingState).toBe('scheduled');
    await member.post(`${base}/ballot`).send({ choices: { categories: { [show.medium]: [a] } } }).expect(409);
    // A time already past would open voting without the checks that opening by hand makes.
    const past = await chair.patch(base).send({ votingOpensAt: new Date(Date.now() - 1000).toISOString() }).expect(400);
    expect(past.body.errors.votingOpensAt).toEqual(['Choose an opening time in the future, or open voting now from the ballot desk.']);
    expect((await chair.get(base).expect(200)).body.votingState).toBe('scheduled');
    // The opening time arrives (the clock is moved in the database), then closing is set a few seconds away.
    await t.orm.em.fork().execute('UPDATE shows SET voting_opens_at = ? WHERE id = ?', [new Date(Date.now() - 1000), show.showId]);
    await chair.patch(base).send({ votingClosesAt: new Date(Date.now() + 4000).toISOString() }).expect(200);
    const ballot = (await member.get(`${base}/ballot`).expect(200)).body;
    expect(ballot.show.votingState).toBe('open');
    expect(ballot.categories[0].entries[0].entryNumber).toBe(1);
    expect((await chair.get(base).expect(200)).body.votingOpenedAt).not.toBeNull();
    await chair.patch(base).send({ votingKind: 'approval' }).expect(409);
    await member.post(`${base}/ballot`).send({ choices: { categories: { [show.medium]: [a] } } }).expect(201);
    await new Promise((r) => setTimeout(r, 4500));
    const late = await signIn(t, s.treasurer.email);
    const refused = await late.post(`${base}/ballot`).send({ choices: { categories: { [show.medium]: [a] } } }).expect(409);
    expect(refused.body.message).toContain('has closed');
    expect((await chair.get(`${base}/results`).expect(200)).body.categories[0].standings[0]).toMatchObject({ title: 'Dawn Chorus', score: 1, ribbon: 1 });
  });

  it('keeps the ballot as it opened: rules cannot change, a corrected title shows, a used card is said before a bad ballot', async () => {
    const { chair, member, base, medium, large, m } = await world();
    const early = await chair.get(`${base}/results`).expect(409);
    expect(early.body.message).toBe('Voting has not opened yet, so there is nothing to count.');
    const noBatch = await chair.get(`${base}/voting/codes.pdf`).expect(400);
    expect(noBatch.body.message).toContain('Choose a batch of cards');
    await chair.post(`${base}/voting/open`).expect(200);
    const rule = await chair.patch(`${base}/categories/${medium}`).send({ sizeRule: { kind: 'dimensions', maxWidthIn: '5' } }).expect(409);
    expect(rule.body.message).toContain("a category's size rule, makers and limits can no longer change");
    await chair.patch(`${base}/categories/${large}`).send({ minMakers: 3 }).expect(409);
    const before = (await member.get(`${base}/ballot`).expect(200)).body;
    expect(before.categories.map((c: { name: string }) => c.name)).toContain('Medium');
    await chair.patch(`${base}/categories/${medium}`).send({ name: 'Medium bed quilts' }).expect(200);
    await chair.patch(`${base}/entries/${m[1]}`).send({ title: 'Lantern Glow at Dusk' }).expect(200);
    const after = (await member.get(`${base}/ballot`).expect(200)).body;
    const medAfter = after.categories.find((c: { id: number }) => c.id === medium);
    expect(medAfter.name).toBe('Medium bed quilts');
    expect(medAfter.entries.map((e: { title: string }) => e.title)).toContain('Lantern Glow at Dusk');

    await chair.post(`${base}/voting/codes`).send({ count: 1 }).expect(201);
    const [code] = await codesOf(Number(base.split('/').pop()));
    // The same code as a paper ballot to write on: its code and a box per category on the ballot.
    const sheet = pdfText((await chair.get(`${base}/voting/codes.pdf?batch=1&layout=paper`).buffer(true).expect(200)).body as Buffer);
    expect(sheet.replace(/\s+/g, ' ')).toContain(`${code.slice(0, 4)}-${code.slice(4, 8)}-${code.slice(8)}`);
    expect(sheet).toContain('Medium bed quilts');
    expect(sheet).toContain('Write the number of your favourite quilt in each category');
    await chair.get(`${base}/voting/codes.pdf?batch=1&layout=poster`).expect(400);
    const visitor = client(t);
    await visitor.post(`/api/public/ballots/${code}`).send({ choices: { categories: { [medium]: [m[0]] } } }).expect(201);
    const again = await visitor.post(`/api/public/ballots/${code}`).send({ choices: { categories: { [medium]: [] } } }).expect(409);
    expect(again.body.message).toBe('This ballot card has already been used to vote. Each card votes once.');
    const paper = await chair.post(`${base}/voting/paper`).send({ code, choices: {} }).expect(409);
    expect(paper.body.message).toContain('Set this paper ballot aside as a duplicate');
  });

  it('takes 200 ballots fired at once, including the same member and the same code ten times each: each voter counted once, every duplicate a 409', async () => {
    const { s, chair, base, showId, medium, m, g } = await world();
    await chair.post(`${base}/voting/codes`).send({ count: 150 }).expect(201);
    const codes = await codesOf(showId);
    const members = await signedInMembers(t, g, s.tag, 20);
    await chair.post(`${base}/voting/open`).expect(200);
    const pick = (i: number) => ({ choices: { categories: { [medium]: [m[i % 3]] } } });
    const visitor = client(t);
    const requests: { key: string; go: () => Promise<{ status: number; body: { message?: string } }> }[] = [];
    // 20 members once each, and member 0 nine more times (10 in all).
    members.forEach((a, i) => requests.push({ key: `member${i}`, go: () => a.post(`${base}/ballot`).send(pick(i)) }));
    for (let k = 0; k < 9; k++) requests.push({ key: 'member0', go: () => members[0].post(`${base}/ballot`).send(pick(k)) });
    // 150 codes once each; code 0 nine more times on phones, code 1 twice more keyed from paper, code 2 nine more times.
    codes.forEach((c, i) => requests.push({ key: `code${i}`, go: () => visitor.post(`/api/public/ballots/${c}`).send(pick(i)) }));
    for (let k = 0; k < 9; k++) requests.push({ key: 'code0', go: () => visitor.post(`/api/public/ballots/${codes[0]}`).send(pick(k)) });
    for (let k = 0; k < 2; k++) requests.push({ key: 'code1', go: () => chair.post(`${base}/voting/paper`).send({ code: codes[1], ...pick(k) }) });
    for (let k = 0; k < 9; k++) requests.push({ key: 'code2', go: () => visitor.post(`/api/public/ballots/${codes[2]}`).send(pick(k)) });
    requests.push({ key: 'member1', go: () => members[1].post(`${base}/ballot`).send(pick(1)) });
    // 20 + 9 + 150 + 9 + 2 + 9 + 1: member 0, code 0 and code 2 are each sent 10 times at once.
    expect(requests).toHaveLength(200);
    requests.sort(() => Math.random() - 0.5);
    const results = await Promise.all(requests.map(async (r) => ({ key: r.key, res: await r.go() })));
    const byKey = new Map<string, number[]>();
    for (const { key, res } of results) byKey.set(key, [...(byKey.get(key) ?? []), res.status]);
    for (const [key, statuses] of byKey) {
      expect([key, statuses.filter((x) => x === 201).length]).toEqual([key, 1]);
      expect([key, statuses.filter((x) => x !== 201 && x !== 409)]).toEqual([key, []]);
    }
    const ok = results.filter((r) => r.res.status === 201).length;
    const dup = results.filter((r) => r.res.status === 409);
    expect(ok).toBe(170);
    expect(dup).toHaveLength(30);
    for (const d of dup) expect(d.res.body.message).toMatch(/already (voted|been used)/);
    expect(await count('show_ballots', showId)).toBe(170);
    expect(await count('show_voters', showId)).toBe(170);
    await chair.post(`${base}/voting/close`).expect(200);
    const r = (await chair.get(`${base}/results`).expect(200)).body;
    const med = r.categories[0];
    expect(med.votes).toBe(170);
    expect(med.standings.reduce((sum: number, x: { score: number }) => sum + x.score, 0)).toBe(170);
    expect(r.audit).toMatchObject({ codesUsed: 150, memberBallots: 20, ballotsCast: 170 });
    expect(r.audit.codeBallots + r.audit.paperBallots).toBe(150);
  }, 120_000);
});
