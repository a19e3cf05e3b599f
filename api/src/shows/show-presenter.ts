import { formatInches, mmToInches } from '../common/units/inches';
import { formatMoney } from '../dues/money';
import { todayIn } from '../dues/dues-rules';
import type { ShowCategory } from './show-category.entity';
import type { ShowEntry } from './show-entry.entity';
import type { Show } from './show.entity';
import { checkSize, perimeterMm, type SizeRule, sizeRuleText } from './size-rules';
import { type SleeveRule, sleeveFor, sleeveRuleText } from './sleeve';
import { votingState } from './voting';

const inches = (mm: number | null | undefined) => (mm == null ? null : mmToInches(mm));

export function sleeveRuleOf(show: Show): SleeveRule {
  return {
    depthIn: mmToInches(show.sleeveDepthMm),
    narrowUnderIn: inches(show.narrowUnderMm),
    narrowDepthIn: inches(show.narrowDepthMm),
    splitOverIn: inches(show.splitOverMm),
  };
}

export function sizeRuleOf(c: ShowCategory): SizeRule {
  if (c.sizeKind === 'dimensions')
    return { kind: 'dimensions', minWidthMm: c.minWidthMm ?? null, maxWidthMm: c.maxWidthMm ?? null, minHeightMm: c.minHeightMm ?? null, maxHeightMm: c.maxHeightMm ?? null };
  if (c.sizeKind === 'perimeter')
    return { kind: 'perimeter', minMm: c.minPerimeterMm ?? null, minInclusive: c.minInclusive, maxMm: c.maxPerimeterMm ?? null, maxInclusive: c.maxInclusive };
  return { kind: 'none' };
}

/** Whether the show takes entries today; once voting has opened the ballot is fixed, so entries are closed whatever the dates say. */
export function entryWindow(show: Show, today: string): 'not_yet' | 'open' | 'closed' {
  const voting = votingState(show);
  if (voting === 'open' || voting === 'closed') return 'closed';
  if (show.entriesOpenOn && today < show.entriesOpenOn) return 'not_yet';
  if (show.entriesCloseOn && today > show.entriesCloseOn) return 'closed';
  if (!show.entriesOpenOn && !show.entriesCloseOn && today > show.endsOn) return 'closed';
  return 'open';
}

export function feeText(show: Show): string | null {
  if (!show.entryFeeCents) return null;
  const each = formatMoney(show.entryFeeCents, show.guild.currency);
  return show.entryFeeCapCents
    ? `${each} per quilt, at most ${formatMoney(show.entryFeeCapCents, show.guild.currency)} per member`
    : `${each} per quilt`;
}

/** What a member owes in entry fees for her entries still in the show (submitted or accepted). */
export function entryFeeCents(show: Show, entries: number): number {
  const total = show.entryFeeCents * entries;
  return show.entryFeeCapCents != null ? Math.min(total, show.entryFeeCapCents) : total;
}

export function presentSummary(show: Show, now = new Date()) {
  const today = todayIn(show.guild.timeZone, now);
  return {
    id: show.id,
    name: show.name,
    venue: show.venue,
    startsOn: show.startsOn,
    endsOn: show.endsOn,
    entriesOpenOn: show.entriesOpenOn ?? null,
    entriesCloseOn: show.entriesCloseOn ?? null,
    entryWindow: entryWindow(show, today),
    votingState: votingState(show, now),
    resultsPublished: !!show.resultsPublishedAt,
  };
}

/** How many quilts a category holds: accepted ones, and entries of any status (a category with any cannot be deleted). */
export interface CategoryCounts {
  accepted: number;
  entries: number;
}

export function presentCategory(c: ShowCategory, counts: CategoryCounts = { accepted: 0, entries: 0 }) {
  const rule = sizeRuleOf(c);
  return {
    id: c.id,
    name: c.name,
    description: c.description,
    judged: c.judged,
    sortOrder: c.sortOrder,
    sizeRule: rule,
    sizeRuleText: sizeRuleText(rule),
    minMakers: c.minMakers ?? null,
    maxEntriesPerMember: c.maxEntriesPerMember ?? null,
    acceptedCount: counts.accepted,
    entryCount: counts.entries,
  };
}

export function presentShow(show: Show, categories: ShowCategory[], extra: { canManage: boolean; myEntryCount: number; countsByCategory: Map<number, CategoryCounts> }) {
  const sleeve = sleeveRuleOf(show);
  return {
    ...presentSummary(show),
    description: show.description,
    maxEntriesPerMember: show.maxEntriesPerMember ?? null,
    entryFeeCents: show.entryFeeCents,
    entryFeeCapCents: show.entryFeeCapCents ?? null,
    entryFeeText: feeText(show),
    currency: show.guild.currency,
    sleeve: { ...sleeve, text: sleeveRuleText(sleeve) },
    votingKind: show.votingKind,
    rankedMethod: show.rankedMethod,
    rankDepth: show.rankDepth,
    votingOpensAt: show.votingOpensAt?.toISOString() ?? null,
    votingClosesAt: show.votingClosesAt?.toISOString() ?? null,
    votingOpenedAt: show.votingOpenedAt?.toISOString() ?? null,
    votingClosedAt: show.votingClosedAt?.toISOString() ?? null,
    resultsPublishedAt: show.resultsPublishedAt?.toISOString() ?? null,
    makersHidden: show.makersHidden,
    categories: categories.map((c) => presentCategory(c, extra.countsByCategory.get(c.id))),
    canManage: extra.canManage,
    myEntryCount: extra.myEntryCount,
  };
}

export const sizeText = (widthMm: number, heightMm: number) => `${formatInches(mmToInches(widthMm))} x ${formatInches(mmToInches(heightMm))} in`;

export function presentEntry(entry: ShowEntry, show: Show, guildId: number) {
  const widthIn = mmToInches(entry.widthMm);
  const problem = checkSize(sizeRuleOf(entry.category), entry.widthMm, entry.heightMm);
  const sleeve = sleeveFor(roundEighth(widthIn), sleeveRuleOf(show));
  return {
    id: entry.id,
    showId: show.id,
    entryNumber: entry.entryNumber ?? null,
    categoryId: entry.category.id,
    categoryName: entry.category.name,
    title: entry.title,
    widthMm: entry.widthMm,
    heightMm: entry.heightMm,
    widthText: formatInches(widthIn),
    heightText: formatInches(mmToInches(entry.heightMm)),
    sizeText: sizeText(entry.widthMm, entry.heightMm),
    perimeterText: `${formatInches(mmToInches(perimeterMm(entry.widthMm, entry.heightMm)))} in`,
    makers: entry.makers,
    quilter: entry.quilter,
    techniques: entry.techniques,
    story: entry.story,
    forSale: entry.forSale,
    priceCents: entry.priceCents ?? null,
    hasPhoto: !!entry.photoKey,
    photoUrl: entry.photoKey ? `/api/guilds/${guildId}/shows/${show.id}/entries/${entry.id}/photo?v=${entry.photoKey.slice(0, 8)}` : null,
    status: entry.status,
    declineReason: entry.declineReason ?? null,
    entrant: { membershipId: entry.membership.id, name: entry.membership.user.name },
    enteredOnBehalf: !!entry.enteredBy && entry.enteredBy.id !== entry.membership.id,
    enteredBy: entry.enteredBy && entry.enteredBy.id !== entry.membership.id ? entry.enteredBy.user.name : null,
    sleeve: { stripWidthText: formatInches(sleeve.stripWidthIn), stripLengthText: formatInches(sleeve.stripLengthIn), pieces: sleeve.pieces, text: sleeve.text },
    sizeProblem: problem?.message ?? null,
    createdAt: entry.createdAt.toISOString(),
  };
}

const roundEighth = (inches: number) => Math.round(inches * 8) / 8;
