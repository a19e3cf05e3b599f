import { BadRequestException, Body, Controller, Delete, Get, HttpCode, Param, ParseIntPipe, Post, Query, Res } from '@nestjs/common';
import { ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { CurrentMembership } from '../common/decorators/current-user.decorator';
import { Public } from '../common/decorators/public.decorator';
import { Roles } from '../common/decorators/roles.decorator';
import { Membership } from '../guilds/membership.entity';
import { BallotDto, IssueCodesDto, PaperBallotDto, TieDecisionDto } from './dto/show.dto';
import { ShowEntriesService } from './show-entries.service';
import { ShowPrintsService } from './show-prints.service';
import { sendFile, sendPhoto } from './shows.controller';
import { VotingService } from './voting.service';

const id = () => new ParseIntPipe({ errorHttpStatusCode: 404 });

export function sendCsv(res: Response, filename: string, csv: string) {
  res.setHeader('Content-Type', 'text/csv; charset=utf-8');
  res.setHeader('Content-Disposition', `attachment; filename="${filename}"`);
  res.send(csv);
}

/** The viewer's choice ballot for members and the show chair's voting desk. */
@ApiTags('shows')
@Controller('guilds/:guildId/shows/:showId')
export class VotingController {
  constructor(
    private readonly voting: VotingService,
    private readonly prints: ShowPrintsService,
  ) {}

  @Get('voting/codes.pdf')
  @Roles('show_chair')
  async codesPdf(
    @CurrentMembership() me: Membership,
    @Param('showId', id()) showId: number,
    @Query('batch', new ParseIntPipe({ exceptionFactory: () => new BadRequestException('Choose a batch of cards: add ?batch=1 for the first.') })) batch: number,
    @Query('layout') layout: string | undefined,
    @Res() res: Response,
  ) {
    if (layout !== undefined && layout !== 'cards' && layout !== 'paper') throw new BadRequestException('layout is cards (to scan) or paper (to write on).');
    const file = layout === 'paper' ? await this.prints.paperBallots(me, showId, batch) : await this.prints.ballotCards(me, showId, batch);
    sendFile(res, file, 'application/pdf');
  }

  @Get('results.pdf')
  @Roles('show_chair')
  async resultsPdf(@CurrentMembership() me: Membership, @Param('showId', id()) showId: number, @Res() res: Response) {
    sendFile(res, await this.prints.resultsPdf(me, showId), 'application/pdf');
  }

  @Get('ballot')
  ballot(@CurrentMembership() me: Membership, @Param('showId', id()) showId: number) {
    return this.voting.memberBallot(me, showId);
  }

  @Post('ballot')
  cast(@CurrentMembership() me: Membership, @Param('showId', id()) showId: number, @Body() body: BallotDto) {
    return this.voting.castMember(me, showId, body.choices);
  }

  @Post('voting/open')
  @Roles('show_chair')
  @HttpCode(200)
  open(@CurrentMembership() me: Membership, @Param('showId', id()) showId: number) {
    return this.voting.open(me, showId);
  }

  @Post('voting/close')
  @Roles('show_chair')
  @HttpCode(200)
  close(@CurrentMembership() me: Membership, @Param('showId', id()) showId: number) {
    return this.voting.close(me, showId);
  }

  @Get('voting/turnout')
  @Roles('show_chair')
  turnout(@CurrentMembership() me: Membership, @Param('showId', id()) showId: number) {
    return this.voting.turnout(me, showId);
  }

  @Post('voting/codes')
  @Roles('show_chair')
  issueCodes(@CurrentMembership() me: Membership, @Param('showId', id()) showId: number, @Body() body: IssueCodesDto) {
    return this.voting.issueCodes(me, showId, body.count);
  }

  @Get('voting/codes')
  @Roles('show_chair')
  batches(@CurrentMembership() me: Membership, @Param('showId', id()) showId: number) {
    return this.voting.batches(me, showId);
  }

  @Post('voting/paper')
  @Roles('show_chair')
  paper(@CurrentMembership() me: Membership, @Param('showId', id()) showId: number, @Body() body: PaperBallotDto) {
    return this.voting.castPaper(me, showId, body.code, body.choices);
  }

  @Get('results')
  results(@CurrentMembership() me: Membership, @Param('showId', id()) showId: number) {
    return this.voting.results(me, showId);
  }

  @Post('results/decisions')
  @Roles('show_chair')
  decide(@CurrentMembership() me: Membership, @Param('showId', id()) showId: number, @Body() body: TieDecisionDto) {
    return this.voting.decide(me, showId, body);
  }

  @Delete('results/decisions/:decisionId')
  @Roles('show_chair')
  undecide(@CurrentMembership() me: Membership, @Param('showId', id()) showId: number, @Param('decisionId', id()) decisionId: number) {
    return this.voting.undecide(me, showId, decisionId);
  }

  @Post('results/publish')
  @Roles('show_chair')
  @HttpCode(200)
  publish(@CurrentMembership() me: Membership, @Param('showId', id()) showId: number) {
    return this.voting.publish(me, showId);
  }

  @Get('results.csv')
  @Roles('show_chair')
  async resultsCsv(@CurrentMembership() me: Membership, @Param('showId', id()) showId: number, @Res() res: Response) {
    sendCsv(res, `results-show-${showId}.csv`, await this.voting.resultsCsv(me, showId));
  }

  @Get('ballots.csv')
  @Roles('show_chair')
  async ballotsCsv(@CurrentMembership() me: Membership, @Param('showId', id()) showId: number, @Res() res: Response) {
    sendCsv(res, `ballots-show-${showId}.csv`, await this.voting.ballotsCsv(me, showId));
  }
}

/** What a visitor reaches without an account: her ballot card's page, entry photos, published results. */
@ApiTags('public')
@Public()
@Controller('public')
export class PublicBallotController {
  constructor(
    private readonly voting: VotingService,
    private readonly entries: ShowEntriesService,
  ) {}

  @Get('ballots/:code')
  ballot(@Param('code') code: string) {
    return this.voting.publicBallot(code);
  }

  @Post('ballots/:code')
  cast(@Param('code') code: string, @Body() body: BallotDto) {
    return this.voting.castCode(code, body.choices);
  }

  @Get('shows/:showId/entries/:entryId/photo')
  async photo(@Param('showId', id()) showId: number, @Param('entryId', id()) entryId: number, @Query('size') size: string | undefined, @Res() res: Response) {
    sendPhoto(res, await this.entries.publicPhoto(showId, entryId, size), 'public');
  }

  @Get('shows/:showId/results')
  results(@Param('showId', id()) showId: number) {
    return this.voting.results(null, showId, { publicView: true });
  }
}
