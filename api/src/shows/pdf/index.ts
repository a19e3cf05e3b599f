/** Printed sheets for the quilt show: pure renderers from plain data to PDF bytes (no Nest, no database). */
export { renderHangTags, MAKERS_HIDDEN, NO_ENTRIES } from './hang-tags';
export type { HangTagEntry, HangTagsInput } from './hang-tags';
export { renderEntryList, statusLabel } from './entry-list';
export type { EntryListCategory, EntryListEntry, EntryListInput } from './entry-list';
export { renderBallotCards, shortUrl } from './ballot-cards';
export type { BallotCard, BallotCardsInput } from './ballot-cards';
export { renderPaperBallots } from './paper-ballots';
export type { PaperBallotsInput } from './paper-ballots';
export { renderResults, CONFIDENTIAL } from './results-pdf';
export type { ResultCategory, ResultRound, ResultStanding, ResultsInput } from './results-pdf';
export { CUT_CAUTION } from './pdf-tools';
export type { RenderOptions } from './pdf-tools';
