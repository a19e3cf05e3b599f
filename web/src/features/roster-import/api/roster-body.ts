/** Where the roster comes from: a chosen file, or rows pasted from a spreadsheet. */
export type RosterSource = { kind: 'file'; file: File } | { kind: 'text'; text: string };

export type DateOrder = 'dmy' | 'mdy';

export const ROSTER_FIELDS = ['name', 'firstName', 'lastName', 'email', 'phone', 'town', 'household', 'memberSince', 'paidThrough', 'roles'] as const;
export type RosterField = (typeof ROSTER_FIELDS)[number];
export type ColumnUse = RosterField | 'ignore';

export const FIELD_LABELS: Record<ColumnUse, string> = {
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
  ignore: 'Leave out',
};

export type RosterOptions = {
  mapping?: ColumnUse[];
  dateOrder?: DateOrder;
  page?: number;
  onlyProblems?: boolean;
};

/** A file goes as multipart (the field `file`), pasted text as JSON; the options go with either. */
export function rosterBody(source: RosterSource, options: RosterOptions): FormData | Record<string, unknown> {
  if (source.kind === 'text') return { text: source.text, ...options };
  const form = new FormData();
  form.append('file', source.file);
  if (options.mapping) form.append('mapping', JSON.stringify(options.mapping));
  if (options.dateOrder) form.append('dateOrder', options.dateOrder);
  if (options.page) form.append('page', String(options.page));
  if (options.onlyProblems !== undefined) form.append('onlyProblems', String(options.onlyProblems));
  return form;
}
