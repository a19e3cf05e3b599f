import { EntityManager } from '@mikro-orm/mariadb';
import { BadRequestException, ForbiddenException, HttpException, Injectable, NotFoundException, UnprocessableEntityException } from '@nestjs/common';
import type { SessionUser } from '../auth/session-user';
import { formatInches, inchesToMm, mmToInches, parseInches, roundMm } from '../common/units/inches';
import { Membership } from '../guilds/membership.entity';
import { RoundBlock } from '../rounds/round-block.entity';
import type { Round } from '../rounds/round.entity';
import { RoundsService } from '../rounds/rounds.service';
import { FileStore } from '../storage/file-store';
import { User } from '../users/user.entity';
import { CARD, printScale, printScaleProblem } from './card-geometry';
import type { ManualSizeDto, PhotoFieldsDto } from './dto/size-check.dto';
import { checkPhoto } from './photo-intake';
import { PhotoProcessor } from './photo-processor.service';
import { SizeCheck } from './size-check.entity';
import { presentSizeCheck } from './size-check-presenter';
import { judgeBlock } from './verdict';

const fieldError = (field: string, message: string) =>
  new BadRequestException({ message: 'Please check the highlighted fields.', errors: { [field]: [message] } });


@Injectable()
export class SizeChecksService {
  constructor(
    private readonly em: EntityManager,
    private readonly rounds: RoundsService,
    private readonly processor: PhotoProcessor,
    private readonly files: FileStore,
  ) {}

  /** The maker herself, or the bee's organiser on her behalf, may check a block. */
  private async writable(me: Membership, beeId: number, month: string, makerId: number) {
    const ctx = await this.rounds.blockContext(me, beeId, month, makerId);
    if (!ctx.isOwn && !ctx.isOrganiser) throw new ForbiddenException("You can check your own block; the organiser can check one on a maker's behalf.");
    return ctx;
  }

  /** The maker, the queen and the organiser see a block's checks. */
  private async readable(me: Membership, beeId: number, month: string, makerId: number) {
    const ctx = await this.rounds.blockContext(me, beeId, month, makerId);
    if (!ctx.isOwn && !ctx.isOrganiser && !ctx.isQueen) throw new ForbiddenException("Only the maker, the queen and the organiser see a block's size checks.");
    return ctx;
  }

  /** The print scale from the ruler reading, or the one this person gave for her last photo. */
  private async scaleFor(user: SessionUser, fields: PhotoFieldsDto): Promise<{ scale: number; readingMm: number }> {
    const unit = fields.rulerUnit ?? 'in';
    const nominal = unit === 'in' ? CARD.inchBar.lengthMm : CARD.cmBar.lengthMm;
    let readingMm: number;
    if (fields.rulerReading?.trim()) {
      try {
        readingMm =
          unit === 'in'
            ? inchesToMm(parseInches(fields.rulerReading))
            : Number(fields.rulerReading.replace(',', '.').replace(/\s*cm$/i, '')) * 10;
      } catch (e) {
        throw fieldError('rulerReading', e instanceof Error ? e.message : 'Type what your ruler reads, like 6 or 5 15/16.');
      }
      if (!Number.isFinite(readingMm)) throw fieldError('rulerReading', 'Type what your ruler reads, like 15 or 14.9.');
    } else {
      const last = await this.em.findOne(
        SizeCheck,
        { uploadedBy: user.id, rulerReadingMm: { $ne: null } },
        { orderBy: { createdAt: 'desc' } },
      );
      if (!last?.rulerReadingMm || !last.printScale)
        throw fieldError('rulerReading', 'Measure the long bar on your printed card with your ruler and type what it reads.');
      return { scale: last.printScale, readingMm: last.rulerReadingMm };
    }
    const scale = printScale(nominal, readingMm);
    const problem = printScaleProblem(scale);
    if (problem) throw fieldError('rulerReading', problem);
    return { scale, readingMm: roundMm(readingMm) };
  }

  async uploadPhoto(
    me: Membership,
    user: SessionUser,
    beeId: number,
    month: string,
    makerId: number,
    file: Express.Multer.File | undefined,
    fields: PhotoFieldsDto,
  ) {
    if (!file) throw fieldError('photo', 'Choose or take a photo of your block.');
    const intake = checkPhoto(file.buffer);
    if (!intake.ok) throw new HttpException({ message: intake.message, errors: { photo: [intake.message] } }, intake.status);
    const ctx = await this.writable(me, beeId, month, makerId);
    const { scale, readingMm } = await this.scaleFor(user, fields);
    let output;
    try {
      // A private copy goes to the worker, so the transfer never detaches memory the request shares.
      output = await this.processor.process({ bytes: new Uint8Array(file.buffer), type: intake.type, printScale: scale });
    } catch {
      throw new UnprocessableEntityException({
        message: 'Selvage could not read that photo; it may be damaged or cut short. Take it again and upload it.',
        errors: { photo: ['Selvage could not read that photo.'] },
      });
    }
    const keys = {
      original: await this.files.put(file.buffer),
      display: await this.files.put(Buffer.from(output.display)),
      thumb: await this.files.put(Buffer.from(output.thumb)),
      ...(output.overlay ? { overlay: await this.files.put(Buffer.from(output.overlay)) } : {}),
    };
    const r = output.result;
    const check = this.em.create(SizeCheck, {
      block: ctx.block,
      uploadedBy: this.em.getReference(User, user.id),
      onBehalf: !ctx.isOwn,
      status: r.ok ? 'measured' : 'failed',
      failureReason: r.ok ? null : r.reason,
      message: r.ok ? null : r.message,
      images: keys,
      photoWidthPx: output.width,
      photoHeightPx: output.height,
      rulerReadingMm: readingMm,
      printScale: Number(scale.toFixed(6)),
      widthMm: r.ok ? roundMm(r.widthMm) : null,
      heightMm: r.ok ? roundMm(r.heightMm) : null,
      diagonalsMm: r.ok ? [roundMm(r.diagonalsMm[0]), roundMm(r.diagonalsMm[1])] : null,
      cornerAnglesDeg: r.ok ? r.cornerAnglesDeg.map((a) => Math.round(a * 100) / 100) : null,
      processingMs: output.ms,
    });
    if (r.ok) this.applyVerdict(check, ctx.round, { widthMm: r.widthMm, heightMm: r.heightMm, diagonalsMm: r.diagonalsMm });
    await this.em.flush();
    return this.present(check, ctx.round.bee.guild.id);
  }

  async manual(me: Membership, user: SessionUser, beeId: number, month: string, makerId: number, dto: ManualSizeDto) {
    const ctx = await this.writable(me, beeId, month, makerId);
    const widthMm = roundMm(inchesToMm(parseInches(dto.width)));
    const heightMm = roundMm(inchesToMm(parseInches(dto.height)));
    let check = await this.em.findOne(SizeCheck, { block: ctx.block }, { orderBy: { createdAt: 'desc', id: 'desc' } });
    if (!check) {
      check = this.em.create(SizeCheck, {
        block: ctx.block,
        uploadedBy: this.em.getReference(User, user.id),
        onBehalf: !ctx.isOwn,
        status: 'manual',
      });
    }
    check.manualWidthMm = widthMm;
    check.manualHeightMm = heightMm;
    // A photo's measurement stays the verdict when there is one; her ruler decides otherwise.
    if (check.status !== 'measured') this.applyVerdict(check, ctx.round, { widthMm, heightMm });
    await this.em.flush();
    return this.present(check, ctx.round.bee.guild.id);
  }

  private applyVerdict(check: SizeCheck, round: Round, measured: { widthMm: number; heightMm: number; diagonalsMm?: [number, number] }) {
    const v = judgeBlock({
      measured,
      finished: { widthMm: round.finishedWidthMm, heightMm: round.finishedHeightMm },
      seamAllowanceMm: round.seamAllowanceMm,
      toleranceMm: round.toleranceMm,
      trimMode: round.trimMode,
    });
    check.verdict = v.kind;
    check.outOfSquare = v.outOfSquare;
    check.summary = v.summary;
  }

  async list(me: Membership, beeId: number, month: string, makerId: number) {
    const ctx = await this.readable(me, beeId, month, makerId);
    const checks = await this.em.find(SizeCheck, { block: ctx.block }, { orderBy: { createdAt: 'desc', id: 'desc' } });
    return checks.map((c) => this.present(c, ctx.round.bee.guild.id));
  }

  async image(me: Membership, checkId: number, kind: string) {
    const check = await this.em.findOne(SizeCheck, { id: checkId }, { populate: ['block.round.bee', 'block.maker'] });
    if (!check || check.block.round.bee.guild.id !== me.guild.id) throw new NotFoundException('No such photo.');
    await this.readable(me, check.block.round.bee.id, check.block.round.month, check.block.maker.id);
    const key = check.images?.[kind as 'original' | 'display' | 'thumb' | 'overlay'];
    if (!key) throw new NotFoundException('No such picture for this check.');
    return { bytes: await this.files.get(key), contentType: kind === 'original' ? null : 'image/jpeg' };
  }

  present(c: SizeCheck, guildId: number) {
    return presentSizeCheck(c, guildId);
  }
}
