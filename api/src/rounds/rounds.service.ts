import { EntityManager } from '@mikro-orm/mariadb';
import {
  BadRequestException,
  ConflictException,
  ForbiddenException,
  Injectable,
  NotFoundException,
  UnsupportedMediaTypeException,
} from '@nestjs/common';
import type { SessionUser } from '../auth/session-user';
import { BeeSlot } from '../bees/bee-slot.entity';
import { BeesService, type BeeAccess } from '../bees/bees.service';
import { inchesToMm, parseInches, roundMm } from '../common/units/inches';
import { Membership } from '../guilds/membership.entity';
import { FileStore } from '../storage/file-store';
import { sniffContentType } from '../storage/content-type';
import { User } from '../users/user.entity';
import { DEFAULT_SEAM_ALLOWANCE_IN, DEFAULT_TOLERANCE_IN, validateRoundSizes } from './block-size';
import type { RoundInputDto, UpdateBlockDto } from './dto/round.dto';
import { renderInstructions } from './markdown';
import { isLate } from './block-status';
import { RoundBlock } from './round-block.entity';
import { latestSizeChecks } from '../size-check/size-check-presenter';
import { RoundFile } from './round-file.entity';
import { RoundMailer } from './round-mailer.service';
import { defaultSendAt, inchText, isValidDate, localDate, roundSizes, zonedInstant } from './round-presenter';
import { Round } from './round.entity';

const MAX_FILES = 10;

/** Field names as makers read them in a "what changed" notice. */
const CHANGE_LABELS: Record<string, string> = {
  title: 'the title',
  instructions: 'the instructions',
  patternLink: 'the pattern link',
  size: 'the block size',
  seamAllowance: 'the seam allowance',
  tolerance: 'the tolerance',
  trimMode: 'trimming',
  colours: 'the colours',
  fabricSource: 'the fabric',
  dueDate: 'the due date',
  delivery: 'where the block goes',
};

interface RoundContext extends BeeAccess {
  slot: BeeSlot;
  round: Round | null;
  isQueen: boolean;
  canEdit: boolean;
  isBeeMember: boolean;
}


@Injectable()
export class RoundsService {
  constructor(
    private readonly em: EntityManager,
    private readonly bees: BeesService,
    private readonly mailer: RoundMailer,
    private readonly files: FileStore,
  ) {}

  private async context(me: Membership, beeId: number, month: string, em: EntityManager = this.em): Promise<RoundContext> {
    const access = await this.bees.access(me, beeId, em);
    const slot = await em.findOne(BeeSlot, { bee: access.bee, month }, { populate: ['queen.user'] });
    if (!slot) throw new NotFoundException(`${month} is not one of this bee's months.`);
    const round = await em.findOne(Round, { bee: access.bee, month }, { populate: ['queen.user', 'bee.guild'] });
    const queenId = round?.sentAt ? round.queen.id : slot.queen?.id;
    const isQueen = queenId === me.id;
    const isBeeMember = access.isOrganiser || access.myBeeMember?.status === 'active';
    return { ...access, slot, round, isQueen, canEdit: isQueen || access.isOrganiser, isBeeMember };
  }

  /** A maker's block with what the caller is to the round; 404 when the block does not exist yet. */
  async blockContext(me: Membership, beeId: number, month: string, makerId: number) {
    const c = await this.context(me, beeId, month);
    const block = c.round ? await this.em.findOne(RoundBlock, { round: c.round, maker: makerId }, { populate: ['maker.user'] }) : null;
    if (!c.round || !block) throw new NotFoundException('There is no block from that maker for this round yet.');
    return { ...c, round: c.round, block, isOwn: makerId === me.id };
  }

  private assertCanEdit(c: RoundContext) {
    if (!c.canEdit) throw new ForbiddenException("Only this month's queen or the bee's organiser can change the round.");
  }

  private today(c: BeeAccess): string {
    return localDate(new Date(), c.bee.guild.timeZone);
  }

  async view(me: Membership, beeId: number, month: string) {
    const c = await this.context(me, beeId, month);
    const blocks = c.round ? await this.blocksFor(c) : [];
    const queen = c.round?.sentAt ? c.round.queen : c.slot.queen;
    return {
      month,
      skipped: c.slot.skipped,
      queen: queen ? { membershipId: queen.id, name: queen.user.name } : null,
      canEdit: c.canEdit && !c.slot.skipped,
      isQueen: c.isQueen,
      isOrganiser: c.isOrganiser,
      isMaker: c.isBeeMember && !c.isQueen,
      isBeeMember: c.isBeeMember,
      myMembershipId: me.id,
      defaultSendAt: defaultSendAt(month, c.bee.guild.timeZone),
      round: c.round ? await this.present(c.round, c.isBeeMember) : null,
      blocks,
    };
  }

  private async blocksFor(c: RoundContext) {
    const round = c.round!;
    const seeAll = c.isQueen || c.isOrganiser;
    const rows = await this.em.find(
      RoundBlock,
      seeAll ? { round } : { round, maker: c.me },
      { populate: ['maker.user', 'maker.user.passwordHash', 'updatedBy'], orderBy: { maker: { user: { name: 'asc' } } } },
    );
    const today = this.today(c);
    const checks = await latestSizeChecks(this.em, rows, c.bee.guild.id);
    return rows.map((b) => ({ ...this.presentBlock(b, round, today), sizeCheck: checks.get(b.id) ?? null }));
  }

  private presentBlock(b: RoundBlock, round: Round, today: string) {
    return {
      membershipId: b.maker.id,
      name: b.maker.user.name,
      status: b.status,
      trackingNumber: b.trackingNumber ?? null,
      late: isLate(b.status, round.dueDate, today),
      updatedAt: b.statusChangedAt ?? null,
      updatedOnBehalf: b.onBehalf,
      /** Who set it for her, when someone else did ("marked by …"). */
      updatedByName: b.onBehalf ? (b.updatedBy?.name ?? null) : null,
      /** She does not sign in: the queen or the organiser marks her block for her. */
      onPaper: !b.maker.user.passwordHash,
    };
  }

  async present(round: Round, withAddress: boolean) {
    const files = await this.em.find(RoundFile, { round }, { orderBy: { id: 'asc' } });
    const sizes = roundSizes(round);
    const tz = round.bee.guild.timeZone;
    return {
      id: round.id,
      status: round.status,
      title: round.title,
      instructions: round.instructions,
      instructionsHtml: renderInstructions(round.instructions),
      patternLink: round.patternLink ?? null,
      finishedWidth: sizes.finished.widthText,
      finishedHeight: sizes.finished.heightText,
      seamAllowance: inchText(round.seamAllowanceMm),
      tolerance: inchText(round.toleranceMm),
      seamAllowanceText: `${inchText(round.seamAllowanceMm)} inch`,
      toleranceText: `${inchText(round.toleranceMm)} inch`,
      finished: sizes.finished,
      unfinished: sizes.unfinished,
      seamAllowanceMm: round.seamAllowanceMm,
      toleranceMm: round.toleranceMm,
      trimMode: round.trimMode,
      swatches: round.swatches,
      background: round.background ?? null,
      fabricSource: round.fabricSource,
      dueDate: round.dueDate,
      sendAt: round.sendAt,
      sendDate: localDate(round.sendAt, tz),
      sendTime: round.sendAt.toLocaleTimeString('en-GB', { timeZone: tz, hour: '2-digit', minute: '2-digit' }),
      deliveryMethod: round.deliveryMethod,
      deliveryAddress: withAddress ? (round.deliveryAddress ?? null) : undefined,
      meetingDetails: round.meetingDetails ?? null,
      publishedAt: round.publishedAt ?? null,
      sentAt: round.sentAt ?? null,
      queenName: round.queen.user.name,
      files: files.map((f) => ({ id: f.id, filename: f.filename, contentType: f.contentType, size: f.size })),
    };
  }

  /** Turns the form into stored values, or a 400 keyed by field. */
  private toValues(dto: RoundInputDto, month: string, timeZone: string) {
    const errors: Record<string, string[]> = {};
    const seam = dto.seamAllowance ? parseInches(dto.seamAllowance) : DEFAULT_SEAM_ALLOWANCE_IN;
    const tolerance = dto.tolerance ? parseInches(dto.tolerance) : DEFAULT_TOLERANCE_IN;
    const sizes = { finishedWidth: parseInches(dto.finishedWidth), finishedHeight: parseInches(dto.finishedHeight), seam, tolerance };
    const sizeErrors = validateRoundSizes(sizes);
    const fieldOf: Record<string, string> = { seam: 'seamAllowance' };
    for (const [k, v] of Object.entries(sizeErrors)) if (v) errors[fieldOf[k] ?? k] = [v];

    const sendDate = dto.sendDate ?? `${month}-01`;
    if (!isValidDate(dto.dueDate)) errors.dueDate = ['That date does not exist.'];
    if (!isValidDate(sendDate)) errors.sendDate = ['That date does not exist.'];
    else if (!errors.dueDate && dto.dueDate <= sendDate)
      errors.dueDate = [`The due date must come after the day the assignment goes out (${sendDate}).`];
    if (dto.deliveryMethod === 'mail' && !dto.deliveryAddress?.trim())
      errors.deliveryAddress = ['Give the address makers mail their blocks to.'];
    if (Object.keys(errors).length) throw new BadRequestException({ message: 'Please check the highlighted fields.', errors });

    return {
      title: dto.title.trim(),
      instructions: dto.instructions,
      patternLink: dto.patternLink?.trim() || null,
      finishedWidthMm: roundMm(inchesToMm(sizes.finishedWidth)),
      finishedHeightMm: roundMm(inchesToMm(sizes.finishedHeight)),
      seamAllowanceMm: roundMm(inchesToMm(seam)),
      toleranceMm: roundMm(inchesToMm(tolerance)),
      trimMode: dto.trimMode,
      swatches: dto.swatches.map((s) => ({ name: s.name.trim(), hex: s.hex.toUpperCase() })),
      background: dto.background ? { name: dto.background.name.trim(), hex: dto.background.hex.toUpperCase() } : null,
      fabricSource: dto.fabricSource,
      dueDate: dto.dueDate,
      sendAt: zonedInstant(sendDate, dto.sendTime ?? '08:00', timeZone),
      deliveryMethod: dto.deliveryMethod,
      deliveryAddress: dto.deliveryMethod === 'mail' ? dto.deliveryAddress!.trim() : null,
      meetingDetails: dto.meetingDetails?.trim() || null,
    };
  }

  private changedFields(round: Round, next: ReturnType<RoundsService['toValues']>): string[] {
    const changed = new Set<string>();
    const same = (a: unknown, b: unknown) => JSON.stringify(a ?? null) === JSON.stringify(b ?? null);
    if (round.title !== next.title) changed.add('title');
    if (round.instructions !== next.instructions) changed.add('instructions');
    if (!same(round.patternLink, next.patternLink)) changed.add('patternLink');
    if (round.finishedWidthMm !== next.finishedWidthMm || round.finishedHeightMm !== next.finishedHeightMm) changed.add('size');
    if (round.seamAllowanceMm !== next.seamAllowanceMm) changed.add('seamAllowance');
    if (round.toleranceMm !== next.toleranceMm) changed.add('tolerance');
    if (round.trimMode !== next.trimMode) changed.add('trimMode');
    if (!same(round.swatches, next.swatches) || !same(round.background, next.background)) changed.add('colours');
    if (round.fabricSource !== next.fabricSource) changed.add('fabricSource');
    if (round.dueDate !== next.dueDate) changed.add('dueDate');
    if (round.deliveryMethod !== next.deliveryMethod || !same(round.deliveryAddress, next.deliveryAddress) || !same(round.meetingDetails, next.meetingDetails))
      changed.add('delivery');
    return [...changed].map((k) => CHANGE_LABELS[k]);
  }

  async save(me: Membership, beeId: number, month: string, dto: RoundInputDto) {
    await this.em.transactional(async (em) => {
      const c = await this.context(me, beeId, month, em);
      this.assertCanEdit(c);
      if (c.slot.skipped) throw new ConflictException('This month is skipped; there is no round to set.');
      if (!c.slot.queen) throw new ConflictException('This month has no queen yet. Ask the organiser to plan the rotation.');
      const values = this.toValues(dto, month, c.bee.guild.timeZone);
      const now = new Date();
      if (!c.round) {
        em.create(Round, { bee: c.bee, month, queen: c.slot.queen, ...values, lastEditedAt: now });
      } else {
        if (c.round.sentAt && values.sendAt.getTime() !== c.round.sendAt.getTime()) values.sendAt = c.round.sendAt;
        const changes = c.round.sentAt ? this.changedFields(c.round, values) : [];
        em.assign(c.round, values);
        c.round.lastEditedAt = now;
        if (changes.length) {
          // Edits within 30 minutes of each other make one "changed" notice (sent by the job).
          c.round.changePendingSince ??= now;
          c.round.changedFields = [...new Set([...c.round.changedFields, ...changes])];
        }
      }
      await em.flush();
    });
    return this.view(me, beeId, month);
  }

  async publish(me: Membership, beeId: number, month: string) {
    const roundId = await this.em.transactional(async (em) => {
      const c = await this.context(me, beeId, month, em);
      this.assertCanEdit(c);
      if (!c.round) throw new ConflictException('Save the round before publishing it.');
      if (c.round.status !== 'published') {
        c.round.status = 'published';
        c.round.publishedAt = new Date();
        await em.flush();
      }
      return c.round.id;
    });
    // The send waited for her: if its time has come, it goes now rather than at the next tick.
    await this.em.fork().transactional((em) => this.mailer.fanOut(em, roundId));
    return this.view(me, beeId, month);
  }

  // --- pattern files -----------------------------------------------------------------------

  async addFile(me: Membership, user: SessionUser, beeId: number, month: string, file: Express.Multer.File | undefined) {
    if (!file) throw new BadRequestException({ message: 'Choose a file to upload.', errors: { file: ['Choose a file to upload.'] } });
    const type = sniffContentType(file.buffer);
    if (!type)
      throw new UnsupportedMediaTypeException({
        message: 'That file is not a PDF or an image. Upload the pattern as PDF, PNG, JPEG, GIF or WebP.',
        errors: { file: ['Upload a PDF, PNG, JPEG, GIF or WebP file.'] },
      });
    const c = await this.context(me, beeId, month);
    this.assertCanEdit(c);
    if (!c.round) throw new ConflictException('Save the round before adding pattern files.');
    if ((await this.em.count(RoundFile, { round: c.round })) >= MAX_FILES)
      throw new ConflictException(`A round holds at most ${MAX_FILES} files. Remove one first.`);
    const key = await this.files.put(file.buffer);
    const filename = (file.originalname || 'pattern').replace(/[\\/\0\r\n"]/g, '_').slice(0, 200);
    const row = this.em.create(RoundFile, {
      round: c.round,
      storageKey: key,
      filename,
      contentType: type,
      size: file.size,
      uploadedBy: this.em.getReference(User, user.id),
    });
    await this.em.flush();
    return { id: row.id, filename: row.filename, contentType: row.contentType, size: row.size };
  }

  async getFile(me: Membership, beeId: number, month: string, fileId: number) {
    const c = await this.context(me, beeId, month);
    const row = c.round ? await this.em.findOne(RoundFile, { id: fileId, round: c.round }) : null;
    if (!row) throw new NotFoundException('No such file.');
    return { row, bytes: await this.files.get(row.storageKey) };
  }

  async deleteFile(me: Membership, beeId: number, month: string, fileId: number) {
    const c = await this.context(me, beeId, month);
    this.assertCanEdit(c);
    const row = c.round ? await this.em.findOne(RoundFile, { id: fileId, round: c.round }) : null;
    if (!row) throw new NotFoundException('No such file.');
    await this.em.remove(row).flush();
    await this.files.delete(row.storageKey);
  }

  // --- makers' blocks ------------------------------------------------------------------------

  async updateBlock(me: Membership, user: SessionUser, beeId: number, month: string, makerId: number, dto: UpdateBlockDto) {
    return this.em.transactional(async (em) => {
      const c = await this.context(me, beeId, month, em);
      if (!c.round?.sentAt) throw new ConflictException('The round has not gone out to makers yet.');
      const block = await em.findOne(RoundBlock, { round: c.round, maker: makerId }, { populate: ['maker.user', 'maker.user.passwordHash', 'updatedBy'] });
      if (!block) throw new NotFoundException('That person is not a maker of this round.');
      const own = makerId === me.id;
      const onPaper = !block.maker.user.passwordHash;
      // The queen marks arrivals (and can undo one); anything else is the maker's own, or the
      // organiser's (or, for a maker who does not sign in, the queen's) on her behalf.
      const queenAct = c.isQueen && (dto.status === 'received' || block.status === 'received');
      const allowed = c.isOrganiser || queenAct || (c.isQueen && onPaper) || (own && dto.status !== 'received' && block.status !== 'received');
      if (!allowed)
        throw new ForbiddenException(
          own ? 'The queen marks a block received when it arrives.' : 'You can only mark your own block; the queen marks blocks received.',
        );
      if (dto.status === 'mailed') block.trackingNumber = dto.trackingNumber?.trim() || null;
      block.status = dto.status;
      block.updatedBy = await em.findOneOrFail(User, user.id);
      block.onBehalf = !own && !queenAct;
      block.statusChangedAt = new Date();
      await em.flush();
      return this.presentBlock(block, c.round, this.today(c));
    });
  }

  async nudgeLate(me: Membership, beeId: number, month: string) {
    return this.em.transactional(async (em) => {
      const c = await this.context(me, beeId, month, em);
      this.assertCanEdit(c);
      if (!c.round?.sentAt) throw new ConflictException('The round has not gone out to makers yet.');
      const today = this.today(c);
      const blocks = await em.find(RoundBlock, { round: c.round }, { populate: ['maker.user'] });
      let nudged = 0;
      for (const b of blocks.filter((x) => isLate(x.status, c.round!.dueDate, today)))
        if (await this.mailer.nudge(em, c.round, b.maker, today)) nudged++;
      return { nudged };
    });
  }
}
