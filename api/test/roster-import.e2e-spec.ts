import { Guild } from '../src/guilds/guild.entity';
import { Membership } from '../src/guilds/membership.entity';
import { User } from '../src/users/user.entity';
import { createScenario, createTestApp, signIn, unique, waitForMail, type TestApp } from './helpers';

/** Moving a guild's spreadsheet in: preview, import, re-import, failure, invitations, bad input (real MariaDB). */
describe('roster import', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  const TABLES = ['users', 'memberships', 'dues_standings', 'households', 'dues_audit_log', 'office_terms', 'invitations', 'outbox_messages'];
  /** Row counts and the latest change of every table the import could touch. */
  async function state() {
    const conn = t.orm.em.fork().getConnection();
    const out: Record<string, string> = {};
    for (const table of TABLES) {
      // The outbox worker stamps messages as it sends them, so only its count is compared.
      const hasUpdated = !['dues_audit_log', 'office_terms', 'outbox_messages'].includes(table);
      const [row] = await conn.execute<{ n: number; u: unknown }[]>(
        `SELECT COUNT(*) AS n, ${hasUpdated ? 'MAX(updated_at)' : 'NULL'} AS u FROM ${table}`,
      );
      out[table] = `${row.n}|${row.u instanceof Date ? row.u.toISOString() : String(row.u)}`;
    }
    return out;
  }

  async function setup() {
    const s = await createScenario(t);
    const admin = await signIn(t, s.admin.email);
    // Her first visit records her admin office (office_terms), before any state is compared.
    await admin.get(`/api/guilds/${s.guild.id}`).expect(200);
    return { s, admin, base: `/api/guilds/${s.guild.id}/roster-import` };
  }

  /** An invented roster: every kind of row, with a few problems. */
  function roster(tag: string) {
    return [
      'Full name,E-mail,Mobile,City,Family,Joined,Dues paid until,Office,Favourite block',
      `Agatha Pinwheel,agatha.${tag}@test.example,555 0101,Brackenby,Pinwheel,2015-09-01,31 December 2026,Treasurer,Log cabin`,
      `Basil Pinwheel,basil.${tag}@test.example,,Brackenby,Pinwheel,"March 1, 2019",12/31/2026,,Star`,
      `Clementine Hatch,,555 0199,Fallowmere,,1 Mar 2020,,member,`,
      `"Dorcas ""Dot"" Wimble",dot.${tag}@test.example,,"Upper Tansley, East",,45292,,Show chair,`,
      `Edna Broadcloth,not-an-address,,,,,,,`,
      `Fenella Quire,,,,,,,President,`,
      `Gwendolyn Tuck,gwen.${tag}@test.example,,,,31/02/2026,,,`,
      `,nameless.${tag}@test.example,,,,,,,`,
      `Hester Mull,,,,,,,,`,
      `Hester Mull,,,,,,,,`,
    ].join('\n');
  }

  it('previews a file without writing anything, with each row, its problems and what importing would do', async () => {
    const { s, admin, base } = await setup();
    const before = await state();
    const res = await admin.post(`${base}/preview`).send({ text: roster(s.tag) }).expect(200);
    expect(res.body).toMatchObject({
      delimiter: 'comma',
      header: ['Full name', 'E-mail', 'Mobile', 'City', 'Family', 'Joined', 'Dues paid until', 'Office', 'Favourite block'],
      mapping: ['name', 'email', 'phone', 'town', 'household', 'memberSince', 'paidThrough', 'roles', 'ignore'],
      guessed: true,
      dateOrder: 'mdy', // the scenario's guild pays in US dollars
      counts: { rows: 10, new: 4, update: 0, unchanged: 0, problems: 6 },
      page: 1,
      pageCount: 1,
    });
    const rows = res.body.rows as { rowNumber: number; values: Record<string, unknown>; problems: string[]; action: string }[];
    expect(rows.map((r) => [r.rowNumber, r.action])).toEqual([
      [2, 'new'], [3, 'new'], [4, 'new'], [5, 'new'], [6, 'skip'], [7, 'skip'], [8, 'skip'], [9, 'skip'], [10, 'skip'], [11, 'skip'],
    ]);
    expect(rows[0].values).toEqual({
      name: 'Agatha Pinwheel', email: `agatha.${s.tag}@test.example`, phone: '555 0101', town: 'Brackenby', household: 'Pinwheel',
      memberSince: '2015-09-01', paidThrough: '2026-12-31', roles: ['treasurer'],
    });
    expect(rows[3].values).toMatchObject({ name: 'Dorcas "Dot" Wimble', town: 'Upper Tansley, East', memberSince: '2024-01-01', roles: ['show_chair'] });
    expect(rows[4].problems).toEqual(['“not-an-address” is not an e-mail address (like name@example.org).']);
    expect(rows[5].problems[0]).toMatch(/“President” is not a role/);
    expect(rows[6].problems[0]).toMatch(/^Member since: “31\/02\/2026” is not a real date read month first/);
    expect(rows[7].problems).toEqual(['No name: every member needs one.']);
    expect(rows[8].problems[0]).toMatch(/“Hester Mull” is on rows 10 and 11/);
    // Day first, the US-style date in row 3 becomes the problem instead.
    const dmy = await admin.post(`${base}/preview`).send({ text: roster(s.tag), dateOrder: 'dmy' }).expect(200);
    expect(dmy.body.rows[1].problems[0]).toMatch(/^Paid through: “12\/31\/2026” is not a real date read day first/);
    const only = await admin.post(`${base}/preview`).send({ text: roster(s.tag), onlyProblems: true }).expect(200);
    expect(only.body.rows.map((r: { rowNumber: number }) => r.rowNumber)).toEqual([6, 7, 8, 9, 10, 11]);
    expect(await state()).toEqual(before);
  });

  it('reads an uploaded semicolon file with a byte-order mark, and tab-separated pasted text', async () => {
    const { s, admin, base } = await setup();
    const before = await state();
    const csv = '\uFEFFFirst name;Last name;Email address;Paid to\r\nIrma;Selvedge;irma.' + s.tag + '@test.example;1.2.2027\r\n;;;\r\nJuno;Bias;;\r\n';
    const up = await admin.post(`${base}/preview`).field('dateOrder', 'dmy').attach('file', Buffer.from(csv), { filename: 'roster.csv', contentType: 'text/csv' }).expect(200);
    expect(up.body).toMatchObject({ delimiter: 'semicolon', header: ['First name', 'Last name', 'Email address', 'Paid to'], counts: { new: 2, problems: 0 } });
    expect(up.body.rows.map((r: { rowNumber: number; values: { name: string; paidThrough: string | null } }) => [r.rowNumber, r.values.name, r.values.paidThrough])).toEqual([
      [2, 'Irma Selvedge', '2027-02-01'],
      [4, 'Juno Bias', null],
    ]);
    // The admin's own mapping travels as JSON text beside the file.
    const upMapped = await admin
      .post(`${base}/preview`)
      .field('mapping', JSON.stringify(['firstName', 'lastName', 'ignore', 'ignore']))
      .field('onlyProblems', 'false')
      .attach('file', Buffer.from(csv), 'roster.csv')
      .expect(200);
    expect(upMapped.body).toMatchObject({ guessed: false, mapping: ['firstName', 'lastName', 'ignore', 'ignore'] });
    expect(upMapped.body.rows[0].values).toMatchObject({ name: 'Irma Selvedge', email: null, paidThrough: null });
    const wrongField = await admin.post(`${base}/preview`).attach('roster', Buffer.from(csv), 'roster.csv').expect(400);
    expect(wrongField.body.message).toBe('Send one file, in the form field named “file”.');
    // UTF-16 with its mark, as a spreadsheet's "Unicode text" saves it (tab-separated).
    const utf16 = Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from('Name\tTown\nZoë Marsh\tBrackenby\n', 'utf16le')]);
    const wide = await admin.post(`${base}/preview`).attach('file', utf16, 'roster.txt').expect(200);
    expect(wide.body.rows[0].values).toMatchObject({ name: 'Zoë Marsh', town: 'Brackenby' });
    const pasted = await admin.post(`${base}/preview`).send({ text: 'Name\tTown\nKit Gusset\tFallowmere\n' }).expect(200);
    expect(pasted.body).toMatchObject({ delimiter: 'tab', counts: { new: 1 } });
    // A mapping chosen by the admin is used as given: the town column read as households.
    const mapped = await admin.post(`${base}/preview`).send({ text: 'Name\tTown\nKit Gusset\tFallowmere\n', mapping: ['name', 'household'] }).expect(200);
    expect(mapped.body).toMatchObject({ guessed: false, mapping: ['name', 'household'] });
    expect(mapped.body.rows[0].values).toMatchObject({ household: 'Fallowmere', town: null });
    // A file whose names are in no column the guess knows: the preview asks which one.
    const unknown = await admin.post(`${base}/preview`).send({ text: 'Quilter\tTown\nKit Gusset\tFallowmere\n' }).expect(200);
    expect(unknown.body).toMatchObject({ mappingProblem: 'Choose which column holds the names.', rows: [], mapping: ['ignore', 'town'] });
    expect(await state()).toEqual(before);
  });

  it('imports the rows without problems in one go, skips the rest, and a second import changes nothing', async () => {
    const { s, admin, base } = await setup();
    // Agatha already has an account from another guild: her name stays hers, she just joins.
    const em = t.orm.em.fork();
    const agathaEmail = `agatha.${s.tag}@test.example`;
    const agatha = em.create(User, { email: agathaEmail, name: 'Agatha P. (her own spelling)', passwordHash: 'x', phone: null });
    em.create(Membership, { user: agatha, guild: s.otherGuild, roles: [] });
    // Clementine is already kept on paper by this guild: matched by name, her phone filled in.
    const clem = em.create(User, { email: null, name: 'clementine hatch', passwordHash: null });
    const clemMembership = em.create(Membership, { user: clem, guild: s.guild, roles: [], joinedAt: new Date('2020-03-01T12:00:00Z') });
    await em.flush();

    const res = await admin.post(base).send({ text: roster(s.tag) }).expect(201);
    expect(res.body.counts).toEqual({ created: 3, updated: 1, unchanged: 0, skipped: 6 });
    expect(res.body.skipped.map((r: { rowNumber: number }) => r.rowNumber)).toEqual([6, 7, 8, 9, 10, 11]);
    expect(res.body.skipped[0]).toMatchObject({ name: 'Edna Broadcloth', problems: [expect.stringMatching(/not an e-mail/)] });
    // Basil and Dot have an e-mail and no password; Agatha signs in already, Clementine is on paper.
    expect(res.body.toInvite.map((r: { name: string; invited: boolean }) => [r.name, r.invited])).toEqual([
      ['Basil Pinwheel', false],
      ['Dorcas "Dot" Wimble', false],
    ]);

    const check = t.orm.em.fork();
    const members = await check.find(Membership, { guild: s.guild.id }, { populate: ['user'] });
    const byName = new Map(members.map((m) => [m.user.name, m]));
    const agathaM = members.find((m) => m.user.email === agathaEmail)!;
    expect(agathaM.user.name).toBe('Agatha P. (her own spelling)');
    expect(agathaM.user.phone).toBeNull();
    expect(agathaM.roles).toEqual(['treasurer']);
    // Noon of that day in the guild's time zone (the scenario's guild keeps Chicago time).
    expect(agathaM.joinedAt.toISOString()).toBe('2015-09-01T17:00:00.000Z');
    const basil = byName.get('Basil Pinwheel')!;
    expect(basil.user).toMatchObject({ email: `basil.${s.tag}@test.example`, town: 'Brackenby' });
    expect(basil.joinedAt.toISOString().slice(0, 10)).toBe('2019-03-01');
    const dot = byName.get('Dorcas "Dot" Wimble')!;
    expect(dot.roles).toEqual(['show_chair']);
    expect(dot.user.town).toBe('Upper Tansley, East');
    expect(byName.get('Clementine Hatch')!.id).toBe(clemMembership.id);
    expect(byName.get('Clementine Hatch')!.user).toMatchObject({ email: null, phone: '555 0199', town: 'Fallowmere' });
    for (const name of ['Edna Broadcloth', 'Fenella Quire', 'Gwendolyn Tuck', 'Hester Mull']) expect(byName.has(name)).toBe(false);

    const conn = check.getConnection();
    const standings = await conn.execute<{ name: string; household: string | null; paid: string | null }[]>(
      `SELECT u.name, h.name AS household, DATE_FORMAT(d.paid_through, '%Y-%m-%d') AS paid
         FROM dues_standings d JOIN memberships m ON m.id = d.membership_id JOIN users u ON u.id = m.user_id
         LEFT JOIN households h ON h.id = d.household_id WHERE m.guild_id = ? ORDER BY u.name`,
      [s.guild.id],
    );
    expect(standings).toEqual([
      { name: 'Agatha P. (her own spelling)', household: 'Pinwheel', paid: '2026-12-31' },
      { name: 'Basil Pinwheel', household: 'Pinwheel', paid: '2026-12-31' },
      { name: 'Dorcas "Dot" Wimble', household: null, paid: null },
    ]);
    const households = await conn.execute<{ n: number }[]>('SELECT COUNT(*) AS n FROM households WHERE guild_id = ?', [s.guild.id]);
    expect(Number(households[0].n)).toBe(1);
    const audit = await conn.execute<{ action: string }[]>('SELECT action FROM dues_audit_log WHERE guild_id = ? ORDER BY id', [s.guild.id]);
    expect(audit.map((a) => a.action)).toEqual(['household_created', 'member_plan_changed', 'member_plan_changed']);
    const terms = await conn.execute<{ role: string; ends: string | null }[]>(
      'SELECT role, ends_on AS ends FROM office_terms WHERE membership_id IN (?, ?) ORDER BY role',
      [agathaM.id, dot.id],
    );
    expect(terms).toEqual([{ role: 'show_chair', ends: null }, { role: 'treasurer', ends: null }]);

    // The same file again: every row unchanged, and not one row of any table touched.
    const before = await state();
    await new Promise((r) => setTimeout(r, 20));
    const again = await admin.post(base).send({ text: roster(s.tag) }).expect(201);
    expect(again.body.counts).toEqual({ created: 0, updated: 0, unchanged: 4, skipped: 6 });
    expect(await state()).toEqual(before);
    const preview = await admin.post(`${base}/preview`).send({ text: roster(s.tag) }).expect(200);
    expect(preview.body.counts).toEqual({ rows: 10, new: 0, update: 0, unchanged: 4, problems: 6 });

    // A later file adds what it says and removes nothing: Agatha's role stays, Basil's paid-through moves on.
    const later = `Name,Email,Paid through,Roles\nAgatha,${agathaEmail},,Admin\nBasil Pinwheel,basil.${s.tag}@test.example,2027-12-31,\n`;
    const upd = await admin.post(`${base}/preview`).send({ text: later }).expect(200);
    expect(upd.body.rows.map((r: { action: string; changes: { field: string }[] }) => [r.action, r.changes.map((c) => c.field)])).toEqual([
      ['update', ['roles']],
      ['update', ['paidThrough']],
    ]);
    await admin.post(base).send({ text: later }).expect(201);
    const after = await t.orm.em.fork().findOneOrFail(Membership, agathaM.id);
    expect(after.roles).toEqual(['admin', 'treasurer']);
    const [last] = await conn.execute<{ summary: string }[]>('SELECT summary FROM dues_audit_log WHERE guild_id = ? ORDER BY id DESC LIMIT 1', [s.guild.id]);
    expect(last.summary).toBe('Basil Pinwheel: paid through 2027-12-31 (was 2026-12-31) (roster import, row 3).');
  });

  it('leaves nothing behind when the database refuses a row half-way', async () => {
    const { s, admin, base } = await setup();
    const conn = t.orm.em.fork().getConnection();
    const victim = `Ivy Faultline ${s.tag}`;
    // The audit lines are the import's last writes: by then its users, memberships, standings and
    // households are all in the transaction.
    await conn.execute(
      `CREATE TRIGGER roster_import_test_fail BEFORE INSERT ON dues_audit_log FOR EACH ROW
         BEGIN IF NEW.summary LIKE '${victim}:%' THEN SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'refused for the test'; END IF; END`,
    );
    try {
      const before = await state();
      const text = ['Name,Household,Paid through', 'Jemima Loft,Loft,2026-12-31', `${victim},Faultline,2026-12-31`, 'Kezia Loft,Loft,2026-12-31'].join('\n');
      const res = await admin.post(base).send({ text });
      expect(res.status).toBe(500);
      expect(await state()).toEqual(before);
    } finally {
      await conn.execute('DROP TRIGGER IF EXISTS roster_import_test_fail');
    }
  });

  it('sends invitations to imported members, skipping anyone who cannot be invited', async () => {
    const { s, admin, base } = await setup();
    const tag = unique('inv');
    const text = `Name,Email\nLettice Bodkin,lettice.${tag}@test.example\nMabel Awl,mabel.${tag}@test.example\nNell Paper,\n`;
    const imported = await admin.post(base).send({ text }).expect(201);
    const invite = imported.body.toInvite.map((r: { membershipId: number }) => r.membershipId);
    expect(invite).toHaveLength(2);
    const paper = await t.orm.em.fork().findOneOrFail(Membership, { guild: s.guild.id, user: { name: 'Nell Paper' } });
    const res = await admin
      .post(`${base}/invitations`)
      .send({ membershipIds: [...invite, paper.id, s.member.membership!.id, s.outsider.membership!.id] })
      .expect(200);
    expect(res.body.sent.map((r: { email: string }) => r.email).sort()).toEqual([`lettice.${tag}@test.example`, `mabel.${tag}@test.example`]);
    expect(res.body.skipped).toEqual([
      { membershipId: paper.id, name: 'Nell Paper', reason: 'No e-mail address: she stays on paper.' },
      { membershipId: s.member.membership!.id, name: s.member.user.name, reason: 'She already signs in.' },
      { membershipId: s.outsider.membership!.id, name: null, reason: 'Not a member of this guild.' },
    ]);
    const mail = await waitForMail(`lettice.${tag}@test.example`, (m) => m.subject.includes(s.guild.name));
    expect(mail.text).toMatch(/\/invitations\//);
    await waitForMail(`mabel.${tag}@test.example`);
    const twice = await admin.post(`${base}/invitations`).send({ membershipIds: [invite[0]] }).expect(200);
    expect(twice.body).toMatchObject({ sent: [], skipped: [{ reason: 'An invitation is already waiting for her.' }] });
    // A second import lists them as already invited.
    const again = await admin.post(base).send({ text }).expect(201);
    expect(again.body.toInvite.every((r: { invited: boolean }) => r.invited)).toBe(true);
    await admin.post(`${base}/invitations`).send({ membershipIds: 'all' }).expect(400);
    const tooMany = await admin.post(`${base}/invitations`).send({ membershipIds: Array.from({ length: 501 }, (_, i) => i + 1) }).expect(400);
    expect(tooMany.body.errors.membershipIds).toEqual(['Send at most 500 invitations at a time.']);
  });

  it('refuses bad input with a clear 4xx and writes nothing', async () => {
    const { s, admin, base } = await setup();
    const before = await state();
    const expectRefused = async (req: Promise<{ status: number; body: { message: string } }>, status: number, message: RegExp) => {
      const res = await req;
      expect([res.status, res.body.message]).toEqual([status, expect.stringMatching(message)]);
    };
    for (const path of [base, `${base}/preview`]) {
      await expectRefused(admin.post(path).send({}), 400, /Choose a CSV file, or paste/);
      await expectRefused(admin.post(path).send({ text: '' }), 400, /^The file is empty/);
      await expectRefused(admin.post(path).send({ text: 'Name,Email\n\n,\n' }), 400, /^The file has a header but no members/);
      await expectRefused(
        admin.post(path).attach('file', Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 73, 72, 68, 82]), 'photo.csv'),
        400,
        /not a spreadsheet saved as text/,
      );
      await expectRefused(admin.post(path).send({ text: 'Name,Town\n"Ada,Brackenby\n' }), 400, /^Line 2 starts a quoted cell/);
      const text = 'Name,Email\nOlive Tack,olive@test.example\n';
      await expectRefused(admin.post(path).send({ text, mapping: ['name', 'shoeSize'] }), 400, /“shoeSize” is not something a column can hold/);
      await expectRefused(admin.post(path).send({ text, mapping: { 0: 'name', 5: 'email' } }), 400, /no column 6/);
      await expectRefused(admin.post(path).send({ text, mapping: ['ignore', 'email'] }), 400, /^Choose which column holds the names\.$/);
      await expectRefused(admin.post(path).send({ text, mapping: ['name', 'name'] }), 400, /both set to “Name”/);
      await expectRefused(admin.post(path).send({ text, dateOrder: 'ymd' }), 400, /highlighted/);
      const many = 'Name\n' + Array.from({ length: 10_001 }, (_, i) => `Person ${i}`).join('\n');
      await expectRefused(admin.post(path).send({ text: many }), 413, /10,001 members.*10,000.*Split/);
      await expectRefused(admin.post(path).send({ text: 'Name\n' + 'x'.repeat(5 * 1024 * 1024 + 10) }), 413, /larger than 5 MB.*split/);
    }
    const mapped = await admin.post(`${base}/preview`).send({ text: 'Name\nAda\n', mapping: ['name', 'email'] });
    expect(mapped.body).toMatchObject({ statusCode: 400, errors: { mapping: [expect.stringMatching(/no column 2/)] } });

    // 50 MB is refused from its size alone, quickly, without the api holding it.
    const big = Buffer.alloc(50 * 1024 * 1024, 0x61);
    const started = Date.now();
    const upload = await admin.post(`${base}/preview`).attach('file', big, 'huge.csv');
    expect(upload.status).toBe(413);
    expect(upload.body.message).toMatch(/larger than 5 MB/);
    expect(Date.now() - started).toBeLessThan(15_000);
    const json = await admin.post(base).set('Content-Type', 'application/json').send(JSON.stringify({ text: 'x'.repeat(12 * 1024 * 1024) }));
    expect([json.status, json.body.message]).toEqual([413, expect.stringMatching(/5 MB/)]);
    expect(await state()).toEqual(before);
    // Other routes keep their own small JSON limit.
    const other = await admin.post(`/api/guilds/${s.guild.id}/invitations`).send({ email: 'x'.repeat(200 * 1024) });
    expect(other.status).toBe(413);
  });

  it('is for admins and membership chairs of the guild only', async () => {
    const { s, base } = await setup();
    const text = 'Name\nPip Rotary\n';
    const chair = await signIn(t, s.membershipChair.email);
    await chair.post(`${base}/preview`).send({ text }).expect(200);
    const member = await signIn(t, s.member.email);
    for (const path of [base, `${base}/preview`, `${base}/invitations`]) {
      const res = await member.post(path).send({ text, membershipIds: [] });
      expect(res.status).toBe(403);
    }
    const outsider = await signIn(t, s.outsider.email);
    expect((await outsider.post(`${base}/preview`).send({ text })).status).toBe(404);
    expect(await t.orm.em.fork().count(User, { name: 'Pip Rotary' })).toBe(0);
    expect(await t.orm.em.fork().count(Guild, { id: s.guild.id })).toBe(1);
  });
});
