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

interface DemoFile {
  password: string;
  guilds: {
    name: string;
    town: string;
    timeZone: string;
    currency: string;
    unit: 'in' | 'cm';
    yearStartMonth: number;
    members: { name: string; email: string; roles: string[] }[];
    bees: { name: string; description: string; organiser: string; members: string[] }[];
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
      for (const b of g.bees) {
        const bee = em.create(Bee, {
          guild,
          name: b.name,
          description: b.description,
          organiser: memberships.get(b.organiser)!,
        });
        for (const email of b.members) em.create(BeeMember, { bee, membership: memberships.get(email)! });
      }
    }
    await em.flush();
  }
}
