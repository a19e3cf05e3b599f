import { pageCount, pageTexts, squash } from '../shows/pdf/pdf-test-helpers';
import { letterOf, MEMBERS_ONLY, paperFor, renderRoster, rosterGroups, surnameOf } from './roster-pdf';

// Invented people in invented towns.
const people = [
  { name: 'Hazel Ormsby', email: 'hazel@wrenfield.example', phone: '+1 555 0101', town: 'Wrenfield' },
  { name: 'Mabel Thornbury', phone: '555 0199', town: 'Little Wrenfield' },
  { name: 'Edith Vasquez-Orr', town: 'Saltmere' },
  { name: 'Ágota Oakhurst' },
  { name: 'Doreen Achterberg', email: 'doreen@wrenfield.example' },
];

describe('roster order', () => {
  it('sorts by surname and groups by its first letter, accents set aside', () => {
    expect(surnameOf('Edith Vasquez-Orr')).toBe('Vasquez-Orr');
    expect(letterOf('Ágota Ébert')).toBe('E');
    expect(letterOf('Cher')).toBe('C');
    expect(letterOf('  ')).toBe('#');
    const groups = rosterGroups(people);
    expect(groups.map((g) => g.letter)).toEqual(['A', 'O', 'T', 'V']);
    expect(groups[1].people.map((p) => p.name)).toEqual(['Ágota Oakhurst', 'Hazel Ormsby']);
  });
});

describe('paperFor', () => {
  it('prints on US Letter for dollar guilds of North America, A4 elsewhere', () => {
    expect(paperFor('USD')).toBe('letter');
    expect(paperFor('cad')).toBe('letter');
    expect(paperFor('GBP')).toBe('a4');
    expect(paperFor('EUR')).toBe('a4');
    expect(paperFor(null)).toBe('a4');
  });
});

describe('renderRoster', () => {
  it('prints the header, each letter, the names and only the details it is given', async () => {
    const pdf = await renderRoster({ guildName: 'Wrenfield Quilt Guild', guildTown: 'Wrenfield', printedOn: '2 December 2026', paper: 'a4', members: people });
    const text = squash((await pageTexts(pdf)).join(' '));
    expect(text).toContain('Wrenfield Quilt Guild');
    expect(text).toContain('Printed on 2 December 2026');
    expect(text).toContain(MEMBERS_ONLY);
    expect(text).toContain('Mabel Thornbury');
    expect(text).toContain('Little Wrenfield · 555 0199');
    expect(text).toContain('Wrenfield · +1 555 0101 · hazel@wrenfield.example');
    expect(text).toContain('Ágota Oakhurst');
    expect(text.indexOf('Doreen Achterberg')).toBeLessThan(text.indexOf('Hazel Ormsby'));
    expect(text.indexOf('Hazel Ormsby')).toBeLessThan(text.indexOf('Mabel Thornbury'));
    expect(text).toContain('Page 1 of 1');
  });

  it('runs over pages on US Letter with the notice and page number on every page', async () => {
    const many = Array.from({ length: 120 }, (_, i) => ({ name: `Member ${String.fromCharCode(65 + (i % 26))}maker${i}`, phone: `555 01${String(i).padStart(2, '0')}`, town: 'Wrenfield' }));
    const pdf = await renderRoster({ guildName: 'Wrenfield Quilt Guild', printedOn: '2 December 2026', paper: 'letter', members: many });
    const count = await pageCount(pdf);
    expect(count).toBeGreaterThan(2);
    const pages = await pageTexts(pdf);
    pages.forEach((page, i) => {
      expect(squash(page)).toContain(MEMBERS_ONLY);
      expect(squash(page)).toContain(`Page ${i + 1} of ${count}`);
    });
    const all = squash(pages.join(' '));
    for (const p of many) expect(all).toContain(p.name);
  });
});
