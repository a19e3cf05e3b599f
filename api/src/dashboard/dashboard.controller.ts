import { EntityManager } from '@mikro-orm/mariadb';
import { Controller, Get } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import type { SessionUser } from '../auth/session-user';
import { BeeMember } from '../bees/bee-member.entity';
import { CurrentUser } from '../common/decorators/current-user.decorator';
import { Membership } from '../guilds/membership.entity';
import { RoundBlock } from '../rounds/round-block.entity';
import { localDate } from '../rounds/round-presenter';
import { isLate } from '../rounds/block-status';

@ApiTags('dashboard')
@Controller('dashboard')
export class DashboardController {
  constructor(private readonly em: EntityManager) {}

  /** Everything the home screen shows, in four queries whatever the number of guilds. */
  @Get()
  async show(@CurrentUser() user: SessionUser) {
    const memberships = await this.em.find(
      Membership,
      { user: user.id, status: 'active' },
      { populate: ['guild'], orderBy: { guild: { name: 'asc' } } },
    );
    const guildIds = memberships.map((m) => m.guild.id);
    const counts: { guild_id: number; n: number }[] = guildIds.length
      ? await this.em
          .getConnection()
          .execute(
            `SELECT guild_id, COUNT(*) AS n FROM memberships WHERE status = 'active' AND guild_id IN (${guildIds.map(() => '?').join(',')}) GROUP BY guild_id`,
            guildIds,
          )
      : [];
    const bees = memberships.length
      ? await this.em.find(BeeMember, { membership: { $in: memberships.map((m) => m.id) } }, { populate: ['bee'] })
      : [];
    const owed = memberships.length
      ? await this.em.find(
          RoundBlock,
          { maker: { $in: memberships.map((m) => m.id) }, status: { $ne: 'received' }, round: { sentAt: { $ne: null } } },
          { populate: ['round.bee.guild', 'round.queen.user'], orderBy: { round: { dueDate: 'asc' } } },
        )
      : [];
    return {
      owed: owed.map((b) => {
        const today = localDate(new Date(), b.round.bee.guild.timeZone);
        return {
          guildId: b.round.bee.guild.id,
          beeId: b.round.bee.id,
          beeName: b.round.bee.name,
          month: b.round.month,
          title: b.round.title,
          queenName: b.round.queen.user.name,
          dueDate: b.round.dueDate,
          status: b.status,
          late: isLate(b.status, b.round.dueDate, today),
        };
      }),
      user,
      guilds: memberships.map((m) => ({
        id: m.guild.id,
        name: m.guild.name,
        town: m.guild.town,
        roles: m.roles,
        status: m.status,
        joinedAt: m.joinedAt,
        memberCount: Number(counts.find((c) => Number(c.guild_id) === m.guild.id)?.n ?? 0),
        bees: bees
          .filter((b) => b.membership.id === m.id && b.status === 'active')
          .map((b) => ({ id: b.bee.id, name: b.bee.name, description: b.bee.description ?? null })),
      })),
    };
  }
}
