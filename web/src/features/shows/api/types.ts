/** The quilt show api's shapes (api/src/shows). Lengths come back in mm with inch text beside them. */

export type SizeRule =
  | { kind: 'none' }
  | { kind: 'dimensions'; maxWidthMm: number | null; maxHeightMm: number | null; minWidthMm: number | null; minHeightMm: number | null }
  | { kind: 'perimeter'; minMm: number | null; minInclusive: boolean; maxMm: number | null; maxInclusive: boolean };

export type Category = {
  id: number;
  name: string;
  description: string;
  judged: boolean;
  sortOrder: number;
  sizeRule: SizeRule;
  /** e.g. "Perimeter more than 240 in and at most 320 in". */
  sizeRuleText: string;
  /** Group quilts: at least this many makers. */
  minMakers: number | null;
  maxEntriesPerMember: number | null;
  acceptedCount: number;
  /** Entries of any status; a category with any cannot be deleted. */
  entryCount: number;
};

export type VotingKind = 'per_category' | 'approval' | 'ranked';
export type RankedMethod = 'points' | 'instant_runoff';
export type VotingState = 'not_open' | 'scheduled' | 'open' | 'closed';
export type EntryWindow = 'not_yet' | 'open' | 'closed';

export type ShowSummary = {
  id: number;
  name: string;
  venue: string;
  startsOn: string;
  endsOn: string;
  entriesOpenOn: string | null;
  entriesCloseOn: string | null;
  entryWindow: EntryWindow;
  votingState: VotingState;
  resultsPublished: boolean;
};

export type ShowSleeve = {
  depthIn: number;
  narrowUnderIn: number | null;
  narrowDepthIn: number | null;
  splitOverIn: number | null;
  text: string;
};

export type Show = ShowSummary & {
  description: string;
  maxEntriesPerMember: number | null;
  entryFeeCents: number;
  entryFeeCapCents: number | null;
  currency: string;
  sleeve: ShowSleeve;
  votingKind: VotingKind;
  rankedMethod: RankedMethod;
  /** How many places a ranked ballot lists. */
  rankDepth: number;
  votingOpensAt: string | null;
  votingClosesAt: string | null;
  votingOpenedAt: string | null;
  votingClosedAt: string | null;
  /** Hang tags and public pages leave makers out until the chair says judging is done. */
  makersHidden: boolean;
  categories: Category[];
  /** The caller is a show chair or an admin. */
  canManage: boolean;
  myEntryCount: number;
};

export type EntryStatus = 'submitted' | 'accepted' | 'declined' | 'withdrawn';

export type Entry = {
  id: number;
  showId: number;
  entryNumber: number | null;
  categoryId: number;
  categoryName: string;
  title: string;
  widthMm: number;
  heightMm: number;
  widthText: string;
  heightText: string;
  perimeterText: string;
  makers: string[];
  quilter: string;
  techniques: string;
  story: string;
  forSale: boolean;
  priceCents: number | null;
  hasPhoto: boolean;
  photoUrl: string | null;
  status: EntryStatus;
  declineReason: string | null;
  entrant: { membershipId: number; name: string };
  enteredOnBehalf: boolean;
  enteredBy: string | null;
  sleeve: { stripWidthText: string; stripLengthText: string; text: string };
  /** Set when the entry no longer fits its category's rule (e.g. after a move). */
  sizeProblem: string | null;
  createdAt: string;
};

/** per_category and approval: entry ids by category id; ranked: entry ids, best first. */
export type BallotChoicesPayload = { categories: Record<string, number[]> } | { ranked: number[] };

export type BallotEntry = {
  id: number;
  entryNumber: number | null;
  title: string;
  /** Null while the show hides makers. */
  makers: string[] | null;
  photoUrl: string | null;
  widthText: string;
  heightText: string;
};

export type BallotCategory = { id: number; name: string; description: string; entries: BallotEntry[] };

export type Ballot = {
  show: {
    id: number;
    name: string;
    venue: string;
    guildName: string;
    votingKind: VotingKind;
    rankDepth: number;
    votingState: VotingState;
    votingClosesAt: string | null;
  };
  categories: BallotCategory[];
  /** Visitor ballots only, formatted "K7QM-3XHD-9PRW". */
  code?: string;
};

export type MemberBallot = Ballot & { hasVoted: boolean };

export type Turnout = {
  state: VotingState;
  codesIssued: number;
  codesUsed: number;
  memberBallots: number;
  codeBallots: number;
  paperBallots: number;
  ballotsCast: number;
  eligibleMembers: number;
};

export type CodeBatch = { batch: number; count: number; used: number; createdAt: string };

export type Standing = {
  entryId: number;
  entryNumber: number | null;
  title: string;
  makers: string[];
  score: number;
  rank: number;
  ribbon: 1 | 2 | 3 | null;
  byDecision: boolean;
};

export type Decision = { id: number; order: number[]; note: string; decidedBy: string; decidedAt: string };

export type ResultCategory = {
  /** Null for the one overall award of a ranked show. */
  categoryId: number | null;
  name: string;
  entryCount: number;
  ballots: number;
  blank: number;
  spoiled: number;
  standings: Standing[];
  ties: { rank: number; entryIds: number[] }[];
  decisions: Decision[];
  rounds?: { counts: Record<string, number>; eliminated: number[]; exhausted: number }[];
};

export type Results = {
  show: { id: number; name: string; votingKind: VotingKind; rankedMethod: RankedMethod; published: boolean; closedAt: string | null };
  audit: {
    codesIssued: number;
    codesUsed: number;
    memberBallots: number;
    codeBallots: number;
    paperBallots: number;
    ballotsCast: number;
    votesPerCategory: { categoryId: number | null; name: string; votes: number }[];
    text: string;
  };
  categories: ResultCategory[];
};
