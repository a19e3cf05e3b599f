import {
  compareMonths,
  monthOf,
  monthsFrom,
  newSeed,
  planRotation,
  queenFor,
  RotationError,
  seededShuffle,
  Slot,
  swapSlots,
} from './rotation';

const TEN_MEMBERS = [11, 12, 13, 14, 15, 16, 17, 18, 19, 20];

function queens(slots: Slot[]): (number | null)[] {
  return slots.map((slot) => slot.queenId);
}

function turnsOf(slots: Slot[]): Map<number, number> {
  const turns = new Map<number, number>();
  for (const { queenId } of slots) if (queenId !== null) turns.set(queenId, (turns.get(queenId) ?? 0) + 1);
  return turns;
}

describe('months', () => {
  it('counts months across the year end', () => {
    expect(monthsFrom('2025-11', 4)).toEqual(['2025-11', '2025-12', '2026-01', '2026-02']);
    expect(monthsFrom('2026-01', 0)).toEqual([]);
    expect(monthsFrom('2026-01', 12)).toHaveLength(12); // TRADE.md §5.1, S72 (12-month bees)
  });

  it('refuses what is not a month', () => {
    expect(() => monthsFrom('2026-13', 2)).toThrow(RotationError);
    expect(() => monthsFrom('2026-1', 2)).toThrow('write it like 2026-01');
    expect(() => monthsFrom('2026-01', -1)).toThrow(RotationError);
  });

  it('takes the month in the guild time zone', () => {
    const instant = new Date('2026-01-31T23:30:00Z');
    expect(monthOf(instant, 'UTC')).toBe('2026-01');
    expect(monthOf(instant, 'Pacific/Auckland')).toBe('2026-02');
    expect(monthOf(new Date('2026-03-01T03:00:00Z'), 'America/Chicago')).toBe('2026-02');
    expect(() => monthOf(instant, 'Mars/Olympus')).toThrow(RotationError);
  });

  it('compares months', () => {
    expect(['2026-03', '2025-12', '2026-01'].sort(compareMonths)).toEqual(['2025-12', '2026-01', '2026-03']);
    expect(compareMonths('2026-01', '2026-01')).toBe(0);
  });
});

describe('seededShuffle', () => {
  it('gives the same order for the same seed, without touching the input', () => {
    const input = Object.freeze([...TEN_MEMBERS]);
    const first = seededShuffle(input, 'spring-bee');
    expect(seededShuffle(input, 'spring-bee')).toEqual(first);
    expect([...first].sort((a, b) => a - b)).toEqual(TEN_MEMBERS);
    expect(input).toEqual(TEN_MEMBERS);
  });

  it('replays a stored seed exactly, so a library upgrade that changed draws would show here', () => {
    expect(seededShuffle(TEN_MEMBERS, 'spring-bee')).toEqual([18, 13, 12, 15, 17, 14, 11, 16, 20, 19]);
  });

  it('almost surely gives another order for another seed', () => {
    const orders = new Set(['a', 'b', 'c', 'd', 'e'].map((seed) => seededShuffle(TEN_MEMBERS, seed).join(',')));
    expect(orders.size).toBeGreaterThan(1);
  });

  it('handles empty and single lists', () => {
    expect(seededShuffle([], 'x')).toEqual([]);
    expect(seededShuffle([7], 'x')).toEqual([7]);
  });

  it('makes short readable seeds', () => {
    const seed = newSeed();
    expect(seed).toMatch(/^[a-z2-9]{10}$/);
    expect(newSeed()).not.toBe(seed);
  });
});

describe('planRotation', () => {
  const year = monthsFrom('2026-01', 12);

  it('gives 10 members 11 of 12 months with December skipped, the first in order going twice', () => {
    const slots = planRotation({ months: year, skipped: new Set(['2026-12']), order: TEN_MEMBERS, kept: [] });
    expect(slots.map((s) => s.month)).toEqual(year);
    expect(queens(slots)).toEqual([...TEN_MEMBERS, 11, null]);
    expect(slots[11]).toEqual({ month: '2026-12', skipped: true, queenId: null });
    const turns = turnsOf(slots);
    expect(turns.get(11)).toBe(2);
    expect(TEN_MEMBERS.slice(1).every((id) => turns.get(id) === 1)).toBe(true);
  });

  it('keeps months 1–5 when a member leaves in month 5 and gives the rest to those not yet queen', () => {
    const first = planRotation({ months: year, skipped: new Set(), order: TEN_MEMBERS, kept: [] });
    const kept = first.slice(0, 5); // queens 11…15
    const leaver = 13;
    const slots = planRotation({
      months: year,
      skipped: new Set(),
      order: TEN_MEMBERS.filter((id) => id !== leaver),
      kept,
    });
    expect(slots.slice(0, 5)).toEqual(kept);
    expect(queenFor(slots, '2026-03')).toBe(leaver);
    expect(queens(slots.slice(5, 10))).toEqual([16, 17, 18, 19, 20]);
    expect(queens(slots.slice(10))).toEqual([11, 12]);
    expect(queens(slots.slice(5))).not.toContain(leaver);
  });

  it('gives a member who joins mid-way a month before anyone is queen twice', () => {
    const members = [1, 2, 3, 4, 5];
    const kept = planRotation({ months: year, skipped: new Set(), order: members, kept: [] }).slice(0, 6);
    expect(queens(kept)).toEqual([1, 2, 3, 4, 5, 1]);
    const slots = planRotation({ months: year, skipped: new Set(), order: [...members, 6], kept });
    expect(queenFor(slots, '2026-07')).toBe(6);
    // Member 1 already had a second turn in month 6, so the others catch up before a third.
    expect(queens(slots.slice(7))).toEqual([2, 3, 4, 5, 6]);
  });

  it('gives a member who joins before anyone repeats a month ahead of the second round', () => {
    const kept = planRotation({ months: year, skipped: new Set(), order: [1, 2, 3, 4, 5], kept: [] }).slice(0, 3);
    const slots = planRotation({ months: year, skipped: new Set(), order: [1, 2, 3, 4, 5, 6], kept });
    expect(queens(slots.slice(3, 9))).toEqual([4, 5, 6, 1, 2, 3]);
  });

  it('puts months in order, leaves no queen when nobody is left, and refuses stray kept months', () => {
    const slots = planRotation({ months: ['2026-02', '2026-01'], skipped: new Set(), order: [], kept: [] });
    expect(slots).toEqual([
      { month: '2026-01', skipped: false, queenId: null },
      { month: '2026-02', skipped: false, queenId: null },
    ]);
    const stray = { month: '2027-01', skipped: false, queenId: 1 };
    expect(() => planRotation({ months: year, skipped: new Set(), order: [1], kept: [stray] })).toThrow(RotationError);
  });
});

describe('swapSlots', () => {
  const slots = planRotation({
    months: monthsFrom('2026-01', 6),
    skipped: new Set(['2026-04']),
    order: [1, 2, 3, 4, 5],
    kept: [],
  });

  it('swaps two future queens without changing the input', () => {
    const swapped = swapSlots(slots, '2026-03', '2026-05', '2026-03');
    expect(queenFor(swapped, '2026-03')).toBe(4);
    expect(queenFor(swapped, '2026-05')).toBe(3);
    expect(queenFor(slots, '2026-03')).toBe(3);
  });

  it('refuses past months, skipped months and months outside the plan', () => {
    expect(() => swapSlots(slots, '2026-02', '2026-05', '2026-03')).toThrow(
      'The queen for February 2026 can no longer change; only March 2026 and later can be swapped.',
    );
    expect(() => swapSlots(slots, '2026-04', '2026-05', '2026-03')).toThrow('April 2026 is skipped');
    expect(() => swapSlots(slots, '2026-05', '2027-01', '2026-03')).toThrow('January 2027 is not a month of this bee.');
  });

  it('has no queen in a skipped month', () => {
    expect(queenFor(slots, '2026-04')).toBeNull();
    expect(queenFor(slots, '2030-01')).toBeNull();
  });
});
