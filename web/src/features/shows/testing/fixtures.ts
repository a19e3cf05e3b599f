/** Invented data for the show tests: the demo guild of Wrenfield and its autumn show. */
import type { Ballot, Category, Entry, Show, Turnout } from '../api/types';

const mm = (inches: number) => Math.round(inches * 25.4 * 10) / 10;

export const guild = { id: 1, name: 'Wrenfield Quilt Guild', town: 'Wrenfield', timeZone: 'America/Chicago', currency: 'USD', myRoles: [] as string[] };

export const categories: Category[] = [
  {
    id: 11,
    name: 'Small',
    description: '',
    judged: true,
    sortOrder: 1,
    sizeRule: { kind: 'perimeter', minMm: null, minInclusive: true, maxMm: mm(160), maxInclusive: false },
    sizeRuleText: 'Perimeter less than 160 in',
    minMakers: null,
    maxEntriesPerMember: null,
    acceptedCount: 0,
    entryCount: 0,
  },
  {
    id: 12,
    name: 'Medium',
    description: '',
    judged: true,
    sortOrder: 2,
    sizeRule: { kind: 'perimeter', minMm: mm(160), minInclusive: true, maxMm: mm(240), maxInclusive: true },
    sizeRuleText: 'Perimeter at least 160 in and at most 240 in',
    minMakers: null,
    maxEntriesPerMember: null,
    acceptedCount: 0,
    entryCount: 0,
  },
  {
    id: 13,
    name: 'Group quilts',
    description: 'Made by three or more members together.',
    judged: false,
    sortOrder: 3,
    sizeRule: { kind: 'none' },
    sizeRuleText: 'Any size',
    minMakers: 3,
    maxEntriesPerMember: 1,
    acceptedCount: 0,
    entryCount: 0,
  },
];

export const show: Show = {
  id: 2,
  name: 'Harvest Quilt Show',
  venue: 'Wrenfield Grange Hall',
  startsOn: '2026-10-02',
  endsOn: '2026-10-04',
  entriesOpenOn: '2026-09-01',
  entriesCloseOn: '2026-09-20',
  entryWindow: 'open',
  votingState: 'not_open',
  resultsPublished: false,
  description: 'Open 10 till 4 each day.',
  maxEntriesPerMember: 3,
  entryFeeCents: 1000,
  entryFeeCapCents: 2500,
  currency: 'USD',
  sleeve: {
    depthIn: 4,
    narrowUnderIn: 30,
    narrowDepthIn: 3,
    splitOverIn: 90,
    text: 'Every quilt needs a 4 in hanging sleeve sewn to the top of the back.',
  },
  votingKind: 'per_category',
  rankedMethod: 'points',
  rankDepth: 3,
  votingOpensAt: null,
  votingClosesAt: null,
  votingOpenedAt: null,
  votingClosedAt: null,
  makersHidden: false,
  categories,
  canManage: false,
  myEntryCount: 0,
};

export const entry: Entry = {
  id: 501,
  showId: 2,
  entryNumber: null,
  categoryId: 12,
  categoryName: 'Medium',
  title: 'Mill Pond at Dusk',
  widthMm: mm(60),
  heightMm: mm(60),
  widthText: '60',
  heightText: '60',
  perimeterText: '240 in',
  makers: ['Marigold Fenwick'],
  quilter: 'Tamsin Oakes',
  techniques: '',
  story: '',
  forSale: false,
  priceCents: null,
  hasPhoto: false,
  photoUrl: null,
  status: 'submitted',
  declineReason: null,
  entrant: { membershipId: 7, name: 'Marigold Fenwick' },
  enteredOnBehalf: false,
  enteredBy: null,
  sleeve: { stripWidthText: '8 1/2', stripLengthText: '59', text: 'A 4 in sleeve: cut a strip 8 1/2 in x 59 in.' },
  sizeProblem: null,
  createdAt: '2026-09-03T15:00:00.000Z',
};

const ballotEntry = (id: number, entryNumber: number | null, title: string, makers: string[] | null = null) => ({
  id,
  entryNumber,
  title,
  makers,
  photoUrl: null,
  widthText: '40',
  heightText: '50',
});

export const ballot = (votingKind: Ballot['show']['votingKind'], extra: Partial<Ballot> = {}): Ballot => ({
  show: {
    id: 2,
    name: 'Harvest Quilt Show',
    venue: 'Wrenfield Grange Hall',
    guildName: 'Wrenfield Quilt Guild',
    votingKind,
    rankDepth: 3,
    votingState: 'open',
    votingClosesAt: null,
  },
  categories: [
    { id: 11, name: 'Small', description: '', entries: [ballotEntry(601, 1, 'Hedgerow Stars', ['Ottilie Brannock']), ballotEntry(602, 2, 'Kitchen Garden')] },
    { id: 12, name: 'Medium', description: '', entries: [ballotEntry(603, 3, 'Orchard Rows'), ballotEntry(604, 4, 'Winter Barn')] },
  ],
  ...extra,
});

export const turnout: Turnout = {
  state: 'open',
  codesIssued: 300,
  codesUsed: 57,
  memberBallots: 41,
  codeBallots: 38,
  paperBallots: 19,
  ballotsCast: 98,
  eligibleMembers: 112,
};
