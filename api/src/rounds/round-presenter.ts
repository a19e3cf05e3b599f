import { DateTime } from 'luxon';
import { formatInches, mmToInches } from '../common/units/inches';
import { unfinishedSize } from './block-size';
import type { Round } from './round.entity';

/** How a length in mm is shown: inches to the nearest 1/8, the precision people cut to. */
export function inchText(mm: number): string {
  return formatInches(mmToInches(mm), 8);
}

export function sizeOut(widthMm: number, heightMm: number) {
  return { widthMm, heightMm, widthText: inchText(widthMm), heightText: inchText(heightMm) };
}

export function roundSizes(round: Pick<Round, 'finishedWidthMm' | 'finishedHeightMm' | 'seamAllowanceMm'>) {
  const unfinished = unfinishedSize({ width: round.finishedWidthMm, height: round.finishedHeightMm }, round.seamAllowanceMm);
  return {
    finished: sizeOut(round.finishedWidthMm, round.finishedHeightMm),
    unfinished: sizeOut(Number(unfinished.width.toFixed(3)), Number(unfinished.height.toFixed(3))),
  };
}

/** "12 x 12 inches" */
export function sizePhrase(size: { widthText: string; heightText: string }): string {
  return `${size.widthText} x ${size.heightText} inches`;
}

export function monthLabel(month: string): string {
  return DateTime.fromISO(`${month}-01`).setLocale('en-US').toFormat('LLLL yyyy');
}

export function dateText(date: string): string {
  return DateTime.fromISO(date).setLocale('en-US').toFormat('cccc d LLLL yyyy');
}

/** The moment a local date and time happen in the guild's zone. */
export function zonedInstant(date: string, time: string, timeZone: string): Date {
  return DateTime.fromISO(`${date}T${time}`, { zone: timeZone }).toJSDate();
}

/** The default send moment: the 1st of the round's month at 08:00 in the guild's zone. */
export function defaultSendAt(month: string, timeZone: string): Date {
  return zonedInstant(`${month}-01`, '08:00', timeZone);
}

/** The local calendar date of an instant in a zone, "YYYY-MM-DD". */
export function localDate(at: Date, timeZone: string): string {
  return DateTime.fromJSDate(at, { zone: timeZone }).toISODate()!;
}

export function isValidDate(date: string): boolean {
  return DateTime.fromISO(date).isValid;
}
