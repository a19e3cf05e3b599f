import { DateTime } from 'luxon';
import {
  membershipYearOf,
  memberStanding,
  quoteDues,
  renewalOpensOn,
  type DuesQuote,
  type DuesSettings,
  type IsoDate,
  type Plan,
} from './dues-rules';
import { isJoining } from './dues-support';

/**
 * Who gets which dues reminder on a given day, as pure functions (no clock, no database): the
 * scheduled job (dues-reminders.service.ts) feeds them each member's plan, paid-through date and the
 * guild's settings and local date, and sends what they answer.
 *
 * Two reminders, each at most once per paid period (the outbox key names the period's last day):
 *
 * - "soon": her paid time is about to run out. The day that matters is the last day memberStanding
 *   calls her "current" (its statusEndsOn): the later of her paid-through date and the due date of the
 *   first year she has not paid for. Until then nothing is late; the day after she is in grace (or,
 *   with no grace, lapsed). It is also the date her dues page shows. The reminder goes out from
 *   SOON_DAYS before that day, but never before renewals for that year open (a guild with no early
 *   renewal opens them on the due date itself: the reminder comes that morning), and only while she
 *   is still current. A member who has already paid for the next year has a later paid-through date,
 *   so she is simply not inside the window; a paid invoice reaching beyond her paid-through date is
 *   checked as well, in case the two ever disagree.
 * - "lapsed": on the day she becomes lapsed (the day after her last day of grace, or after her last
 *   current day when the guild has no grace), with what renewing costs now. If the job could not run
 *   that day it still goes out in the next LAPSED_NOTICE_DAYS days; after that she is left alone, so
 *   switching reminders on never writes to everyone who lapsed years ago.
 *
 * Lifetime and honorary members, members with no plan, free plans and members who never paid get
 * nothing. Reminders go out from SEND_FROM_HOUR in the guild's time zone, not at midnight.
 */

/** Days ahead of her last current day that the "soon" reminder may go (common practice: two weeks). */
export const SOON_DAYS = 14;
/** Days after she lapses that a lapse notice missed by the job may still go out. */
export const LAPSED_NOTICE_DAYS = 7;
/** Local hour (guild time zone) from which reminders go out. */
export const SEND_FROM_HOUR = 9;

export type ReminderKind = 'soon' | 'lapsed';

export interface ReminderInput {
  /** Her plan; null when none has been chosen. */
  plan: Plan | null;
  settings: DuesSettings;
  /** The guild's local date. */
  today: IsoDate;
  /** Last day paid for; null when she never paid. */
  paidThrough: IsoDate | null;
  /** The latest coversThrough of her paid (or partly refunded) invoices, when known. */
  paidInvoicesThrough?: IsoDate | null;
}

interface ReminderBase {
  kind: ReminderKind;
  /** Her paid-through date: the period the reminder is about (part of the outbox key). */
  periodEnd: IsoDate;
  /** What renewing costs (on renewBy for "soon", today for "lapsed"); never empty. */
  quote: DuesQuote;
  /** "2028", "2027–28", or "2027 and 2028" when the payment would cover two years. */
  yearLabel: string;
}

export interface SoonReminder extends ReminderBase {
  kind: 'soon';
  /** Her last current day: renew by then and nothing is late. */
  renewBy: IsoDate;
  /** Last day of grace after renewBy; null when there is none. */
  graceEndsOn: IsoDate | null;
  /** The late fee a renewal after graceEndsOn adds, in minor units; 0 when none applies. */
  lateFeeCents: number;
}

export interface LapsedReminder extends ReminderBase {
  kind: 'lapsed';
  /** The first day she was lapsed. */
  lapsedOn: IsoDate;
}

export type DuesReminder = SoonReminder | LapsedReminder;

const PAYING_KINDS: readonly Plan['kind'][] = ['standard', 'household'];

function addDays(date: IsoDate, days: number): IsoDate {
  return DateTime.fromISO(date, { zone: 'utc' }).plus({ days }).toISODate()!;
}

/** The outbox key: the kind, the membership and the last day of the period it is about. */
export function reminderKey(kind: ReminderKind, membershipId: number, periodEnd: IsoDate): string {
  return `dues-reminder:${kind}:${membershipId}:${periodEnd}`;
}

/** Whether it is late enough in the guild's day to send reminders (not at midnight). */
export function remindersMaySendAt(now: Date, timeZone: string): boolean {
  const local = DateTime.fromJSDate(now, { zone: timeZone });
  return local.isValid && local.hour >= SEND_FROM_HOUR;
}

/**
 * Walks memberStanding forward from her paid-through date: her last current day and, when the guild
 * has grace, her last day of grace (null when she goes straight from current to lapsed).
 */
export function standingTimeline(plan: Plan, settings: DuesSettings, paidThrough: IsoDate): { lastCurrentDay: IsoDate; lastGraceDay: IsoDate | null } {
  const atEnd = memberStanding({ plan, settings, paidThrough, today: paidThrough });
  const lastCurrentDay = atEnd.endsOn!;
  const after = memberStanding({ plan, settings, paidThrough, today: addDays(lastCurrentDay, 1) });
  return { lastCurrentDay, lastGraceDay: after.status === 'grace' ? after.endsOn : null };
}

function yearLabelOf(quote: DuesQuote, settings: DuesSettings): string {
  const first = membershipYearOf(quote.coversFrom ?? quote.coversThrough!, settings).label;
  const last = membershipYearOf(quote.coversThrough!, settings).label;
  return first === last ? last : `${first} and ${last}`;
}

/** A quote worth sending: something to pay and a period it pays for. */
function usable(quote: DuesQuote): boolean {
  return quote.totalCents > 0 && quote.lines.length > 0 && quote.coversThrough !== null;
}

/** The reminder she is due today, or null. */
export function duesReminderFor(input: ReminderInput): DuesReminder | null {
  const { plan, settings, today, paidThrough } = input;
  if (!plan || !PAYING_KINDS.includes(plan.kind) || plan.yearlyCents <= 0) return null;
  if (paidThrough === null) return null;
  // A paid invoice reaching past her paid-through date: she has paid for the next period already.
  if (input.paidInvoicesThrough && input.paidInvoicesThrough > paidThrough) return null;

  const standing = memberStanding({ plan, settings, today, paidThrough });
  const { lastCurrentDay, lastGraceDay } = standingTimeline(plan, settings, paidThrough);

  if (standing.status === 'current') {
    const renewBy = standing.endsOn!;
    const firstUnpaid = membershipYearOf(addDays(paidThrough, 1), settings);
    const windowOpens = [addDays(renewBy, -SOON_DAYS), renewalOpensOn(firstUnpaid, settings)].sort()[1];
    if (today < windowOpens) return null;
    // What she pays if she renews by renewBy: that year's dues, no late fee.
    const quote = quoteDues({ plan, settings, today: renewBy, paidThrough, joining: isJoining(paidThrough, renewBy, settings) });
    if (!usable(quote)) return null;
    return {
      kind: 'soon',
      periodEnd: paidThrough,
      renewBy,
      graceEndsOn: lastGraceDay,
      lateFeeCents: settings.lateFeeCents,
      quote,
      yearLabel: yearLabelOf(quote, settings),
    };
  }

  if (standing.status === 'lapsed') {
    const lapsedOn = addDays(lastGraceDay ?? lastCurrentDay, 1);
    if (today < lapsedOn || today > addDays(lapsedOn, LAPSED_NOTICE_DAYS - 1)) return null;
    const quote = quoteDues({ plan, settings, today, paidThrough, joining: isJoining(paidThrough, today, settings) });
    if (!usable(quote)) return null;
    return { kind: 'lapsed', periodEnd: paidThrough, lapsedOn, quote, yearLabel: yearLabelOf(quote, settings) };
  }

  return null; // in grace: the "soon" reminder has gone, the lapse notice comes later
}
