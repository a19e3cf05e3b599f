/**
 * A `datetime-local` box holds a wall-clock time with no zone ("2026-10-03T09:00"). Show times are
 * the guild's, so the box is read and filled in the guild's time zone, whatever the browser's is.
 */

const LOCAL_RE = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})(?::(\d{2}))?$/;

function usableZone(timeZone?: string): string | undefined {
  if (!timeZone) return undefined;
  try {
    new Intl.DateTimeFormat('en', { timeZone });
    return timeZone;
  } catch {
    return undefined;
  }
}

function wallParts(date: Date, timeZone: string | undefined) {
  const parts = new Intl.DateTimeFormat('en-US', {
    timeZone,
    hourCycle: 'h23',
    year: 'numeric',
    month: '2-digit',
    day: '2-digit',
    hour: '2-digit',
    minute: '2-digit',
    second: '2-digit',
  }).formatToParts(date);
  const get = (type: string) => Number(parts.find((p) => p.type === type)?.value ?? '0');
  return { year: get('year'), month: get('month'), day: get('day'), hour: get('hour') % 24, minute: get('minute'), second: get('second') };
}

/** How far the zone's clocks are ahead of UTC at an instant, in ms. */
function offsetMs(instant: number, timeZone: string | undefined): number {
  const p = wallParts(new Date(instant), timeZone);
  const wall = Date.UTC(p.year, p.month - 1, p.day, p.hour, p.minute, p.second);
  return wall - Math.floor(instant / 1000) * 1000;
}

/** "2026-10-03T09:00" on the guild's clocks → an ISO instant; null for anything else (e.g. empty). */
export function localInputToIso(value: string, timeZone?: string): string | null {
  const m = LOCAL_RE.exec(value.trim());
  if (!m) return null;
  const wall = Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3]), Number(m[4]), Number(m[5]), Number(m[6] ?? 0));
  const zone = usableZone(timeZone);
  // Two passes find the offset on the right side of a daylight-saving change.
  let instant = wall - offsetMs(wall, zone);
  instant = wall - offsetMs(instant, zone);
  return new Date(instant).toISOString();
}

/** An ISO instant → "2026-10-03T09:00" on the guild's clocks, for a datetime-local box. */
export function isoToLocalInput(iso: string | null | undefined, timeZone?: string): string {
  if (!iso) return '';
  const date = new Date(iso);
  if (Number.isNaN(date.getTime())) return '';
  const p = wallParts(date, usableZone(timeZone));
  const two = (n: number) => String(n).padStart(2, '0');
  return `${p.year}-${two(p.month)}-${two(p.day)}T${two(p.hour)}:${two(p.minute)}`;
}
