import { LockMode } from '@mikro-orm/core';
import { EntityManager } from '@mikro-orm/mariadb';
import { ConflictException, Injectable, Logger, NotFoundException } from '@nestjs/common';
import { writeAudit } from '../dues/money-audit';
import { formatMoney } from '../dues/money';
import { Membership } from '../guilds/membership.entity';
import { ROLE_LABELS } from '../guilds/roles';
import { endSessionsOf } from '../sessions/sessions';
import { FileStore } from '../storage/file-store';
import { User } from '../users/user.entity';
import { erasureRefusals, formerMemberName, replaceName, type ErasureFacts, type UnpaidInvoice } from './erasure-rules';

/** What an erasure removes and what it keeps, for the admin to read before she confirms. */
export interface ErasurePlan {
  membershipId: number;
  name: string;
  newName: string;
  leftAt: Date | null;
  eraseRequestedAt: Date | null;
  refusals: { code: string; message: string }[];
  erases: string[];
  keeps: string[];
}

const ERASES = [
  'her name (replaced by the record name), e-mail address, phone, town and password',
  'her directory choices and e-mail preferences, and every session she is signed in with',
  'her date of birth, if the treasurer recorded one for a dues plan',
  'her block photos and their size checks, and the photos and stories of her show entries',
  'e-mails Selvage sent her, her invitations and password reset links',
];
const KEEPS = [
  'every invoice, payment, refund and receipt number, with the amounts, under the record name (the treasurer must keep them)',
  'the money audit log exactly as it was written: it can only ever be added to',
  'her bee blocks and show entries (titles, sizes, results), under the record name',
  'ballots: they never carried her name',
];

@Injectable()
export class DeparturesService {
  private readonly logger = new Logger(DeparturesService.name);

  constructor(
    private readonly em: EntityManager,
    private readonly files: FileStore,
  ) {}

  /** She leaves the guild herself (from her profile page). */
  async leave(me: Membership, eraseRequest: boolean) {
    return this.markLeft(me.guild.id, me.id, eraseRequest, true);
  }

  /** An officer records that a member has left (she told them, or stopped renewing). */
  async recordDeparture(viewer: Membership, membershipId: number) {
    if (membershipId === viewer.id) throw new ConflictException('To leave the guild yourself, use "Leave this guild" on your profile page.');
    return this.markLeft(viewer.guild.id, membershipId, false, false);
  }

  private async markLeft(guildId: number, membershipId: number, eraseRequest: boolean, self: boolean) {
    return this.em.transactional(async (em) => {
      const m = await em.findOne(Membership, { id: membershipId, guild: guildId }, { populate: ['user'], lockMode: LockMode.PESSIMISTIC_WRITE });
      if (!m) throw new NotFoundException('That member is not in this guild.');
      if (m.status === 'left') throw new ConflictException(self ? 'You have already left this guild.' : `${m.user.name} has already left.`);
      if (m.roles.length) {
        const offices = m.roles.map((r) => ROLE_LABELS[r]).join(' and ');
        throw new ConflictException(
          self
            ? `You are the guild's ${offices}. Ask an admin to hand the office on (Officers page) before you leave.`
            : `${m.user.name} is the guild's ${offices}. Hand the office on first (Officers page), then record that she has left.`,
        );
      }
      const now = new Date();
      m.status = 'left';
      m.leftAt = now;
      if (eraseRequest) m.eraseRequestedAt = now;
      // She stops being a maker in the guild's bees; her past blocks stay in their rounds.
      await em.getConnection().execute(
        "UPDATE bee_members SET status = 'left', left_at = ?, updated_at = ? WHERE membership_id = ? AND status <> 'left'",
        [now, now, m.id],
        'run',
        em.getTransactionContext(),
      );
      await em.flush();
      return { membershipId: m.id, name: m.user.name, status: m.status, leftAt: m.leftAt, eraseRequestedAt: m.eraseRequestedAt ?? null };
    });
  }

  async plan(viewer: Membership, membershipId: number): Promise<ErasurePlan> {
    return this.gather(this.em, viewer.guild.id, membershipId, false);
  }

  /**
   * Erases a departed member's personal data in one transaction; money records stay, under the
   * record name. Photos are removed from storage once the transaction has committed.
   */
  async erase(viewer: Membership, membershipId: number, actorName: string) {
    const photoKeys: string[] = [];
    const result = await this.em.transactional(async (em) => {
      const plan = await this.gather(em, viewer.guild.id, membershipId, true);
      if (plan.refusals.length) throw new ConflictException({ message: plan.refusals.map((r) => r.message).join(' '), refusals: plan.refusals });
      const m = await em.findOneOrFail(Membership, { id: membershipId }, { populate: ['user'] });
      const user = m.user;
      const oldEmail = user.email;
      const oldName = user.name;
      const run = (sql: string, params: unknown[]) => em.getConnection().execute(sql, params, 'run', em.getTransactionContext());
      const all = <T>(sql: string, params: unknown[]) => em.getConnection().execute(sql, params, 'all', em.getTransactionContext()) as Promise<T[]>;
      const mine = await all<{ id: number }>('SELECT id FROM memberships WHERE user_id = ?', [user.id]);
      const ids = mine.map((r) => Number(r.id));
      const inList = `(${ids.map(() => '?').join(', ')})`;

      // Photos: block size checks she uploaded, and her show entries' pictures.
      const checks = await all<{ images: string | null }>('SELECT images FROM size_checks WHERE uploaded_by_id = ?', [user.id]);
      for (const c of checks) {
        const images = typeof c.images === 'string' ? (JSON.parse(c.images) as Record<string, string> | null) : (c.images as Record<string, string> | null);
        if (images) photoKeys.push(...Object.values(images).filter(Boolean));
      }
      await run('DELETE FROM size_checks WHERE uploaded_by_id = ?', [user.id]);
      const entries = await all<{ id: number; makers: string | string[]; quilter: string; photo_key: string | null; photo_thumb_key: string | null }>(
        `SELECT id, makers, quilter, photo_key, photo_thumb_key FROM show_entries WHERE membership_id IN ${inList}`,
        ids,
      );
      const newName = formerMemberName(m.id);
      for (const e of entries) {
        const makers = typeof e.makers === 'string' ? (JSON.parse(e.makers) as string[]) : e.makers;
        if (e.photo_key) photoKeys.push(e.photo_key);
        if (e.photo_thumb_key) photoKeys.push(e.photo_thumb_key);
        await run("UPDATE show_entries SET makers = ?, quilter = ?, story = '', photo_key = NULL, photo_thumb_key = NULL, updated_at = ? WHERE id = ?", [
          JSON.stringify(replaceName(makers, oldName, newName)),
          replaceName([e.quilter], oldName, newName)[0],
          new Date(),
          e.id,
        ]);
      }
      await run(`UPDATE dues_standings SET birth_date = NULL WHERE membership_id IN ${inList}`, ids);
      await run('UPDATE round_blocks SET tracking_number = NULL WHERE maker_id IN ' + inList, ids);
      await run('DELETE FROM password_resets WHERE user_id = ?', [user.id]);
      if (oldEmail) {
        await run('DELETE FROM invitations WHERE email = ?', [oldEmail]);
        await run('DELETE FROM sign_in_failures WHERE email = ?', [oldEmail]);
        await run("DELETE FROM outbox_messages WHERE to_address = ? AND status <> 'sending'", [oldEmail]);
      }
      await endSessionsOf(em, user.id);
      user.name = newName;
      user.email = null;
      user.passwordHash = null;
      user.phone = null;
      user.town = null;
      user.showEmail = false;
      user.showPhone = false;
      user.showTown = false;
      user.remindersOff = true;
      user.lastSignInAt = null;
      user.erasedAt = new Date();
      // The books' own log says that it happened and who did it, without the name it erased.
      writeAudit(em, {
        guild: viewer.guild.id,
        actor: viewer.id,
        actorName,
        action: 'member_erased',
        subjectType: 'membership',
        subjectId: m.id,
        summary: `Personal data of a departed member erased; her money records are kept under "${newName}".`,
      });
      await em.flush();
      return { membershipId: m.id, name: newName, erasedAt: user.erasedAt, photosRemoved: photoKeys.length, showEntriesChanged: entries.length };
    });
    for (const key of photoKeys) {
      try {
        await this.files.delete(key);
      } catch (e) {
        this.logger.warn(`could not remove an erased member's photo: ${(e as Error).message}`);
      }
    }
    return result;
  }

  private async gather(em: EntityManager, guildId: number, membershipId: number, lock: boolean): Promise<ErasurePlan> {
    const m = await em.findOne(
      Membership,
      { id: membershipId, guild: guildId },
      { populate: ['user', 'guild'], ...(lock ? { lockMode: LockMode.PESSIMISTIC_WRITE } : {}) },
    );
    if (!m) throw new NotFoundException('That member is not in this guild.');
    const user = await em.findOneOrFail(User, { id: m.user.id }, lock ? { lockMode: LockMode.PESSIMISTIC_WRITE } : {});
    const elsewhere: { name: string }[] = await em.execute(
      "SELECT g.name FROM memberships x JOIN guilds g ON g.id = x.guild_id WHERE x.user_id = ? AND x.id <> ? AND x.status = 'active' ORDER BY g.name",
      [user.id, m.id],
    );
    const unpaid: { id: number; purpose: string; year_label: string; total_cents: number; currency: string }[] = await em.execute(
      "SELECT i.id, i.purpose, i.year_label, i.total_cents, i.currency FROM dues_invoices i JOIN memberships x ON x.id = i.membership_id WHERE x.user_id = ? AND i.status = 'open' ORDER BY i.id",
      [user.id],
    );
    const facts: ErasureFacts = {
      status: m.status,
      erasedAt: user.erasedAt ?? null,
      activeElsewhere: elsewhere.map((r) => r.name),
      unpaid: unpaid.map((r): UnpaidInvoice => ({ id: Number(r.id), purpose: r.purpose, yearLabel: r.year_label, totalCents: Number(r.total_cents), currency: r.currency })),
    };
    return {
      membershipId: m.id,
      name: user.name,
      newName: formerMemberName(m.id),
      leftAt: m.leftAt ?? null,
      eraseRequestedAt: m.eraseRequestedAt ?? null,
      refusals: erasureRefusals(facts, (cents, currency) => formatMoney(cents, currency)),
      erases: ERASES,
      keeps: KEEPS,
    };
  }
}
