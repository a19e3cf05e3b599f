import {
  arrangements,
  backing,
  batting,
  bedsCovered,
  binding,
  LayoutError,
  MATTRESSES,
  planLayout,
  sashingPieces,
  topSize,
} from './layout-planner';

describe('arrangements', () => {
  it('prefers using every block, then a 4:5 portrait', () => {
    const thirty = arrangements(30);
    expect(thirty[0]).toEqual({ rows: 6, columns: 5, used: 30, leftover: 0 });
    expect(thirty.every((a) => a.rows >= a.columns && a.used + a.leftover === 30)).toBe(true);
    expect(arrangements(20)[0]).toEqual({ rows: 5, columns: 4, used: 20, leftover: 0 });
  });

  it('offers square-ish layouts and leftovers for awkward counts', () => {
    expect(arrangements(16)[0]).toEqual({ rows: 4, columns: 4, used: 16, leftover: 0 });
    const thirteen = arrangements(13);
    expect(thirteen[0]).toEqual({ rows: 4, columns: 3, used: 12, leftover: 1 });
  });

  it('keeps to at most six, portrait or square, no runners', () => {
    const many = arrangements(2000);
    expect(many.length).toBeLessThanOrEqual(6);
    expect(many.every((a) => a.rows >= a.columns && a.rows <= 2 * a.columns)).toBe(true);
    expect(arrangements(1)).toEqual([{ rows: 1, columns: 1, used: 1, leftover: 0 }]);
    expect(arrangements(3)[0]).toEqual({ rows: 3, columns: 1, used: 3, leftover: 0 });
  });

  it('refuses impossible counts', () => {
    expect(() => arrangements(0)).toThrow(LayoutError);
    expect(() => arrangements(2001)).toThrow('from 1 to 2000');
    expect(() => arrangements(2.5)).toThrow(LayoutError);
  });
});

describe('topSize', () => {
  it('adds blocks, sashing between and two of each border', () => {
    const top = topSize({ rows: 6, columns: 5, blockWidth: 12, blockHeight: 12, sashing: 3, borders: [3] });
    expect(top).toEqual({ width: 78, height: 93 }); // TRADE.md §3.3, S44
    const small = topSize({ rows: 10, columns: 8, blockWidth: 6, blockHeight: 6, sashing: 2, borders: [10] });
    expect(small).toEqual({ width: 82, height: 98 }); // TRADE.md §3.3, S45
  });

  it('runs sashing round the outside when asked', () => {
    const top = topSize({ rows: 6, columns: 5, blockWidth: 12, blockHeight: 12, sashing: 3, sashingAround: true });
    expect(top).toEqual({ width: 78, height: 93 }); // TRADE.md §3.3, S44: outer 3 inch sashing adds what its 3 inch frame does
    expect(topSize({ rows: 2, columns: 3, blockWidth: 10, blockHeight: 8 })).toEqual({ width: 30, height: 16 });
  });

  it('refuses nonsense', () => {
    expect(() => topSize({ rows: 2, columns: 2, blockWidth: 0, blockHeight: 12 })).toThrow('block width');
    expect(() => topSize({ rows: 2, columns: 2, blockWidth: 12, blockHeight: 12, sashing: -1 })).toThrow(LayoutError);
    expect(() => topSize({ rows: 2, columns: 2, blockWidth: 12, blockHeight: 12, borders: [3, 0] })).toThrow('border 2');
    expect(() => topSize({ rows: 50, columns: 50, blockWidth: 1, blockHeight: 1 })).toThrow('at most 2000 blocks');
  });
});

describe('sashingPieces', () => {
  it('counts sashing round every block', () => {
    const pieces = sashingPieces({ rows: 4, columns: 5, sashingAround: true, cornerstones: true });
    expect(pieces.cornerstones).toBe(30); // TRADE.md §3.4, S46
    expect(pieces.strips).toBe(49); // TRADE.md §3.4, S46
  });

  it('counts sashing between blocks only', () => {
    expect(sashingPieces({ rows: 4, columns: 5, sashingAround: false, cornerstones: true })).toMatchObject({
      cornerstones: 12,
      strips: 4 * 4 + 3 * 5,
      longStrips: 0,
    });
    const noStones = sashingPieces({ rows: 4, columns: 5, sashingAround: false, cornerstones: false });
    expect(noStones).toMatchObject({ cornerstones: 0, shortStrips: 16, longStrips: 3, strips: 19 });
    expect(noStones.description).toBe(
      '16 block-length strips between blocks in a row and 3 long strips the full width of the blocks, no cornerstones.',
    );
  });
});

describe('binding', () => {
  it('adds 12 inches to the perimeter and cuts 40 inch strips', () => {
    // TRADE.md §3.6, S49 (the source prints 26.5 inches of fabric, a slip: 11 × 2.5 = 27.5)
    expect(binding({ width: 96, height: 110 })).toEqual({ length: 424, strips: 11, fabric: 27.5 });
  });

  it('follows other usable widths', () => {
    expect(binding({ width: 50, height: 60, extra: 0, usableWidth: 38 }).strips).toBe(6); // TRADE.md §3.6, S51
    expect(binding({ width: 30, height: 30, extra: 0 }).strips).toBe(3); // exactly 120 / 40
  });
});

describe('backing and batting', () => {
  it('adds 4 inches on every side', () => {
    expect(backing({ width: 60, height: 70 })).toMatchObject({ width: 68, height: 78 }); // TRADE.md §3.7, S52, S53
    expect(backing({ width: 60, height: 80 })).toMatchObject({ width: 68, height: 88 }); // TRADE.md §3.7, S52, S53
  });

  it('seams whichever way needs less fabric and rounds up to an eighth of a yard', () => {
    // 68 × 78: two 78 long (156) vs two 68 long (136) — across wins; 136 / 36 = 3.78 → 3 7/8.
    expect(backing({ width: 60, height: 70 })).toMatchObject({
      pieces: 2,
      pieceLength: 68,
      seams: 'horizontal',
      fabricLength: 136,
      yardage: 3.875,
    });
    // 98 × 108: three 108 long (324) vs three 98 long (294).
    expect(backing({ width: 90, height: 100 })).toMatchObject({ pieces: 3, seams: 'horizontal', fabricLength: 294 });
    // 38 × 48 fits one width of fabric: 48 / 36 = 1.33 → 1 3/8.
    expect(backing({ width: 30, height: 40 })).toMatchObject({ pieces: 1, seams: 'none', yardage: 1.375 });
    expect(backing({ width: 28, height: 28, margin: 4 }).yardage).toBe(1); // exactly one yard
  });

  it('keeps vertical seams on a tie', () => {
    expect(backing({ width: 72, height: 72 }).seams).toBe('vertical');
  });

  it('gives batting its own margin', () => {
    expect(batting({ width: 60, height: 80 })).toEqual({ width: 68, height: 88 }); // TRADE.md §3.7, S53 (4 a side)
    expect(batting({ width: 60, height: 80, margin: 8 })).toEqual({ width: 76, height: 96 }); // TRADE.md §3.7: 3–8
  });
});

describe('bedsCovered', () => {
  it('knows the mattresses', () => {
    expect(MATTRESSES.find((m) => m.bed === 'queen')).toMatchObject({ width: 60, length: 80 }); // TRADE.md §3.1, S41
    expect(MATTRESSES.find((m) => m.bed === 'california-king')).toMatchObject({ width: 72, length: 84 }); // TRADE.md §3.1, S41
  });

  it('measures the drops over side and foot', () => {
    const fits = bedsCovered({ width: 78, height: 93 });
    expect(fits.find((f) => f.bed === 'queen')).toEqual({
      bed: 'queen',
      label: 'Queen',
      covers: true,
      sideDrop: 9, // (78 − 60) / 2, TRADE.md §3.1, S41
      footDrop: 13, // 93 − 80
    });
    expect(fits.find((f) => f.bed === 'california-king')?.covers).toBe(true);
    expect(fits.filter((f) => f.covers).map((f) => f.bed)).toEqual([
      'crib', 'twin', 'twin-xl', 'full', 'queen', 'king', 'california-king',
    ]);
    expect(bedsCovered({ width: 70, height: 90 }).find((f) => f.bed === 'king')).toMatchObject({
      covers: false,
      sideDrop: -3,
    });
  });
});

describe('planLayout', () => {
  it('puts it all together for one arrangement', () => {
    const plan = planLayout({
      rows: 6,
      columns: 5,
      blockWidth: 12,
      blockHeight: 12,
      sashing: 3,
      cornerstones: true,
      borders: [3],
    });
    expect(plan.top).toEqual({ width: 78, height: 93 }); // TRADE.md §3.3, S44
    expect(plan.blockCount).toBe(30);
    expect(plan.sashingPieces).toMatchObject({ cornerstones: 20 });
    expect(plan.binding.length).toBe(2 * (78 + 93) + 12); // TRADE.md §3.6, S49
    expect(plan.backing).toMatchObject({ width: 86, height: 101 });
    expect(plan.batting).toEqual({ width: 86, height: 101 });
    expect(plan.beds).toHaveLength(7);
  });

  it('drops cornerstones and sashing pieces when there is no sashing', () => {
    const plan = planLayout({ rows: 2, columns: 2, blockWidth: 12, blockHeight: 12, cornerstones: true });
    expect(plan).toMatchObject({ sashing: 0, cornerstones: false, sashingPieces: null, top: { width: 24, height: 24 } });
  });
});
