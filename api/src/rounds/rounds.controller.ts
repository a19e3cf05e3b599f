import {
  Body,
  Controller,
  Delete,
  Get,
  HttpCode,
  Param,
  ParseIntPipe,
  Patch,
  Post,
  Put,
  Res,
  UploadedFile,
  UseInterceptors,
} from '@nestjs/common';
import { FileInterceptor } from '@nestjs/platform-express';
import { ApiConsumes, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import type { SessionUser } from '../auth/session-user';
import { MONTH_PATTERN } from '../bees/dto/bee.dto';
import { CurrentMembership, CurrentUser } from '../common/decorators/current-user.decorator';
import { Membership } from '../guilds/membership.entity';
import { NotFoundException, PipeTransform } from '@nestjs/common';
import { RoundInputDto, UpdateBlockDto } from './dto/round.dto';
import { RoundsService } from './rounds.service';

const id = () => new ParseIntPipe({ errorHttpStatusCode: 404 });

export class MonthPipe implements PipeTransform<string, string> {
  transform(value: string): string {
    if (!MONTH_PATTERN.test(value)) throw new NotFoundException('Months are written like 2027-03.');
    return value;
  }
}

export const MAX_UPLOAD_BYTES = 20 * 1024 * 1024;

@ApiTags('rounds')
@Controller('guilds/:guildId/bees/:beeId/rounds/:month')
export class RoundsController {
  constructor(private readonly rounds: RoundsService) {}

  @Get()
  view(@CurrentMembership() me: Membership, @Param('beeId', id()) beeId: number, @Param('month', MonthPipe) month: string) {
    return this.rounds.view(me, beeId, month);
  }

  @Put()
  save(
    @CurrentMembership() me: Membership,
    @Param('beeId', id()) beeId: number,
    @Param('month', MonthPipe) month: string,
    @Body() body: RoundInputDto,
  ) {
    return this.rounds.save(me, beeId, month, body);
  }

  @Post('publish')
  @HttpCode(200)
  publish(@CurrentMembership() me: Membership, @Param('beeId', id()) beeId: number, @Param('month', MonthPipe) month: string) {
    return this.rounds.publish(me, beeId, month);
  }

  @Post('files')
  @ApiConsumes('multipart/form-data')
  @UseInterceptors(FileInterceptor('file', { limits: { fileSize: MAX_UPLOAD_BYTES, files: 1, fields: 5 } }))
  addFile(
    @CurrentMembership() me: Membership,
    @CurrentUser() user: SessionUser,
    @Param('beeId', id()) beeId: number,
    @Param('month', MonthPipe) month: string,
    @UploadedFile() file: Express.Multer.File | undefined,
  ) {
    return this.rounds.addFile(me, user, beeId, month, file);
  }

  @Get('files/:fileId')
  async getFile(
    @CurrentMembership() me: Membership,
    @Param('beeId', id()) beeId: number,
    @Param('month', MonthPipe) month: string,
    @Param('fileId', id()) fileId: number,
    @Res() res: Response,
  ) {
    const { row, bytes } = await this.rounds.getFile(me, beeId, month, fileId);
    res.setHeader('Content-Type', row.contentType);
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.setHeader('Content-Security-Policy', "default-src 'none'; sandbox");
    res.setHeader('Content-Disposition', `inline; filename*=UTF-8''${encodeURIComponent(row.filename)}`);
    res.send(bytes);
  }

  @Delete('files/:fileId')
  @HttpCode(204)
  async deleteFile(
    @CurrentMembership() me: Membership,
    @Param('beeId', id()) beeId: number,
    @Param('month', MonthPipe) month: string,
    @Param('fileId', id()) fileId: number,
  ) {
    await this.rounds.deleteFile(me, beeId, month, fileId);
  }

  @Patch('blocks/:membershipId')
  updateBlock(
    @CurrentMembership() me: Membership,
    @CurrentUser() user: SessionUser,
    @Param('beeId', id()) beeId: number,
    @Param('month', MonthPipe) month: string,
    @Param('membershipId', id()) membershipId: number,
    @Body() body: UpdateBlockDto,
  ) {
    return this.rounds.updateBlock(me, user, beeId, month, membershipId, body);
  }

  @Post('nudges')
  @HttpCode(200)
  nudge(@CurrentMembership() me: Membership, @Param('beeId', id()) beeId: number, @Param('month', MonthPipe) month: string) {
    return this.rounds.nudgeLate(me, beeId, month);
  }
}
