import type { EntityManager } from '@mikro-orm/core';
import { Seeder } from '@mikro-orm/seeder';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { hashPassword } from '../../auth/passwords';
import { BeeMember } from '../../bees/bee-member.entity';
import { Bee } from '../../bees/bee.entity';
import { findUp } from '../../common/find-up';
import { Guild } from '../../guilds/guild.entity';
import { Membership } from '../../guilds/membership.entity';
import { normaliseRoles } from '../../guilds/roles';
import { User } from '../../users/user.entity';
import { BeeSlot } from '../../bees/bee-slot.entity';
import { monthOf, monthsFrom, planRotation, seededShuffle } from '../../bees/rotation';
import { inchesToMm, parseInches, roundMm } from '../../common/units/inches';
import { RoundBlock, type BlockStatus } from '../../rounds/round-block.entity';
import { defaultSendAt } from '../../rounds/round-presenter';
import { Round } from '../../rounds/round.entity';
import { seedDemoDues } from './demo-dues';
import { seedDemoShows } from './demo-show';
import { seedDemoOffices } from './demo-offices';

/** The month `offset` months after `month` (negative for before). */
function monthsAround(month: string, offset: number): string {
  if (offset >= 0) return monthsFrom(month, offset + 1)[offset];
  const [y, m] = month.split('-').map(Number);
  const index = y * 12 + (m - 1) + offset;
  return `${Math.floor(index / 12)}-${String((index % 12) + 1).padStart(2, '0')}`;
}

interface DemoRound {
  offset: number;
  title: string;
  finished: string;
  instructions: string;
  swatches: [string, string][];
  background: [string, string] | null;
  trim: 'trim' | 'untrimmed';
  draft?: boolean;
  statuses?: BlockStatus[];
}

interface DemoBee {
  name: string;
  description: string;
  organiser: string;
  members: string[];
  handover: 'mail' | 'meeting';
  startOffsetMonths: number;
  months: number;
  skip: string[];
  seed: string;
  address?: string;
  meeting?: string;
  rounds: DemoRound[];
}

interface DemoFile {
  password: string;
  guilds: {
    key?: string;
    name: string;
    town: string;
    timeZone: string;
    currency: string;
    unit: 'in' | 'cm';
    yearStartMonth: number;
    /** `leftDaysAgo`: she has left the guild (and with `eraseRequested`, asked to be erased). */
    members: { name: string; email: string; roles: string[]; leftDaysAgo?: number; eraseRequested?: boolean }[];
    /** Members kept on paper: no e-mail address, no password; bees list them by `key`. */
    paperMembers?: { key: string; name: string; phone?: string; town?: string; memberSince: string; showPhone?: boolean; showTown?: boolean }[];
    bees: DemoBee[];
  }[];
}

/** The invented demo guilds from fixtures/demo-guild.json. */
export class DemoSeeder extends Seeder {
  async run(em: EntityManager): Promise<void> {
    const demo = JSON.parse(readFileSync(join(findUp('fixtures'), 'demo-guild.json'), 'utf8')) as DemoFile;
    const passwordHash = await hashPassword(demo.password);
    const users = new Map<string, User>();
    const joined = new Date(Date.UTC(2024, 8, 1));
    for (const g of demo.guilds) {
      const guild = em.create(Guild, {
        name: g.name,
        town: g.town,
        timeZone: g.timeZone,
        currency: g.currency,
        unit: g.unit,
        yearStartMonth: g.yearStartMonth,
      });
      const memberships = new Map<string, Membership>();
      for (const m of g.members) {
        let user = users.get(m.email);
        if (!user) {
          user = em.create(User, { email: m.email, name: m.name, passwordHash });
          users.set(m.email, user);
        }
        memberships.set(
          m.email,
          em.create(Membership, { user, guild, roles: normaliseRoles(m.roles), joinedAt: joined }),
        );
      }
      // Kept apart from `memberships` (keyed by e-mail), which the dues, show and office seeds walk.
      const paper = new Map<string, Membership>();
      for (const p of g.paperMembers ?? []) {
        const user = em.create(User, {
          email: null,
          name: p.name,
          passwordHash: null,
          phone: p.phone ?? null,
          town: p.town ?? null,
          showPhone: p.showPhone ?? false,
          showTown: p.showTown ?? false,
        });
        paper.set(p.key, em.create(Membership, { user, guild, roles: [], joinedAt: new Date(`${p.memberSince}T12:00:00Z`) }));
      }
      await em.flush();
      await seedDemoOffices(em, guild, memberships, g.key === 'wrenfield');
      for (const b of g.bees) await this.seedBee(em, guild, b, new Map([...memberships, ...paper]));
      if (g.key === 'wrenfield') {
        await seedDemoDues(em, guild, memberships);
        await seedDemoShows(em, guild, memberships);
      }
      // Members who have left go last, once the dues and shows have their history with them.
      for (const m of g.members.filter((x) => x.leftDaysAgo !== undefined)) {
        const membership = memberships.get(m.email)!;
        const leftAt = new Date(Date.now() - m.leftDaysAgo! * 24 * 3600 * 1000);
        membership.status = 'left';
        membership.leftAt = leftAt;
        if (m.eraseRequested) membership.eraseRequestedAt = leftAt;
      }
    }
    await em.flush();
  }

  /** A bee with a shuffled rotation and a few months of rounds around today, so the demo is alive. */
  private async seedBee(em: EntityManager, guild: Guild, b: DemoBee, memberships: Map<string, Membership>) {
    const current = monthOf(new Date(), guild.timeZone);
    const startMonth = monthsAround(current, b.startOffsetMonths);
    const months = monthsFrom(startMonth, b.months);
    const skipped = new Set(months.filter((m) => b.skip.includes(m.slice(5))));
    const members = b.members.map((email) => memberships.get(email)!);
    const order = seededShuffle(members.map((m) => m.id), b.seed);
    const bee = em.create(Bee, {
      guild,
      name: b.name,
      description: b.description,
      organiser: memberships.get(b.organiser)!,
      handover: b.handover,
      startMonth,
      months: b.months,
      skippedMonths: [...skipped],
      rotationOrder: order,
      rotationSeed: b.seed,
    });
    for (const m of members) em.create(BeeMember, { bee, membership: m, status: 'active', joinedAt: new Date() });
    const slots = planRotation({ months, skipped, order, kept: [] });
    for (const slot of slots)
      em.create(BeeSlot, { bee, month: slot.month, skipped: slot.skipped, queen: slot.queenId ? members.find((m) => m.id === slot.queenId)! : null });
    await em.flush();

    for (const r of b.rounds) {
      const month = monthsAround(current, r.offset);
      const slot = slots.find((s) => s.month === month);
      if (!slot || slot.skipped || !slot.queenId) continue;
      const queen = members.find((m) => m.id === slot.queenId)!;
      const [w, h] = r.finished.split(' x ');
      const sendAt = defaultSendAt(month, guild.timeZone);
      const round = em.create(Round, {
        bee,
        month,
        queen,
        title: r.title,
        instructions: r.instructions,
        finishedWidthMm: roundMm(inchesToMm(parseInches(w))),
        finishedHeightMm: roundMm(inchesToMm(parseInches(h ?? w))),
        seamAllowanceMm: roundMm(inchesToMm(0.25)),
        toleranceMm: roundMm(inchesToMm(0.125)),
        trimMode: r.trim,
        swatches: r.swatches.map(([name, hex]) => ({ name, hex })),
        background: r.background ? { name: r.background[0], hex: r.background[1] } : null,
        fabricSource: 'stash',
        // Due by the 15th of the following month, a common bee rule (TRADE.md §5.4).
        dueDate: `${monthsAround(month, 1)}-15`,
        sendAt,
        deliveryMethod: b.handover,
        deliveryAddress: b.handover === 'mail' ? (b.address ?? null) : null,
        meetingDetails: b.handover === 'meeting' ? (b.meeting ?? null) : null,
        status: r.draft ? 'draft' : 'published',
        publishedAt: r.draft ? null : sendAt,
        sentAt: r.draft ? null : sendAt,
        lastEditedAt: sendAt,
      });
      if (r.draft) continue;
      members
        .filter((m) => m.id !== queen.id)
        .forEach((maker, i) => {
          const status = r.statuses?.[i % r.statuses.length] ?? 'not_started';
          // A maker kept on paper has her block marked by the organiser, on the record (the queen marks it received).
          const onBehalf = maker.user.passwordHash === null && status !== 'not_started' && status !== 'received';
          em.create(RoundBlock, {
            round,
            maker,
            status,
            statusChangedAt: status === 'not_started' ? null : sendAt,
            onBehalf,
            updatedBy: onBehalf ? bee.organiser.user : maker.user.passwordHash === null && status === 'received' ? queen.user : null,
          });
        });
    }
  }
}
