import { BadRequestException, Body, Controller, Delete, Get, HttpCode, Param, ParseIntPipe, Patch, Post, Query, Res, UploadedFile, UseInterceptors } from '@nestjs/common';
import { FileInterceptor } from '@nestjs/platform-express';
import { ApiConsumes, ApiTags } from '@nestjs/swagger';
import type { Response } from 'express';
import { CurrentMembership } from '../common/decorators/current-user.decorator';
import { Roles } from '../common/decorators/roles.decorator';
import { Membership } from '../guilds/membership.entity';
import { MAX_PHOTO_BYTES } from '../size-check/photo-intake';
import { CategoryDto, CreateShowDto, EntryDto, NumberEntriesDto, ReviewEntryDto, UpdateCategoryDto, UpdateEntryDto, UpdateShowDto } from './dto/show.dto';
import { ShowEntriesService } from './show-entries.service';
import { ShowFeesService } from './show-fees.service';
import { type PrintedFile, ShowPrintsService } from './show-prints.service';
import { ShowsService } from './shows.service';

const id = () => new ParseIntPipe({ errorHttpStatusCode: 404 });

export function sendFile(res: Response, file: PrintedFile, contentType: string) {
  res.setHeader('Content-Type', contentType);
  res.setHeader('Content-Disposition', `attachment; filename="${file.filename}"`);
  res.setHeader('Cache-Control', 'private, no-store');
  res.send(file.bytes);
}

export function sendPhoto(res: Response, bytes: Buffer, cache: 'private' | 'public') {
  res.setHeader('Content-Type', 'image/jpeg');
  res.setHeader('X-Content-Type-Options', 'nosniff');
  res.setHeader('Cache-Control', `${cache}, max-age=86400`);
  res.send(bytes);
}

/** Shows, categories and entries. Every member reads and enters; the show chair sets up and reviews. */
@ApiTags('shows')
@Controller('guilds/:guildId/shows')
export class ShowsController {
  constructor(
    private readonly shows: ShowsService,
    private readonly entries: ShowEntriesService,
    private readonly prints: ShowPrintsService,
    private readonly fees: ShowFeesService,
  ) {}

  @Get(':showId/fees/mine')
  myFees(@CurrentMembership() me: Membership, @Param('showId', id()) showId: number) {
    return this.fees.mine(me, showId);
  }

  @Post(':showId/fees/checkout')
  payFees(@CurrentMembership() me: Membership, @Param('showId', id()) showId: number) {
    return this.fees.checkout(me, showId);
  }

  @Get()
  list(@CurrentMembership() me: Membership) {
    return this.shows.list(me);
  }

  @Post()
  @Roles('show_chair')
  create(@CurrentMembership() me: Membership, @Body() body: CreateShowDto) {
    return this.shows.create(me, body);
  }

  @Get(':showId')
  detail(@CurrentMembership() me: Membership, @Param('showId', id()) showId: number) {
    return this.shows.detail(me, showId);
  }

  @Patch(':showId')
  @Roles('show_chair')
  update(@CurrentMembership() me: Membership, @Param('showId', id()) showId: number, @Body() body: UpdateShowDto) {
    return this.shows.update(me, showId, body);
  }

  @Post(':showId/categories')
  @Roles('show_chair')
  createCategory(@CurrentMembership() me: Membership, @Param('showId', id()) showId: number, @Body() body: CategoryDto) {
    return this.shows.createCategory(me, showId, body);
  }

  @Patch(':showId/categories/:categoryId')
  @Roles('show_chair')
  updateCategory(
    @CurrentMembership() me: Membership,
    @Param('showId', id()) showId: number,
    @Param('categoryId', id()) categoryId: number,
    @Body() body: UpdateCategoryDto,
  ) {
    return this.shows.updateCategory(me, showId, categoryId, body);
  }

  @Delete(':showId/categories/:categoryId')
  @Roles('show_chair')
  @HttpCode(204)
  async deleteCategory(@CurrentMembership() me: Membership, @Param('showId', id()) showId: number, @Param('categoryId', id()) categoryId: number) {
    await this.shows.deleteCategory(me, showId, categoryId);
  }

  @Get(':showId/entries/mine')
  mine(@CurrentMembership() me: Membership, @Param('showId', id()) showId: number) {
    return this.entries.mine(me, showId);
  }

  @Get(':showId/entries')
  @Roles('show_chair')
  entriesList(@CurrentMembership() me: Membership, @Param('showId', id()) showId: number, @Query('status') status?: string) {
    return this.entries.list(me, showId, status);
  }

  @Post(':showId/entries')
  enter(@CurrentMembership() me: Membership, @Param('showId', id()) showId: number, @Body() body: EntryDto) {
    return this.entries.create(me, showId, body);
  }

  @Post(':showId/entries/number')
  @Roles('show_chair')
  @HttpCode(200)
  number(@CurrentMembership() me: Membership, @Param('showId', id()) showId: number, @Body() body: NumberEntriesDto) {
    return this.entries.number(me, showId, body.startAt);
  }

  @Patch(':showId/entries/:entryId')
  updateEntry(
    @CurrentMembership() me: Membership,
    @Param('showId', id()) showId: number,
    @Param('entryId', id()) entryId: number,
    @Body() body: UpdateEntryDto,
  ) {
    return this.entries.update(me, showId, entryId, body);
  }

  @Post(':showId/entries/:entryId/withdraw')
  @HttpCode(200)
  withdraw(@CurrentMembership() me: Membership, @Param('showId', id()) showId: number, @Param('entryId', id()) entryId: number) {
    return this.entries.withdraw(me, showId, entryId);
  }

  @Post(':showId/entries/:entryId/review')
  @Roles('show_chair')
  @HttpCode(200)
  review(@CurrentMembership() me: Membership, @Param('showId', id()) showId: number, @Param('entryId', id()) entryId: number, @Body() body: ReviewEntryDto) {
    return this.entries.review(me, showId, entryId, body);
  }

  @Post(':showId/entries/:entryId/photo')
  @ApiConsumes('multipart/form-data')
  @HttpCode(200)
  @UseInterceptors(FileInterceptor('photo', { limits: { fileSize: MAX_PHOTO_BYTES, files: 1, fields: 2 } }))
  uploadPhoto(
    @CurrentMembership() me: Membership,
    @Param('showId', id()) showId: number,
    @Param('entryId', id()) entryId: number,
    @UploadedFile() photo: Express.Multer.File | undefined,
  ) {
    return this.entries.uploadPhoto(me, showId, entryId, photo);
  }

  @Get(':showId/entries/:entryId/photo')
  async photo(
    @CurrentMembership() me: Membership,
    @Param('showId', id()) showId: number,
    @Param('entryId', id()) entryId: number,
    @Query('size') size: string | undefined,
    @Res() res: Response,
  ) {
    sendPhoto(res, await this.entries.photo(me, showId, entryId, size), 'private');
  }

  @Get(':showId/hang-tags.pdf')
  @Roles('show_chair')
  async hangTags(@CurrentMembership() me: Membership, @Param('showId', id()) showId: number, @Query('hideMakers') hide: string | undefined, @Res() res: Response) {
    const choice = hide === undefined ? null : hide === '1' || hide === 'true' ? true : hide === '0' || hide === 'false' ? false : undefined;
    if (choice === undefined) throw new BadRequestException('hideMakers is 1 to leave the makers off the tags or 0 to print them.');
    sendFile(res, await this.prints.hangTags(me, showId, choice), 'application/pdf');
  }

  @Get(':showId/entries.pdf')
  @Roles('show_chair')
  async entriesPdf(@CurrentMembership() me: Membership, @Param('showId', id()) showId: number, @Res() res: Response) {
    sendFile(res, await this.prints.entryListPdf(me, showId), 'application/pdf');
  }

  @Get(':showId/entries.csv')
  @Roles('show_chair')
  async entriesCsv(@CurrentMembership() me: Membership, @Param('showId', id()) showId: number, @Res() res: Response) {
    sendFile(res, await this.prints.entryListCsv(me, showId), 'text/csv; charset=utf-8');
  }
}
