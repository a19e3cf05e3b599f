import { describe, expect, it } from 'vitest';
import { EMPTY_LEDGER_FILTERS, ledgerCsvHref, ledgerFiltersFromSearch, ledgerQueryString } from './get-ledger';
import { rosterCsvHref, rosterQueryString } from './get-roster';

describe('ledger filters', () => {
  it('become a query string with only the filters that are set, in a fixed order', () => {
    expect(ledgerQueryString(EMPTY_LEDGER_FILTERS)).toBe('');
    expect(ledgerQueryString({ year: '2026–27', planId: '', status: 'paid', method: '' })).toBe('?year=2026%E2%80%9327&status=paid');
    expect(ledgerQueryString({ method: 'cash', status: 'refunded', planId: '4', year: '2026' })).toBe(
      '?year=2026&planId=4&status=refunded&method=cash',
    );
  });

  it('come back from the address, ignoring anything else', () => {
    const filters = ledgerFiltersFromSearch(new URLSearchParams('?status=paid&year=2026%E2%80%9327&page=2&method='));
    expect(filters).toEqual({ year: '2026–27', planId: '', status: 'paid', method: '' });
    expect(ledgerQueryString(filters)).toBe('?year=2026%E2%80%9327&status=paid');
  });

  it('carry over to the CSV download', () => {
    expect(ledgerCsvHref('1', { ...EMPTY_LEDGER_FILTERS, method: 'card' })).toBe('/api/guilds/1/dues/ledger.csv?method=card');
    expect(ledgerCsvHref('1', EMPTY_LEDGER_FILTERS)).toBe('/api/guilds/1/dues/ledger.csv');
  });
});

describe('roster filter', () => {
  it('asks for members in grace or lapsed in one parameter', () => {
    expect(rosterQueryString(['grace', 'lapsed'])).toBe('?status=grace%2Clapsed');
    expect(rosterQueryString([])).toBe('');
    expect(rosterCsvHref('1', ['grace', 'lapsed'])).toBe('/api/guilds/1/dues/roster.csv?status=grace%2Clapsed');
  });
});
