import { Body, Controller, Get, Param, ParseIntPipe, Post, Res, UploadedFile, UseInterceptors } from '@nestjs/common';
import { FileInterceptor } from '@nestjs/platform-express';
import { ApiConsumes, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import type { SessionUser } from '../auth/session-user';
import { CurrentMembership, CurrentUser } from '../common/decorators/current-user.decorator';
import { Membership } from '../guilds/membership.entity';
import { MonthPipe } from '../rounds/rounds.controller';
import { ManualSizeDto, PhotoFieldsDto } from './dto/size-check.dto';
import { MAX_PHOTO_BYTES } from './photo-intake';
import { SizeChecksService } from './size-checks.service';

const id = () => new ParseIntPipe({ errorHttpStatusCode: 404 });

@ApiTags('size checks')
@Controller('guilds/:guildId')
export class SizeChecksController {
  constructor(private readonly checks: SizeChecksService) {}

  @Post('bees/:beeId/rounds/:month/blocks/:membershipId/photos')
  @ApiConsumes('multipart/form-data')
  @UseInterceptors(FileInterceptor('photo', { limits: { fileSize: MAX_PHOTO_BYTES, files: 1, fields: 5 } }))
  upload(
    @CurrentMembership() me: Membership,
    @CurrentUser() user: SessionUser,
    @Param('beeId', id()) beeId: number,
    @Param('month', MonthPipe) month: string,
    @Param('membershipId', id()) membershipId: number,
    @UploadedFile() photo: Express.Multer.File | undefined,
    @Body() fields: PhotoFieldsDto,
  ) {
    return this.checks.uploadPhoto(me, user, beeId, month, membershipId, photo, fields);
  }

  @Post('bees/:beeId/rounds/:month/blocks/:membershipId/manual-size')
  manual(
    @CurrentMembership() me: Membership,
    @CurrentUser() user: SessionUser,
    @Param('beeId', id()) beeId: number,
    @Param('month', MonthPipe) month: string,
    @Param('membershipId', id()) membershipId: number,
    @Body() body: ManualSizeDto,
  ) {
    return this.checks.manual(me, user, beeId, month, membershipId, body);
  }

  @Get('bees/:beeId/rounds/:month/blocks/:membershipId/size-checks')
  list(
    @CurrentMembership() me: Membership,
    @Param('beeId', id()) beeId: number,
    @Param('month', MonthPipe) month: string,
    @Param('membershipId', id()) membershipId: number,
  ) {
    return this.checks.list(me, beeId, month, membershipId);
  }

  @Get('size-checks/:checkId/images/:kind')
  async image(
    @CurrentMembership() me: Membership,
    @Param('checkId', id()) checkId: number,
    @Param('kind') kind: string,
    @Res() res: Response,
  ) {
    const { bytes, contentType } = await this.checks.image(me, checkId, kind);
    res.setHeader('Content-Type', contentType ?? (bytes[0] === 0x89 ? 'image/png' : 'image/jpeg'));
    res.setHeader('X-Content-Type-Options', 'nosniff');
    res.setHeader('Cache-Control', 'private, max-age=86400');
    res.send(bytes);
  }
}
