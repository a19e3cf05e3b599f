/** Pure counting for the show's viewer's-choice ballots. See README.md in this folder. */
export type { BallotAccount, EntryId, SpoiledTally, SpoilReason, Standing } from './types';
export { rankWithTies } from './rank';
export { plurality, type PluralityBallot, type ScoreResult } from './plurality';
export { approval, type ApprovalBallot } from './approval';
export type { RankedBallot } from './ranked';
export { bordaPoints, DEFAULT_RANK_POINTS, rankedPoints } from './ranked-points';
export { instantRunoff, type EliminationRule, type RunoffResult, type RunoffRound } from './instant-runoff';
export { defaultPlaces, type Place, type Ribbon, type RibbonResult, type RibbonRules, ribbons, type TieDecision } from './ribbons';
