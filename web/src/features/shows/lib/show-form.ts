import * as yup from 'yup';
import { checkInches, formatInches, inchesOrNull, inchesToStoredMm } from '@/lib/inches';
import { centsToInput, parseMoney } from '@/features/dues/lib/money';
import type { RankedMethod, Show, VotingKind } from '../api/types';
import { isoToLocalInput, localInputToIso } from './zoned-time';

export type ShowValues = {
  name: string;
  venue: string;
  description: string;
  startsOn: string;
  endsOn: string;
  entriesOpenOn: string;
  entriesCloseOn: string;
  /** Formik turns what is typed in a number box into a number. */
  maxEntriesPerMember: string | number;
  entryFee: string;
  entryFeeCap: string;
  sleeveDepthIn: string;
  narrowUnderIn: string;
  narrowDepthIn: string;
  splitOverIn: string;
  votingKind: VotingKind;
  rankedMethod: RankedMethod;
  /** How many places a ranked ballot lists. */
  rankDepth: string | number;
  /** datetime-local values on the guild's clocks. */
  votingOpensAt: string;
  votingClosesAt: string;
  makersHidden: boolean;
};

export type ShowInput = {
  name: string;
  venue: string;
  description?: string;
  startsOn: string;
  endsOn: string;
  entriesOpenOn?: string | null;
  entriesCloseOn?: string | null;
  maxEntriesPerMember?: number | null;
  entryFeeCents?: number;
  entryFeeCapCents?: number | null;
  sleeveDepthIn?: string;
  narrowUnderIn?: string | null;
  narrowDepthIn?: string | null;
  splitOverIn?: string | null;
  votingKind?: VotingKind;
  rankedMethod?: RankedMethod;
  rankDepth?: number;
  votingOpensAt?: string | null;
  votingClosesAt?: string | null;
  makersHidden?: boolean;
};

export const SHOW_FIELD_MAP = { entryFeeCents: 'entryFee', entryFeeCapCents: 'entryFeeCap' } as const;

/** A new show: a 4 in sleeve, 3 in under 30 in wide, split over 90 in; one vote per category. */
export const NEW_SHOW_VALUES: ShowValues = {
  name: '',
  venue: '',
  description: '',
  startsOn: '',
  endsOn: '',
  entriesOpenOn: '',
  entriesCloseOn: '',
  maxEntriesPerMember: '',
  entryFee: '',
  entryFeeCap: '',
  sleeveDepthIn: '4',
  narrowUnderIn: '30',
  narrowDepthIn: '3',
  splitOverIn: '90',
  votingKind: 'per_category',
  rankedMethod: 'points',
  rankDepth: 3,
  votingOpensAt: '',
  votingClosesAt: '',
  makersHidden: false,
};

const inchText = (value: number | null) => (value == null ? '' : formatInches(value));

export function toShowValues(show: Show, timeZone?: string): ShowValues {
  return {
    name: show.name,
    venue: show.venue,
    description: show.description,
    startsOn: show.startsOn,
    endsOn: show.endsOn,
    entriesOpenOn: show.entriesOpenOn ?? '',
    entriesCloseOn: show.entriesCloseOn ?? '',
    maxEntriesPerMember: show.maxEntriesPerMember == null ? '' : String(show.maxEntriesPerMember),
    entryFee: show.entryFeeCents ? centsToInput(show.entryFeeCents, show.currency) : '',
    entryFeeCap: centsToInput(show.entryFeeCapCents, show.currency),
    sleeveDepthIn: inchText(show.sleeve.depthIn),
    narrowUnderIn: inchText(show.sleeve.narrowUnderIn),
    narrowDepthIn: inchText(show.sleeve.narrowDepthIn),
    splitOverIn: inchText(show.sleeve.splitOverIn),
    votingKind: show.votingKind,
    rankedMethod: show.rankedMethod,
    rankDepth: show.rankDepth ?? 3,
    votingOpensAt: isoToLocalInput(show.votingOpensAt, timeZone),
    votingClosesAt: isoToLocalInput(show.votingClosesAt, timeZone),
    makersHidden: show.makersHidden,
  };
}

const blank = (value: string | number | null | undefined) => value == null || String(value).trim() === '';

/** Empty money is 0 (or no cap); anything typed is read the same way dues are. */
const optionalMoney = (currency: string, message: string) =>
  yup.string().test('money', (value, context) => {
    if (blank(value)) return true;
    const parsed = parseMoney(String(value), currency);
    return parsed.ok ? true : context.createError({ message: parsed.message || message });
  });

const cents = (value: string, currency: string) => {
  const parsed = parseMoney(value, currency);
  return parsed.ok ? parsed.cents : 0;
};

/** The api's limits on a show (CreateShowDto). */
export const SHOW_NAME_MAX = 120;
export const VENUE_MAX = 200;
export const SHOW_DESCRIPTION_MAX = 4000;
const MAX_FEE_CENTS = 100_000;
const RANK_DEPTH_MESSAGE = 'A ranked ballot lists 2 to 5 places.';
const MAX_ENTRIES_MESSAGE = 'Enter a whole number of quilts from 1 to 50, or leave it empty for no limit.';

/** Inch text read and limited as the api does. */
const inches = (range: { min?: number; max: number }, required: boolean) =>
  yup
    .string()
    .trim()
    .test('inches', (value, context) => {
      if (blank(value)) return !required;
      const message = checkInches(value, range);
      return message ? context.createError({ message }) : true;
    });

const mmOf = (value: string | undefined) => {
  const n = blank(value) ? null : inchesOrNull(value);
  return n === null ? null : inchesToStoredMm(n);
};

const DATE = /^\d{4}-(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/;
/** 2027-02-30 matches the pattern but is no day; the api refuses it. */
const realDate = (s: string) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s);
const dateField = (required?: string) => {
  const base = yup
    .string()
    .trim()
    .matches(DATE, { message: 'Write the date as yyyy-mm-dd, like 2027-05-14.', excludeEmptyString: true })
    .test('real', 'That date does not exist.', (value) => !value || !DATE.test(value) || realDate(value));
  return required ? base.required(required) : base;
};

/** The opening time goes to the api only for a saved show whose voting has not opened: before that it waits, after it is history. */
export const sendsOpeningTime = (create: boolean, votingState: Show['votingState'] | undefined) =>
  !create && votingState !== 'open' && votingState !== 'closed';

type SchemaOptions = {
  /** The opening time will be sent (see sendsOpeningTime), so the api will hold it to the future. */
  checkOpening?: boolean;
  timeZone?: string;
};

export const showSchema = (currency: string, { checkOpening = false, timeZone }: SchemaOptions = {}) =>
  yup.object({
    name: yup.string().trim().required('Give the show a name.').max(SHOW_NAME_MAX, 'Use at most 120 characters.'),
    venue: yup.string().trim().required('Say where the show is.').max(VENUE_MAX, 'Use at most 200 characters.'),
    description: yup.string().trim().max(SHOW_DESCRIPTION_MAX, 'Use at most 4,000 characters.'),
    startsOn: dateField('Enter the first day of the show.'),
    endsOn: dateField('Enter the last day of the show.').test(
      'after-start',
      'The show cannot end before it starts.',
      (value, context) => !value || !context.parent.startsOn || value >= context.parent.startsOn,
    ),
    entriesOpenOn: dateField().test(
      'by-last-day',
      "Entries must open on or before the show's last day.",
      (value, context) => !value || !context.parent.endsOn || value <= context.parent.endsOn,
    ),
    entriesCloseOn: dateField()
      .test('by-last-day', 'Entries must close by the last day of the show.', (value, context) => !value || !context.parent.endsOn || value <= context.parent.endsOn)
      .test('after-open', 'Entries cannot close before they open.', (value, context) => !value || !context.parent.entriesOpenOn || value >= context.parent.entriesOpenOn),
    maxEntriesPerMember: yup
      .number()
      .transform((value, original) => (blank(original) ? undefined : value))
      .typeError(MAX_ENTRIES_MESSAGE)
      .integer(MAX_ENTRIES_MESSAGE)
      .min(1, MAX_ENTRIES_MESSAGE)
      .max(50, MAX_ENTRIES_MESSAGE),
    entryFee: optionalMoney(currency, 'Type the fee like 10 or 10.00.').test(
      'fee-max',
      'The entry fee must be at most 1,000.00.',
      (value) => blank(value) || cents(String(value), currency) <= MAX_FEE_CENTS,
    ),
    entryFeeCap: optionalMoney(currency, 'Type the cap like 30 or 30.00.')
      .test('cap-above-zero', 'The cap must be more than 0, or leave it empty for no cap.', (value) => blank(value) || cents(String(value), currency) > 0)
      .test('cap-max', 'The cap must be at most 1,000.00.', (value) => blank(value) || cents(String(value), currency) <= MAX_FEE_CENTS)
      .test(
        'cap-above-fee',
        'The most a member pays must be at least one entry fee.',
        (value, context) => blank(value) || blank(context.parent.entryFee) || cents(String(value), currency) >= cents(context.parent.entryFee, currency),
      ),
    sleeveDepthIn: inches({ min: 1, max: 12 }, true).required('Enter the sleeve depth in inches.'),
    narrowUnderIn: inches({ max: 200 }, false),
    narrowDepthIn: inches({ max: 12 }, false)
      .test(
        'needs-depth',
        'Enter the sleeve depth for narrow quilts, or empty the width above.',
        (value, context) => blank(context.parent.narrowUnderIn) || !blank(value),
      )
      .test('not-deeper', "The narrow quilts' sleeve should not be deeper than the usual one.", (value, context) => {
        const narrow = mmOf(value);
        const usual = mmOf(context.parent.sleeveDepthIn);
        return blank(context.parent.narrowUnderIn) || narrow === null || usual === null || narrow <= usual;
      }),
    splitOverIn: inches({ max: 400 }, false),
    votingKind: yup.string().oneOf(['per_category', 'approval', 'ranked']).required('Choose how people vote.'),
    rankedMethod: yup.string().oneOf(['points', 'instant_runoff']),
    rankDepth: yup.mixed().test('depth', RANK_DEPTH_MESSAGE, (value, context) => {
      if (context.parent.votingKind !== 'ranked') return true;
      const n = blank(value as string) ? NaN : Number(value);
      return Number.isInteger(n) && n >= 2 && n <= 5;
    }),
    votingOpensAt: yup.string().test('future', 'Choose an opening time in the future, or open voting now from the ballot desk.', (value) => {
      if (!checkOpening || blank(value)) return true;
      const iso = localInputToIso(String(value), timeZone);
      // A time already past would open voting at once, so the api refuses it.
      return !iso || Date.parse(iso) > Date.now();
    }),
    votingClosesAt: yup
      .string()
      .test('after-opening', 'Voting must close after it opens.', (value, context) => !value || !context.parent.votingOpensAt || value > context.parent.votingOpensAt),
    makersHidden: yup.boolean(),
  });

type ToInputOptions = {
  /** A new show (POST): empty optional fields are left out and the schedule waits for the settings page. */
  create: boolean;
  /** Voting has opened: its kind and counting are fixed, so they are not sent. */
  votingLocked?: boolean;
  /** The voting desk's state: once open the opening time is history, once closed neither time can change. */
  votingState?: Show['votingState'];
  timeZone?: string;
};

/** The api body. Inch fields go as typed text; money as whole cents; a change sends null to clear a field. */
export function toShowInput(values: ShowValues, currency: string, { create, votingLocked = false, votingState, timeZone }: ToInputOptions): ShowInput {
  const text = (value: string) => value.trim();
  const maybe = <T>(value: T | null): T | null | undefined => (value === null && create ? undefined : value);
  const input: ShowInput = {
    name: text(values.name),
    venue: text(values.venue),
    description: text(values.description),
    startsOn: values.startsOn,
    endsOn: values.endsOn,
    entriesOpenOn: maybe(blank(values.entriesOpenOn) ? null : values.entriesOpenOn),
    entriesCloseOn: maybe(blank(values.entriesCloseOn) ? null : values.entriesCloseOn),
    maxEntriesPerMember: maybe(blank(values.maxEntriesPerMember) ? null : Number(values.maxEntriesPerMember)),
    entryFeeCents: blank(values.entryFee) ? 0 : cents(values.entryFee, currency),
    entryFeeCapCents: maybe(blank(values.entryFeeCap) ? null : cents(values.entryFeeCap, currency)),
    sleeveDepthIn: text(values.sleeveDepthIn),
    narrowUnderIn: maybe(blank(values.narrowUnderIn) ? null : text(values.narrowUnderIn)),
    narrowDepthIn: maybe(blank(values.narrowUnderIn) || blank(values.narrowDepthIn) ? null : text(values.narrowDepthIn)),
    splitOverIn: maybe(blank(values.splitOverIn) ? null : text(values.splitOverIn)),
  };
  if (create && !input.description) delete input.description;
  if (!votingLocked) {
    input.votingKind = values.votingKind;
    input.rankedMethod = values.rankedMethod;
    if (values.votingKind === 'ranked') input.rankDepth = Number(values.rankDepth);
  }
  if (!create) {
    // The api refuses any opening time once voting is open, and any time at all once it has closed.
    if (sendsOpeningTime(create, votingState))
      input.votingOpensAt = blank(values.votingOpensAt) ? null : localInputToIso(values.votingOpensAt, timeZone);
    if (votingState !== 'closed')
      input.votingClosesAt = blank(values.votingClosesAt) ? null : localInputToIso(values.votingClosesAt, timeZone);
    input.makersHidden = values.makersHidden;
  }
  for (const k of Object.keys(input) as (keyof ShowInput)[]) if (input[k] === undefined) delete input[k];
  return input;
}

/** Voting's kind and counting are fixed once voting has opened. */
export const isVotingLocked = (show: Pick<Show, 'votingOpenedAt' | 'votingState'> | null | undefined) =>
  Boolean(show && (show.votingOpenedAt || show.votingState === 'open' || show.votingState === 'closed'));
