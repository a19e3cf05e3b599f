import { CODE_ALPHABET, CODE_BITS, formatBallotCode, generateBallotCode, normaliseBallotCode } from './ballot-code';

describe('ballot codes', () => {
  it('carry at least 50 random bits from an alphabet without I, L, O or U', () => {
    expect(CODE_BITS).toBeGreaterThanOrEqual(50);
    expect(CODE_ALPHABET).toHaveLength(32);
    expect(CODE_ALPHABET).not.toMatch(/[ILOU]/);
  });

  it('use every symbol about equally (no modulo bias)', () => {
    const counts = new Map<string, number>();
    for (let i = 0; i < 4000; i++) for (const ch of generateBallotCode()) counts.set(ch, (counts.get(ch) ?? 0) + 1);
    expect(counts.size).toBe(32);
    // 48,000 symbols / 32 = 1,500 each; 6 standard deviations is about ±230.
    for (const n of counts.values()) expect(Math.abs(n - 1500)).toBeLessThan(230);
  });

  it('map each byte to a symbol from its low five bits', () => {
    const fixed = (n: number) => Buffer.from(Array.from({ length: n }, (_, i) => i * 33));
    expect(generateBallotCode(fixed)).toBe('0123456789AB');
  });

  it('print in groups of four and read back however they are typed', () => {
    expect(formatBallotCode('K7QM3XHD9PRW')).toBe('K7QM-3XHD-9PRW');
    expect(normaliseBallotCode('k7qm 3xhd 9prw')).toBe('K7QM3XHD9PRW');
    expect(normaliseBallotCode(' K7QM–3XHD–9PRW ')).toBe('K7QM3XHD9PRW');
    expect(normaliseBallotCode('OIL0-0000-0000')).toBe('011000000000');
  });

  it('refuse what cannot be a code', () => {
    expect(normaliseBallotCode('K7QM-3XHD')).toBeNull();
    expect(normaliseBallotCode('K7QM-3XHD-9PRU')).toBeNull();
    expect(normaliseBallotCode('K7QM-3XHD-9PRW-X')).toBeNull();
    expect(normaliseBallotCode('x'.repeat(1000))).toBeNull();
  });
});
