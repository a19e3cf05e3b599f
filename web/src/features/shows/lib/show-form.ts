import * as yup from 'yup';
import { centsToInput, parseMoney } from '@/features/dues/lib/money';
import { formatInches, parseInches } from '@/lib/inches';
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

const inches = (label: string, required: boolean) =>
  yup
    .string()
    .trim()
    .test('inches', `Type ${label} in inches, like 4 or 3 1/2.`, (value) => {
      if (blank(value)) return !required;
      const n = parseInches(value);
      return n !== null && n > 0;
    });

const DATE = /^\d{4}-\d{2}-\d{2}$/;
const dateField = (required?: string) => {
  const base = yup.string().trim().matches(DATE, { message: 'Write the date like 2026-10-02.', excludeEmptyString: true });
  return required ? base.required(required) : base;
};

export const showSchema = (currency: string) =>
  yup.object({
    name: yup.string().trim().required('Give the show a name.'),
    venue: yup.string().trim().required('Say where the show is.'),
    description: yup.string(),
    startsOn: dateField('Enter the first day of the show.'),
    endsOn: dateField('Enter the last day of the show.').test(
      'after-start',
      'The last day cannot be before the first day.',
      (value, context) => !value || !context.parent.startsOn || value >= context.parent.startsOn,
    ),
    entriesOpenOn: dateField(),
    entriesCloseOn: dateField().test(
      'after-open',
      'Entries cannot close before they open.',
      (value, context) => !value || !context.parent.entriesOpenOn || value >= context.parent.entriesOpenOn,
    ),
    maxEntriesPerMember: yup
      .number()
      .transform((value, original) => (blank(original) ? undefined : value))
      .typeError('Enter a whole number, or leave it empty for no limit.')
      .integer('Enter a whole number, or leave it empty for no limit.')
      .min(1, 'Allow at least 1 entry, or leave it empty for no limit.'),
    entryFee: optionalMoney(currency, 'Type the fee like 10 or 10.00.'),
    entryFeeCap: optionalMoney(currency, 'Type the cap like 30 or 30.00.').test(
      'cap-above-fee',
      'The most a member pays must be at least one entry fee.',
      (value, context) => blank(value) || blank(context.parent.entryFee) || cents(String(value), currency) >= cents(context.parent.entryFee, currency),
    ),
    sleeveDepthIn: inches('the sleeve depth', true).required('Enter the sleeve depth in inches.'),
    narrowUnderIn: inches('the width', false),
    narrowDepthIn: inches('the sleeve depth', false).test(
      'needs-depth',
      'Enter the sleeve depth for narrow quilts, or empty the width above.',
      (value, context) => blank(context.parent.narrowUnderIn) || !blank(value),
    ),
    splitOverIn: inches('the width', false),
    votingKind: yup.string().oneOf(['per_category', 'approval', 'ranked']).required('Choose how people vote.'),
    rankedMethod: yup.string().oneOf(['points', 'instant_runoff']),
    votingOpensAt: yup.string(),
    votingClosesAt: yup
      .string()
      .test('after-opening', 'Voting cannot close before it opens.', (value, context) => !value || !context.parent.votingOpensAt || value > context.parent.votingOpensAt),
    makersHidden: yup.boolean(),
  });

type ToInputOptions = {
  /** A new show (POST): empty optional fields are left out and the schedule waits for the settings page. */
  create: boolean;
  /** Voting has opened: its kind and counting are fixed, so they are not sent. */
  votingLocked?: boolean;
  timeZone?: string;
};

/** The api body. Inch fields go as typed text; money as whole cents; a change sends null to clear a field. */
export function toShowInput(values: ShowValues, currency: string, { create, votingLocked = false, timeZone }: ToInputOptions): ShowInput {
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
  }
  if (!create) {
    input.votingOpensAt = blank(values.votingOpensAt) ? null : localInputToIso(values.votingOpensAt, timeZone);
    input.votingClosesAt = blank(values.votingClosesAt) ? null : localInputToIso(values.votingClosesAt, timeZone);
    input.makersHidden = values.makersHidden;
  }
  for (const k of Object.keys(input) as (keyof ShowInput)[]) if (input[k] === undefined) delete input[k];
  return input;
}

/** Voting's kind and counting are fixed once voting has opened. */
export const isVotingLocked = (show: Pick<Show, 'votingOpenedAt' | 'votingState'> | null | undefined) =>
  Boolean(show && (show.votingOpenedAt || show.votingState === 'open' || show.votingState === 'closed'));
