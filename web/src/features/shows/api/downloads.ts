import { showHref } from './show-path';

/** Hang tags for every accepted entry; `hideMakers` leaves the makers' names off until judging is done. */
export const hangTagsHref = (guildId: string, showId: string, hideMakers: boolean) =>
  showHref(guildId, showId, `/hang-tags.pdf${hideMakers ? '?hideMakers=1' : ''}`);

export const entriesPdfHref = (guildId: string, showId: string) => showHref(guildId, showId, '/entries.pdf');
export const entriesCsvHref = (guildId: string, showId: string) => showHref(guildId, showId, '/entries.csv');

/** Sheets of visitor ballot cards for one batch of codes. */
export const codesPdfHref = (guildId: string, showId: string, batch: number) =>
  showHref(guildId, showId, `/voting/codes.pdf?batch=${encodeURIComponent(String(batch))}`);

export const resultsCsvHref = (guildId: string, showId: string) => showHref(guildId, showId, '/results.csv');
export const resultsPdfHref = (guildId: string, showId: string) => showHref(guildId, showId, '/results.pdf');
export const ballotsCsvHref = (guildId: string, showId: string) => showHref(guildId, showId, '/ballots.csv');
