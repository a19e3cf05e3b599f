import { normaliseRoles, ROLE_LABELS, type Role } from '../guilds/roles';
import { nameKey, type RosterCandidate } from './roster-rows';

/** A member of the guild as the import sees her. */
export interface ExistingMember {
  membershipId: number;
  userId: number;
  name: string;
  email: string | null;
  phone: string | null;
  town: string | null;
  /** She chose a password (signs in), or belongs to another guild too: her details are hers, not the roster's. */
  ownsDetails: boolean;
  hasPassword: boolean;
  status: 'active' | 'left';
  /** "Member since" as a guild-local date. */
  joinedOn: string;
  roles: Role[];
  household: string | null;
  paidThrough: string | null;
}

/** An account that exists (she signed up, or another guild keeps her) but is not in this guild. */
export interface ExistingAccount {
  userId: number;
  email: string;
  hasPassword: boolean;
}

export interface RosterSnapshot {
  membersByEmail: Map<string, ExistingMember>;
  /** This guild's members kept without an e-mail, by lower-cased name. */
  paperMembersByName: Map<string, ExistingMember[]>;
  /** This guild's members who have an e-mail, by lower-cased name: a row without one may be one of them. */
  emailMembersByName?: Map<string, ExistingMember[]>;
  accountsByEmail: Map<string, ExistingAccount>;
}

export type ChangeField = 'name' | 'phone' | 'town' | 'memberSince' | 'paidThrough' | 'household' | 'roles' | 'status';
export interface FieldChange {
  field: ChangeField;
  from: string | null;
  to: string | null;
}

export type RowPlan =
  | { action: 'skip' }
  | { action: 'new'; account: ExistingAccount | null }
  | { action: 'update'; member: ExistingMember; changes: FieldChange[] }
  | { action: 'unchanged'; member: ExistingMember };

const roleText = (roles: readonly Role[]) => (roles.length ? roles.map((r) => ROLE_LABELS[r]).join(', ') : null);

/**
 * What importing each row would do, against the guild as it is. A row is matched to a member by
 * e-mail, or, without one, by name among the members kept without an e-mail. Only what the file
 * says is applied: a blank cell keeps what Selvage holds, roles are only ever added, "paid
 * through" only moves forward, and the name, phone and town of someone who signs in (or belongs to
 * another guild) stay hers. May add a problem to a candidate (a name that matches two members).
 */
export function planRow(c: RosterCandidate, snap: RosterSnapshot): RowPlan {
  if (c.problems.length) return { action: 'skip' };
  let member: ExistingMember | undefined;
  if (c.email) {
    member = snap.membersByEmail.get(c.email);
    if (!member) return { action: 'new', account: snap.accountsByEmail.get(c.email) ?? null };
  } else {
    const matches = snap.paperMembersByName.get(nameKey(c.name)) ?? [];
    if (matches.length > 1) {
      c.problems.push(`The guild already has ${matches.length} members called “${c.name}” without an e-mail. Add her e-mail to the file so Selvage knows which one she is.`);
      return { action: 'skip' };
    }
    member = matches[0];
    if (!member) {
      // Without an e-mail the row cannot say she is the member of that name who has one; adding her
      // again would make two of her, so the admin decides.
      const namesake = snap.emailMembersByName?.get(nameKey(c.name))?.[0];
      if (namesake) {
        c.problems.push(`The guild already has a member called “${c.name}” with the e-mail ${namesake.email}. If this is her, add that e-mail to the row; if not, tell them apart in the name.`);
        return { action: 'skip' };
      }
      return { action: 'new', account: null };
    }
  }
  const changes: FieldChange[] = [];
  const set = (field: ChangeField, from: string | null, to: string | null) => {
    if (to !== null && to !== from) changes.push({ field, from, to });
  };
  if (!member.ownsDetails) {
    set('name', member.name, c.name);
    set('phone', member.phone, c.phone);
    set('town', member.town, c.town);
  }
  set('memberSince', member.joinedOn, c.memberSince);
  if (c.paidThrough && (member.paidThrough === null || c.paidThrough > member.paidThrough)) set('paidThrough', member.paidThrough, c.paidThrough);
  if (c.household && nameKey(c.household) !== nameKey(member.household ?? '')) set('household', member.household, c.household);
  const roles = normaliseRoles([...member.roles, ...c.roles]);
  if (roles.length !== member.roles.length) set('roles', roleText(member.roles), roleText(roles));
  if (member.status === 'left') set('status', 'left', 'active');
  return changes.length ? { action: 'update', member, changes } : { action: 'unchanged', member };
}

export interface PlanCounts {
  rows: number;
  new: number;
  update: number;
  unchanged: number;
  problems: number;
}

export function countPlans(plans: readonly RowPlan[]): PlanCounts {
  const counts: PlanCounts = { rows: plans.length, new: 0, update: 0, unchanged: 0, problems: 0 };
  for (const p of plans) {
    if (p.action === 'skip') counts.problems++;
    else counts[p.action]++;
  }
  return counts;
}
