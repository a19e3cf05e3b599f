import { showHref } from './show-path';

/** Hang tags for every accepted entry; `hideMakers` leaves the makers' names off until judging is done. */
export const hangTagsHref = (guildId: string, showId: string, hideMakers: boolean) =>
  showHref(guildId, showId, `/hang-tags.pdf${hideMakers ? '?hideMakers=1' : ''}`);

export const entriesPdfHref = (guildId: string, showId: string) => showHref(guildId, showId, '/entries.pdf');
export const entriesCsvHref = (guildId: string, showId: string) => showHref(guildId, showId, '/entries.csv');

/** One batch of codes as cards to scan, or as half-page paper ballots to write on. */
export const codesPdfHref = (guildId: string, showId: string, batch: number, layout: 'cards' | 'paper' = 'cards') =>
  showHref(guildId, showId, `/voting/codes.pdf?batch=${encodeURIComponent(String(batch))}${layout === 'paper' ? '&layout=paper' : ''}`);

export const resultsCsvHref = (guildId: string, showId: string) => showHref(guildId, showId, '/results.csv');
export const resultsPdfHref = (guildId: string, showId: string) => showHref(guildId, showId, '/results.pdf');
export const ballotsCsvHref = (guildId: string, showId: string) => showHref(guildId, showId, '/ballots.csv');
