import { Controller, ForbiddenException, Get, Injectable, Param, ParseIntPipe, Query, Res } from '@nestjs/common';
import { EntityManager } from '@mikro-orm/mariadb';
import { ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { DateTime } from 'luxon';
import { BeeMember } from '../bees/bee-member.entity';
import { BeeSlot } from '../bees/bee-slot.entity';
import { BeesService } from '../bees/bees.service';
import { monthsFrom } from '../bees/rotation';
import { CurrentMembership } from '../common/decorators/current-user.decorator';
import { RosterPdfQueryDto } from '../guilds/dto/paper-member.dto';
import { Membership } from '../guilds/membership.entity';
import { PAPER_SIZES, paperFor, type Paper } from '../guilds/roster-pdf';
import { renderBeeSchedule, type ScheduleMonth } from './bee-schedule-pdf';
import { dateText, monthLabel, roundSizes, sizePhrase } from './round-presenter';
import { Round } from './round.entity';


@Injectable()
export class BeeScheduleService {
  constructor(
    private readonly em: EntityManager,
    private readonly bees: BeesService,
  ) {}

  /** The bee's year on paper, for its makers (invited ones too) and the guild's officers. */
  async render(me: Membership, beeId: number, paper?: Paper): Promise<{ filename: string; pdf: Buffer }> {
    const a = await this.bees.access(me, beeId);
    const inBee = a.isOrganiser || a.myBeeMember?.status === 'active' || a.myBeeMember?.status === 'invited';
    if (!inBee && me.roles.length === 0) throw new ForbiddenException("The schedule is for the bee's makers and the guild's officers.");
    const bee = a.bee;
    const [members, slots, rounds] = await Promise.all([
      this.em.find(BeeMember, { bee, status: 'active' }, { populate: ['membership.user'], orderBy: { membership: { user: { name: 'asc' } } } }),
      this.em.find(BeeSlot, { bee }, { populate: ['queen.user'], orderBy: { month: 'asc' } }),
      this.em.find(Round, { bee, status: 'published' }, { populate: ['queen.user'] }),
    ]);
    const months: ScheduleMonth[] = monthsFrom(bee.startMonth, bee.months).map((month) => {
      const slot = slots.find((s) => s.month === month);
      const round = rounds.find((r) => r.month === month);
      const queen = round?.sentAt ? round.queen : slot?.queen;
      const skipped = slot?.skipped ?? bee.skippedMonths.includes(month);
      let block: ScheduleMonth['block'] = null;
      if (round && !skipped) {
        const sizes = roundSizes(round);
        const colours = [round.swatches.map((s) => s.name).join(', '), round.background ? `background ${round.background.name}` : '']
          .filter(Boolean)
          .join('; ');
        const delivery =
          round.deliveryMethod === 'mail'
            ? inBee
              ? `Mail it to: ${round.deliveryAddress ?? 'ask the queen for her address'}`
              : "Mailed to the queen (her address is printed for the bee's makers)"
            : `Bring it to: ${round.meetingDetails ?? 'the meeting'}`;
        block = {
          title: round.title,
          sizeText: `${sizePhrase(sizes.finished)} finished (${sizePhrase(sizes.unfinished)} with seam allowance${round.trimMode === 'untrimmed' ? ', leave it untrimmed' : ''})`,
          colours: colours || null,
          fabric: round.fabricSource === 'queen_sends' ? 'The queen sends you fabric' : 'From your own stash',
          dueText: dateText(round.dueDate),
          deliveryText: delivery,
          patternLink: round.patternLink ?? null,
        };
      }
      return { label: monthLabel(month), skipped, queenName: skipped ? null : (queen?.user.name ?? null), block };
    });
    const guild = bee.guild;
    const chosen: Paper = paper ?? paperFor(guild.currency);
    const pdf = await renderBeeSchedule({
      guildName: guild.name,
      beeName: bee.name,
      description: bee.description ?? null,
      organiserName: bee.organiser.user.name,
      handoverText: bee.handover === 'mail' ? 'Blocks go by mail' : 'Blocks are handed over at meetings',
      makers: members.map((m) => m.membership.user.name),
      months,
      printedOn: DateTime.now().setZone(guild.timeZone).setLocale('en-GB').toFormat('d LLLL yyyy'),
      size: PAPER_SIZES[chosen],
    });
    const slug = bee.name.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'bee';
    return { filename: `${slug}-schedule.pdf`, pdf };
  }
}

@ApiTags('bees')
@Controller('guilds/:guildId/bees/:beeId')
export class BeeScheduleController {
  constructor(private readonly schedule: BeeScheduleService) {}

  @Get('schedule.pdf')
  async pdf(
    @CurrentMembership() me: Membership,
    @Param('beeId', new ParseIntPipe({ errorHttpStatusCode: 404 })) beeId: number,
    @Query() query: RosterPdfQueryDto,
    @Res() res: Response,
  ) {
    const { filename, pdf } = await this.schedule.render(me, beeId, query.paper);
    res.setHeader('Content-Type', 'application/pdf');
    res.setHeader('Content-Disposition', `inline; filename="${filename}"`);
    res.setHeader('Cache-Control', 'private, no-store');
    res.send(pdf);
  }
}
