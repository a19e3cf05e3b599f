import { describe, expect, it } from 'vitest';
import { isoToLocalInput, localInputToIso } from './zoned-time';

describe('show times in the guild’s time zone', () => {
  it('read a datetime-local value on the guild’s clocks', () => {
    // Chicago is 5 hours behind UTC in October (daylight time) and 6 in December.
    expect(localInputToIso('2026-10-03T09:00', 'America/Chicago')).toBe('2026-10-03T14:00:00.000Z');
    expect(localInputToIso('2026-12-05T09:30', 'America/Chicago')).toBe('2026-12-05T15:30:00.000Z');
    expect(localInputToIso('2026-10-03T09:00', 'UTC')).toBe('2026-10-03T09:00:00.000Z');
  });

  it('fill the box back the same way', () => {
    expect(isoToLocalInput('2026-10-03T14:00:00.000Z', 'America/Chicago')).toBe('2026-10-03T09:00');
    expect(isoToLocalInput('2026-12-05T15:30:00Z', 'America/Chicago')).toBe('2026-12-05T09:30');
    expect(isoToLocalInput('2027-01-01T00:00:00Z', 'Pacific/Auckland')).toBe('2027-01-01T13:00');
  });

  it('leave empty or unreadable values empty', () => {
    expect(localInputToIso('', 'UTC')).toBeNull();
    expect(localInputToIso('3 October', 'UTC')).toBeNull();
    expect(isoToLocalInput(null, 'UTC')).toBe('');
    expect(isoToLocalInput('not a date', 'UTC')).toBe('');
  });

  it('round-trip across a daylight-saving change', () => {
    for (const local of ['2026-03-08T01:30', '2026-03-08T03:30', '2026-11-01T00:30', '2026-11-01T03:00']) {
      expect(isoToLocalInput(localInputToIso(local, 'America/Chicago'), 'America/Chicago')).toBe(local);
    }
  });
});
