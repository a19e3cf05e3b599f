import { readRosterTable } from './roster-file';
import { guessMapping, MappingError, parseRoles, readCandidates, resolveMapping } from './roster-rows';

const mappingError = (f: () => unknown) => {
  try {
    f();
  } catch (e) {
    if (e instanceof MappingError) return e.message;
    throw e;
  }
  throw new Error('expected a MappingError');
};

describe('roster columns and rows', () => {
  it('guesses the columns from common header words and ignores the rest', () => {
    expect(guessMapping(['Full name', 'E-mail', 'Mobile', 'City', 'Family', 'Joined', 'Dues paid until', 'Office', 'Favourite block'])).toEqual([
      'name', 'email', 'phone', 'town', 'household', 'memberSince', 'paidThrough', 'roles', 'ignore',
    ]);
    expect(guessMapping(['Member', 'Email address', 'Telephone', 'Town', 'Household', 'Member since', 'Paid to', 'Position'])).toEqual([
      'name', 'email', 'phone', 'town', 'household', 'memberSince', 'paidThrough', 'roles',
    ]);
    expect(guessMapping(['First name', 'Last name', 'Expires', 'Roles', 'Name'])).toEqual(['firstName', 'lastName', 'paidThrough', 'roles', 'name']);
    // The second column with the same meaning is left out rather than guessed twice.
    expect(guessMapping(['Email', 'E-mail'])).toEqual(['email', 'ignore']);
  });

  it('checks a chosen mapping: known fields, real columns, one column per field, a name', () => {
    const header = ['Name', 'Email', 'Notes'];
    expect(resolveMapping(header, ['name', 'email', 'ignore'])).toEqual(['name', 'email', 'ignore']);
    expect(resolveMapping(header, { 0: 'name' })).toEqual(['name', 'ignore', 'ignore']);
    expect(mappingError(() => resolveMapping(header, ['name', 'shoeSize']))).toMatch(/“shoeSize” is not something a column can hold/);
    expect(mappingError(() => resolveMapping(header, { 7: 'email', 0: 'name' }))).toBe('The file has 3 columns; there is no column 8.');
    expect(mappingError(() => resolveMapping(header, ['name', 'ignore', 'ignore', 'email']))).toMatch(/no column 4/);
    expect(mappingError(() => resolveMapping(header, ['ignore', 'email']))).toBe('Choose which column holds the names.');
    expect(mappingError(() => resolveMapping(header, ['name', 'email', 'email']))).toMatch(/Columns 2 and 3 are both set to “E-mail”/);
    expect(mappingError(() => resolveMapping(header, 'name'))).toMatch(/list/);
  });

  it('joins first and last names', () => {
    const t = readRosterTable('First name,Last name,Email\nAda,Quill,\n,Loom,bea@example.org\nCora,,\n');
    const rows = readCandidates(t, guessMapping(t.header), 'dmy');
    expect(rows.map((r) => r.name)).toEqual(['Ada Quill', 'Loom', 'Cora']);
    expect(rows.every((r) => r.problems.length === 0)).toBe(true);
  });

  it('reads every field and mixed date formats in the chosen order', () => {
    const t = readRosterTable(
      'Name,E-mail,Phone,Town,Household,Member since,Paid through,Roles\n' +
        'Ada Quill,ADA@Example.org ,555 0101,Brackenby,Quill,2019-09-01,31/12/2026,"Treasurer, admin"\n' +
        'Bea Loom,,,,,"March 1, 2020",1/2/27,member\n' +
        'Cora Thimble,cora@example.org,,,,45292,01.02.2027,\n',
    );
    const [ada, bea, cora] = readCandidates(t, guessMapping(t.header), 'dmy');
    expect(ada).toEqual({
      rowNumber: 2, name: 'Ada Quill', email: 'ada@example.org', phone: '555 0101', town: 'Brackenby', household: 'Quill',
      memberSince: '2019-09-01', paidThrough: '2026-12-31', roles: ['admin', 'treasurer'], problems: [],
    });
    expect(bea).toMatchObject({ email: null, memberSince: '2020-03-01', paidThrough: '2027-02-01', roles: [], problems: [] });
    expect(cora).toMatchObject({ memberSince: '2024-01-01', paidThrough: '2027-02-01', problems: [] });
    const mdy = readCandidates(t, guessMapping(t.header), 'mdy');
    expect(mdy[0].problems).toEqual([expect.stringMatching(/^Paid through: “31\/12\/2026” is not a real date read month first/)]);
    expect(mdy[1].paidThrough).toBe('2027-01-02');
  });

  it('flags a missing name, a bad e-mail, an unknown role and an unreadable date', () => {
    const t = readRosterTable('Name,Email,Roles,Joined\n,nobody@example.org,,\nDot Hem,dot(at)example,,\nEve Bind,,President,\nFay Seam,,,soon\n');
    const rows = readCandidates(t, guessMapping(t.header), 'dmy');
    expect(rows[0].problems).toEqual(['No name: every member needs one.']);
    expect(rows[1].problems).toEqual(['“dot(at)example” is not an e-mail address (like name@example.org).']);
    expect(rows[2].problems).toEqual([expect.stringMatching(/^“President” is not a role Selvage knows/)]);
    expect(rows[3].problems).toEqual([expect.stringMatching(/^Member since: “soon” is not a date/)]);
  });

  it('flags every copy of an e-mail, and of a name without an e-mail', () => {
    const t = readRosterTable('Name,Email\nAda Quill,ada@example.org\nAda Q.,ADA@example.org\nBea Loom,\nbea  loom,\nBea Loom,bea@example.org\nCora,\n');
    const rows = readCandidates(t, guessMapping(t.header), 'dmy');
    expect(rows[0].problems).toEqual(['The e-mail ada@example.org is on rows 2 and 3. One e-mail belongs to one person: keep it on one row only.']);
    expect(rows[1].problems).toHaveLength(1);
    expect(rows[2].problems).toEqual([expect.stringMatching(/^“Bea Loom” is on rows 4 and 5 without an e-mail/)]);
    expect(rows[3].problems).toHaveLength(1);
    expect(rows[4].problems).toEqual([]);
    expect(rows[5].problems).toEqual([]);
  });

  it('reads role words and labels', () => {
    expect(parseRoles('Membership Chair / show chair')).toEqual({ roles: ['membership_chair', 'show_chair'], unknown: [] });
    expect(parseRoles('Administrator and Treasurer')).toEqual({ roles: ['admin', 'treasurer'], unknown: [] });
    expect(parseRoles('member')).toEqual({ roles: [], unknown: [] });
    expect(parseRoles('')).toEqual({ roles: [], unknown: [] });
    expect(parseRoles('membership_chair; Secretary')).toEqual({ roles: ['membership_chair'], unknown: ['Secretary'] });
  });
});
