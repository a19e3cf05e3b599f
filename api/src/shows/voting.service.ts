import { UniqueConstraintViolationException } from '@mikro-orm/core';
import { EntityManager } from '@mikro-orm/mariadb';
import { BadRequestException, ConflictException, ForbiddenException, Injectable, NotFoundException } from '@nestjs/common';
import { randomBytes } from 'node:crypto';
import { formatInches, mmToInches } from '../common/units/inches';
import { withTransaction } from '../database/transaction';
import { formatDate, todayIn } from '../dues/dues-rules';
import { toCsv } from '../dues/csv';
import { Membership } from '../guilds/membership.entity';
import { formatBallotCode, generateBallotCode, normaliseBallotCode } from './ballot-code';
import { BallotCode, type BallotChoices, TieDecisionRecord, type VoterChannel } from './ballot.entity';
import { TieDecisionDto } from './dto/show.dto';
import { ShowEntriesService } from './show-entries.service';
import { BallotDefinitions } from './ballot-definitions';
import { Show } from './show.entity';
import { isShowChair, ShowsService } from './shows.service';
import { type BallotCategory, checkBallot, countShow, votingState } from './voting';

/** An accepted entry as the ballot and the count need it (plain data, safe to keep between requests). */
interface BallotEntry {
  id: number;
  entryNumber: number | null;
  title: string;
  makers: string[];
  hasPhoto: boolean;
  widthMm: number;
  heightMm: number;
}

/** What a show's ballot offers, and what casting needs to know about the show. */
export interface BallotDefinition {
  show: { id: number; name: string; votingKind: Show['votingKind']; rankDepth: number };
  categories: (BallotCategory & { description: string })[];
  entries: Map<number, BallotEntry>;
}

const SCORE_LABEL = { per_category: 'Votes', approval: 'Approvals', points: 'Points', instant_runoff: 'Votes in the last round' } as const;

/**
 * The viewer's choice ballot: opening and closing, visitor codes, casting (one ballot per member or
 * code, enforced by a unique key in the same transaction as the ballot), turnout, and the count.
 */
const CARD_USED = 'This ballot card has already been used to vote. Each card votes once.';

/** Why there is nothing to count yet, in the words of the voting's state. */
function notCountedYet(state: string, what: string): string {
  return state === 'open' ? `Voting is still open: ${what} until it closes.` : 'Voting has not opened yet, so there is nothing to count.';
}

@Injectable()
export class VotingService {
  constructor(
    private readonly em: EntityManager,
    private readonly shows: ShowsService,
    private readonly entries: ShowEntriesService,
    private readonly definitions: BallotDefinitions<BallotDefinition>,
  ) {}

  // ---- the ballot's content ------------------------------------------------------------------------

  private async definition(show: Show, em: EntityManager = this.em): Promise<BallotDefinition> {
    const build = async (): Promise<BallotDefinition> => {
      const categories = await this.shows.categories(show, em);
      const accepted = await this.entries.accepted(show, em);
      return {
        show: { id: show.id, name: show.name, votingKind: show.votingKind, rankDepth: show.rankDepth },
        categories: categories
          .map((c) => ({
            id: c.id,
            name: c.name,
            description: c.description,
            entries: accepted.filter((e) => e.category.id === c.id).map((e) => ({ id: e.id, entryNumber: e.entryNumber ?? null, title: e.title })),
          }))
          .filter((c) => c.entries.length > 0),
        entries: new Map(
          accepted.map((e) => [
            e.id,
            { id: e.id, entryNumber: e.entryNumber ?? null, title: e.title, makers: e.makers, hasPhoto: !!e.photoKey, widthMm: e.widthMm, heightMm: e.heightMm },
          ]),
        ),
      };
    };
    if (votingState(show) !== 'open') return build();
    if (!show.votingOpenedAt) await this.openedBySchedule(show);
    return this.openDefinition(show.id, build);
  }

  /**
   * The schedule opened voting with nobody pressing "Open": the first request to see it records the
   * opening and numbers the accepted quilts, as opening by hand does (under the show's lock, once).
   */
  private async openedBySchedule(show: Show): Promise<void> {
    await withTransaction(this.em, async (tx) => {
      await tx.execute('SELECT id FROM shows WHERE id = ? FOR UPDATE', [show.id]);
      const fresh = await tx.findOneOrFail(Show, { id: show.id }, { refresh: true, populate: ['guild'] });
      if (fresh.votingOpenedAt || votingState(fresh) !== 'open') return;
      await this.entries.assignNumbers(tx, fresh);
      fresh.votingOpenedAt = fresh.votingOpensAt ?? new Date();
      await tx.flush();
    });
    const after = await this.em.fork().findOneOrFail(Show, { id: show.id });
    show.votingOpenedAt = after.votingOpenedAt;
  }

  /** The cached definition of a show whose voting is open (its kind, categories and entries are frozen). */
  private openDefinition(showId: number, build: () => Promise<BallotDefinition>): Promise<BallotDefinition> {
    return this.definitions.get(showId, build);
  }

  private async presentBallot(show: Show, extra: Record<string, unknown>, publicPhotos: boolean) {
    const def = await this.definition(show);
    const photoUrl = (e: BallotEntry) =>
      !e.hasPhoto ? null : publicPhotos ? `/api/public/shows/${show.id}/entries/${e.id}/photo?size=thumb` : `/api/guilds/${show.guild.id}/shows/${show.id}/entries/${e.id}/photo?size=thumb`;
    return {
      show: {
        id: show.id,
        name: show.name,
        venue: show.venue,
        guildName: show.guild.name,
        votingKind: show.votingKind,
        rankedMethod: show.rankedMethod,
        rankDepth: show.rankDepth,
        votingState: votingState(show),
        votingClosesAt: show.votingClosesAt?.toISOString() ?? null,
      },
      categories: def.categories.map((c) => ({
        id: c.id,
        name: c.name,
        description: c.description,
        entries: c.entries.map(({ id }) => {
          const e = def.entries.get(id)!;
          return {
            id,
            entryNumber: e.entryNumber ?? null,
            title: e.title,
            makers: show.makersHidden ? null : e.makers,
            photoUrl: photoUrl(e),
            widthText: formatInches(mmToInches(e.widthMm)),
            heightText: formatInches(mmToInches(e.heightMm)),
          };
        }),
      })),
      ...extra,
    };
  }

  async memberBallot(me: Membership, showId: number) {
    const show = await this.shows.findShow(me, showId);
    const voted = await this.em.execute('SELECT 1 FROM show_voters WHERE show_id = ? AND voter_key = ?', [show.id, `member:${me.id}`]);
    return this.presentBallot(show, { hasVoted: voted.length > 0 }, false);
  }

  private async codeRow(typed: string): Promise<BallotCode> {
    const code = normaliseBallotCode(typed);
    const row = code ? await this.em.findOne(BallotCode, { code }, { populate: ['show.guild'] }) : null;
    if (!row) throw new NotFoundException('We do not know that code. Check it against your ballot card; the letters O and I are never used.');
    return row;
  }

  async publicBallot(typed: string) {
    const row = await this.codeRow(typed);
    const show = row.show;
    if (row.usedAt) throw new ConflictException('This ballot card has already been used to vote. Each card votes once.');
    this.assertOpen(show);
    return this.presentBallot(show, { code: formatBallotCode(row.code) }, true);
  }

  private assertOpen(show: Show) {
    const state = votingState(show);
    if (state === 'closed') throw new ConflictException(`Voting for ${show.name} has closed. Thank you for coming.`);
    if (state !== 'open') throw new ConflictException(`Voting for ${show.name} has not opened yet.`);
  }

  // ---- casting -------------------------------------------------------------------------------------

  async castMember(me: Membership, showId: number, choices: unknown) {
    const show = await this.shows.findShow(me, showId);
    this.assertOpen(show);
    return this.cast(await this.definition(show), `member:${me.id}`, 'member', null, choices, 'You have already voted in this show. A cast ballot is final.');
  }

  async castCode(typed: string, choices: unknown) {
    // The busiest path at a show: one indexed read, then the cached ballot definition while voting is open.
    const code = normaliseBallotCode(typed);
    const rows: { id: number; show_id: number; used_at: Date | null }[] = code
      ? await this.em.execute('SELECT id, show_id, used_at FROM ballot_codes WHERE code = ?', [code])
      : [];
    if (!rows.length) throw new NotFoundException('We do not know that code. Check it against your ballot card; the letters O and I are never used.');
    // Said before anything about her choices, so nobody corrects a ballot that cannot count (the unique key still decides a race).
    if (rows[0].used_at) throw new ConflictException(CARD_USED);
    const showId = Number(rows[0].show_id);
    let def = await this.definitions.peek(showId);
    if (!def) {
      const show = await this.em.findOneOrFail(Show, { id: showId }, { populate: ['guild'] });
      this.assertOpen(show);
      def = await this.definition(show);
    }
    return this.cast(def, `code:${rows[0].id}`, 'code', Number(rows[0].id), choices, CARD_USED);
  }

  async castPaper(me: Membership, showId: number, typed: string, choices: unknown) {
    const show = await this.shows.findShow(me, showId);
    const code = normaliseBallotCode(typed);
    if (!code) throw new BadRequestException({ message: 'That is not a ballot code: codes have 12 letters and digits, like K7QM-3XHD-9PRW.', errors: { code: ['Check the code on the paper ballot.'] } });
    const row = await this.em.findOne(BallotCode, { code, show: show.id });
    if (!row) throw new NotFoundException({ message: 'No ballot card of this show has that code. Check it against the paper ballot.', errors: { code: ['No card of this show has that code.'] } });
    this.assertOpen(show);
    const duplicate = `Code ${formatBallotCode(code)} has already voted. Set this paper ballot aside as a duplicate.`;
    if (row.usedAt) throw new ConflictException(duplicate);
    const result = await this.cast(await this.definition(show), `code:${row.id}`, 'paper', row.id, choices, duplicate);
    // The volunteer keying a stack of paper ballots sees the running total after each one.
    const cast: { n: number | string }[] = await this.em.execute('SELECT COUNT(*) AS n FROM show_ballots WHERE show_id = ?', [show.id]);
    return { ...result, code: formatBallotCode(code), ballotsCast: Number(cast[0].n) };
  }

  /**
   * Writes one ballot, or nothing. The ballot is checked against the definition first; then, in one
   * transaction: the show's voting state under a shared lock (closing takes it for update, so it waits
   * for ballots in flight and a later ballot sees it closed), the voter's row (the unique key on
   * (show_id, voter_key) is the one-ballot rule), the code marked used, and the anonymous ballot.
   */
  private async cast(def: BallotDefinition, voterKey: string, channel: VoterChannel, codeId: number | null, raw: unknown, duplicate: string) {
    const show = def.show;
    const checked = checkBallot(show.votingKind, show.rankDepth, def.categories, raw);
    if (!checked.ok) throw new BadRequestException({ message: checked.message, errors: { choices: [checked.message] } });
    const now = new Date();
    try {
      await withTransaction(this.em, async (tx) => {
        const rows: Record<'opens' | 'closes' | 'opened' | 'closed', number | string | null>[] = await tx.execute(
          `SELECT UNIX_TIMESTAMP(voting_opens_at) AS opens, UNIX_TIMESTAMP(voting_closes_at) AS closes,
                  UNIX_TIMESTAMP(voting_opened_at) AS opened, UNIX_TIMESTAMP(voting_closed_at) AS closed
             FROM shows WHERE id = ? LOCK IN SHARE MODE`,
          [show.id],
        );
        const at = (v: number | string | null) => (v == null ? null : new Date(Number(v) * 1000));
        const r = rows[0];
        const state = votingState({ votingOpensAt: at(r.opens), votingClosesAt: at(r.closes), votingOpenedAt: at(r.opened), votingClosedAt: at(r.closed) }, now);
        if (state === 'closed') throw new ConflictException(`Voting for ${show.name} has closed. Thank you for coming.`);
        if (state !== 'open') throw new ConflictException(`Voting for ${show.name} has not opened yet.`);
        await tx.execute('INSERT INTO show_voters (show_id, voter_key, channel, cast_at) VALUES (?, ?, ?, ?)', [show.id, voterKey, channel, now], 'run');
        if (codeId !== null) await tx.execute('UPDATE ballot_codes SET used_at = ?, updated_at = ? WHERE id = ?', [now, now, codeId], 'run');
        await tx.execute('INSERT INTO show_ballots (id, show_id, choices) VALUES (?, ?, ?)', [randomBytes(16).toString('base64url'), show.id, JSON.stringify(checked.choices)], 'run');
      });
    } catch (e) {
      if (isDuplicateKey(e)) throw new ConflictException(duplicate);
      throw e;
    }
    return { ok: true, votes: checked.votes };
  }

  // ---- the chair's desk ----------------------------------------------------------------------------

  private async lockShow(tx: EntityManager, me: Membership, showId: number): Promise<Show> {
    await tx.execute('SELECT id FROM shows WHERE id = ? AND guild_id = ? FOR UPDATE', [showId, me.guild.id]);
    return this.shows.findShow(me, showId, tx);
  }

  async open(me: Membership, showId: number) {
    return withTransaction(this.em, async (tx) => {
      const show = await this.lockShow(tx, me, showId);
      const state = votingState(show);
      if (state === 'open') throw new ConflictException('Voting is already open.');
      if (state === 'closed') throw new ConflictException('Voting has closed, and closing is final.');
      const accepted = await tx.count('ShowEntry', { show: show.id, status: 'accepted' });
      if (accepted === 0) throw new ConflictException('Accept at least one quilt before voting opens: the ballot would be empty.');
      // Paper ballots and hang tags name quilts by number: any accepted quilt still without one gets the next.
      await this.entries.assignNumbers(tx, show);
      show.votingOpenedAt = new Date();
      show.votingOpensAt = null;
      await tx.flush();
      return this.shows.present(me, show, tx);
    });
  }

  async close(me: Membership, showId: number) {
    return withTransaction(this.em, async (tx) => {
      const show = await this.lockShow(tx, me, showId);
      const state = votingState(show);
      if (state === 'closed') throw new ConflictException('Voting is already closed.');
      if (state !== 'open') throw new ConflictException('Voting has not opened yet, so there is nothing to close.');
      show.votingClosedAt = new Date();
      await tx.flush();
      return this.shows.present(me, show, tx);
    });
  }

  async turnout(me: Membership, showId: number) {
    const show = await this.shows.findShow(me, showId);
    const counts = await this.counts(show.id);
    const members: { n: number }[] = await this.em.execute("SELECT COUNT(*) AS n FROM memberships WHERE guild_id = ? AND status = 'active'", [me.guild.id]);
    return { state: votingState(show), ...counts, eligibleMembers: Number(members[0].n) };
  }

  private async counts(showId: number) {
    const codes: { issued: number; used: number }[] = await this.em.execute(
      'SELECT COUNT(*) AS issued, COUNT(used_at) AS used FROM ballot_codes WHERE show_id = ?',
      [showId],
    );
    const voters: { channel: VoterChannel; n: number }[] = await this.em.execute('SELECT channel, COUNT(*) AS n FROM show_voters WHERE show_id = ? GROUP BY channel', [showId]);
    const by = (c: VoterChannel) => Number(voters.find((v) => v.channel === c)?.n ?? 0);
    const ballots: { n: number }[] = await this.em.execute('SELECT COUNT(*) AS n FROM show_ballots WHERE show_id = ?', [showId]);
    return {
      codesIssued: Number(codes[0].issued),
      codesUsed: Number(codes[0].used),
      memberBallots: by('member'),
      codeBallots: by('code'),
      paperBallots: by('paper'),
      ballotsCast: Number(ballots[0].n),
    };
  }

  async issueCodes(me: Membership, showId: number, count: number) {
    return withTransaction(this.em, async (tx) => {
      const show = await this.lockShow(tx, me, showId);
      if (votingState(show) === 'closed') throw new ConflictException('Voting has closed; no more ballot cards are needed.');
      const total = await tx.count(BallotCode, { show: show.id });
      if (total + count > 20_000) throw new ConflictException(`A show can have at most 20,000 ballot cards; ${total} are printed already.`);
      const rows: { top: number | null }[] = await tx.execute('SELECT MAX(batch) AS top FROM ballot_codes WHERE show_id = ?', [show.id]);
      const batch = Number(rows[0]?.top ?? 0) + 1;
      const codes = new Set<string>();
      while (codes.size < count) codes.add(generateBallotCode());
      const now = new Date();
      const values = [...codes].map((c) => [now, now, show.id, c, batch]);
      // 60 random bits make a clash with an existing code vanishingly rare; the unique key would refuse it.
      for (let i = 0; i < values.length; i += 500) {
        const chunk = values.slice(i, i + 500);
        await tx.execute(
          `INSERT INTO ballot_codes (created_at, updated_at, show_id, code, batch) VALUES ${chunk.map(() => '(?, ?, ?, ?, ?)').join(', ')}`,
          chunk.flat(),
          'run',
        );
      }
      return { batch, count, codesIssued: total + count };
    });
  }

  async batches(me: Membership, showId: number) {
    const show = await this.shows.findShow(me, showId);
    const rows: { batch: number; n: number; used: number; created: Date }[] = await this.em.execute(
      'SELECT batch, COUNT(*) AS n, COUNT(used_at) AS used, MIN(created_at) AS created FROM ballot_codes WHERE show_id = ? GROUP BY batch ORDER BY batch',
      [show.id],
    );
    return { batches: rows.map((r) => ({ batch: Number(r.batch), count: Number(r.n), used: Number(r.used), createdAt: new Date(r.created).toISOString() })) };
  }

  /** The codes of one batch, for the printed cards. */
  async batchCodes(me: Membership, showId: number, batch: number) {
    const show = await this.shows.findShow(me, showId);
    const rows = await this.em.find(BallotCode, { show: show.id, batch }, { orderBy: { id: 'asc' } });
    if (!rows.length) throw new NotFoundException('No such batch of ballot cards.');
    return { show, codes: rows.map((r) => r.code) };
  }

  // ---- results -------------------------------------------------------------------------------------

  async results(me: Membership | null, showId: number, options: { publicView?: boolean } = {}) {
    const show = me ? await this.shows.findShow(me, showId) : await this.em.findOne(Show, { id: showId }, { populate: ['guild'] });
    if (!show) throw new NotFoundException('No such show.');
    const chair = me ? isShowChair(me) : false;
    const state = votingState(show);
    if (!show.resultsPublishedAt) {
      if (!chair) {
        if (options.publicView) throw new NotFoundException('The results of this show have not been announced yet.');
        throw new ForbiddenException('The results have not been announced yet.');
      }
      if (state !== 'closed') throw new ConflictException(notCountedYet(state, 'the standings stay hidden'));
    }
    return this.count(show);
  }

  private async count(show: Show, em: EntityManager = this.em) {
    const def = await this.definition(show, em);
    const ballotRows: { choices: BallotChoices | string }[] = await em.execute('SELECT choices FROM show_ballots WHERE show_id = ?', [show.id]);
    const ballots = ballotRows.map((r) => (typeof r.choices === 'string' ? (JSON.parse(r.choices) as BallotChoices) : r.choices));
    const decisions = await em.find(TieDecisionRecord, { show: show.id }, { orderBy: { id: 'asc' } });
    const counted = countShow(
      show.votingKind,
      show.rankedMethod,
      def.categories,
      ballots,
      decisions.map((d) => ({ id: d.id, categoryId: d.category?.id ?? null, order: d.entryOrder })),
    );
    const counts = await this.counts(show.id);
    const entry = (id: number) => def.entries.get(id)!;
    const votesPerCategory = counted.map((c) => ({ categoryId: c.categoryId, name: c.name, votes: c.votes }));
    const parts = [
      `Ballot cards printed: ${counts.codesIssued}; used: ${counts.codesUsed} (${counts.codeBallots} on phones, ${counts.paperBallots} keyed from paper).`,
      `Member ballots: ${counts.memberBallots}. Ballots cast: ${counts.ballotsCast}.`,
      `Votes: ${votesPerCategory.map((v) => `${v.name} ${v.votes}`).join('; ') || 'none'}.`,
    ];
    const voters = counts.memberBallots + counts.codeBallots + counts.paperBallots;
    if (voters !== counts.ballotsCast) parts.push(`Warning: ${voters} voters are recorded against ${counts.ballotsCast} ballots.`);
    return {
      show: {
        id: show.id,
        name: show.name,
        guildName: show.guild.name,
        votingKind: show.votingKind,
        rankedMethod: show.rankedMethod,
        scoreLabel: SCORE_LABEL[show.votingKind === 'ranked' ? show.rankedMethod : show.votingKind],
        published: !!show.resultsPublishedAt,
        publishedAt: show.resultsPublishedAt?.toISOString() ?? null,
        closedAt: (show.votingClosedAt ?? show.votingClosesAt)?.toISOString() ?? null,
      },
      audit: { ...counts, votesPerCategory, text: parts.join(' ') },
      categories: counted.map((c) => ({
        ...c,
        standings: c.standings.map((s) => ({ ...s, entryNumber: entry(s.entryId).entryNumber ?? null, title: entry(s.entryId).title, makers: entry(s.entryId).makers })),
        decisions: decisions
          .filter((d) => (d.category?.id ?? null) === c.categoryId)
          .map((d) => ({ id: d.id, order: d.entryOrder, note: d.note, decidedBy: d.decidedByName, decidedAt: d.createdAt.toISOString(), stale: c.staleDecisionIds.includes(d.id) })),
      })),
    };
  }

  async decide(me: Membership, showId: number, dto: TieDecisionDto) {
    return withTransaction(this.em, async (tx) => {
      const show = await this.lockShow(tx, me, showId);
      if (votingState(show) !== 'closed') throw new ConflictException('Ties are settled after voting closes.');
      if (show.resultsPublishedAt) throw new ConflictException('The results are published; they can no longer change.');
      if ((show.votingKind === 'ranked') !== (dto.categoryId === null))
        throw new BadRequestException(show.votingKind === 'ranked' ? 'A ranked show has one overall award: leave the category empty.' : 'Choose the category of the tie.');
      const now = await this.count(show, tx);
      const result = now.categories.find((c) => c.categoryId === dto.categoryId);
      if (!result) throw new NotFoundException('No such category on the ballot.');
      const order = dto.order;
      const tie = result.ties.find((t) => t.entryIds.length === order.length && t.entryIds.every((id) => order.includes(id)));
      if (!tie || new Set(order).size !== order.length)
        throw new BadRequestException('Those entries are not tied with each other. List exactly the entries that share one place, in the order you decided.');
      const actor = await tx.findOneOrFail(Membership, { id: me.id }, { populate: ['user'] });
      tx.create(TieDecisionRecord, {
        show: show.id,
        category: dto.categoryId,
        entryOrder: order,
        note: (dto.note ?? '').trim(),
        decidedBy: me.id,
        decidedByName: actor.user.name,
      });
      await tx.flush();
      return this.count(show, tx);
    });
  }

  async undecide(me: Membership, showId: number, decisionId: number) {
    return withTransaction(this.em, async (tx) => {
      const show = await this.lockShow(tx, me, showId);
      if (show.resultsPublishedAt) throw new ConflictException('The results are published; they can no longer change.');
      const d = await tx.findOne(TieDecisionRecord, { id: decisionId, show: show.id });
      if (!d) throw new NotFoundException('No such decision.');
      tx.remove(d);
      await tx.flush();
      return this.count(show, tx);
    });
  }

  async publish(me: Membership, showId: number) {
    return withTransaction(this.em, async (tx) => {
      const show = await this.lockShow(tx, me, showId);
      if (votingState(show) !== 'closed') throw new ConflictException('Close voting before publishing the results.');
      if (show.resultsPublishedAt) throw new ConflictException('The results are already published.');
      show.resultsPublishedAt = new Date();
      await tx.flush();
      return this.count(show, tx);
    });
  }

  async resultsCsv(me: Membership, showId: number): Promise<string> {
    const r = await this.results(me, showId);
    const rows = r.categories.flatMap((c) =>
      c.standings.map((s) => [c.name, s.rank, s.entryNumber, s.title, s.makers.join('; '), s.score, s.ribbon ? ['1st', '2nd', '3rd'][s.ribbon - 1] : '', s.byDecision ? 'yes' : '']),
    );
    return toCsv(['Category', 'Rank', 'Entry number', 'Title', 'Makers', r.show.scoreLabel, 'Ribbon', "By the chair's decision"], rows);
  }

  /** Every ballot, anonymous, for a recount by hand: one row per ballot and category, in no particular order. */
  async ballotsCsv(me: Membership, showId: number): Promise<string> {
    const show = await this.shows.findShow(me, showId);
    const state = votingState(show);
    if (state !== 'closed') throw new ConflictException(notCountedYet(state, 'the ballots stay sealed'));
    const def = await this.definition(show);
    const number = (id: number) => def.entries.get(id)?.entryNumber ?? `id ${id}`;
    const ballotRows: { choices: BallotChoices | string }[] = await this.em.execute('SELECT choices FROM show_ballots WHERE show_id = ? ORDER BY id', [show.id]);
    const rows: (string | number)[][] = [];
    ballotRows.forEach((r, i) => {
      const b = typeof r.choices === 'string' ? (JSON.parse(r.choices) as BallotChoices) : r.choices;
      if (b.ranked) rows.push([i + 1, 'Overall', b.ranked.map(number).join(' > ')]);
      for (const c of def.categories) {
        const marks = b.categories?.[String(c.id)];
        if (marks?.length) rows.push([i + 1, c.name, marks.map(number).join(' ')]);
      }
    });
    return toCsv(['Ballot', 'Category', 'Entry numbers marked'], rows);
  }

  closedOnText(show: Show): string | null {
    const at = show.votingClosedAt ?? show.votingClosesAt;
    return at ? formatDate(todayIn(show.guild.timeZone, at)) : null;
  }
}

function isDuplicateKey(e: unknown): boolean {
  if (e instanceof UniqueConstraintViolationException) return true;
  const err = e as { code?: string; errno?: number; cause?: { code?: string; errno?: number } };
  return err?.code === 'ER_DUP_ENTRY' || err?.errno === 1062 || err?.cause?.code === 'ER_DUP_ENTRY';
}
