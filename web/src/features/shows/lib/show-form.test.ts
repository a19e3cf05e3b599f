import { describe, expect, it } from 'vitest';
import type { Show } from '../api/types';
import { isVotingLocked, NEW_SHOW_VALUES, sendsOpeningTime, showSchema, toShowInput, toShowValues, type ShowValues } from './show-form';

const values: ShowValues = {
  ...NEW_SHOW_VALUES,
  name: ' Harvest Quilt Show ',
  venue: 'Wrenfield Grange Hall',
  startsOn: '2026-10-02',
  endsOn: '2026-10-04',
  entryFee: '10',
  entryFeeCap: '25.50',
};

const problems = async (v: ShowValues) => {
  try {
    await showSchema('USD').validate(v, { abortEarly: false });
    return [];
  } catch (error) {
    return (error as { errors: string[] }).errors;
  }
};

describe('show form', () => {
  it('holds an opening time that will be sent to the future, in the api’s words', async () => {
    const past = { ...values, votingOpensAt: '2020-03-01T09:00' };
    const future = { ...values, votingOpensAt: '2999-03-01T09:00' };
    const check = (v: ShowValues, checkOpening: boolean) =>
      showSchema('USD', { checkOpening, timeZone: 'America/Chicago' })
        .validate(v, { abortEarly: false })
        .then(() => [], (error: { errors: string[] }) => error.errors);
    expect(await check(past, true)).toEqual(['Choose an opening time in the future, or open voting now from the ballot desk.']);
    expect(await check(future, true)).toEqual([]);
    // Not sent once voting is open or closed (nor for a new show), so not checked.
    expect(await check(past, false)).toEqual([]);
    expect(sendsOpeningTime(false, 'not_open')).toBe(true);
    expect(sendsOpeningTime(false, 'open')).toBe(false);
    expect(sendsOpeningTime(false, 'closed')).toBe(false);
    expect(sendsOpeningTime(true, undefined)).toBe(false);
  });

  it('sends a new show without the empty optional fields, the sleeve as inch text and the fee in cents', () => {
    expect(toShowInput(values, 'USD', { create: true })).toEqual({
      name: 'Harvest Quilt Show',
      venue: 'Wrenfield Grange Hall',
      startsOn: '2026-10-02',
      endsOn: '2026-10-04',
      entryFeeCents: 1000,
      entryFeeCapCents: 2550,
      sleeveDepthIn: '4',
      narrowUnderIn: '30',
      narrowDepthIn: '3',
      splitOverIn: '90',
      votingKind: 'per_category',
      rankedMethod: 'points',
    });
  });

  it('clears fields with null on a change, sends the schedule as instants and leaves locked voting alone', () => {
    const input = toShowInput(
      { ...values, entryFeeCap: '', narrowUnderIn: '', votingOpensAt: '2026-10-02T10:00', makersHidden: true },
      'USD',
      { create: false, votingLocked: true, timeZone: 'America/Chicago' },
    );
    expect(input).toMatchObject({
      entryFeeCapCents: null,
      narrowUnderIn: null,
      narrowDepthIn: null,
      entriesOpenOn: null,
      votingOpensAt: '2026-10-02T15:00:00.000Z',
      votingClosesAt: null,
      makersHidden: true,
    });
    expect(input).not.toHaveProperty('votingKind');
    expect(input).not.toHaveProperty('rankedMethod');
  });

  it('checks dates, money and inches', async () => {
    expect(await problems(values)).toEqual([]);
    expect(
      await problems({ ...values, endsOn: '2026-10-01', entryFeeCap: '5', sleeveDepthIn: 'four', votingOpensAt: '2026-10-03T10:00', votingClosesAt: '2026-10-02T10:00' }),
    ).toEqual([
      'The show cannot end before it starts.',
      'The most a member pays must be at least one entry fee.',
      'Could not read "four" as inches. Write it like 12 1/2, 12.5 or 12½.',
      'Voting must close after it opens.',
    ]);
  });

  it('keeps entries within the show: open and close on or before its last day', async () => {
    expect(await problems({ ...values, entriesOpenOn: '2026-10-05', entriesCloseOn: '2026-10-06' })).toEqual([
      "Entries must open on or before the show's last day.",
      'Entries must close by the last day of the show.',
    ]);
    expect(await problems({ ...values, entriesOpenOn: '2026-10-04', entriesCloseOn: '2026-10-04' })).toEqual([]);
    expect(await problems({ ...values, entriesOpenOn: '2026-09-20', entriesCloseOn: '2026-09-10' })).toEqual(['Entries cannot close before they open.']);
    expect(await problems({ ...values, startsOn: '2027-02-30', endsOn: '2027-03-01' })).toEqual(['That date does not exist.']);
  });

  it('holds numbers, texts, money and inches to the api’s limits', async () => {
    const quilts = 'Enter a whole number of quilts from 1 to 50, or leave it empty for no limit.';
    expect(await problems({ ...values, maxEntriesPerMember: 0 })).toEqual([quilts]);
    expect(await problems({ ...values, maxEntriesPerMember: 51 })).toEqual([quilts]);
    expect(await problems({ ...values, maxEntriesPerMember: 50 })).toEqual([]);
    expect(await problems({ ...values, name: 'x'.repeat(121), venue: 'x'.repeat(201), description: 'x'.repeat(4001) })).toEqual([
      'Use at most 120 characters.',
      'Use at most 200 characters.',
      'Use at most 4,000 characters.',
    ]);
    expect(await problems({ ...values, entryFee: '1000.01', entryFeeCap: '' })).toEqual(['The entry fee must be at most 1,000.00.']);
    expect(await problems({ ...values, entryFee: '', entryFeeCap: '0' })).toEqual(['The cap must be more than 0, or leave it empty for no cap.']);
    expect(await problems({ ...values, sleeveDepthIn: '12 1/2', splitOverIn: '400,5' })).toEqual([
      'Must be at most 12 inches.',
      'Could not read "400,5" as inches. Write it like 12 1/2, 12.5 or 12½.',
    ]);
    expect(await problems({ ...values, sleeveDepthIn: '3', narrowDepthIn: '3 1/2' })).toEqual([
      "The narrow quilts' sleeve should not be deeper than the usual one.",
    ]);
  });

  it('asks how many places a ranked ballot lists, 2 to 5, and sends it as a number', async () => {
    const ranked: ShowValues = { ...values, votingKind: 'ranked', rankDepth: '6' };
    expect(await problems(ranked)).toEqual(['A ranked ballot lists 2 to 5 places.']);
    expect(await problems({ ...ranked, rankDepth: '' })).toEqual(['A ranked ballot lists 2 to 5 places.']);
    expect(await problems({ ...values, rankDepth: '6' })).toEqual([]);
    expect(toShowInput({ ...ranked, rankDepth: '5' }, 'USD', { create: true })).toMatchObject({ votingKind: 'ranked', rankDepth: 5 });
    expect(toShowInput({ ...ranked, rankDepth: '5' }, 'USD', { create: false, votingLocked: true })).not.toHaveProperty('rankDepth');
    expect(NEW_SHOW_VALUES.rankDepth).toBe(3);
  });

  it('leaves out the schedule times the api no longer takes once voting has opened or closed', () => {
    const timed = { ...values, votingOpensAt: '2026-10-02T10:00', votingClosesAt: '2026-10-04T16:00' };
    const open = toShowInput(timed, 'USD', { create: false, votingLocked: true, votingState: 'open', timeZone: 'America/Chicago' });
    expect(open).not.toHaveProperty('votingOpensAt');
    expect(open).toHaveProperty('votingClosesAt', '2026-10-04T21:00:00.000Z');
    const closed = toShowInput(timed, 'USD', { create: false, votingLocked: true, votingState: 'closed', timeZone: 'America/Chicago' });
    expect(closed).not.toHaveProperty('votingOpensAt');
    expect(closed).not.toHaveProperty('votingClosesAt');
  });

  it('fills the form back from a show', () => {
    const show = {
      name: 'Harvest Quilt Show',
      venue: 'Hall',
      description: '',
      startsOn: '2026-10-02',
      endsOn: '2026-10-04',
      entriesOpenOn: null,
      entriesCloseOn: '2026-09-20',
      maxEntriesPerMember: 3,
      entryFeeCents: 0,
      entryFeeCapCents: null,
      currency: 'USD',
      sleeve: { depthIn: 4, narrowUnderIn: 30, narrowDepthIn: 3.5, splitOverIn: null, text: '' },
      votingKind: 'ranked',
      rankedMethod: 'instant_runoff',
      rankDepth: 4,
      votingOpensAt: '2026-10-02T15:00:00.000Z',
      votingClosesAt: null,
      makersHidden: false,
    } as unknown as Show;
    expect(toShowValues(show, 'America/Chicago')).toMatchObject({
      entryFee: '',
      entryFeeCap: '',
      maxEntriesPerMember: '3',
      narrowDepthIn: '3 1/2',
      splitOverIn: '',
      votingOpensAt: '2026-10-02T10:00',
      entriesCloseOn: '2026-09-20',
      rankDepth: 4,
    });
    expect(isVotingLocked({ votingOpenedAt: null, votingState: 'scheduled' })).toBe(false);
    expect(isVotingLocked({ votingOpenedAt: '2026-10-02T15:00:00Z', votingState: 'closed' })).toBe(true);
  });
});
