/**
 * Calendar files (iCalendar, RFC 5545) attached to Selvage's e-mails, so a maker can put a
 * block's due date in her calendar with one tap.
 */
import icalGenerator, { ICalAlarmType, ICalCalendarMethod } from 'ical-generator';
import { DateTime } from 'luxon';

/** The Content-Type for the attachment (and for an inline text/calendar part). */
export const ICS_CONTENT_TYPE = 'text/calendar; charset=utf-8; method=PUBLISH';

/** Seconds before the start of the due day: 09:00 local time two days before (24 h + 15 h). */
const ALARM_BEFORE_SECONDS = (24 + 15) * 3600;

export interface DueDateIcsInput {
  /** Stable for the round and the maker, so a later file updates the same entry instead of adding one. */
  uid: string;
  /** The due date, "YYYY-MM-DD", in the guild's time zone. */
  dueDate: string;
  summary: string;
  description: string;
  /** Where the round's page is (http or https). */
  url: string;
  /** IANA zone of the guild, e.g. "Europe/London". */
  timeZone: string;
  /** Raise it each time a changed file is sent for the same uid (default 0). */
  sequence?: number;
}

/**
 * One all-day event on the due date with a reminder two days before (09:00 on the maker's
 * calendar). All-day dates float: the day is the same wherever the calendar is.
 */
export function buildDueDateIcs(input: DueDateIcsInput): string {
  const { uid, dueDate, summary, description, url, timeZone } = input;
  if (!uid || /[\r\n]/.test(uid)) throw new Error('buildDueDateIcs: uid must be one non-empty line');
  if (!/^\d{4}-\d{2}-\d{2}$/.test(dueDate)) {
    throw new Error(`buildDueDateIcs: dueDate must be YYYY-MM-DD, got "${dueDate}"`);
  }
  if (!/^https?:\/\//i.test(url)) throw new Error(`buildDueDateIcs: url must be an http(s) address, got "${url}"`);
  const start = DateTime.fromISO(dueDate, { zone: timeZone });
  if (!start.isValid) {
    throw new Error(`buildDueDateIcs: "${dueDate}" in "${timeZone}" is not a date (${start.invalidExplanation ?? start.invalidReason})`);
  }

  const calendar = icalGenerator({
    prodId: { company: 'Selvage', product: 'Bee rounds', language: 'EN' },
    method: ICalCalendarMethod.PUBLISH,
  });
  calendar.createEvent({
    id: uid,
    sequence: input.sequence ?? 0,
    allDay: true,
    start,
    end: start.plus({ days: 1 }),
    summary,
    description,
    url,
    alarms: [{ type: ICalAlarmType.display, trigger: ALARM_BEFORE_SECONDS, description: summary }],
  });
  return calendar.toString();
}
