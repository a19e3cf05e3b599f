import { isEmail } from 'class-validator';
import { normaliseRoles, ROLE_LABELS, type Role } from '../guilds/roles';
import { parseRosterDate, type DateOrder } from './roster-dates';
import type { RosterTable } from './roster-file';

/** What a column can hold. A roster needs `name`, or `firstName` and/or `lastName`. */
export const ROSTER_FIELDS = [
  'name',
  'firstName',
  'lastName',
  'email',
  'phone',
  'town',
  'household',
  'memberSince',
  'paidThrough',
  'roles',
] as const;
export type RosterField = (typeof ROSTER_FIELDS)[number];
export type ColumnUse = RosterField | 'ignore';
export type Mapping = ColumnUse[];

export const FIELD_LABELS: Record<RosterField, string> = {
  name: 'Name',
  firstName: 'First name',
  lastName: 'Last name',
  email: 'E-mail',
  phone: 'Phone',
  town: 'Town',
  household: 'Household',
  memberSince: 'Member since',
  paidThrough: 'Paid through',
  roles: 'Roles',
};

/** Header words, lower-cased with anything but letters removed, for each field. */
const HEADER_WORDS: Record<RosterField, string[]> = {
  name: ['name', 'fullname', 'member', 'membername', 'names', 'yourname'],
  firstName: ['firstname', 'first', 'forename', 'givenname', 'christianname'],
  lastName: ['lastname', 'last', 'surname', 'familyname'],
  email: ['email', 'emailaddress', 'mail', 'emails'],
  phone: ['phone', 'mobile', 'telephone', 'tel', 'phonenumber', 'cell', 'cellphone', 'mobilephone', 'telephonenumber'],
  town: ['town', 'city', 'townorcity', 'village'],
  household: ['household', 'family', 'householdname'],
  memberSince: ['membersince', 'joined', 'datejoined', 'joinedon', 'joindate', 'since'],
  paidThrough: ['paidthrough', 'paidto', 'paiduntil', 'duespaiduntil', 'duespaidthrough', 'duespaidto', 'expires', 'expiry', 'expirydate', 'expiresOn'.toLowerCase(), 'renewaldue'],
  roles: ['roles', 'role', 'office', 'offices', 'position', 'positions', 'officer'],
};

const headerKey = (h: string) => h.toLowerCase().replace(/[^a-z]/g, '');

/** A first guess at each column's meaning from its header; unknown headers are ignored. */
export function guessMapping(header: readonly string[]): Mapping {
  const taken = new Set<RosterField>();
  return header.map((h) => {
    const key = headerKey(h);
    const field = ROSTER_FIELDS.find((f) => !taken.has(f) && HEADER_WORDS[f].includes(key));
    if (!field) return 'ignore';
    taken.add(field);
    return field;
  });
}

/** A mapping problem the admin must fix before anything can be read; always a 400. */
export class MappingError extends Error {}

/**
 * Checks a mapping the admin chose: an array with one entry per column, or an object from column
 * number (counting from 0) to field; columns left out are ignored.
 */
export function resolveMapping(header: readonly string[], given: unknown): Mapping {
  const fields = new Set<string>([...ROSTER_FIELDS, 'ignore']);
  const out: Mapping = header.map(() => 'ignore');
  let entries: [string, unknown][];
  if (Array.isArray(given)) entries = given.map((v, i) => [String(i), v]);
  else if (given && typeof given === 'object') entries = Object.entries(given as Record<string, unknown>);
  else throw new MappingError('Send the column choices as a list with one entry per column.');
  for (const [k, v] of entries) {
    if (!/^\d{1,6}$/.test(k) || Number(k) >= header.length)
      throw new MappingError(`The file has ${header.length} column${header.length === 1 ? '' : 's'}; there is no column ${Number(k) + 1}.`);
    if (typeof v !== 'string' || !fields.has(v))
      throw new MappingError(`“${String(v)}” is not something a column can hold. Choose one of: ${[...fields].join(', ')}.`);
    out[Number(k)] = v as ColumnUse;
  }
  const seen = new Map<string, number>();
  out.forEach((f, i) => {
    if (f === 'ignore') return;
    if (seen.has(f))
      throw new MappingError(
        `Columns ${seen.get(f)! + 1} and ${i + 1} are both set to “${FIELD_LABELS[f]}”. Choose one of them and set the other to “Leave out”.`,
      );
    seen.set(f, i);
  });
  if (!seen.has('name') && !seen.has('firstName') && !seen.has('lastName'))
    throw new MappingError('Choose which column holds the names.');
  if (seen.has('name') && (seen.has('firstName') || seen.has('lastName')))
    throw new MappingError('Choose either one column with the whole name, or the first-name and last-name columns, not both.');
  return out;
}

/** Words accepted in a roles cell; several may be given, separated by commas, semicolons, "/" or "and". */
const ROLE_WORDS: Record<string, Role | null> = {
  member: null,
  members: null,
  none: null,
  admin: 'admin',
  administrator: 'admin',
  treasurer: 'treasurer',
  membershipchair: 'membership_chair',
  membership: 'membership_chair',
  membershipsecretary: 'membership_chair',
  showchair: 'show_chair',
  show: 'show_chair',
  quiltshowchair: 'show_chair',
};

export function parseRoles(cell: string): { roles: Role[]; unknown: string[] } {
  const roles: Role[] = [];
  const unknown: string[] = [];
  for (const part of cell.split(/[,;/&+]|\band\b/i)) {
    const word = part.trim();
    if (!word) continue;
    const key = word.toLowerCase().replace(/[^a-z]/g, '');
    if (key in ROLE_WORDS) {
      const role = ROLE_WORDS[key];
      if (role) roles.push(role);
    } else unknown.push(word);
  }
  return { roles: normaliseRoles(roles), unknown };
}

export interface RosterCandidate {
  rowNumber: number;
  name: string;
  email: string | null;
  phone: string | null;
  town: string | null;
  household: string | null;
  memberSince: string | null;
  paidThrough: string | null;
  roles: Role[];
  problems: string[];
}

export const nameKey = (name: string) => name.trim().replace(/\s+/g, ' ').toLowerCase();

const LIMITS: Partial<Record<RosterField, number>> = { name: 120, email: 254, phone: 40, town: 120, household: 120 };
const ROLE_LIST = Object.values(ROLE_LABELS).join(', ');

/**
 * Reads every data row into a candidate member with the problems that keep it out of the import:
 * a missing name, a bad e-mail, an unknown role, a date that cannot be read, a value too long, or
 * a duplicate (the same e-mail twice, or the same name twice without an e-mail: every copy is
 * flagged, since the file does not say which one is right).
 */
export function readCandidates(table: RosterTable, mapping: Mapping, dateOrder: DateOrder): RosterCandidate[] {
  const col = (f: RosterField) => mapping.indexOf(f);
  const idx = Object.fromEntries(ROSTER_FIELDS.map((f) => [f, col(f)])) as Record<RosterField, number>;
  const cell = (cells: string[], f: RosterField) => (idx[f] >= 0 ? (cells[idx[f]] ?? '').replace(/\s+/g, ' ').trim() : '');

  const out = table.rows.map(({ rowNumber, cells }): RosterCandidate => {
    const problems: string[] = [];
    const name = idx.name >= 0 ? cell(cells, 'name') : [cell(cells, 'firstName'), cell(cells, 'lastName')].filter(Boolean).join(' ');
    if (!name) problems.push('No name: every member needs one.');
    else if (name.length > LIMITS.name!) problems.push(`The name is longer than ${LIMITS.name} letters.`);

    const rawEmail = cell(cells, 'email');
    let email: string | null = null;
    if (rawEmail) {
      const e = rawEmail.replace(/^mailto:/i, '').toLowerCase();
      if (e.length > LIMITS.email! || !isEmail(e)) problems.push(`“${rawEmail}” is not an e-mail address (like name@example.org).`);
      else email = e;
    }
    const text = (f: 'phone' | 'town' | 'household', label: string) => {
      const v = cell(cells, f);
      if (v.length > LIMITS[f]!) problems.push(`The ${label} is longer than ${LIMITS[f]} letters.`);
      return v || null;
    };
    const phone = text('phone', 'phone number');
    const town = text('town', 'town');
    const household = text('household', 'household name');
    const date = (f: 'memberSince' | 'paidThrough', label: string) => {
      const v = cell(cells, f);
      if (!v) return null;
      const r = parseRosterDate(v, dateOrder);
      if (r.ok) return r.date;
      problems.push(`${label}: ${r.message}`);
      return null;
    };
    const memberSince = date('memberSince', 'Member since');
    const paidThrough = date('paidThrough', 'Paid through');
    const { roles, unknown } = parseRoles(cell(cells, 'roles'));
    for (const u of unknown) problems.push(`“${u}” is not a role Selvage knows. Use ${ROLE_LIST} or Member (or leave it blank).`);
    return { rowNumber, name, email, phone, town, household, memberSince, paidThrough, roles, problems };
  });

  const byEmail = new Map<string, RosterCandidate[]>();
  const byName = new Map<string, RosterCandidate[]>();
  for (const c of out) {
    if (c.email) byEmail.set(c.email, [...(byEmail.get(c.email) ?? []), c]);
    else if (c.name && !c.problems.some((p) => p.includes('e-mail address'))) byName.set(nameKey(c.name), [...(byName.get(nameKey(c.name)) ?? []), c]);
  }
  for (const group of byEmail.values()) {
    if (group.length < 2) continue;
    const rows = group.map((c) => c.rowNumber);
    for (const c of group)
      c.problems.push(`The e-mail ${c.email} is on rows ${listRows(rows)}. One e-mail belongs to one person: keep it on one row only.`);
  }
  for (const group of byName.values()) {
    if (group.length < 2) continue;
    const rows = group.map((c) => c.rowNumber);
    for (const c of group)
      c.problems.push(`“${c.name}” is on rows ${listRows(rows)} without an e-mail, so Selvage cannot tell them apart. Remove the copy, or add an e-mail to each.`);
  }
  return out;
}

function listRows(rows: number[]): string {
  return rows.length <= 2 ? rows.join(' and ') : `${rows.slice(0, -1).join(', ')} and ${rows[rows.length - 1]}`;
}
