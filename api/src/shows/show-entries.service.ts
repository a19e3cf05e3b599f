import { UniqueConstraintViolationException } from '@mikro-orm/core';
import { EntityManager } from '@mikro-orm/mariadb';
import {
  BadRequestException,
  ConflictException,
  ForbiddenException,
  HttpException,
  Injectable,
  NotFoundException,
  UnprocessableEntityException,
} from '@nestjs/common';
import { inchesField, inchesToMm, roundMm } from '../common/units/inches';
import { withTransaction } from '../database/transaction';
import { todayIn, formatDate } from '../dues/dues-rules';
import { Membership } from '../guilds/membership.entity';
import { checkPhoto } from '../size-check/photo-intake';
import { PhotoProcessor } from '../size-check/photo-processor.service';
import { FileStore } from '../storage/file-store';
import { EntryDto, ReviewEntryDto, UpdateEntryDto } from './dto/show.dto';
import { ShowCategory } from './show-category.entity';
import { type EntryStatus, ShowEntry } from './show-entry.entity';
import { entryWindow, presentEntry, sizeRuleOf } from './show-presenter';
import { Show } from './show.entity';
import { BallotDefinitions } from './ballot-definitions';
import { isShowChair, ShowsService } from './shows.service';
import { checkSize } from './size-rules';
import { votingState } from './voting';

const invalid = (errors: Record<string, string[]>) => new BadRequestException({ message: 'Please check the highlighted fields.', errors });
const LIVE: EntryStatus[] = ['submitted', 'accepted'];
const POPULATE = ['category', 'membership.user', 'enteredBy.user'] as const;

/** Quilts entered in a show: members enter their own, the show chair reviews, numbers and moves them. */
@Injectable()
export class ShowEntriesService {
  constructor(
    private readonly em: EntityManager,
    private readonly shows: ShowsService,
    private readonly files: FileStore,
    private readonly processor: PhotoProcessor,
    private readonly ballots: BallotDefinitions,
  ) {}

  private present(e: ShowEntry, show: Show) {
    return presentEntry(e, show, show.guild.id);
  }

  async mine(me: Membership, showId: number) {
    const show = await this.shows.findShow(me, showId);
    const entries = await this.em.find(ShowEntry, { show: show.id, membership: me.id }, { populate: POPULATE, orderBy: { id: 'asc' } });
    return entries.map((e) => this.present(e, show));
  }

  async list(me: Membership, showId: number, status?: string) {
    const show = await this.shows.findShow(me, showId);
    const where: Record<string, unknown> = { show: show.id };
    if (status) {
      const wanted = status.split(',');
      if (!wanted.every((s) => ['submitted', 'accepted', 'declined', 'withdrawn'].includes(s)))
        throw new BadRequestException('Filter by submitted, accepted, declined or withdrawn.');
      where.status = { $in: wanted };
    }
    const entries = await this.em.find(ShowEntry, where, { populate: POPULATE });
    return sortEntries(entries).map((e) => this.present(e, show));
  }

  /** Accepted entries in the printed order: by category, then entry number, then when entered. */
  async accepted(show: Show, em: EntityManager = this.em): Promise<ShowEntry[]> {
    return sortEntries(await em.find(ShowEntry, { show: show.id, status: 'accepted' }, { populate: POPULATE }));
  }

  private async entryOf(tx: EntityManager, show: Show, entryId: number, lock = false): Promise<ShowEntry> {
    if (lock) await tx.execute('SELECT id FROM show_entries WHERE id = ? AND show_id = ? FOR UPDATE', [entryId, show.id]);
    const entry = await tx.findOne(ShowEntry, { id: entryId, show: show.id }, { populate: POPULATE, refresh: lock });
    if (!entry) throw new NotFoundException('No such entry in this show.');
    return entry;
  }

  private async lockShow(tx: EntityManager, me: Membership, showId: number): Promise<Show> {
    await tx.execute('SELECT id FROM shows WHERE id = ? AND guild_id = ? FOR UPDATE', [showId, me.guild.id]);
    return this.shows.findShow(me, showId, tx);
  }

  private async categoryOf(tx: EntityManager, show: Show, categoryId: number): Promise<ShowCategory> {
    const category = await tx.findOne(ShowCategory, { id: categoryId, show: show.id });
    if (!category) throw invalid({ categoryId: ['Choose one of this show\'s categories.'] });
    return category;
  }

  private checkFits(category: ShowCategory, widthMm: number, heightMm: number, makers: string[]) {
    const problem = checkSize(sizeRuleOf(category), widthMm, heightMm);
    if (problem) throw new BadRequestException({ message: `${category.name}: ${problem.message}`, errors: { [problem.field]: [problem.message] } });
    if (category.minMakers != null && makers.length < category.minMakers)
      throw invalid({ makers: [`${category.name} is for quilts made by ${category.minMakers} or more people; this one names ${makers.length}.`] });
  }

  async create(me: Membership, showId: number, dto: EntryDto) {
    const chair = isShowChair(me);
    if (dto.onBehalfOf !== undefined && !chair) throw new ForbiddenException("Only the show chair can enter a quilt for another member.");
    return withTransaction(this.em, async (tx) => {
      // The show's row lock serialises entries, so two at once cannot both slip under a limit.
      const show = await this.lockShow(tx, me, showId);
      let entrant = me;
      if (dto.onBehalfOf !== undefined && dto.onBehalfOf !== me.id) {
        const other = await tx.findOne(Membership, { id: dto.onBehalfOf, guild: me.guild.id, status: 'active' }, { populate: ['user'] });
        if (!other) throw invalid({ onBehalfOf: ['Choose a member of this guild.'] });
        entrant = other;
      }
      const onBehalf = entrant.id !== me.id;
      const state = votingState(show);
      if (state === 'open' || state === 'closed') throw new ConflictException('Voting has opened, so the show takes no more entries.');
      const window = entryWindow(show, todayIn(show.guild.timeZone));
      if (!onBehalf || !chair) {
        if (window === 'not_yet') throw new ConflictException(`Entries for ${show.name} open on ${formatDate(show.entriesOpenOn!)}.`);
        if (window === 'closed' && !chair)
          throw new ConflictException(`Entries for ${show.name} closed${show.entriesCloseOn ? ` on ${formatDate(show.entriesCloseOn)}` : ''}. Ask the show chair about a late entry.`);
      }
      const category = await this.categoryOf(tx, show, dto.categoryId);
      const widthMm = roundMm(inchesToMm(inchesField(dto.widthIn)));
      const heightMm = roundMm(inchesToMm(inchesField(dto.heightIn)));
      const makers = cleanMakers(dto.makers);
      this.checkFits(category, widthMm, heightMm, makers);
      const live = await tx.find(ShowEntry, { show: show.id, membership: entrant.id, status: { $in: LIVE } }, { fields: ['id', 'category'] });
      const who = onBehalf ? `${entrant.user.name} has` : 'You have';
      if (show.maxEntriesPerMember != null && live.length >= show.maxEntriesPerMember)
        throw new ConflictException(`${who} already entered ${live.length} ${live.length === 1 ? 'quilt' : 'quilts'}; ${show.name} takes at most ${show.maxEntriesPerMember} from each member.`);
      const inCategory = live.filter((e) => e.category.id === category.id).length;
      if (category.maxEntriesPerMember != null && inCategory >= category.maxEntriesPerMember)
        throw new ConflictException(`${who} already entered ${inCategory} in ${category.name}, which takes at most ${category.maxEntriesPerMember} from each member.`);
      const entry = tx.create(ShowEntry, {
        show: show.id,
        category: category.id,
        membership: entrant.id,
        enteredBy: me.id,
        title: dto.title.trim(),
        widthMm,
        heightMm,
        makers,
        quilter: (dto.quilter ?? '').trim(),
        techniques: (dto.techniques ?? '').trim(),
        story: (dto.story ?? '').trim(),
        forSale: dto.forSale ?? false,
        priceCents: dto.forSale ? dto.priceCents ?? null : null,
      });
      await tx.flush();
      await tx.populate(entry, POPULATE);
      return this.present(entry, show);
    });
  }

  async update(me: Membership, showId: number, entryId: number, dto: UpdateEntryDto) {
    const chair = isShowChair(me);
    if (dto.onBehalfOf !== undefined) throw invalid({ onBehalfOf: ['An entry cannot change hands; withdraw it and enter it again for the other member.'] });
    const saved = await withTransaction(this.em, async (tx) => {
      const show = await this.lockShow(tx, me, showId);
      const entry = await this.entryOf(tx, show, entryId, true);
      const own = entry.membership.id === me.id;
      if (!own && !chair) throw new NotFoundException('No such entry in this show.');
      if (!chair && entry.status !== 'submitted')
        throw new ConflictException(`This entry has been ${entry.status}; ask the show chair if something needs to change.`);
      if (!chair && (dto.entryNumber !== undefined)) throw new ForbiddenException('Only the show chair assigns entry numbers.');
      const state = votingState(show);
      const started = state === 'open' || state === 'closed';
      if (started && dto.categoryId !== undefined && dto.categoryId !== entry.category.id)
        throw new ConflictException('Voting has opened: entries can no longer move between categories.');
      if (started && dto.entryNumber !== undefined && dto.entryNumber !== (entry.entryNumber ?? null))
        throw new ConflictException('Voting has opened: entry numbers stay as they are on the hang tags and ballots.');
      const category = dto.categoryId !== undefined ? await this.categoryOf(tx, show, dto.categoryId) : entry.category;
      const widthMm = dto.widthIn !== undefined ? roundMm(inchesToMm(inchesField(dto.widthIn))) : entry.widthMm;
      const heightMm = dto.heightIn !== undefined ? roundMm(inchesToMm(inchesField(dto.heightIn))) : entry.heightMm;
      const makers = dto.makers !== undefined ? cleanMakers(dto.makers) : entry.makers;
      if (dto.categoryId !== undefined || dto.widthIn !== undefined || dto.heightIn !== undefined || dto.makers !== undefined)
        this.checkFits(category, widthMm, heightMm, makers);
      if (category.id !== entry.category.id && category.maxEntriesPerMember != null && LIVE.includes(entry.status)) {
        const there = await tx.count(ShowEntry, { show: show.id, membership: entry.membership.id, category: category.id, status: { $in: LIVE } });
        if (there >= category.maxEntriesPerMember)
          throw new ConflictException(`${entry.membership.user.name} already has ${there} in ${category.name}, which takes at most ${category.maxEntriesPerMember} from each member.`);
      }
      if (dto.entryNumber !== undefined && dto.entryNumber !== null && dto.entryNumber !== entry.entryNumber) {
        const taken = await tx.findOne(ShowEntry, { show: show.id, entryNumber: dto.entryNumber, id: { $ne: entry.id } });
        if (taken) throw new ConflictException(`Entry number ${dto.entryNumber} is already taken by "${taken.title}".`);
      }
      entry.category = category;
      entry.widthMm = widthMm;
      entry.heightMm = heightMm;
      entry.makers = makers;
      if (dto.title !== undefined) entry.title = dto.title.trim();
      if (dto.quilter !== undefined) entry.quilter = dto.quilter.trim();
      if (dto.techniques !== undefined) entry.techniques = dto.techniques.trim();
      if (dto.story !== undefined) entry.story = dto.story.trim();
      if (dto.forSale !== undefined) entry.forSale = dto.forSale;
      if (dto.priceCents !== undefined) entry.priceCents = dto.priceCents;
      if (!entry.forSale) entry.priceCents = null;
      if (dto.entryNumber !== undefined) entry.entryNumber = dto.entryNumber;
      try {
        await tx.flush();
      } catch (e) {
        if (e instanceof UniqueConstraintViolationException) throw new ConflictException(`Entry number ${dto.entryNumber} is already taken.`);
        throw e;
      }
      return this.present(entry, show);
    });
    // A corrected title or maker shows on the next ballot opened.
    this.ballots.forget(showId);
    return saved;
  }

  async withdraw(me: Membership, showId: number, entryId: number) {
    return withTransaction(this.em, async (tx) => {
      const show = await this.lockShow(tx, me, showId);
      const entry = await this.entryOf(tx, show, entryId, true);
      if (entry.membership.id !== me.id && !isShowChair(me)) throw new NotFoundException('No such entry in this show.');
      if (entry.status === 'withdrawn') throw new ConflictException('This entry is already withdrawn.');
      const state = votingState(show);
      if (entry.status === 'accepted' && (state === 'open' || state === 'closed'))
        throw new ConflictException('Voting has opened with this quilt on the ballot; it can no longer be withdrawn. Talk to the show chair.');
      entry.status = 'withdrawn';
      entry.entryNumber = null;
      await tx.flush();
      return this.present(entry, show);
    });
  }

  async review(me: Membership, showId: number, entryId: number, dto: ReviewEntryDto) {
    return withTransaction(this.em, async (tx) => {
      const show = await this.lockShow(tx, me, showId);
      const entry = await this.entryOf(tx, show, entryId, true);
      const state = votingState(show);
      if (state === 'open' || state === 'closed') throw new ConflictException('Voting has opened: the ballot\'s quilts can no longer change.');
      if (entry.status === 'withdrawn') throw new ConflictException('The entrant withdrew this quilt.');
      if (dto.decision === 'decline') {
        const reason = (dto.reason ?? '').trim();
        if (!reason) throw invalid({ reason: ['Say why the entry is declined; the entrant sees it.'] });
        entry.status = 'declined';
        entry.declineReason = reason;
        entry.entryNumber = null;
      } else {
        this.checkFits(entry.category, entry.widthMm, entry.heightMm, entry.makers);
        entry.status = 'accepted';
        entry.declineReason = null;
      }
      entry.reviewedAt = new Date();
      await tx.flush();
      return this.present(entry, show);
    });
  }

  /** Numbers the accepted entries that have no number yet, in category order, after the highest number in use. */
  async number(me: Membership, showId: number, startAt = 1) {
    return withTransaction(this.em, async (tx) => {
      const show = await this.lockShow(tx, me, showId);
      const all = await this.assignNumbers(tx, show, startAt);
      return all.map((e) => this.present(e, show));
    });
  }

  /** Gives every accepted entry without a number the next one, in category order; the caller holds the show's lock. */
  async assignNumbers(tx: EntityManager, show: Show, startAt = 1): Promise<ShowEntry[]> {
    const all = await this.accepted(show, tx);
    const rows: { top: number | null }[] = await tx.execute('SELECT MAX(entry_number) AS top FROM show_entries WHERE show_id = ?', [show.id]);
    let next = Math.max(startAt, Number(rows[0]?.top ?? 0) + 1);
    for (const e of all) if (e.entryNumber == null) e.entryNumber = next++;
    if (next > 10_000) throw new ConflictException('Entry numbers go up to 9999; start lower.');
    await tx.flush();
    return all;
  }

  // ---- photos ------------------------------------------------------------------------------------

  async uploadPhoto(me: Membership, showId: number, entryId: number, file: Express.Multer.File | undefined) {
    if (!file) throw invalid({ photo: ['Choose or take a photo of your quilt.'] });
    const intake = checkPhoto(file.buffer);
    if (!intake.ok) throw new HttpException({ message: intake.message, errors: { photo: [intake.message] } }, intake.status);
    const show = await this.shows.findShow(me, showId);
    const before = await this.entryOf(this.em.fork(), show, entryId);
    if (before.membership.id !== me.id && !isShowChair(me)) throw new NotFoundException('No such entry in this show.');
    if (before.status === 'withdrawn' || before.status === 'declined') throw new ConflictException(`This entry is ${before.status}.`);
    let output;
    try {
      output = await this.processor.resize({ bytes: new Uint8Array(file.buffer), type: intake.type });
    } catch {
      throw new UnprocessableEntityException({
        message: 'Selvage could not read that photo; it may be damaged or cut short. Take it again and upload it.',
        errors: { photo: ['Selvage could not read that photo.'] },
      });
    }
    const display = await this.files.put(Buffer.from(output.display));
    const thumb = await this.files.put(Buffer.from(output.thumb));
    const old = await withTransaction(this.em, async (tx) => {
      const entry = await this.entryOf(tx, show, entryId, true);
      const previous = [entry.photoKey, entry.photoThumbKey].filter((k): k is string => !!k);
      entry.photoKey = display;
      entry.photoThumbKey = thumb;
      await tx.flush();
      return { previous, entry };
    });
    for (const key of old.previous) await this.files.delete(key).catch(() => undefined);
    return this.present(old.entry, show);
  }

  async photo(me: Membership, showId: number, entryId: number, size: string | undefined) {
    const show = await this.shows.findShow(me, showId);
    const entry = await this.entryOf(this.em, show, entryId);
    // Other members see a quilt's photo once it is accepted for the show, as the ballot shows it.
    if (!isShowChair(me) && entry.membership.id !== me.id && entry.status !== 'accepted') throw new NotFoundException('No such photo.');
    return this.photoBytes(entry, size);
  }

  /** A visitor's view: only accepted entries, and only while the ballot is open or the results are out. */
  async publicPhoto(showId: number, entryId: number, size: string | undefined) {
    const entry = await this.em.findOne(ShowEntry, { id: entryId, show: showId, status: 'accepted' }, { populate: ['show'] });
    const state = entry ? votingState(entry.show) : 'not_open';
    if (!entry || (state !== 'open' && !entry.show.resultsPublishedAt)) throw new NotFoundException('No such photo.');
    return this.photoBytes(entry, size);
  }

  private async photoBytes(entry: ShowEntry, size: string | undefined): Promise<Buffer> {
    const key = size === 'thumb' ? entry.photoThumbKey : entry.photoKey;
    if (!key) throw new NotFoundException('This entry has no photo yet.');
    return this.files.get(key);
  }
}

function cleanMakers(makers: string[]): string[] {
  const seen = new Set<string>();
  const out: string[] = [];
  for (const m of makers.map((x) => x.trim().replace(/\s+/g, ' ')).filter(Boolean)) {
    if (seen.has(m.toLowerCase())) continue;
    seen.add(m.toLowerCase());
    out.push(m);
  }
  if (!out.length) throw invalid({ makers: ['Name at least one maker.'] });
  return out;
}

export function sortEntries(entries: ShowEntry[]): ShowEntry[] {
  return [...entries].sort(
    (a, b) =>
      a.category.sortOrder - b.category.sortOrder ||
      a.category.id - b.category.id ||
      (a.entryNumber ?? 1e9) - (b.entryNumber ?? 1e9) ||
      a.id - b.id,
  );
}
