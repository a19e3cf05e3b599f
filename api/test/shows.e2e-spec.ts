import { Jimp } from 'jimp';
import { parse } from 'csv-parse/sync';
import { createScenario, createTestApp, pdfText, signIn, type TestApp } from './helpers';
import { acceptedEntry, setUpShow } from './shows-helpers';

/**
 * Show set-up, entries and the chair's review against the real database. The ballot itself is in
 * voting.e2e-spec.ts.
 */
describe('quilt show: set-up and entries', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => {
    await t.close();
  });

  async function world() {
    const s = await createScenario(t);
    const chair = await signIn(t, s.showChair.email);
    const member = await signIn(t, s.member.email);
    const g = s.guild.id;
    const show = await setUpShow(chair, g, { maxEntriesPerMember: 3, entriesOpenOn: '2020-01-01', entriesCloseOn: '2030-05-01' });
    return { s, chair, member, g, ...show, base: `/api/guilds/${g}/shows/${show.showId}` };
  }

  it('lets only the show chair set a show up, and shows members the rules, the sleeve and the categories', async () => {
    const { s, member, g, base } = await world();
    await member.post(`/api/guilds/${g}/shows`).send({ name: 'Mine', venue: 'x', startsOn: '2030-01-01', endsOn: '2030-01-01' }).expect(403);
    const show = (await member.get(base).expect(200)).body;
    expect(show.canManage).toBe(false);
    expect(show.categories.map((c: { name: string; sizeRuleText: string }) => [c.name, c.sizeRuleText])).toEqual([
      ['Medium', 'Perimeter at least 160 in and at most 240 in'],
      ['Large', 'Perimeter more than 240 in and at most 320 in'],
      ['Group quilts', 'Any size'],
    ]);
    expect(show.sleeve.text).toContain('4 in hanging sleeve');
    expect(show.entryWindow).toBe('open');
    const outsider = await signIn(t, s.outsider.email);
    await outsider.get(base).expect(404);
  });

  it('refuses bad show and category settings with a message per field', async () => {
    const { chair, g, base, showId } = await world();
    const bad = await chair.post(`/api/guilds/${g}/shows`).send({ name: '', venue: 'Hall', startsOn: '2030-05-15', endsOn: '2030-05-14', sleeveDepthIn: 'four' }).expect(400);
    expect(Object.keys(bad.body.errors).sort()).toEqual(['name', 'sleeveDepthIn']);
    const order = await chair.post(`/api/guilds/${g}/shows`).send({ name: 'Backwards', venue: 'Hall', startsOn: '2030-05-15', endsOn: '2030-05-14' }).expect(400);
    expect(order.body.errors.endsOn).toEqual(['The show cannot end before it starts.']);
    const feb = await chair.post(`/api/guilds/${g}/shows`).send({ name: 'Leap', venue: 'Hall', startsOn: '2031-02-29', endsOn: '2031-03-01' }).expect(400);
    expect(feb.body.errors.startsOn).toEqual(['That date does not exist.']);
    const rule = await chair.post(`${base}/categories`).send({ name: 'Odd', sizeRule: { kind: 'perimeter', minIn: '300', maxIn: '200' } }).expect(400);
    expect(rule.body.errors['sizeRule.minIn']).toBeDefined();
    const empty = await chair.post(`${base}/categories`).send({ name: 'Odd', sizeRule: { kind: 'dimensions' } }).expect(400);
    expect(empty.body.errors['sizeRule.maxWidthIn']).toBeDefined();
    const dup = await chair.post(`${base}/categories`).send({ name: 'Medium' }).expect(400);
    expect(dup.body.errors.name).toEqual(['Another category of this show already has that name.']);
    await chair.patch(`/api/guilds/${g}/shows/999999`).send({ name: 'x' }).expect(404);
    expect((await chair.get(base).expect(200)).body.categories).toHaveLength(3);
    expect(showId).toBeGreaterThan(0);
  });

  it('answers nonsense with a 4xx it can act on and saves none of it', async () => {
    const { s, chair, member, g, base, medium, large } = await world();
    const showId = Number(base.split('/').pop());
    const entry = (await member.post(`${base}/entries`).send({ categoryId: medium, title: 'Plain Sailing', widthIn: '50', heightIn: '60', makers: ['Me'] }).expect(201)).body;
    const before = (await chair.get(base).expect(200)).body;
    // null where a field may be left out but not emptied: each its own message, never a 500.
    for (const field of ['name', 'venue', 'description', 'startsOn', 'entryFeeCents', 'votingKind', 'rankDepth', 'makersHidden', 'sleeveDepthIn']) {
      const r = await chair.patch(base).send({ [field]: null });
      expect([r.status, field]).toEqual([400, field]);
      expect(r.body.errors[field]).toHaveLength(1);
    }
    for (const field of ['title', 'quilter', 'story', 'widthIn', 'makers', 'forSale']) {
      const r = await member.patch(`${base}/entries/${entry.id}`).send({ [field]: null });
      expect([r.status, field]).toEqual([400, field]);
    }
    for (const field of ['name', 'description', 'judged', 'sortOrder', 'sizeRule']) {
      const r = await chair.patch(`${base}/categories/${large}`).send({ [field]: null });
      expect([r.status, field]).toEqual([400, field]);
    }
    // Spaces only are empty.
    const blank = await chair.post(`/api/guilds/${g}/shows`).send({ name: '   ', venue: ' \t ', startsOn: '2030-05-14', endsOn: '2030-05-15' }).expect(400);
    expect(blank.body.errors).toEqual({ name: ['Give the show a name.'], venue: ['Say where the show is.'] });
    await member.patch(`${base}/entries/${entry.id}`).send({ title: '   ' }).expect(400);
    await member.patch(`${base}/entries/${entry.id}`).send({ makers: ['  '] }).expect(400);
    // Dates and money that cannot work.
    const late = await chair.patch(base).send({ entriesOpenOn: '2030-06-01', entriesCloseOn: null }).expect(400);
    expect(late.body.errors.entriesOpenOn).toEqual(["Entries must open on or before the show's last day."]);
    const cap = await chair.patch(base).send({ entryFeeCents: 500, entryFeeCapCents: 100 }).expect(400);
    expect(cap.body.errors.entryFeeCapCents).toEqual(['The most one member pays cannot be less than the fee for one quilt.']);
    // Bodies that are not forms.
    expect((await chair.patch(base).send([{ name: 'x' }]).expect(400)).body.message).toContain('JSON object');
    let deep: Record<string, unknown> = {};
    const nested = { name: 'Deep', extra: deep };
    for (let i = 0; i < 1000; i++) deep = (deep.a = {}) as Record<string, unknown>;
    expect((await chair.patch(base).send(nested).expect(400)).body.message).toContain('nested too deeply');
    // Addresses and queries.
    expect((await chair.get(`/api/guilds/${g}/shows/abc`).expect(404)).body.message).toBe('There is nothing at that address. Check the link.');
    await chair.get(`${base}/entries?status=accepted,bogus`).expect(400);
    await chair.get(`${base}/hang-tags.pdf?hideMakers=maybe`).expect(400);
    // Nothing above was saved.
    const after = (await chair.get(base).expect(200)).body;
    expect(after).toEqual(before);
    expect((await member.get(`${base}/entries/mine`).expect(200)).body[0]).toMatchObject({ title: 'Plain Sailing', makers: ['Me'], widthText: '50' });
    expect(s.guild.id).toBe(g);
    expect(showId).toBeGreaterThan(0);
  });

  it('shows a quilt\'s photo to other members only once it is accepted', async () => {
    const { s, chair, member, base, medium } = await world();
    const e = (await member.post(`${base}/entries`).send({ categoryId: medium, title: 'Snapshot', widthIn: '50', heightIn: '60', makers: ['Me'] }).expect(201)).body.id;
    const png = await new Jimp({ width: 400, height: 480, color: 0x8f3a6eff }).getBuffer('image/png');
    await member.post(`${base}/entries/${e}/photo`).attach('photo', png, { filename: 'q.png', contentType: 'image/png' }).expect(200);
    const other = await signIn(t, s.treasurer.email);
    await other.get(`${base}/entries/${e}/photo`).expect(404);
    await member.get(`${base}/entries/${e}/photo`).expect(200);
    await chair.get(`${base}/entries/${e}/photo`).expect(200);
    await chair.post(`${base}/entries/${e}/review`).send({ decision: 'accept' }).expect(200);
    await other.get(`${base}/entries/${e}/photo`).expect(200);
  });

  it('takes an entry in fractions of an inch, checks the size rule and says by how much it fails', async () => {
    const { member, base, medium, large, group } = await world();
    const ok = await member
      .post(`${base}/entries`)
      .send({ categoryId: medium, title: 'Evening on the Millpond', widthIn: '60 1/2', heightIn: '59½', makers: ['Me Myself'], quilter: 'Me Myself', forSale: true, priceCents: 45000 })
      .expect(201);
    expect(ok.body).toMatchObject({ widthText: '60 1/2', heightText: '59 1/2', perimeterText: '240 in', status: 'submitted', forSale: true, priceCents: 45000 });
    // TRADE.md §3.8: a 60 1/2 in quilt with a 4 in sleeve cuts a strip 8 1/2 x 59 1/2.
    expect(ok.body.sleeve.text).toBe('A 4 in sleeve: cut a strip 8 1/2 in x 59 1/2 in.');

    const tooBig = await member.post(`${base}/entries`).send({ categoryId: medium, title: 'Too big', widthIn: '60', heightIn: '66', makers: ['Me'] }).expect(400);
    expect(tooBig.body.errors.widthIn[0]).toBe('This category takes quilts at most 240 in around (perimeter); yours is 252 in around, 12 in over.');
    const gap = await member.post(`${base}/entries`).send({ categoryId: medium, title: 'In the gap', widthIn: '60', heightIn: '60 1/4', makers: ['Me'] }).expect(400);
    expect(gap.body.message).toContain('1/2 in over');
    await member.post(`${base}/entries`).send({ categoryId: large, title: 'In the gap', widthIn: '60', heightIn: '60 1/4', makers: ['Me'] }).expect(201);
    const few = await member.post(`${base}/entries`).send({ categoryId: group, title: 'Bee quilt', widthIn: '60', heightIn: '70', makers: ['Me', 'You'] }).expect(400);
    expect(few.body.errors.makers[0]).toContain('3 or more people; this one names 2');
    const bad = await member.post(`${base}/entries`).send({ categoryId: 0, title: '', widthIn: '6o', heightIn: '-3', makers: [] }).expect(400);
    expect(Object.keys(bad.body.errors).sort()).toEqual(['categoryId', 'heightIn', 'makers', 'title', 'widthIn']);
    const otherShow = await member.post(`${base}/entries`).send({ categoryId: 99999999, title: 'x', widthIn: '50', heightIn: '50', makers: ['Me'] }).expect(400);
    expect(otherShow.body.errors.categoryId).toBeDefined();
    expect((await member.get(`${base}/entries/mine`).expect(200)).body).toHaveLength(2);
  });

  it('enforces the entry limits and the entry window, and lets the chair enter for a member', async () => {
    const { s, chair, member, g, base, medium, large } = await world();
    await chair.patch(base).send({ maxEntriesPerMember: 2 }).expect(200);
    await chair.patch(`${base}/categories/${large}`).send({ maxEntriesPerMember: 1 }).expect(200);
    const entry = (title: string, categoryId = large) => ({ categoryId, title, widthIn: '70', heightIn: '80', makers: ['Me'] });
    await member.post(`${base}/entries`).send(entry('One')).expect(201);
    const cat = await member.post(`${base}/entries`).send(entry('Two')).expect(409);
    expect(cat.body.message).toBe('You have already entered 1 in Large, which takes at most 1 from each member.');
    await member.post(`${base}/entries`).send(entry('Two', medium)).expect(400); // 300 in is not medium
    await member.post(`${base}/entries`).send({ ...entry('Two', medium), widthIn: '50', heightIn: '60' }).expect(201);
    const cap = await member.post(`${base}/entries`).send({ ...entry('Three', medium), widthIn: '50', heightIn: '60' }).expect(409);
    expect(cap.body.message).toContain('at most 2 from each member');

    // On behalf: only the chair; the entry belongs to the member and says who keyed it.
    await member.post(`${base}/entries`).send({ ...entry('For you', medium), widthIn: '50', heightIn: '60', onBehalfOf: s.showChair.membership!.id }).expect(403);
    const other = await createScenario(t);
    const stranger = await chair.post(`${base}/entries`).send({ ...entry('x', medium), widthIn: '50', heightIn: '60', onBehalfOf: other.member.membership!.id }).expect(400);
    expect(stranger.body.errors.onBehalfOf).toEqual(['Choose a member of this guild.']);
    const admin = s.admin.membership!.id;
    const behalf = await chair.post(`${base}/entries`).send({ ...entry('Paper entrant', medium), widthIn: '50', heightIn: '60', onBehalfOf: admin }).expect(201);
    expect(behalf.body).toMatchObject({ entrant: { membershipId: admin }, enteredOnBehalf: true, enteredBy: s.showChair.user.name });

    // The window: closed for members, the chair may still take a late entry for someone.
    await chair.patch(base).send({ entriesOpenOn: '2020-01-01', entriesCloseOn: '2020-02-01', maxEntriesPerMember: null }).expect(200);
    const late = await member.post(`${base}/entries`).send({ ...entry('Late', medium), widthIn: '50', heightIn: '60' }).expect(409);
    expect(late.body.message).toContain('closed on');
    await chair.post(`${base}/entries`).send({ ...entry('Late but kind', medium), widthIn: '50', heightIn: '60', onBehalfOf: admin }).expect(201);
    expect(g).toBeGreaterThan(0);
  });

  it('lets the chair review, move and number entries; declines need a reason; members cannot edit once reviewed', async () => {
    const { s, chair, member, base, medium, large } = await world();
    const mine = await member.post(`${base}/entries`).send({ categoryId: medium, title: 'Log Cabin Dusk', widthIn: '50', heightIn: '60', makers: ['Me'] }).expect(201);
    const e = mine.body.id;
    await member.post(`${base}/entries/${e}/review`).send({ decision: 'accept' }).expect(403);
    await member.patch(`${base}/entries/${e}`).send({ title: 'Log Cabin at Dusk' }).expect(200);
    const noReason = await chair.post(`${base}/entries/${e}/review`).send({ decision: 'decline' }).expect(400);
    expect(noReason.body.errors.reason).toBeDefined();
    await chair.post(`${base}/entries/${e}/review`).send({ decision: 'decline', reason: 'No sleeve sewn on.' }).expect(200);
    const declined = (await member.get(`${base}/entries/mine`).expect(200)).body[0];
    expect(declined).toMatchObject({ status: 'declined', declineReason: 'No sleeve sewn on.' });
    await member.patch(`${base}/entries/${e}`).send({ title: 'Changed' }).expect(409);
    await chair.post(`${base}/entries/${e}/review`).send({ decision: 'accept' }).expect(200);

    // Moving into a category the quilt does not fit is refused with the rule's message.
    const move = await chair.patch(`${base}/entries/${e}`).send({ categoryId: large }).expect(400);
    expect(move.body.message).toContain('Large: This category takes quilts more than 240 in around');
    const second = await acceptedEntry(chair, s.guild.id, Number(base.split('/').pop()), large, 'Big Star', ['70', '80']);
    const numbered = (await chair.post(`${base}/entries/number`).send({ startAt: 101 }).expect(200)).body;
    expect(numbered.map((x: { title: string; entryNumber: number }) => [x.title, x.entryNumber])).toEqual([
      ['Log Cabin at Dusk', 101],
      ['Big Star', 102],
    ]);
    const taken = await chair.patch(`${base}/entries/${second}`).send({ entryNumber: 101 }).expect(409);
    expect(taken.body.message).toBe('Entry number 101 is already taken by "Log Cabin at Dusk".');
    await member.patch(`${base}/entries/${e}`).send({ entryNumber: 5 }).expect(409);
    const list = (await chair.get(`${base}/entries?status=accepted`).expect(200)).body;
    expect(list).toHaveLength(2);
    await chair.get(`${base}/entries?status=bogus`).expect(400);
    await member.get(`${base}/entries`).expect(403);
    // Another member's entry is invisible to a member.
    const other = await signIn(t, s.treasurer.email);
    await other.patch(`${base}/entries/${e}`).send({ title: 'Mine now' }).expect(404);
    await other.post(`${base}/entries/${e}/withdraw`).expect(404);
  });

  it('takes a photo of the quilt by its content and serves a display copy; refuses files that are not photos', async () => {
    const { member, base, medium } = await world();
    const e = (await member.post(`${base}/entries`).send({ categoryId: medium, title: 'Photo quilt', widthIn: '50', heightIn: '60', makers: ['Me'] }).expect(201)).body.id;
    const image = new Jimp({ width: 2000, height: 2400, color: 0x3a6e8fff });
    const png = await image.getBuffer('image/png');
    const up = await member.post(`${base}/entries/${e}/photo`).attach('photo', png, { filename: 'quilt.png', contentType: 'image/png' }).expect(200);
    expect(up.body.hasPhoto).toBe(true);
    const shown = await member.get(`${base}/entries/${e}/photo`).expect(200);
    expect(shown.headers['content-type']).toBe('image/jpeg');
    const decoded = await Jimp.read(shown.body as Buffer);
    expect(Math.max(decoded.bitmap.width, decoded.bitmap.height)).toBe(1280);
    const thumb = await Jimp.read((await member.get(`${base}/entries/${e}/photo?size=thumb`).expect(200)).body as Buffer);
    expect(Math.max(thumb.bitmap.width, thumb.bitmap.height)).toBe(320);

    const text = await member.post(`${base}/entries/${e}/photo`).attach('photo', Buffer.from('not a picture at all'), { filename: 'quilt.jpg', contentType: 'image/jpeg' }).expect(415);
    expect(text.body.message).toContain('JPEG or PNG');
    await member.post(`${base}/entries/${e}/photo`).expect(400);
    const truncated = png.subarray(0, 60);
    await member.post(`${base}/entries/${e}/photo`).attach('photo', truncated, { filename: 'q.png', contentType: 'image/png' }).expect((r) => expect([415, 422]).toContain(r.status));
    // The good photo is still there.
    await member.get(`${base}/entries/${e}/photo`).expect(200);
  });

  it('prints hang tags (makers hidden until judging is done), the entry list as PDF and CSV', async () => {
    const { s, chair, member, base, medium, large, group } = await world();
    const showId = Number(base.split('/').pop());
    await acceptedEntry(chair, s.guild.id, showId, medium, 'Wren Song', ['50', '60'], ['Ottoline Marsh', 'Bea Thistle']);
    await acceptedEntry(chair, s.guild.id, showId, large, 'Hollow Oak', ['70', '80 1/4'], ['Ida Fenwick']);
    const bee = await chair
      .post(`${base}/entries`)
      .send({ categoryId: group, title: 'Bee Stars', widthIn: '60', heightIn: '60', makers: ['Ann', 'Bet', 'Cis'], forSale: true, priceCents: 18050 })
      .expect(201);
    await chair.post(`${base}/entries/${bee.body.id}/review`).send({ decision: 'accept' }).expect(200);
    await member.post(`${base}/entries`).send({ categoryId: medium, title: 'Still waiting', widthIn: '50', heightIn: '60', makers: ['Me'] }).expect(201);
    await chair.post(`${base}/entries/number`).send({ startAt: 7 }).expect(200);
    const binary = (r: import('supertest').Response) => r.body as Buffer;
    const hidden = pdfText(binary(await chair.get(`${base}/hang-tags.pdf`).buffer(true).expect(200).expect('content-type', 'application/pdf')));
    expect(hidden).toContain('Wren Song');
    expect(hidden).toContain('No. 7');
    expect(hidden).not.toContain('Ottoline');
    expect(hidden).not.toContain('Still waiting'); // only accepted entries hang
    const shown = pdfText(binary(await chair.get(`${base}/hang-tags.pdf?hideMakers=0`).buffer(true).expect(200)));
    expect(shown).toContain('Ottoline Marsh');
    expect(shown).toContain('70 x 80 1/4 in');
    // The group category is exhibit only: tags and list say so, so nobody judges it by mistake.
    expect(shown).toContain('Category: Group quilts (exhibit only)');
    expect(shown).toContain('For sale: $180.50');
    await member.get(`${base}/hang-tags.pdf`).expect(403);
    const list = pdfText(binary(await chair.get(`${base}/entries.pdf`).buffer(true).expect(200)));
    for (const title of ['Wren Song', 'Hollow Oak', 'Still waiting', 'Group quilts (exhibit only)']) expect(list).toContain(title);
    const csv = parse((await chair.get(`${base}/entries.csv`).expect(200)).text.replace(/^\uFEFF/, ''), { columns: true }) as Record<string, string>[];
    expect(csv.map((r) => [r['Entry number'], r.Title, r.Status])).toEqual([
      ['7', 'Wren Song', 'Accepted'],
      ['', 'Still waiting', 'Submitted'],
      ['8', 'Hollow Oak', 'Accepted'],
      ['9', 'Bee Stars', 'Accepted'],
    ]);
    expect(csv[0].Makers).toBe('Ottoline Marsh; Bea Thistle');
    expect(csv[3].Price).toBe('180.50');
  });

  it('withdraws an entry and frees its number', async () => {
    const { s, chair, member, base, medium } = await world();
    const e = await acceptedEntry(chair, s.guild.id, Number(base.split('/').pop()), medium, 'Withdrawn one');
    await chair.post(`${base}/entries/number`).send({}).expect(200);
    const w = await chair.post(`${base}/entries/${e}/withdraw`).expect(200);
    expect(w.body).toMatchObject({ status: 'withdrawn', entryNumber: null });
    await chair.post(`${base}/entries/${e}/withdraw`).expect(409);
    await chair.post(`${base}/entries/${e}/review`).send({ decision: 'accept' }).expect(409);
    expect(member).toBeDefined();
  });
});
