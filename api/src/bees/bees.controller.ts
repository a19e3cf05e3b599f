import { Body, Controller, Delete, Get, HttpCode, Param, ParseIntPipe, Patch, Post } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import { CurrentMembership } from '../common/decorators/current-user.decorator';
import { Membership } from '../guilds/membership.entity';
import { BeesService } from './bees.service';
import { CreateBeeDto, InviteToBeeDto, RotationDto, SkipMonthDto, SwapMonthsDto, UpdateBeeDto } from './dto/bee.dto';

const id = () => new ParseIntPipe({ errorHttpStatusCode: 404 });

/** Bees are open to every member of the guild; who may change what is checked per bee. */
@ApiTags('bees')
@Controller('guilds/:guildId/bees')
export class BeesController {
  constructor(private readonly bees: BeesService) {}

  @Get()
  list(@CurrentMembership() me: Membership) {
    return this.bees.list(me);
  }

  @Post()
  create(@CurrentMembership() me: Membership, @Body() body: CreateBeeDto) {
    return this.bees.create(me, body);
  }

  @Get(':beeId')
  detail(@CurrentMembership() me: Membership, @Param('beeId', id()) beeId: number) {
    return this.bees.detail(me, beeId);
  }

  @Patch(':beeId')
  update(@CurrentMembership() me: Membership, @Param('beeId', id()) beeId: number, @Body() body: UpdateBeeDto) {
    return this.bees.update(me, beeId, body);
  }

  @Post(':beeId/invitations')
  invite(@CurrentMembership() me: Membership, @Param('beeId', id()) beeId: number, @Body() body: InviteToBeeDto) {
    return this.bees.invite(me, beeId, body.membershipIds);
  }

  /** The organiser adds members who do not sign in straight to the bee (they cannot accept an invitation). */
  @Post(':beeId/members')
  addOnBehalf(@CurrentMembership() me: Membership, @Param('beeId', id()) beeId: number, @Body() body: InviteToBeeDto) {
    return this.bees.addOnBehalf(me, beeId, body.membershipIds);
  }

  @Post(':beeId/join')
  @HttpCode(200)
  join(@CurrentMembership() me: Membership, @Param('beeId', id()) beeId: number) {
    return this.bees.join(me, beeId);
  }

  @Post(':beeId/leave')
  @HttpCode(200)
  leave(@CurrentMembership() me: Membership, @Param('beeId', id()) beeId: number) {
    return this.bees.leave(me, beeId);
  }

  @Delete(':beeId/members/:membershipId')
  remove(
    @CurrentMembership() me: Membership,
    @Param('beeId', id()) beeId: number,
    @Param('membershipId', id()) membershipId: number,
  ) {
    return this.bees.remove(me, beeId, membershipId);
  }

  @Post(':beeId/rotation')
  @HttpCode(200)
  rotation(@CurrentMembership() me: Membership, @Param('beeId', id()) beeId: number, @Body() body: RotationDto) {
    return this.bees.setRotation(me, beeId, body);
  }

  @Post(':beeId/rotation/skip')
  @HttpCode(200)
  skip(@CurrentMembership() me: Membership, @Param('beeId', id()) beeId: number, @Body() body: SkipMonthDto) {
    return this.bees.setSkipped(me, beeId, body.month, body.skipped);
  }

  @Post(':beeId/rotation/swap')
  @HttpCode(200)
  swap(@CurrentMembership() me: Membership, @Param('beeId', id()) beeId: number, @Body() body: SwapMonthsDto) {
    return this.bees.swap(me, beeId, body.monthA, body.monthB);
  }
}
