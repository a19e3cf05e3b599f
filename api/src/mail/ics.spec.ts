import ICAL from 'ical.js';
import { buildDueDateIcs, ICS_CONTENT_TYPE, type DueDateIcsInput } from './ics';

const input: DueDateIcsInput = {
  uid: 'bee-7-round-2027-03-maker-41@selvage',
  dueDate: '2027-03-15',
  summary: 'Block due for Hazel: Wonky Stars',
  description: 'Make one Wonky Stars block, 12 1/2 x 12 1/2 inches unfinished (12 x 12 inches finished).',
  url: 'https://selvage.example/guilds/1/bees/7/rounds/2027-03',
  timeZone: 'Europe/London',
};

function parse(ics: string) {
  const calendar = new ICAL.Component(ICAL.parse(ics));
  const vevents = calendar.getAllSubcomponents('vevent');
  expect(vevents).toHaveLength(1);
  return { calendar, vevent: vevents[0], event: new ICAL.Event(vevents[0]) };
}

describe('buildDueDateIcs', () => {
  it('names Selvage, publishes, and uses CRLF line ends', () => {
    const ics = buildDueDateIcs(input);
    const { calendar } = parse(ics);
    expect(calendar.getFirstPropertyValue('prodid')).toMatch(/Selvage/);
    expect(calendar.getFirstPropertyValue('method')).toBe('PUBLISH');
    expect(calendar.getFirstPropertyValue('version')).toBe('2.0');
    expect(ics).toContain('\r\n');
    expect(ics.replace(/\r\n/g, '')).not.toContain('\n');
  });

  it('has one all-day event on the due date with the given uid, summary, description and url', () => {
    const ics = buildDueDateIcs(input);
    const { vevent, event } = parse(ics);
    expect(ics).toContain('DTSTART;VALUE=DATE:20270315');
    expect(event.startDate.isDate).toBe(true);
    expect(event.startDate.toString()).toBe('2027-03-15');
    expect(event.endDate.toString()).toBe('2027-03-16');
    expect(event.uid).toBe(input.uid);
    expect(event.summary).toBe(input.summary);
    expect(event.description).toBe(input.description);
    expect(vevent.getFirstPropertyValue('url')).toBe(input.url);
    expect(vevent.getFirstPropertyValue('sequence')).toBe(0);
  });

  it('keeps the date whatever the zone (no shift to UTC)', () => {
    for (const timeZone of ['Pacific/Auckland', 'America/Los_Angeles', 'UTC']) {
      const { event } = parse(buildDueDateIcs({ ...input, timeZone, dueDate: '2027-01-01' }));
      expect(event.startDate.toString()).toBe('2027-01-01');
    }
  });

  it('has a display alarm at 09:00 two days before the due day', () => {
    const { vevent, event } = parse(buildDueDateIcs(input));
    const alarms = vevent.getAllSubcomponents('valarm');
    expect(alarms).toHaveLength(1);
    expect(alarms[0].getFirstPropertyValue('action')).toBe('DISPLAY');
    const trigger = alarms[0].getFirstPropertyValue('trigger') as ICAL.Duration;
    expect(trigger.toString()).toBe('-P1DT15H');
    const fires = event.startDate.clone();
    fires.isDate = false;
    fires.addDuration(trigger);
    expect(fires.toString()).toBe('2027-03-13T09:00:00');
  });

  it('escapes commas, semicolons, backslashes and line breaks so they survive', () => {
    const summary = 'Stars, stripes; and\nmore \\ things';
    const description = 'Line one\r\nLine two, with; punctuation';
    const { event } = parse(buildDueDateIcs({ ...input, summary, description }));
    expect(event.summary).toBe(summary);
    expect(event.description).toBe('Line one\nLine two, with; punctuation');
    expect(event.uid).toBe(input.uid);
  });

  it('folds long lines and keeps them readable', () => {
    const summary = 'A very long summary '.repeat(10).trim();
    const ics = buildDueDateIcs({ ...input, summary });
    for (const line of ics.split('\r\n')) expect(Buffer.byteLength(line)).toBeLessThanOrEqual(75);
    expect(parse(ics).event.summary).toBe(summary);
  });

  it('carries a sequence number when one is given', () => {
    const { vevent } = parse(buildDueDateIcs({ ...input, sequence: 3 }));
    expect(vevent.getFirstPropertyValue('sequence')).toBe(3);
  });

  it('refuses bad dates, zones, links and uids', () => {
    expect(() => buildDueDateIcs({ ...input, dueDate: '15/03/2027' })).toThrow(/YYYY-MM-DD/);
    expect(() => buildDueDateIcs({ ...input, dueDate: '2027-02-30' })).toThrow(/not a date/);
    expect(() => buildDueDateIcs({ ...input, timeZone: 'Mars/Olympus' })).toThrow(/not a date/);
    expect(() => buildDueDateIcs({ ...input, url: 'javascript:alert(1)' })).toThrow(/http/);
    expect(() => buildDueDateIcs({ ...input, uid: '' })).toThrow(/uid/);
    expect(() => buildDueDateIcs({ ...input, uid: 'a\nb' })).toThrow(/uid/);
  });

  it('exports the content type for the attachment', () => {
    expect(ICS_CONTENT_TYPE).toBe('text/calendar; charset=utf-8; method=PUBLISH');
  });
});
