import { describe, expect, it } from 'vitest';
import { currencyOptions, MONTH_OPTIONS, timeZoneOptions } from './guild-options';

describe('new guild options', () => {
  it('offers every month, January = 1', () => {
    expect(MONTH_OPTIONS).toHaveLength(12);
    expect(MONTH_OPTIONS[8]).toEqual({ value: '9', label: 'September' });
  });

  it('lists time zones readably and keeps the IANA name as the value', () => {
    const zones = timeZoneOptions(['Europe/London', 'America/North_Dakota/New_Salem', 'America/Chicago']);
    expect(zones.map((z) => z.value)).toEqual(['America/Chicago', 'America/North_Dakota/New_Salem', 'Europe/London']);
    expect(zones[1].label).toBe('America / North Dakota / New Salem');
  });

  it('puts the usual currencies first, each with its ISO 4217 code', () => {
    const options = currencyOptions(['JPY', 'EUR', 'USD', 'CHF', 'GBP']);
    expect(options.map((o) => o.value)).toEqual(['USD', 'GBP', 'EUR', 'CHF', 'JPY']);
    expect(options[0].label).toBe('US Dollar (USD)');
  });
});
