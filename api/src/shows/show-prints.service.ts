import { EntityManager } from '@mikro-orm/mariadb';
import { Inject, Injectable, NotFoundException } from '@nestjs/common';
import { formatInches, mmToInches } from '../common/units/inches';
import { appConfig, type AppConfig } from '../config/app.config';
import { toCsv } from '../dues/csv';
import { centsToDecimalString, minorUnitDigits } from '../dues/money';
import { formatDate, todayIn } from '../dues/dues-rules';
import { Membership } from '../guilds/membership.entity';
import { formatBallotCode } from './ballot-code';
import { renderBallotCards, renderEntryList, renderHangTags, renderPaperBallots, renderResults, statusLabel } from './pdf';
import { sortEntries } from './show-entries.service';
import type { ShowCategory } from './show-category.entity';
import { ShowEntry } from './show-entry.entity';
import { sizeText } from './show-presenter';
import { ShowsService } from './shows.service';
import { VotingService } from './voting.service';

export interface PrintedFile {
  filename: string;
  bytes: Buffer;
}

const slug = (s: string) => s.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '').slice(0, 40) || 'show';

/** The category as printed on tags and lists: an exhibit-only one says so, for the judges and the hangers. */
export function printedCategory(c: Pick<ShowCategory, 'name' | 'judged'>): string {
  return c.judged ? c.name : `${c.name} (exhibit only)`;
}

/** The show's printed sheets: hang tags, the entry list (PDF and CSV), visitor ballot cards and results. */
@Injectable()
export class ShowPrintsService {
  constructor(
    private readonly em: EntityManager,
    private readonly shows: ShowsService,
    private readonly voting: VotingService,
    @Inject(appConfig.KEY) private readonly app: AppConfig,
  ) {}

  /** Hang tags for the accepted entries; `hideMakers` null follows the show's "hidden until judging is done". */
  async hangTags(me: Membership, showId: number, hideMakers: boolean | null): Promise<PrintedFile> {
    const show = await this.shows.findShow(me, showId);
    const entries = sortEntries(await this.em.find(ShowEntry, { show: show.id, status: 'accepted' }, { populate: ['category'] }));
    const bytes = await renderHangTags({
      guildName: show.guild.name,
      showName: show.name,
      hideMakers: hideMakers ?? show.makersHidden,
      currency: show.guild.currency,
      entries: entries.map((e) => ({
        entryNumber: e.entryNumber ?? null,
        title: e.title,
        categoryName: printedCategory(e.category),
        sizeText: sizeText(e.widthMm, e.heightMm),
        makers: e.makers,
        quilter: e.quilter,
        forSale: e.forSale,
        priceCents: e.priceCents ?? null,
      })),
    });
    return { filename: `hang-tags-${slug(show.name)}.pdf`, bytes };
  }

  private async allEntries(me: Membership, showId: number) {
    const show = await this.shows.findShow(me, showId);
    const categories = await this.shows.categories(show);
    const entries = sortEntries(await this.em.find(ShowEntry, { show: show.id }, { populate: ['category', 'membership.user'] }));
    return { show, categories, entries };
  }

  async entryListPdf(me: Membership, showId: number): Promise<PrintedFile> {
    const { show, categories, entries } = await this.allEntries(me, showId);
    const bytes = await renderEntryList({
      guildName: show.guild.name,
      showName: show.name,
      venue: show.venue,
      datesText: show.startsOn === show.endsOn ? formatDate(show.startsOn) : `${formatDate(show.startsOn)} to ${formatDate(show.endsOn)}`,
      printedOn: formatDate(todayIn(show.guild.timeZone)),
      categories: categories.map((c) => ({
        name: printedCategory(c),
        entries: entries
          .filter((e) => e.category.id === c.id)
          .map((e) => ({
            entryNumber: e.entryNumber ?? null,
            title: e.title,
            makers: e.makers,
            quilter: e.quilter,
            sizeText: sizeText(e.widthMm, e.heightMm),
            status: statusLabel(e.status),
            forSale: e.forSale,
          })),
      })),
    });
    return { filename: `entries-${slug(show.name)}.pdf`, bytes };
  }

  async entryListCsv(me: Membership, showId: number): Promise<PrintedFile> {
    const { show, entries } = await this.allEntries(me, showId);
    const csv = toCsv(
      ['Entry number', 'Category', 'Title', 'Makers', 'Quilted by', 'Width (in)', 'Height (in)', 'Status', 'Entered for', 'For sale', 'Price', 'Techniques', 'Story'],
      entries.map((e) => {
        return [
          e.entryNumber ?? null,
          e.category.name,
          e.title,
          e.makers.join('; '),
          e.quilter,
          formatInches(mmToInches(e.widthMm)),
          formatInches(mmToInches(e.heightMm)),
          statusLabel(e.status),
          e.membership.user.name,
          e.forSale ? 'yes' : 'no',
          e.priceCents != null ? centsToDecimalString(e.priceCents, minorUnitDigits(show.guild.currency)) : null,
          e.techniques,
          e.story,
        ];
      }),
    );
    return { filename: `entries-${slug(show.name)}.csv`, bytes: Buffer.from(csv, 'utf8') };
  }

  async ballotCards(me: Membership, showId: number, batch: number): Promise<PrintedFile> {
    const { show, codes } = await this.voting.batchCodes(me, showId, batch);
    const voteUrlBase = `${this.app.origin.replace(/\/+$/, '')}/vote`;
    const bytes = await renderBallotCards({
      guildName: show.guild.name,
      showName: show.name,
      voteUrlBase,
      cards: codes.map((code) => ({ code: formatBallotCode(code), url: `${voteUrlBase}/${code}` })),
    });
    return { filename: `ballot-cards-${slug(show.name)}-batch-${batch}.pdf`, bytes };
  }

  /** The same batch's codes as half-page paper ballots, for visitors without a phone or a signal. */
  async paperBallots(me: Membership, showId: number, batch: number): Promise<PrintedFile> {
    const { show, codes } = await this.voting.batchCodes(me, showId, batch);
    const categories = await this.shows.categories(show);
    const bytes = await renderPaperBallots({
      guildName: show.guild.name,
      showName: show.name,
      kind: show.votingKind,
      rankDepth: show.rankDepth,
      categories: categories.map((c) => c.name),
      codes: codes.map((code) => formatBallotCode(code)),
    });
    return { filename: `paper-ballots-${slug(show.name)}-batch-${batch}.pdf`, bytes };
  }

  async resultsPdf(me: Membership, showId: number): Promise<PrintedFile> {
    const r = await this.voting.results(me, showId);
    const show = await this.shows.findShow(me, showId);
    const bytes = await renderResults({
      guildName: show.guild.name,
      showName: show.name,
      closedOn: this.voting.closedOnText(show),
      published: r.show.published,
      scoreLabel: r.show.scoreLabel,
      auditText: r.audit.text,
      categories: r.categories.map((c) => {
        const numberOf = new Map(c.standings.map((s) => [String(s.entryId), s.entryNumber != null ? String(s.entryNumber) : s.title]));
        return {
          name: c.name,
          ballots: c.ballots,
          blank: c.blank,
          spoiled: c.spoiled,
          standings: c.standings.map((s) => ({ rank: s.rank, entryNumber: s.entryNumber, title: s.title, makers: s.makers, score: s.score, ribbon: s.ribbon, byDecision: s.byDecision && s.ribbon !== null })),
          rounds: c.rounds?.map((round) => ({
            counts: Object.fromEntries(Object.entries(round.counts).map(([id, n]) => [numberOf.get(id) ?? id, n])),
            eliminated: round.eliminated.map((id) => numberOf.get(String(id)) ?? String(id)),
            exhausted: round.exhausted,
          })),
        };
      }),
    });
    if (!bytes.length) throw new NotFoundException('Nothing to print.');
    return { filename: `results-${slug(show.name)}.pdf`, bytes };
  }
}
