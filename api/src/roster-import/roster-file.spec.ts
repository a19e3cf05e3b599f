import { checkRosterText, decodeRosterBytes, detectDelimiter, readRosterTable, RosterFileError } from './roster-file';

const fileError = (f: () => unknown): RosterFileError => {
  try {
    f();
  } catch (e) {
    if (e instanceof RosterFileError) return e;
    throw e;
  }
  throw new Error('expected a RosterFileError');
};

describe('reading a roster file', () => {
  it('drops a UTF-8 byte-order mark from bytes and from pasted text', () => {
    const bytes = Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from('Name,Email\nAda Quill,ada@example.org\n')]);
    const text = decodeRosterBytes(bytes);
    expect(text.startsWith('Name')).toBe(true);
    expect(readRosterTable(text).header).toEqual(['Name', 'Email']);
    expect(checkRosterText('\uFEFFName\nAda')).toBe('Name\nAda');
  });

  it('reads UTF-16 text with its mark and falls back to Windows-1252 for old spreadsheets', () => {
    const utf16 = Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from('Name\tTown\nZoë Marsh\tBrackenby\n', 'utf16le')]);
    expect(readRosterTable(decodeRosterBytes(utf16)).rows[0].cells).toEqual(['Zoë Marsh', 'Brackenby']);
    const latin = Buffer.from([0x4e, 0x61, 0x6d, 0x65, 0x0a, 0x52, 0x65, 0x6e, 0xe9, 0x65, 0x0a]); // "Name\nRenée\n"
    expect(decodeRosterBytes(latin)).toBe('Name\nRen\u00e9e\n');
  });

  it('refuses binary content with a message saying what to do', () => {
    const png = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 0x0d, 0x49, 0x48, 0x44, 0x52]);
    expect(fileError(() => decodeRosterBytes(png)).message).toMatch(/not a spreadsheet saved as text.*CSV/);
    const noisy = Array.from({ length: 400 }, (_, i) => String.fromCharCode(1 + (i % 7))).join('') + 'Name\nAda';
    expect(fileError(() => checkRosterText(noisy)).status).toBe(400);
    expect(fileError(() => checkRosterText('Name\u0000\nAda')).message).toMatch(/not a spreadsheet/);
    const workbook = Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x14, 0x00, 0x06, 0x00]);
    expect(fileError(() => decodeRosterBytes(workbook)).message).toMatch(/^This is a spreadsheet workbook.*CSV/);
  });

  it('refuses more than 5 MB with a 413 that suggests splitting', () => {
    const e = fileError(() => decodeRosterBytes(Buffer.alloc(5 * 1024 * 1024 + 1, 0x61)));
    expect(e.status).toBe(413);
    expect(e.message).toMatch(/5 MB.*split/);
  });

  it('detects comma, semicolon and tab, ignoring the ones inside quotes', () => {
    expect(detectDelimiter('Name,Email\nA,b')).toBe(',');
    expect(detectDelimiter('Name;Email;Town\nA;b;c')).toBe(';');
    expect(detectDelimiter('Name\tEmail\nA\tb')).toBe('\t');
    expect(detectDelimiter('"Name, full";Email\n')).toBe(';');
    expect(detectDelimiter('\n\nName,Town\n')).toBe(',');
    expect(detectDelimiter('Name\n')).toBe(',');
  });

  it('reads quoted cells holding commas, doubled quotes and line breaks, and trims every cell', () => {
    const t = readRosterTable('Name,Notes,Town\n"Marsh, Zoë","She said ""hello""","Line one\nLine two"\n  Ada Quill  , x ,Brackenby\n');
    expect(t.rows).toEqual([
      { rowNumber: 2, cells: ['Marsh, Zoë', 'She said "hello"', 'Line one\nLine two'] },
      { rowNumber: 3, cells: ['Ada Quill', 'x', 'Brackenby'] },
    ]);
  });

  it('skips blank lines and rows of empty cells but keeps spreadsheet row numbers', () => {
    const t = readRosterTable('Name;Town\r\n\r\nAda;Brackenby\r\n;;\r\n  ;\r\nBea;Fallowmere\r\n');
    expect(t.delimiter).toBe(';');
    expect(t.rows.map((r) => [r.rowNumber, r.cells[0]])).toEqual([
      [3, 'Ada'],
      [6, 'Bea'],
    ]);
  });

  it('reads tab-separated text pasted from a spreadsheet', () => {
    const t = readRosterTable('Name\tE-mail\nAda Quill\tada@example.org\nBea Loom\t\n');
    expect(t.delimiter).toBe('\t');
    expect(t.rows[1].cells).toEqual(['Bea Loom', '']);
  });

  it('explains an unclosed quote by its line instead of failing', () => {
    const e = fileError(() => readRosterTable('Name,Town\nAda,Brackenby\n"Bea,Fallowmere\nCora,Ditchling\n'));
    expect(e.status).toBe(400);
    expect(e.message).toMatch(/^Line 3 starts a quoted cell/);
    // A stray quote after a quoted cell is kept as written rather than refused.
    expect(readRosterTable('Name,Town\n"Ada"x,Brackenby\n').rows[0].cells).toEqual(['"Ada"x', 'Brackenby']);
  });

  it('refuses an empty file and a header without members', () => {
    expect(fileError(() => readRosterTable('')).message).toMatch(/empty/);
    expect(fileError(() => readRosterTable('  \n\n')).message).toMatch(/empty/);
    expect(fileError(() => readRosterTable('Name,Email\n,\n\n')).message).toBe('The file has a header but no members: every row below the header is empty.');
  });

  it('refuses more than 10,000 rows', () => {
    const text = 'Name\n' + Array.from({ length: 10_001 }, (_, i) => `Person ${i}`).join('\n');
    const e = fileError(() => readRosterTable(text));
    expect(e.status).toBe(413);
    expect(e.message).toMatch(/10,001 members.*10,000/);
    expect(readRosterTable(text.split('\n').slice(0, 10_001).join('\n')).rows).toHaveLength(10_000);
  });
});
