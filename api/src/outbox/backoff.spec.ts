import { retryDelayMs } from './backoff';

describe('retryDelayMs', () => {
  it('doubles from 30 s and stops growing at one hour', () => {
    expect([1, 2, 3, 4].map(retryDelayMs)).toEqual([30_000, 60_000, 120_000, 240_000]);
    expect(retryDelayMs(8)).toBe(3_600_000);
    expect(retryDelayMs(20)).toBe(3_600_000);
  });
});
