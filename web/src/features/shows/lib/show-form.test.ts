import { describe, expect, it } from 'vitest';
import type { Show } from '../api/types';
import { isVotingLocked, NEW_SHOW_VALUES, showSchema, toShowInput, toShowValues, type ShowValues } from './show-form';

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
      'The last day cannot be before the first day.',
      'The most a member pays must be at least one entry fee.',
      'Type the sleeve depth in inches, like 4 or 3 1/2.',
      'Voting cannot close before it opens.',
    ]);
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
    });
    expect(isVotingLocked({ votingOpenedAt: null, votingState: 'scheduled' })).toBe(false);
    expect(isVotingLocked({ votingOpenedAt: '2026-10-02T15:00:00Z', votingState: 'closed' })).toBe(true);
  });
});
