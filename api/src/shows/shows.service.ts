import { EntityManager } from '@mikro-orm/mariadb';
import { BadRequestException, ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { inchesField, inchesToMm, roundMm } from '../common/units/inches';
import { withTransaction } from '../database/transaction';
import { hasAnyRole } from '../guilds/roles';
import type { Membership } from '../guilds/membership.entity';
import { CategoryDto, CreateShowDto, SizeRuleDto, UpdateCategoryDto, UpdateShowDto } from './dto/show.dto';
import { BallotDefinitions } from './ballot-definitions';
import { ShowCategory } from './show-category.entity';
import { ShowEntry } from './show-entry.entity';
import { presentCategory, presentShow, presentSummary } from './show-presenter';
import { Show } from './show.entity';
import { votingState } from './voting';

export const isShowChair = (me: Membership) => hasAnyRole(me.roles, ['show_chair']);

const invalid = (errors: Record<string, string[]>) => new BadRequestException({ message: 'Please check the highlighted fields.', errors });
const mmOf = (inches: string | null | undefined): number | null =>
  inches == null || inches === '' ? null : roundMm(inchesToMm(inchesField(inches)));

/** Shows and their categories: set up by the show chair, read by every member of the guild. */
@Injectable()
export class ShowsService {
  constructor(
    private readonly em: EntityManager,
    private readonly ballots: BallotDefinitions,
  ) {}

  /** The show, if it belongs to the caller's guild (404 otherwise, so other guilds' shows stay unknown). */
  async findShow(me: Membership, showId: number, em: EntityManager = this.em): Promise<Show> {
    const show = await em.findOne(Show, { id: showId, guild: me.guild.id }, { populate: ['guild'] });
    if (!show) throw new NotFoundException('No such show in this guild.');
    return show;
  }

  async categories(show: Show, em: EntityManager = this.em): Promise<ShowCategory[]> {
    return em.find(ShowCategory, { show: show.id }, { orderBy: { sortOrder: 'asc', id: 'asc' } });
  }

  async list(me: Membership) {
    const shows = await this.em.find(Show, { guild: me.guild.id }, { populate: ['guild'], orderBy: { startsOn: 'desc', id: 'desc' } });
    return shows.map((s) => presentSummary(s));
  }

  async detail(me: Membership, showId: number) {
    const show = await this.findShow(me, showId);
    return this.present(me, show);
  }

  async present(me: Membership, show: Show, em: EntityManager = this.em) {
    const categories = await this.categories(show, em);
    const rows: { category_id: number; accepted: number | string; n: number | string }[] = await em.execute(
      "SELECT category_id, SUM(status = 'accepted') AS accepted, COUNT(*) AS n FROM show_entries WHERE show_id = ? GROUP BY category_id",
      [show.id],
    );
    const mine = await em.count(ShowEntry, { show: show.id, membership: me.id, status: { $in: ['submitted', 'accepted'] } });
    return presentShow(show, categories, {
      canManage: isShowChair(me),
      myEntryCount: mine,
      countsByCategory: new Map(rows.map((r) => [Number(r.category_id), { accepted: Number(r.accepted), entries: Number(r.n) }])),
    });
  }

  async create(me: Membership, dto: CreateShowDto) {
    this.checkDates(dto);
    const show = this.em.create(Show, {
      guild: me.guild.id,
      name: dto.name.trim(),
      venue: dto.venue.trim(),
      startsOn: dto.startsOn,
      endsOn: dto.endsOn,
      createdBy: me.id,
    });
    this.apply(show, dto);
    await this.em.flush();
    await this.em.populate(show, ['guild']);
    return this.present(me, show);
  }

  async update(me: Membership, showId: number, dto: UpdateShowDto) {
    const saved = await withTransaction(this.em, async (tx) => {
      await tx.execute('SELECT id FROM shows WHERE id = ? AND guild_id = ? FOR UPDATE', [showId, me.guild.id]);
      const show = await this.findShow(me, showId, tx);
      const state = votingState(show);
      const started = state === 'open' || state === 'closed';
      const countingChanged =
        (dto.votingKind !== undefined && dto.votingKind !== show.votingKind) ||
        (dto.rankedMethod !== undefined && dto.rankedMethod !== show.rankedMethod) ||
        (dto.rankDepth !== undefined && dto.rankDepth !== show.rankDepth);
      if (started && countingChanged)
        throw new ConflictException('Voting has opened: the kind of ballot and the way it is counted can no longer change.');
      if (state === 'closed' && (dto.votingOpensAt !== undefined || dto.votingClosesAt !== undefined))
        throw new ConflictException('Voting has closed, and closing is final: the schedule can no longer change.');
      if (state === 'open' && dto.votingOpensAt !== undefined)
        throw new ConflictException('Voting is already open; only the closing time can change.');
      this.checkDates({
        startsOn: dto.startsOn ?? show.startsOn,
        endsOn: dto.endsOn ?? show.endsOn,
        entriesOpenOn: dto.entriesOpenOn !== undefined ? dto.entriesOpenOn : show.entriesOpenOn,
        entriesCloseOn: dto.entriesCloseOn !== undefined ? dto.entriesCloseOn : show.entriesCloseOn,
      });
      const opens = dto.votingOpensAt !== undefined ? (dto.votingOpensAt ? new Date(dto.votingOpensAt) : null) : show.votingOpensAt ?? null;
      const closes = dto.votingClosesAt !== undefined ? (dto.votingClosesAt ? new Date(dto.votingClosesAt) : null) : show.votingClosesAt ?? null;
      // A time already past would open voting at once, without the checks that opening by hand makes.
      if (dto.votingOpensAt && opens! <= new Date())
        throw invalid({ votingOpensAt: ['Choose an opening time in the future, or open voting now from the ballot desk.'] });
      if (opens && closes && closes <= opens) throw invalid({ votingClosesAt: ['Voting must close after it opens.'] });
      if (dto.votingClosesAt && closes! <= new Date()) throw invalid({ votingClosesAt: ['Choose a closing time in the future, or close voting now from the voting desk.'] });
      if (dto.name !== undefined) show.name = dto.name.trim();
      if (dto.venue !== undefined) show.venue = dto.venue.trim();
      if (dto.startsOn !== undefined) show.startsOn = dto.startsOn;
      if (dto.endsOn !== undefined) show.endsOn = dto.endsOn;
      this.apply(show, dto);
      if (dto.votingOpensAt !== undefined) show.votingOpensAt = opens;
      if (dto.votingClosesAt !== undefined) show.votingClosesAt = closes;
      if (dto.makersHidden !== undefined) show.makersHidden = dto.makersHidden;
      await tx.flush();
      return this.present(me, show, tx);
    });
    // The ballot names the show; a corrected name shows on the next ballot opened.
    this.ballots.forget(showId);
    return saved;
  }

  private apply(show: Show, dto: Partial<CreateShowDto>) {
    if (dto.description !== undefined) show.description = dto.description.trim();
    if (dto.entriesOpenOn !== undefined) show.entriesOpenOn = dto.entriesOpenOn;
    if (dto.entriesCloseOn !== undefined) show.entriesCloseOn = dto.entriesCloseOn;
    if (dto.maxEntriesPerMember !== undefined) show.maxEntriesPerMember = dto.maxEntriesPerMember;
    if (dto.entryFeeCents !== undefined) show.entryFeeCents = dto.entryFeeCents;
    if (dto.entryFeeCapCents !== undefined) show.entryFeeCapCents = dto.entryFeeCapCents;
    if (dto.sleeveDepthIn !== undefined) show.sleeveDepthMm = mmOf(dto.sleeveDepthIn)!;
    if (dto.narrowUnderIn !== undefined) show.narrowUnderMm = mmOf(dto.narrowUnderIn);
    if (dto.narrowDepthIn !== undefined) show.narrowDepthMm = mmOf(dto.narrowDepthIn);
    if (dto.splitOverIn !== undefined) show.splitOverMm = mmOf(dto.splitOverIn);
    if ((show.narrowUnderMm == null) !== (show.narrowDepthMm == null))
      throw invalid({ narrowDepthIn: ['Give both the width under which a narrower sleeve is allowed and that sleeve\'s depth, or neither.'] });
    if (show.narrowDepthMm != null && show.narrowDepthMm > show.sleeveDepthMm)
      throw invalid({ narrowDepthIn: ['The narrow quilts\' sleeve should not be deeper than the usual one.'] });
    if (show.entryFeeCapCents != null && show.entryFeeCapCents < show.entryFeeCents)
      throw invalid({ entryFeeCapCents: ['The most one member pays cannot be less than the fee for one quilt.'] });
    if (dto.votingKind !== undefined) show.votingKind = dto.votingKind;
    if (dto.rankedMethod !== undefined) show.rankedMethod = dto.rankedMethod;
    if (dto.rankDepth !== undefined) show.rankDepth = dto.rankDepth;
  }

  private checkDates(d: { startsOn: string; endsOn: string; entriesOpenOn?: string | null; entriesCloseOn?: string | null }) {
    const errors: Record<string, string[]> = {};
    const real = (s: string) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s);
    for (const k of ['startsOn', 'endsOn', 'entriesOpenOn', 'entriesCloseOn'] as const) if (d[k] && !real(d[k]!)) errors[k] = ['That date does not exist.'];
    if (!errors.endsOn && d.endsOn < d.startsOn) errors.endsOn = ['The show cannot end before it starts.'];
    if (d.entriesOpenOn && d.entriesCloseOn && d.entriesCloseOn < d.entriesOpenOn) errors.entriesCloseOn = ['Entries cannot close before they open.'];
    if (d.entriesCloseOn && d.entriesCloseOn > d.endsOn) errors.entriesCloseOn = ['Entries must close by the last day of the show.'];
    if (d.entriesOpenOn && d.entriesOpenOn > d.endsOn) errors.entriesOpenOn = ["Entries must open on or before the show's last day."];
    if (Object.keys(errors).length) throw invalid(errors);
  }

  // ---- categories --------------------------------------------------------------------------------

  async createCategory(me: Membership, showId: number, dto: CategoryDto) {
    return withTransaction(this.em, async (tx) => {
      await tx.execute('SELECT id FROM shows WHERE id = ? AND guild_id = ? FOR UPDATE', [showId, me.guild.id]);
      const show = await this.findShow(me, showId, tx);
      if (votingState(show) !== 'not_open' && votingState(show) !== 'scheduled')
        throw new ConflictException('Voting has opened: categories can no longer be added, because ballots are already being cast.');
      const existing = await tx.count(ShowCategory, { show: show.id });
      if (existing >= 60) throw new ConflictException('A show can have at most 60 categories.');
      await this.assertNameFree(tx, show.id, dto.name.trim(), 0);
      const category = tx.create(ShowCategory, { show: show.id, name: dto.name.trim(), sortOrder: dto.sortOrder ?? existing });
      await this.applyCategory(tx, category, dto);
      return presentCategory(category);
    });
  }

  async updateCategory(me: Membership, showId: number, categoryId: number, dto: UpdateCategoryDto) {
    const saved = await withTransaction(this.em, async (tx) => {
      await tx.execute('SELECT id FROM shows WHERE id = ? AND guild_id = ? FOR UPDATE', [showId, me.guild.id]);
      const show = await this.findShow(me, showId, tx);
      const category = await tx.findOne(ShowCategory, { id: categoryId, show: show.id });
      if (!category) throw new NotFoundException('No such category in this show.');
      const state = votingState(show);
      // The quilts on the ballot were accepted under these rules; a name or description may still be corrected.
      if ((state === 'open' || state === 'closed') && (dto.sizeRule !== undefined || dto.minMakers !== undefined || dto.maxEntriesPerMember !== undefined))
        throw new ConflictException("Voting has opened: a category's size rule, makers and limits can no longer change. Its name and description still can.");
      if (dto.name !== undefined) {
        await this.assertNameFree(tx, show.id, dto.name.trim(), category.id);
        category.name = dto.name.trim();
      }
      if (dto.sortOrder !== undefined) category.sortOrder = dto.sortOrder;
      await this.applyCategory(tx, category, dto);
      const accepted = await tx.count(ShowEntry, { category: category.id, status: 'accepted' });
      const entries = await tx.count(ShowEntry, { category: category.id });
      return presentCategory(category, { accepted, entries });
    });
    this.ballots.forget(showId);
    return saved;
  }

  async deleteCategory(me: Membership, showId: number, categoryId: number) {
    await withTransaction(this.em, async (tx) => {
      await tx.execute('SELECT id FROM shows WHERE id = ? AND guild_id = ? FOR UPDATE', [showId, me.guild.id]);
      const show = await this.findShow(me, showId, tx);
      const category = await tx.findOne(ShowCategory, { id: categoryId, show: show.id });
      if (!category) throw new NotFoundException('No such category in this show.');
      if (votingState(show) === 'open' || votingState(show) === 'closed')
        throw new ConflictException('Voting has opened: categories can no longer be removed.');
      const entries = await tx.count(ShowEntry, { category: category.id });
      if (entries > 0)
        throw new ConflictException(
          `${category.name} has ${entries === 1 ? '1 entry. Move it' : `${entries} entries. Move them`} to another category first, then delete it.`,
        );
      tx.remove(category);
    });
  }

  private async applyCategory(tx: EntityManager, category: ShowCategory, dto: UpdateCategoryDto) {
    if (dto.description !== undefined) category.description = dto.description.trim();
    if (dto.judged !== undefined) category.judged = dto.judged;
    if (dto.minMakers !== undefined) category.minMakers = dto.minMakers;
    if (dto.maxEntriesPerMember !== undefined) category.maxEntriesPerMember = dto.maxEntriesPerMember;
    if (dto.sizeRule) this.applySizeRule(category, dto.sizeRule);
    await tx.flush();
  }

  private async assertNameFree(tx: EntityManager, showId: number, name: string, exceptId: number) {
    const clash = await tx.findOne(ShowCategory, { show: showId, name, id: { $ne: exceptId } });
    if (clash) throw invalid({ name: ['Another category of this show already has that name.'] });
  }

  private applySizeRule(c: ShowCategory, r: SizeRuleDto) {
    c.sizeKind = r.kind;
    c.minWidthMm = c.maxWidthMm = c.minHeightMm = c.maxHeightMm = c.minPerimeterMm = c.maxPerimeterMm = null;
    c.minInclusive = c.maxInclusive = true;
    const errors: Record<string, string[]> = {};
    if (r.kind === 'dimensions') {
      c.minWidthMm = mmOf(r.minWidthIn);
      c.maxWidthMm = mmOf(r.maxWidthIn);
      c.minHeightMm = mmOf(r.minHeightIn);
      c.maxHeightMm = mmOf(r.maxHeightIn);
      if (c.minWidthMm == null && c.maxWidthMm == null && c.minHeightMm == null && c.maxHeightMm == null)
        errors['sizeRule.maxWidthIn'] = ['Give at least one width or height limit, or choose no size rule.'];
      if (c.minWidthMm != null && c.maxWidthMm != null && c.minWidthMm > c.maxWidthMm) errors['sizeRule.minWidthIn'] = ['The least width is more than the greatest.'];
      if (c.minHeightMm != null && c.maxHeightMm != null && c.minHeightMm > c.maxHeightMm) errors['sizeRule.minHeightIn'] = ['The least height is more than the greatest.'];
    } else if (r.kind === 'perimeter') {
      c.minPerimeterMm = mmOf(r.minIn);
      c.maxPerimeterMm = mmOf(r.maxIn);
      c.minInclusive = r.minInclusive ?? true;
      c.maxInclusive = r.maxInclusive ?? true;
      if (c.minPerimeterMm == null && c.maxPerimeterMm == null) errors['sizeRule.maxIn'] = ['Give a lower or an upper perimeter, or choose no size rule.'];
      if (c.minPerimeterMm != null && c.maxPerimeterMm != null && c.minPerimeterMm >= c.maxPerimeterMm)
        errors['sizeRule.minIn'] = ['The lower perimeter must be less than the upper one.'];
    }
    if (Object.keys(errors).length) throw invalid(errors);
  }
}
