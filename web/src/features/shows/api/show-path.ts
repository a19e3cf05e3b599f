import { env } from '@/config/env';

const part = (value: string | number) => encodeURIComponent(String(value));

/** The api path of a guild's shows, e.g. /guilds/4/shows. */
export const showsPath = (guildId: string) => `/guilds/${part(guildId)}/shows`;

/** The api path of one show, e.g. /guilds/4/shows/2. */
export const showPath = (guildId: string, showId: string | number) => `${showsPath(guildId)}/${part(showId)}`;

/** The prefix of every show query's key; invalidating it refreshes the list and every show. */
export const showsQueryKey = (guildId: string) => ['guilds', guildId, 'shows'] as const;

/** The prefix of one show's queries (the show, entries, ballot, turnout, results). */
export const showQueryKey = (guildId: string, showId: string | number) => [...showsQueryKey(guildId), String(showId)] as const;

/** A link the browser follows itself (PDF and CSV downloads). */
export const showHref = (guildId: string, showId: string | number, rest: string) => `${env.apiBaseUrl}${showPath(guildId, showId)}${rest}`;

/** The public (signed-out) ballot of a visitor's code. */
export const publicBallotPath = (code: string) => `/public/ballots/${part(code)}`;
