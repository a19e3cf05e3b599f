import { randomInt } from 'crypto';
import { DateTime } from 'luxon';
import seedrandom from 'seedrandom';

/** A rotation request that cannot be carried out; the message can be shown to the organiser. */
export class RotationError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'RotationError';
  }
}

const MONTH_PATTERN = /^(\d{4})-(0[1-9]|1[0-2])$/;

// Messages name months as people say them; the "YYYY-MM" form is for storage.
function monthName(month: string): string {
  const parsed = DateTime.fromFormat(month, 'yyyy-MM', { locale: 'en' });
  return parsed.isValid ? parsed.toFormat('LLLL yyyy') : `"${month}"`;
}

function assertMonth(month: string): void {
  if (!MONTH_PATTERN.test(month)) throw new RotationError(`"${month}" is not a month; write it like 2026-01.`);
}

/** `count` consecutive "YYYY-MM" months starting with `startMonth`. */
export function monthsFrom(startMonth: string, count: number): string[] {
  assertMonth(startMonth);
  if (!Number.isInteger(count) || count < 0) throw new RotationError('The number of months must be a whole number, 0 or more.');
  const [year, month] = startMonth.split('-').map(Number);
  return Array.from({ length: count }, (_, offset) => {
    const index = year * 12 + (month - 1) + offset;
    return `${String(Math.floor(index / 12)).padStart(4, '0')}-${String((index % 12) + 1).padStart(2, '0')}`;
  });
}

/** The guild's calendar month for an instant: 23:30 UTC on 31 January is already February in Auckland. */
export function monthOf(date: Date, timeZone: string): string {
  const local = DateTime.fromJSDate(date, { zone: timeZone });
  if (!local.isValid) throw new RotationError(`Cannot tell the month of that date in time zone "${timeZone}".`);
  return local.toFormat('yyyy-MM');
}

/** Sort comparator; "YYYY-MM" strings order correctly as text once they are known to be months. */
export function compareMonths(a: string, b: string): number {
  assertMonth(a);
  assertMonth(b);
  return a < b ? -1 : a > b ? 1 : 0;
}

/** Fisher–Yates driven by the seed, so a stored seed replays the exact draw the members saw. */
export function seededShuffle<T>(items: readonly T[], seed: string): T[] {
  const random = seedrandom(seed);
  const shuffled = [...items];
  for (let i = shuffled.length - 1; i > 0; i--) {
    const j = Math.floor(random() * (i + 1));
    [shuffled[i], shuffled[j]] = [shuffled[j], shuffled[i]];
  }
  return shuffled;
}

// No look-alike characters (0/o, 1/l/i), so a seed can be read aloud or copied by hand.
const SEED_ALPHABET = 'abcdefghjkmnpqrstuvwxyz23456789';

/** A fresh 10-character seed (about 50 bits), safe in URLs, file names and sentences. */
export function newSeed(): string {
  return Array.from({ length: 10 }, () => SEED_ALPHABET[randomInt(SEED_ALPHABET.length)]).join('');
}

/** One month of a bee. `queenId: null` on a month that is not skipped means nobody was available. */
export type Slot = { month: string; skipped: boolean; queenId: number | null };

export interface RotationInput {
  months: string[];
  skipped: ReadonlySet<string>;
  /** Current members in queen order; anyone missing here is no longer a member. */
  order: readonly number[];
  /** Past and current slots, copied unchanged. */
  kept: readonly Slot[];
}

/**
 * A slot for every month, in month order: kept slots unchanged, skipped months without a queen,
 * and the rest filled so nobody is queen again while a current member has had fewer turns.
 */
export function planRotation(input: RotationInput): Slot[] {
  const months = [...new Set(input.months)].sort(compareMonths);
  const keptByMonth = keptSlotsByMonth(input.kept, new Set(months));
  const order = [...new Set(input.order)];
  const turns = new Map(order.map((id) => [id, 0]));
  for (const slot of keptByMonth.values()) {
    if (slot.queenId !== null && turns.has(slot.queenId)) turns.set(slot.queenId, turns.get(slot.queenId)! + 1);
  }
  return months.map((month) => {
    const kept = keptByMonth.get(month);
    if (kept) return { ...kept };
    if (input.skipped.has(month)) return { month, skipped: true, queenId: null };
    const queenId = nextQueen(order, turns);
    if (queenId !== null) turns.set(queenId, turns.get(queenId)! + 1);
    return { month, skipped: false, queenId };
  });
}

function keptSlotsByMonth(kept: readonly Slot[], months: ReadonlySet<string>): Map<string, Slot> {
  const byMonth = new Map<string, Slot>();
  for (const slot of kept) {
    if (!months.has(slot.month)) throw new RotationError(`The kept month ${slot.month} is not one of the bee's months.`);
    if (byMonth.has(slot.month)) throw new RotationError(`The month ${slot.month} is kept twice.`);
    byMonth.set(slot.month, slot);
  }
  return byMonth;
}

// Fewest turns first, ties in queen order: first everyone not yet queen, then round again in order.
function nextQueen(order: readonly number[], turns: ReadonlyMap<number, number>): number | null {
  let best: number | null = null;
  for (const id of order) if (best === null || turns.get(id)! < turns.get(best)!) best = id;
  return best;
}

/** Exchanges the queens of two future months, e.g. when a queen asks to go later. */
export function swapSlots(slots: Slot[], a: string, b: string, firstEditableMonth: string): Slot[] {
  const indexA = editableSlotIndex(slots, a, firstEditableMonth);
  const indexB = editableSlotIndex(slots, b, firstEditableMonth);
  const swapped = slots.map((slot) => ({ ...slot }));
  swapped[indexA].queenId = slots[indexB].queenId;
  swapped[indexB].queenId = slots[indexA].queenId;
  return swapped;
}

function editableSlotIndex(slots: readonly Slot[], month: string, firstEditableMonth: string): number {
  const index = slots.findIndex((slot) => slot.month === month);
  if (index < 0) throw new RotationError(`${monthName(month)} is not a month of this bee.`);
  if (compareMonths(month, firstEditableMonth) < 0) {
    throw new RotationError(
      `The queen for ${monthName(month)} can no longer change; only ${monthName(firstEditableMonth)} and later can be swapped.`,
    );
  }
  if (slots[index].skipped) throw new RotationError(`${monthName(month)} is skipped, so it has no queen to swap.`);
  return index;
}

export function queenFor(slots: readonly Slot[], month: string): number | null {
  return slots.find((slot) => slot.month === month)?.queenId ?? null;
}
