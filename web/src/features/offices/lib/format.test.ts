import { describe, expect, it } from 'vitest';
import { describeTerm, formatDay } from './format';

describe('term dates in words', () => {
  it('writes dates out and says when access ends', () => {
    expect(formatDay('2026-01-01')).toBe('1 January 2026');
    expect(describeTerm({ startsOn: '2026-01-01', endsOn: '2027-01-01' }, '2026-12-02')).toBe('since 1 January 2026, access ends on 1 January 2027');
    expect(describeTerm({ startsOn: '2027-04-01', endsOn: null }, '2026-12-02')).toBe('from 1 April 2027, no end date set');
  });
});
