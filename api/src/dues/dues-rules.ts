import { DateTime } from 'luxon';
import { MoneyError, assertCents, halfOfCents, minorUnitDigits, sumCents } from './money';

/**
 * Membership dues as pure functions: which membership year a date falls in, when renewal is due, how
 * long the grace period lasts, what a member owes today and what state their membership is in.
 *
 * Dates are calendar dates written "yyyy-mm-dd" (IsoDate) everywhere, in and out. They are the guild's
 * local dates: the caller turns "now" into the guild's date (todayIn) and passes it in, so nothing here
 * reads the clock or depends on the server's time zone. Arithmetic is done on UTC midnights, which have
 * no daylight-saving gaps.
 *
 * Money is integer minor units (see money.ts).
 *
 * Decisions (defaults a guild can change are settings; the rest are documented here):
 * - Due date of a year: dueMonth/dueDay taken at the occurrence nearest the year's first day. If dueMonth
 *   is one of the first six months of the membership year the renewal is due inside that year (Jan 1 for a
 *   calendar year); otherwise it is due before the year starts (Oct 31 for a Nov–Oct year, the day before
 *   it begins). Due day 29 in February means the last day of February (the 28th in common years).
 * - Grace: graceDays after the due date; the last grace day is graceEndsOn. A renewing member who pays
 *   after it pays the late fee. Joiners never do. Grace periods are common (TRADE.md §4, S66); a
 *   calendar year due Jan 1 with 30 days of grace gives "delinquent Jan 31, dropped Feb 1" (S65).
 * - Early renewal: renewal for a year opens earlyRenewalDays (default 60) before that year's due date or
 *   its first day, whichever is earlier (Nov 2 for a calendar year due Jan 1 or due at the end of
 *   February; Sep 1 for a Nov–Oct year due Oct 31). From then on a renewing member's payment goes to
 *   that year, even if the current year was left unpaid (there is no point paying for a year that is
 *   almost over). Before then a member already paid for the current year has nothing to pay. (Our default; opening renewals ahead of time is common practice,
 *   the 60 days is not from a source.)
 * - No back dues: a member who missed whole years pays for the year being quoted, not the missed ones
 *   (common practice). Whether a long-lapsed member renews (late fee) or joins again (proration, no late
 *   fee) is the caller's choice.
 * - Status: "current" through the later of paidThrough and the next due date (dues not yet due are not
 *   late), "grace" through graceEndsOn, then "lapsed". No payment on record counts as lapsed.
 * - Joiners: the proration band of the month they join in decides full or half dues (half rounded
 *   half-up, see money.ts) and whether the payment also covers the next year; the membership is paid
 *   from the join date.
 * - Year labels: "2026" for a year starting in January; otherwise "2025–26" with an en dash (the start
 *   year in full, the end year's last two digits, or both in full across a century: "2099–2100").
 */

export type IsoDate = string;

/** A rule input that cannot be used; the message names the problem in plain words. */
export class DuesRuleError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'DuesRuleError';
  }
}

export interface ProrationBand {
  /** First month (1–12) of the band; the band runs until the next band's month, or the year's end. */
  fromMonth: number;
  /** What a member joining in these months pays: the full yearly amount or half of it. */
  charge: 'full' | 'half';
  /** The payment covers the rest of this membership year and all of the next. */
  coversNextYear: boolean;
}

export interface DuesSettings {
  /** ISO 4217 code, e.g. "USD". */
  currency: string;
  /** Month (1–12) the membership year starts in: 1 for a calendar year, 11 for a Nov–Oct year. */
  yearStartMonth: number;
  /** Renewal due date as month and day, e.g. 1/1 for a calendar year or 10/31 for a Nov–Oct year. */
  dueMonth: number;
  dueDay: number;
  /** Days after the due date during which a renewal is still on time (0–364). */
  graceDays: number;
  /** Added to a renewal paid after the grace period, in minor units. */
  lateFeeCents: number;
  /**
   * What joiners pay, by the month they join, in order through the membership year; the first band
   * starts in yearStartMonth. An empty list means joiners always pay the full year.
   */
  proration: ProrationBand[];
  /**
   * Days before a year's due date (or its first day, if that is earlier) from which renewals count for
   * that year (0–180, default 60).
   */
  earlyRenewalDays?: number;
}

/**
 * Lifetime and honorary members pay no dues (TRADE.md §4, S61–S64). Household membership is from memory
 * (TRADE.md §4.2): it is priced like any other plan, the yearly amount being the household's.
 */
export type PlanKind = 'standard' | 'household' | 'lifetime' | 'honorary';

export interface Plan {
  id: number | string;
  name: string;
  kind: PlanKind;
  /** Dues for one membership year, in minor units; ignored for lifetime and honorary plans. */
  yearlyCents: number;
  /** Inclusive age limits, e.g. a junior plan with maxAge 17. */
  minAge?: number;
  maxAge?: number;
}

export interface MembershipYear {
  /** "2026" for a calendar year, "2025–26" (en dash) for a year that spans two calendar years. */
  label: string;
  /** Calendar year the membership year starts in. */
  startYear: number;
  startsOn: IsoDate;
  endsOn: IsoDate;
}

export type MemberStatus = 'current' | 'grace' | 'lapsed' | 'lifetime' | 'honorary';

export interface MemberStanding {
  status: MemberStatus;
  /** Last day of this status, if it ends on its own (current → grace → lapsed); null otherwise. */
  endsOn: IsoDate | null;
}

export interface DuesQuoteLine {
  kind: 'dues' | 'proration' | 'late-fee';
  label: string;
  amountCents: number;
}

export interface DuesQuote {
  lines: DuesQuoteLine[];
  totalCents: number;
  currency: string;
  /** First and last day the payment pays for; null when nothing is being paid for. */
  coversFrom: IsoDate | null;
  coversThrough: IsoDate | null;
  /** Why nothing is due (no-dues plans, or renewal not open yet); null when the quote is a charge. */
  note: string | null;
}

export interface QuoteInput {
  plan: Plan;
  settings: DuesSettings;
  /** The guild's calendar date today. */
  today: IsoDate;
  /** Last day already paid for; null when the member has never paid. */
  paidThrough: IsoDate | null;
  /** A new member (proration bands, never a late fee) rather than a renewal. */
  joining: boolean;
}

export interface StatusInput {
  plan: Plan;
  settings: DuesSettings;
  today: IsoDate;
  paidThrough: IsoDate | null;
}

export const DEFAULT_EARLY_RENEWAL_DAYS = 60;
const MAX_GRACE_DAYS = 364;
const MAX_EARLY_RENEWAL_DAYS = 180;
const PLAN_KINDS: readonly PlanKind[] = ['standard', 'household', 'lifetime', 'honorary'];

const MONTHS = [
  'January',
  'February',
  'March',
  'April',
  'May',
  'June',
  'July',
  'August',
  'September',
  'October',
  'November',
  'December',
] as const;

// ---------------------------------------------------------------------------------------------------
// Dates

const ISO_DATE = /^\d{4}-\d{2}-\d{2}$/;

function toDate(value: IsoDate, what: string): DateTime {
  const parsed = typeof value === 'string' && ISO_DATE.test(value) ? DateTime.fromISO(value, { zone: 'utc' }) : null;
  if (!parsed || !parsed.isValid) throw new DuesRuleError(`${what} must be a date written yyyy-mm-dd, got "${String(value)}".`);
  return parsed;
}

function iso(date: DateTime): IsoDate {
  return date.toISODate()!;
}

function addDays(date: IsoDate, days: number): IsoDate {
  return iso(toDate(date, 'Date').plus({ days }));
}

function laterOf(a: IsoDate, b: IsoDate): IsoDate {
  return a > b ? a : b;
}

/** "28 February 2027": dates in labels and notes, written out so they cannot be misread. */
export function formatDate(date: IsoDate): string {
  return toDate(date, 'Date').setLocale('en-US').toFormat('d LLLL yyyy');
}

/** The guild's calendar date at an instant: 23:30 UTC on 31 December is already 1 January in Auckland. */
export function todayIn(timeZone: string, now: Date = new Date()): IsoDate {
  const local = DateTime.fromJSDate(now, { zone: timeZone });
  if (!local.isValid) throw new DuesRuleError(`"${timeZone}" is not a time zone.`);
  return iso(local);
}

/**
 * Whole years from birthDate to today. A 29 February birthday counts on 1 March in common years (a
 * choice: conventions differ between places).
 */
export function ageOn(birthDate: IsoDate, today: IsoDate): number {
  const birth = toDate(birthDate, 'Birth date');
  const on = toDate(today, 'Today');
  if (on < birth) throw new DuesRuleError('The birth date is after today.');
  const hadBirthday = on.month > birth.month || (on.month === birth.month && on.day >= birth.day);
  return on.year - birth.year - (hadBirthday ? 0 : 1);
}

// ---------------------------------------------------------------------------------------------------
// Settings and plans

const isMonth = (m: unknown): m is number => typeof m === 'number' && Number.isInteger(m) && m >= 1 && m <= 12;
const isWhole = (n: unknown): n is number => typeof n === 'number' && Number.isSafeInteger(n);
/** Position of a month inside the membership year: 0 for the first month, 11 for the last. */
const positionInYear = (month: number, startMonth: number) => (month - startMonth + 12) % 12;

/** A problem with one setting: `field` is the settings key (`proration.2` for the third band). */
export interface SettingsProblem {
  field: string;
  message: string;
}

/** Every problem with the settings, as sentences a treasurer can act on; empty when they are usable. */
export function validateDuesSettings(settings: DuesSettings): string[] {
  return duesSettingsProblems(settings).map((p) => p.message);
}

/** The same problems as validateDuesSettings, each with the field it is about, for forms. */
export function duesSettingsProblems(settings: DuesSettings): SettingsProblem[] {
  if (!settings || typeof settings !== 'object') return [{ field: 'settings', message: 'Dues settings are missing.' }];
  const problems: SettingsProblem[] = [];
  const add = (field: string, message: string) => problems.push({ field, message });
  const { currency, yearStartMonth, dueMonth, dueDay, graceDays, lateFeeCents, proration, earlyRenewalDays } = settings;

  try {
    minorUnitDigits(currency);
  } catch (e) {
    add('currency', e instanceof MoneyError ? e.message : `"${String(currency)}" is not a currency code.`);
  }
  if (!isMonth(yearStartMonth))
    add('yearStartMonth', `The membership year must start in a month numbered 1 to 12, got ${String(yearStartMonth)}.`);
  if (!isMonth(dueMonth)) add('dueMonth', `The due month must be numbered 1 to 12, got ${String(dueMonth)}.`);
  else {
    // February allows 29, read as "the last day of February".
    const maxDay = DateTime.utc(2000, dueMonth).daysInMonth!;
    if (!isWhole(dueDay) || dueDay < 1 || dueDay > maxDay)
      add('dueDay', `The due day must be a day of ${MONTHS[dueMonth - 1]} (1 to ${maxDay}), got ${String(dueDay)}.`);
  }
  if (!isWhole(graceDays) || graceDays < 0 || graceDays > MAX_GRACE_DAYS)
    add('graceDays', `The grace period must be a whole number of days from 0 to ${MAX_GRACE_DAYS}, got ${String(graceDays)}.`);
  if (!isWhole(lateFeeCents) || lateFeeCents < 0)
    add('lateFeeCents', `The late fee must be a whole number of cents, 0 or more, got ${String(lateFeeCents)}.`);
  if (earlyRenewalDays !== undefined && (!isWhole(earlyRenewalDays) || earlyRenewalDays < 0 || earlyRenewalDays > MAX_EARLY_RENEWAL_DAYS))
    add(
      'earlyRenewalDays',
      `Early renewal must open a whole number of days from 0 to ${MAX_EARLY_RENEWAL_DAYS} before the due date, got ${String(earlyRenewalDays)}.`,
    );

  if (!Array.isArray(proration)) add('proration', 'The proration bands must be a list (it may be empty).');
  else {
    let bandsUsable = true;
    proration.forEach((band, i) => {
      const n = i + 1;
      if (!band || typeof band !== 'object') {
        add(`proration.${i}`, `Proration band ${n} is missing.`);
        bandsUsable = false;
        return;
      }
      if (!isMonth(band.fromMonth)) {
        add(`proration.${i}.fromMonth`, `Proration band ${n} must start in a month numbered 1 to 12, got ${String(band.fromMonth)}.`);
        bandsUsable = false;
      }
      if (band.charge !== 'full' && band.charge !== 'half')
        add(`proration.${i}.charge`, `Proration band ${n} must charge "full" or "half", got ${JSON.stringify(band.charge)}.`);
      if (typeof band.coversNextYear !== 'boolean')
        add(`proration.${i}.coversNextYear`, `Proration band ${n} must say whether it covers the next year (true or false).`);
    });
    if (bandsUsable && proration.length > 0 && isMonth(yearStartMonth)) {
      if (proration[0].fromMonth !== yearStartMonth)
        add(
          'proration',
          `The first proration band must start in ${MONTHS[yearStartMonth - 1]}, the first month of the membership year.`,
        );
      const positions = proration.map((b) => positionInYear(b.fromMonth, yearStartMonth));
      if (positions.some((p, i) => i > 0 && p <= positions[i - 1]))
        add(
          'proration',
          `Proration bands must be listed in order through the membership year from ${MONTHS[yearStartMonth - 1]}, with no month twice.`,
        );
    }
  }
  return problems;
}

/** Throws one DuesRuleError listing every problem. */
export function assertDuesSettings(settings: DuesSettings): void {
  const problems = validateDuesSettings(settings);
  if (problems.length > 0) throw new DuesRuleError(`The dues settings cannot be used: ${problems.join(' ')}`);
}

/** Every problem with a plan; empty when it is usable. */
export function validatePlan(plan: Plan): string[] {
  if (!plan || typeof plan !== 'object') return ['The membership plan is missing.'];
  const problems: string[] = [];
  if (typeof plan.name !== 'string' || plan.name.trim() === '') problems.push('The plan needs a name.');
  if (!PLAN_KINDS.includes(plan.kind))
    problems.push(`The plan kind must be one of ${PLAN_KINDS.join(', ')}, got ${JSON.stringify(plan.kind)}.`);
  if (!isWhole(plan.yearlyCents) || plan.yearlyCents < 0)
    problems.push(`Yearly dues must be a whole number of cents, 0 or more, got ${String(plan.yearlyCents)}.`);
  for (const key of ['minAge', 'maxAge'] as const) {
    const v = plan[key];
    if (v !== undefined && (!isWhole(v) || v < 0 || v > 150))
      problems.push(`The plan's ${key === 'minAge' ? 'lowest' : 'highest'} age must be a whole number of years, got ${String(v)}.`);
  }
  if (isWhole(plan.minAge) && isWhole(plan.maxAge) && plan.minAge > plan.maxAge)
    problems.push(`The plan's lowest age (${plan.minAge}) is above its highest age (${plan.maxAge}).`);
  return problems;
}

function assertPlan(plan: Plan): void {
  const problems = validatePlan(plan);
  if (problems.length > 0) throw new DuesRuleError(`The membership plan cannot be used: ${problems.join(' ')}`);
}

/** Whether someone of this age (whole years) may take the plan; both limits are inclusive. */
export function planFitsAge(plan: Plan, age: number): boolean {
  assertPlan(plan);
  if (!isWhole(age) || age < 0) throw new DuesRuleError(`An age must be a whole number of years, got ${String(age)}.`);
  return (plan.minAge === undefined || age >= plan.minAge) && (plan.maxAge === undefined || age <= plan.maxAge);
}

// ---------------------------------------------------------------------------------------------------
// Membership years

/** "2026" when the year starts in January, otherwise "2025–26" (or "2099–2100" across a century). */
function yearLabel(startYear: number, startMonth: number): string {
  if (startMonth === 1) return String(startYear);
  const end = startYear + 1;
  if (Math.floor(end / 100) !== Math.floor(startYear / 100)) return `${startYear}–${end}`;
  return `${startYear}–${String(end % 100).padStart(2, '0')}`;
}

/** The membership year that starts in the given calendar year. */
export function membershipYearStarting(startYear: number, settings: DuesSettings): MembershipYear {
  assertDuesSettings(settings);
  if (!isWhole(startYear) || startYear < 1 || startYear > 9998) throw new DuesRuleError(`"${String(startYear)}" is not a year.`);
  const start = DateTime.utc(startYear, settings.yearStartMonth, 1);
  return {
    label: yearLabel(startYear, settings.yearStartMonth),
    startYear,
    startsOn: iso(start),
    endsOn: iso(start.plus({ years: 1 }).minus({ days: 1 })),
  };
}

/** The membership year a date falls in. */
export function membershipYearOf(date: IsoDate, settings: DuesSettings): MembershipYear {
  assertDuesSettings(settings);
  const d = toDate(date, 'The date');
  return membershipYearStarting(d.month >= settings.yearStartMonth ? d.year : d.year - 1, settings);
}

/** The membership year after the given one. */
export function membershipYearAfter(year: MembershipYear, settings: DuesSettings): MembershipYear {
  return membershipYearStarting(year.startYear + 1, settings);
}

/** The date renewal for this year is due (see the decisions at the top of the file). */
export function renewalDueDate(year: MembershipYear, settings: DuesSettings): IsoDate {
  assertDuesSettings(settings);
  const start = toDate(year.startsOn, 'The start of the year');
  const offset = positionInYear(settings.dueMonth, settings.yearStartMonth);
  // In the first six months of the year, or else in the six months before it starts.
  const month = start.plus({ months: offset < 6 ? offset : offset - 12 });
  return iso(month.set({ day: Math.min(settings.dueDay, month.daysInMonth!) }));
}

/** The last day of the grace period for this year's renewal. */
export function graceEndsOn(year: MembershipYear, settings: DuesSettings): IsoDate {
  return addDays(renewalDueDate(year, settings), settings.graceDays);
}

/**
 * The first day a renewal counts for this year rather than the one before: earlyRenewalDays before the
 * earlier of the year's due date and its first day.
 */
export function renewalOpensOn(year: MembershipYear, settings: DuesSettings): IsoDate {
  const from = [renewalDueDate(year, settings), year.startsOn].sort()[0];
  return addDays(from, -(settings.earlyRenewalDays ?? DEFAULT_EARLY_RENEWAL_DAYS));
}

// ---------------------------------------------------------------------------------------------------
// Status

/** The member's standing today, and the last day of it when it runs out by itself. */
export function memberStanding({ plan, paidThrough, settings, today }: StatusInput): MemberStanding {
  assertDuesSettings(settings);
  assertPlan(plan);
  toDate(today, 'Today');
  if (plan.kind === 'lifetime' || plan.kind === 'honorary') return { status: plan.kind, endsOn: null };
  if (paidThrough === null) return { status: 'lapsed', endsOn: null };
  toDate(paidThrough, 'Paid through');

  const unpaid = membershipYearOf(addDays(paidThrough, 1), settings);
  const currentThrough = laterOf(paidThrough, renewalDueDate(unpaid, settings));
  const graceThrough = graceEndsOn(unpaid, settings);
  if (today <= currentThrough) return { status: 'current', endsOn: currentThrough };
  if (today <= graceThrough) return { status: 'grace', endsOn: graceThrough };
  return { status: 'lapsed', endsOn: null };
}

export function memberStatus(input: StatusInput): MemberStatus {
  return memberStanding(input).status;
}

// ---------------------------------------------------------------------------------------------------
// Quotes

function quote(settings: DuesSettings, lines: DuesQuoteLine[], coversFrom: IsoDate | null, coversThrough: IsoDate | null, note: string | null): DuesQuote {
  for (const line of lines) assertCents(line.amountCents, line.label);
  return { lines, totalCents: sumCents(lines.map((l) => l.amountCents)), currency: settings.currency, coversFrom, coversThrough, note };
}

/** The band a joiner falls in this month; null when the guild has no bands (always the full year). */
function bandFor(month: number, settings: DuesSettings): ProrationBand | null {
  const position = positionInYear(month, settings.yearStartMonth);
  let found: ProrationBand | null = null;
  for (const band of settings.proration) if (positionInYear(band.fromMonth, settings.yearStartMonth) <= position) found = band;
  return found;
}

/** What the member pays today, line by line (see the decisions at the top of the file). */
export function quoteDues({ plan, settings, today, paidThrough, joining }: QuoteInput): DuesQuote {
  assertDuesSettings(settings);
  assertPlan(plan);
  toDate(today, 'Today');
  if (paidThrough !== null) toDate(paidThrough, 'Paid through');

  if (plan.kind === 'lifetime' || plan.kind === 'honorary') {
    const what = plan.kind === 'lifetime' ? 'Lifetime' : 'Honorary';
    return quote(settings, [{ kind: 'dues', label: `${what} membership: no dues`, amountCents: 0 }], null, null, `${what} members pay no dues.`);
  }

  const current = membershipYearOf(today, settings);
  const next = membershipYearAfter(current, settings);

  if (joining) {
    if (paidThrough !== null && paidThrough >= today)
      throw new DuesRuleError(`This member is already paid through ${formatDate(paidThrough)}; renew instead of joining.`);
    const month = toDate(today, 'Today').month;
    const band = bandFor(month, settings);
    const coversThrough = band?.coversNextYear ? next.endsOn : current.endsOn;
    if (band?.charge === 'half') {
      const label = `Half of ${current.label} dues — ${plan.name} (joined in ${MONTHS[month - 1]})`;
      return quote(settings, [{ kind: 'proration', label, amountCents: halfOfCents(plan.yearlyCents) }], today, coversThrough, null);
    }
    const label = band?.coversNextYear
      ? `Rest of ${current.label} and all of ${next.label} — ${plan.name}`
      : `${current.label} dues — ${plan.name}`;
    return quote(settings, [{ kind: 'dues', label, amountCents: plan.yearlyCents }], today, coversThrough, null);
  }

  let target: MembershipYear;
  if (paidThrough === null || paidThrough < current.endsOn) {
    target = today >= renewalOpensOn(next, settings) ? next : current;
  } else {
    const firstUnpaid = membershipYearOf(addDays(paidThrough, 1), settings);
    const opens = renewalOpensOn(firstUnpaid, settings);
    if (today < opens)
      return quote(
        settings,
        [],
        null,
        null,
        `Paid through ${formatDate(paidThrough)}. Renewal for ${firstUnpaid.label} opens on ${formatDate(opens)}.`,
      );
    target = firstUnpaid;
  }

  const lines: DuesQuoteLine[] = [{ kind: 'dues', label: `${target.label} dues — ${plan.name}`, amountCents: plan.yearlyCents }];
  const graceEnd = graceEndsOn(target, settings);
  // No late fee on a free plan: there was nothing to be late with.
  if (today > graceEnd && settings.lateFeeCents > 0 && plan.yearlyCents > 0)
    lines.push({ kind: 'late-fee', label: `Late fee (renewed after ${formatDate(graceEnd)})`, amountCents: settings.lateFeeCents });
  return quote(settings, lines, target.startsOn, target.endsOn, null);
}
