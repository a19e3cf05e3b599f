import { judgeBlock, type VerdictInput } from './verdict';

const IN = 25.4;
const base = (over: Partial<VerdictInput> & { w: number; h: number; diag?: [number, number] }): VerdictInput => ({
  measured: { widthMm: over.w * IN, heightMm: over.h * IN, diagonalsMm: over.diag?.map((d) => d * IN) as [number, number] },
  finished: { widthMm: 12 * IN, heightMm: 12 * IN },
  seamAllowanceMm: 0.25 * IN,
  toleranceMm: 0.125 * IN,
  trimMode: 'trim',
  ...over,
});

describe('judgeBlock', () => {
  // TRADE.md §1.1 (S1, S3): a 12 inch finished block is 12 1/2 unfinished; §1.6: within 1/8 (common practice, S14).
  it('calls a 12 1/2 block for a 12 inch round in size, and a hair off still in size', () => {
    expect(judgeBlock(base({ w: 12.5, h: 12.5 })).kind).toBe('in_size');
    expect(judgeBlock(base({ w: 12.5 + 0.12, h: 12.5 - 0.12 })).kind).toBe('in_size');
    expect(judgeBlock(base({ w: 12.5, h: 12.5 })).summary).toBe('In size: 12 1/2 x 12 1/2 inches unfinished, within 1/8 inch.');
  });
  it('says how much to trim when too big, and by how much when too small', () => {
    const big = judgeBlock(base({ w: 12.75, h: 12.5 }));
    expect(big.kind).toBe('too_big');
    expect(big.summary).toBe('Too big by 1/4: trim it to 12 1/2 x 12 1/2 inches unfinished.');
    // TRADE.md §1.8 (S20): 12 1/2 one way and 12 1/4 the other is a common miss.
    const small = judgeBlock(base({ w: 12.5, h: 12.25 }));
    expect(small.kind).toBe('too_small');
    expect(small.summary).toMatch(/^Too small by 1\/4/);
    // Trimmed to the finished size instead of the unfinished: a costly, common mistake (TRADE.md §1.2).
    expect(judgeBlock(base({ w: 12, h: 12 })).summary).toMatch(/^Too small by 1\/2/);
  });
  it('accepts anything big enough when the queen asked for untrimmed blocks', () => {
    expect(judgeBlock(base({ w: 13.25, h: 13, trimMode: 'untrimmed' })).kind).toBe('big_enough');
    expect(judgeBlock(base({ w: 12.25, h: 13, trimMode: 'untrimmed' })).kind).toBe('too_small');
  });
  it('matches a rectangle either way round', () => {
    const input = base({ w: 6.5, h: 12.5, finished: { widthMm: 12 * IN, heightMm: 6 * IN } });
    expect(judgeBlock(input).kind).toBe('in_size');
  });
  it('flags out of square when the diagonals differ by more than the tolerance', () => {
    const square = Math.hypot(12.5, 12.5);
    expect(judgeBlock(base({ w: 12.5, h: 12.5, diag: [square, square + 0.1] })).outOfSquare).toBe(false);
    const skew = judgeBlock(base({ w: 12.5, h: 12.5, diag: [square - 0.15, square + 0.15] }));
    expect(skew.outOfSquare).toBe(true);
    expect(skew.summary).toMatch(/Out of square: the diagonals differ by 5\/16 inch/);
  });
});
