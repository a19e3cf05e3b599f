import { LockMode } from '@mikro-orm/core';
import { EntityManager } from '@mikro-orm/mariadb';
import { BadRequestException, ConflictException, HttpException, Injectable } from '@nestjs/common';
import { DateTime } from 'luxon';
import type { SessionUser } from '../auth/session-user';
import { withTransaction } from '../database/transaction';
import { DuesStanding } from '../dues/dues-standing.entity';
import { Household } from '../dues/household.entity';
import { todayIn } from '../dues/dues-rules';
import { writeAudit } from '../dues/money-audit';
import { Guild } from '../guilds/guild.entity';
import { Membership } from '../guilds/membership.entity';
import { normaliseRoles, type Role } from '../guilds/roles';
import { Invitation } from '../invitations/invitation.entity';
import { InvitationsService } from '../invitations/invitations.service';
import { OfficeTerm } from '../offices/office-term.entity';
import { termsOverlap } from '../offices/terms';
import { User } from '../users/user.entity';
import { defaultDateOrder, type DateOrder } from './roster-dates';
import { checkRosterText, DELIMITER_NAMES, decodeRosterBytes, readRosterTable, RosterFileError, type RosterTable } from './roster-file';
import { countPlans, planRow, type ExistingMember, type RosterSnapshot, type RowPlan } from './roster-plan';
import { guessMapping, MappingError, nameKey, readCandidates, resolveMapping, type Mapping, type RosterCandidate } from './roster-rows';
import type { RosterImportDto } from './dto/roster-import.dto';

export const PREVIEW_PAGE_SIZE = 100;

export interface RosterInput {
  dto: RosterImportDto;
  file?: { buffer: Buffer } | undefined;
}

interface ReadRoster {
  table: RosterTable;
  mapping: Mapping;
  guessed: boolean;
  mappingProblem: string | null;
  dateOrder: DateOrder;
  candidates: RosterCandidate[];
}

/** Entities behind a planned update, so the import can change them. */
interface Loaded {
  snapshot: RosterSnapshot;
  memberships: Map<number, Membership>;
  standings: Map<number, DuesStanding>;
  households: Map<string, Household>;
}

const IN_CHUNK = 1000;
const chunks = <T>(list: T[]) => Array.from({ length: Math.ceil(list.length / IN_CHUNK) }, (_, i) => list.slice(i * IN_CHUNK, (i + 1) * IN_CHUNK));

/** "Member since" is kept as noon of that day in the guild's time zone, so it reads back as the same day. */
const noonIn = (isoDate: string, timeZone: string) => DateTime.fromISO(isoDate, { zone: timeZone }).set({ hour: 12 }).toJSDate();

@Injectable()
export class RosterImportService {
  constructor(
    private readonly em: EntityManager,
    private readonly invitations: InvitationsService,
  ) {}

  /** The file or pasted text, its columns and every row read into a candidate member. Writes nothing. */
  read(guild: Guild, { dto, file }: RosterInput, { requireMapping }: { requireMapping: boolean }): ReadRoster {
    let text: string;
    try {
      if (file) text = decodeRosterBytes(file.buffer);
      else if (typeof dto.text === 'string') text = checkRosterText(dto.text);
      else throw new RosterFileError('Choose a CSV file, or paste the rows from your spreadsheet.');
      const table = readRosterTable(text);
      const dateOrder = dto.dateOrder ?? defaultDateOrder(guild.currency);
      if (dto.mapping !== undefined && dto.mapping !== null) {
        const mapping = resolveMapping(table.header, dto.mapping);
        return { table, mapping, guessed: false, mappingProblem: null, dateOrder, candidates: readCandidates(table, mapping, dateOrder) };
      }
      const mapping = guessMapping(table.header);
      try {
        resolveMapping(table.header, mapping);
      } catch (e) {
        if (!(e instanceof MappingError) || requireMapping) throw e;
        // The preview still shows the columns so the admin can say which one holds the names.
        return { table, mapping, guessed: true, mappingProblem: e.message, dateOrder, candidates: [] };
      }
      return { table, mapping, guessed: true, mappingProblem: null, dateOrder, candidates: readCandidates(table, mapping, dateOrder) };
    } catch (e) {
      if (e instanceof RosterFileError) throw new HttpException({ statusCode: e.status, message: e.message }, e.status);
      if (e instanceof MappingError) throw new BadRequestException({ message: e.message, errors: { mapping: [e.message] } });
      throw e;
    }
  }

  async preview(me: Membership, input: RosterInput) {
    const read = this.read(me.guild, input, { requireMapping: false });
    const loaded = await this.load(this.em.fork(), me.guild, read.candidates);
    const plans = read.candidates.map((c) => planRow(c, loaded.snapshot));
    const rows = read.candidates.map((c, i) => rowView(c, plans[i]));
    const shown = input.dto.onlyProblems ? rows.filter((r) => r.action === 'skip') : rows;
    const pageCount = Math.max(1, Math.ceil(shown.length / PREVIEW_PAGE_SIZE));
    const page = Math.min(input.dto.page ?? 1, pageCount);
    return {
      delimiter: DELIMITER_NAMES[read.table.delimiter],
      header: read.table.header,
      mapping: read.mapping,
      guessed: read.guessed,
      mappingProblem: read.mappingProblem,
      dateOrder: read.dateOrder,
      counts: countPlans(plans),
      page,
      pageCount,
      pageSize: PREVIEW_PAGE_SIZE,
      onlyProblems: Boolean(input.dto.onlyProblems),
      rows: shown.slice((page - 1) * PREVIEW_PAGE_SIZE, page * PREVIEW_PAGE_SIZE),
    };
  }

  /**
   * Writes every row without problems in one transaction (the guild row locked, so two imports
   * never interleave); rows with problems are reported and left out. Nothing the file lacks is removed.
   */
  async import(me: Membership, input: RosterInput) {
    const read = this.read(me.guild, input, { requireMapping: true });
    return withTransaction(this.em, async (tx) => {
      await tx.findOneOrFail(Guild, { id: me.guild.id }, { lockMode: LockMode.PESSIMISTIC_WRITE });
      const actor = await tx.findOneOrFail(User, { id: me.user.id });
      const guild = tx.getReference(Guild, me.guild.id);
      // Plan again inside the transaction: the guild may have changed since the preview.
      const candidates = read.candidates.map((c) => ({ ...c, problems: [...c.problems] }));
      const loaded = await this.load(tx, me.guild, candidates);
      const plans = candidates.map((c) => planRow(c, loaded.snapshot));

      const newHouseholds: Household[] = [];
      const household = (name: string): Household => {
        const key = nameKey(name);
        let h = loaded.households.get(key);
        if (!h) {
          h = tx.create(Household, { guild, name });
          loaded.households.set(key, h);
          newHouseholds.push(h);
        }
        return h;
      };

      const written: { candidate: RosterCandidate; membership: Membership; user: User; standingNotes: string[]; rolesAdded: Role[] }[] = [];
      const unchanged: { membershipId: number }[] = [];
      plans.forEach((plan, i) => {
        const c = candidates[i];
        if (plan.action === 'skip') return;
        if (plan.action === 'unchanged') {
          unchanged.push({ membershipId: plan.member.membershipId });
          return;
        }
        if (plan.action === 'new') {
          const user = plan.account
            ? tx.getReference(User, plan.account.userId)
            : tx.create(User, { email: c.email, name: c.name, passwordHash: null, phone: c.phone, town: c.town });
          const membership = tx.create(Membership, {
            user,
            guild,
            roles: c.roles,
            joinedAt: c.memberSince ? noonIn(c.memberSince, me.guild.timeZone) : new Date(),
          });
          tx.create(DuesStanding, {
            membership,
            household: c.household ? household(c.household) : null,
            paidThrough: c.paidThrough,
          });
          const standingNotes = [c.household && `household ${c.household}`, c.paidThrough && `paid through ${c.paidThrough}`].filter((x): x is string => !!x);
          written.push({ candidate: c, membership, user, standingNotes, rolesAdded: c.roles });
          return;
        }
        const membership = loaded.memberships.get(plan.member.membershipId)!;
        const user = membership.user;
        let standing = loaded.standings.get(membership.id);
        const standingNotes: string[] = [];
        const rolesAdded = c.roles.filter((r) => !membership.roles.includes(r));
        const standingRow = () => (standing ??= tx.create(DuesStanding, { membership }));
        for (const change of plan.changes) {
          if (change.field === 'name') user.name = c.name;
          else if (change.field === 'phone') user.phone = c.phone;
          else if (change.field === 'town') user.town = c.town;
          else if (change.field === 'memberSince') membership.joinedAt = noonIn(c.memberSince!, me.guild.timeZone);
          else if (change.field === 'roles') membership.roles = normaliseRoles([...membership.roles, ...c.roles]);
          else if (change.field === 'status') membership.status = 'active';
          else if (change.field === 'paidThrough') {
            standingRow().paidThrough = c.paidThrough;
            standingNotes.push(`paid through ${c.paidThrough} (was ${change.from ?? 'never paid'})`);
          } else if (change.field === 'household') {
            standingRow().household = household(c.household!);
            standingNotes.push(`household ${c.household} (was ${change.from ?? 'none'})`);
          }
        }
        written.push({ candidate: c, membership, user, standingNotes, rolesAdded });
      });
      await tx.flush();

      // A role the file gives her is an office held from today, as when an admin adds it by hand.
      const withRoles = written.filter((w) => w.rolesAdded.length);
      if (withRoles.length) {
        const today = todayIn(me.guild.timeZone);
        const terms = await tx.find(OfficeTerm, { guild: me.guild.id, membership: { $in: withRoles.map((w) => w.membership.id) } });
        for (const w of withRoles)
          for (const role of w.rolesAdded) {
            const open = { startsOn: today, endsOn: null };
            if (terms.some((t) => t.membership.id === w.membership.id && t.role === role && termsOverlap(t, open))) continue;
            tx.create(OfficeTerm, { guild, membership: w.membership, role, startsOn: today, recordedBy: me.id, note: 'Roster import' });
          }
      }

      // The money audit log, as the treasurer's own screens write it.
      for (const h of newHouseholds)
        writeAudit(tx, {
          guild: me.guild.id,
          actor: me.id,
          actorName: actor.name,
          action: 'household_created',
          subjectType: 'household',
          subjectId: h.id,
          summary: `Household "${h.name}" created by the roster import.`,
        });
      for (const w of written) {
        if (!w.standingNotes.length) continue;
        const c = w.candidate;
        writeAudit(tx, {
          guild: me.guild.id,
          actor: me.id,
          actorName: actor.name,
          action: 'member_plan_changed',
          subjectType: 'membership',
          subjectId: w.membership.id,
          summary: `${c.name}: ${w.standingNotes.join(', ')} (roster import, row ${c.rowNumber}).`,
          detail: { membershipId: w.membership.id, rosterRow: c.rowNumber, household: c.household, paidThrough: c.paidThrough },
        });
      }
      await tx.flush();

      const counts = countPlans(plans);
      const touched = [...written.map((w) => w.membership.id), ...unchanged.map((u) => u.membershipId)];
      return {
        counts: { created: counts.new, updated: counts.update, unchanged: counts.unchanged, skipped: counts.problems },
        skipped: candidates
          .filter((_, i) => plans[i].action === 'skip')
          .map((c) => ({ rowNumber: c.rowNumber, name: c.name, problems: c.problems })),
        toInvite: await this.invitable(tx, me.guild, touched),
      };
    });
  }

  /** Of these memberships, the ones with an e-mail who cannot sign in yet, and whether an invitation is waiting. */
  private async invitable(em: EntityManager, guild: Guild, membershipIds: number[]) {
    const out: { membershipId: number; name: string; email: string; invited: boolean }[] = [];
    for (const ids of chunks(membershipIds)) {
      const rows: { id: number; name: string; email: string; invited: number }[] = await em.execute(
        `SELECT m.id, u.name, u.email,
                EXISTS (SELECT 1 FROM invitations i WHERE i.guild_id = m.guild_id AND i.email = u.email
                        AND i.accepted_at IS NULL AND i.revoked_at IS NULL AND i.expires_at > ?) AS invited
           FROM memberships m JOIN users u ON u.id = m.user_id
          WHERE m.guild_id = ? AND m.id IN (${ids.map(() => '?').join(',')}) AND m.status = 'active'
            AND u.email IS NOT NULL AND u.password_hash IS NULL`,
        [new Date(), guild.id, ...ids],
      );
      for (const r of rows) out.push({ membershipId: r.id, name: r.name, email: r.email, invited: Boolean(Number(r.invited)) });
    }
    return out.sort((a, b) => a.name.localeCompare(b.name));
  }

  /** The guild's members, standings and households, and the accounts the file's e-mails belong to. */
  private async load(em: EntityManager, guild: Guild, candidates: RosterCandidate[]): Promise<Loaded> {
    const memberships = await em.find(Membership, { guild: guild.id }, { populate: ['user', 'user.passwordHash'] });
    const standings = await em.find(DuesStanding, { membership: { guild: guild.id } }, { populate: ['household'] });
    const households = await em.find(Household, { guild: guild.id });
    const inOtherGuilds = new Set(
      (
        await em.execute<{ user_id: number }[]>(
          `SELECT DISTINCT o.user_id FROM memberships m JOIN memberships o ON o.user_id = m.user_id AND o.guild_id <> m.guild_id WHERE m.guild_id = ?`,
          [guild.id],
        )
      ).map((r) => Number(r.user_id)),
    );
    const standingOf = new Map(standings.map((s) => [s.membership.id, s]));
    const snapshot: RosterSnapshot = { membersByEmail: new Map(), paperMembersByName: new Map(), emailMembersByName: new Map(), accountsByEmail: new Map() };
    for (const m of memberships) {
      const u = m.user;
      const st = standingOf.get(m.id);
      const member: ExistingMember = {
        membershipId: m.id,
        userId: u.id,
        name: u.name,
        email: u.email,
        phone: u.phone ?? null,
        town: u.town ?? null,
        hasPassword: Boolean(u.passwordHash),
        ownsDetails: Boolean(u.passwordHash) || inOtherGuilds.has(u.id),
        status: m.status,
        joinedOn: DateTime.fromJSDate(m.joinedAt).setZone(guild.timeZone).toISODate()!,
        roles: m.roles,
        household: st?.household?.name ?? null,
        paidThrough: st?.paidThrough ?? null,
      };
      if (u.email) {
        snapshot.membersByEmail.set(u.email, member);
        const key = nameKey(u.name);
        snapshot.emailMembersByName!.set(key, [...(snapshot.emailMembersByName!.get(key) ?? []), member]);
      } else {
        const key = nameKey(u.name);
        snapshot.paperMembersByName.set(key, [...(snapshot.paperMembersByName.get(key) ?? []), member]);
      }
    }
    const emails = [...new Set(candidates.map((c) => c.email).filter((e): e is string => !!e && !snapshot.membersByEmail.has(e)))];
    for (const list of chunks(emails)) {
      const users = await em.find(User, { email: { $in: list } }, { populate: ['passwordHash'] });
      for (const u of users) snapshot.accountsByEmail.set(u.email!, { userId: u.id, email: u.email!, hasPassword: Boolean(u.passwordHash) });
    }
    return {
      snapshot,
      memberships: new Map(memberships.map((m) => [m.id, m])),
      standings: standingOf,
      households: new Map(households.map((h) => [nameKey(h.name), h])),
    };
  }

  /**
   * One invitation each through the ordinary invitation path; anyone who already signs in, has no
   * e-mail, already has an invitation waiting or is not in the guild is skipped with the reason.
   */
  async invite(me: Membership, inviter: SessionUser, membershipIds: number[]) {
    const ids = [...new Set(membershipIds)];
    const found = new Map<number, Membership>();
    for (const list of chunks(ids))
      for (const m of await this.em.fork().find(Membership, { id: { $in: list }, guild: me.guild.id }, { populate: ['user', 'user.passwordHash'] }))
        found.set(m.id, m);
    const sent: { membershipId: number; name: string; email: string }[] = [];
    const skipped: { membershipId: number; name: string | null; reason: string }[] = [];
    for (const id of ids) {
      const m = found.get(id);
      if (!m || m.status !== 'active') {
        skipped.push({ membershipId: id, name: m?.user.name ?? null, reason: 'Not a member of this guild.' });
        continue;
      }
      const { name, email } = m.user;
      if (!email) skipped.push({ membershipId: id, name, reason: 'No e-mail address: she stays on paper.' });
      else if (m.user.passwordHash) skipped.push({ membershipId: id, name, reason: 'She already signs in.' });
      else if (await this.em.fork().count(Invitation, { guild: me.guild.id, email, acceptedAt: null, revokedAt: null, expiresAt: { $gt: new Date() } }))
        skipped.push({ membershipId: id, name, reason: 'An invitation is already waiting for her.' });
      else {
        try {
          await this.invitations.invite(me, inviter, email);
          sent.push({ membershipId: id, name, email });
        } catch (e) {
          if (!(e instanceof ConflictException)) throw e;
          skipped.push({ membershipId: id, name, reason: e.message });
        }
      }
    }
    return { sent, skipped };
  }
}

function rowView(c: RosterCandidate, plan: RowPlan) {
  return {
    rowNumber: c.rowNumber,
    values: {
      name: c.name,
      email: c.email,
      phone: c.phone,
      town: c.town,
      household: c.household,
      memberSince: c.memberSince,
      paidThrough: c.paidThrough,
      roles: c.roles,
    },
    problems: c.problems,
    action: plan.action,
    existingAccount: plan.action === 'new' && plan.account !== null,
    changes: plan.action === 'update' ? plan.changes : [],
  };
}
