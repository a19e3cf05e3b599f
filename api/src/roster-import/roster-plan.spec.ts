import { countPlans, planRow, type ExistingMember, type RosterSnapshot } from './roster-plan';
import type { RosterCandidate } from './roster-rows';

const candidate = (over: Partial<RosterCandidate>): RosterCandidate => ({
  rowNumber: 2, name: 'Ada Quill', email: null, phone: null, town: null, household: null,
  memberSince: null, paidThrough: null, roles: [], problems: [], ...over,
});
const member = (over: Partial<ExistingMember>): ExistingMember => ({
  membershipId: 1, userId: 1, name: 'Ada Quill', email: null, phone: null, town: null, ownsDetails: false, hasPassword: false,
  status: 'active', joinedOn: '2020-01-01', roles: [], household: null, paidThrough: null, ...over,
});
const snapshot = (members: ExistingMember[], accounts: { userId: number; email: string; hasPassword: boolean }[] = []): RosterSnapshot => {
  const snap: RosterSnapshot = { membersByEmail: new Map(), paperMembersByName: new Map(), emailMembersByName: new Map(), accountsByEmail: new Map() };
  for (const m of members) {
    if (m.email) {
      snap.membersByEmail.set(m.email, m);
      snap.emailMembersByName!.set(m.name.toLowerCase(), [m]);
    }
    else snap.paperMembersByName.set(m.name.toLowerCase(), [...(snap.paperMembersByName.get(m.name.toLowerCase()) ?? []), m]);
  }
  for (const a of accounts) snap.accountsByEmail.set(a.email, a);
  return snap;
};

describe('planning an import', () => {
  it('skips rows with problems and makes new members for the rest', () => {
    expect(planRow(candidate({ problems: ['No name'] }), snapshot([]))).toEqual({ action: 'skip' });
    expect(planRow(candidate({ email: 'ada@example.org' }), snapshot([]))).toEqual({ action: 'new', account: null });
    const account = { userId: 9, email: 'ada@example.org', hasPassword: true };
    expect(planRow(candidate({ email: 'ada@example.org' }), snapshot([], [account]))).toEqual({ action: 'new', account });
  });

  it('matches by e-mail, or by name among members without an e-mail, and lists what changes', () => {
    const byEmail = member({ email: 'ada@example.org', name: 'Ada Q', roles: ['treasurer'] });
    const plan = planRow(candidate({ email: 'ada@example.org', phone: '555', roles: ['admin'], paidThrough: '2026-12-31', household: 'Quill' }), snapshot([byEmail]));
    expect(plan).toEqual({
      action: 'update',
      member: byEmail,
      changes: [
        { field: 'name', from: 'Ada Q', to: 'Ada Quill' },
        { field: 'phone', from: null, to: '555' },
        { field: 'paidThrough', from: null, to: '2026-12-31' },
        { field: 'household', from: null, to: 'Quill' },
        { field: 'roles', from: 'Treasurer', to: 'Admin, Treasurer' },
      ],
    });
    const paper = member({ name: 'Bea Loom', town: 'Fallowmere' });
    expect(planRow(candidate({ name: 'Bea Loom', town: 'Fallowmere' }), snapshot([paper]))).toEqual({ action: 'unchanged', member: paper });
    // Matched whatever the letter case; the file's spelling is then kept.
    expect(planRow(candidate({ name: 'BEA LOOM' }), snapshot([paper]))).toMatchObject({ action: 'update', changes: [{ field: 'name', from: 'Bea Loom', to: 'BEA LOOM' }] });
    // A paper member is not matched by a row that has an e-mail.
    expect(planRow(candidate({ name: 'Bea Loom', email: 'bea@example.org' }), snapshot([paper])).action).toBe('new');
  });

  it('never removes a role, never moves paid-through back, keeps blank cells as they are', () => {
    const m = member({ roles: ['admin'], paidThrough: '2027-12-31', household: 'Quill', town: 'Brackenby' });
    expect(planRow(candidate({ roles: [], paidThrough: '2026-12-31', household: 'quill' }), snapshot([m])).action).toBe('unchanged');
  });

  it("leaves the name, phone and town of someone who owns her account", () => {
    const m = member({ email: 'ada@example.org', name: 'Ada', ownsDetails: true, hasPassword: true });
    expect(planRow(candidate({ email: 'ada@example.org', name: 'Ada Quill', phone: '555', memberSince: '2019-01-01' }), snapshot([m]))).toMatchObject({
      action: 'update',
      changes: [{ field: 'memberSince', from: '2020-01-01', to: '2019-01-01' }],
    });
  });

  it('brings back a member who had left, and refuses a name that matches two members', () => {
    const left = member({ status: 'left' });
    expect(planRow(candidate({}), snapshot([left]))).toMatchObject({ action: 'update', changes: [{ field: 'status', from: 'left', to: 'active' }] });
    const c = candidate({});
    expect(planRow(c, snapshot([member({ membershipId: 1 }), member({ membershipId: 2 })]))).toEqual({ action: 'skip' });
    expect(c.problems).toEqual([expect.stringMatching(/already has 2 members called “Ada Quill”/)]);
  });

  it('counts the actions', () => {
    expect(countPlans([{ action: 'skip' }, { action: 'new', account: null }, { action: 'new', account: null }, { action: 'unchanged', member: member({}) }])).toEqual({
      rows: 4, new: 2, update: 0, unchanged: 1, problems: 1,
    });
  });

  it('will not add a second record for a member who has an e-mail when the row has none', () => {
    const c = candidate({ name: 'ada quill' });
    expect(planRow(c, snapshot([member({ email: 'ada@example.org' })]))).toEqual({ action: 'skip' });
    expect(c.problems).toEqual(['The guild already has a member called “ada quill” with the e-mail ada@example.org. If this is her, add that e-mail to the row; if not, tell them apart in the name.']);
    // With her e-mail the same row updates her.
    expect(planRow(candidate({ name: 'Ada Quill', email: 'ada@example.org' }), snapshot([member({ email: 'ada@example.org' })])).action).toBe('unchanged');
  });
});
