import { CARD, markerCorners, printScale, printScaleProblem } from './card-geometry';

describe('the reference card', () => {
  it('fits inside both US Letter and A4 with a margin (TRADE.md §7.4: 8.5 x 11 in; 210 x 297 mm, from memory)', () => {
    for (const [w] of [[215.9, 279.4], [210, 297]]) expect(CARD.widthMm).toBeLessThanOrEqual(w - 2 * 12);
  });
  it('has bars at least 5 inches and 12 cm long', () => {
    expect(CARD.inchBar.lengthMm).toBeGreaterThanOrEqual(5 * 25.4);
    expect(CARD.cmBar.lengthMm).toBeGreaterThanOrEqual(120);
  });
  it('keeps markers, square and bars apart and on the card', () => {
    for (const m of CARD.markers) {
      const [, , [x2, y2]] = markerCorners(m.id);
      expect(x2).toBeLessThanOrEqual(CARD.widthMm);
      expect(y2).toBeLessThanOrEqual(CARD.heightMm);
    }
    const markerRows = [CARD.markers[0].y, CARD.markers[3].y].map((y) => [y, y + CARD.markerSizeMm]);
    for (const bar of [CARD.inchBar, CARD.cmBar]) {
      expect(bar.x + bar.lengthMm).toBeLessThanOrEqual(CARD.widthMm - 6);
      for (const [top, bottom] of markerRows) expect(bar.y < top - 4 || bar.y > bottom + 4).toBe(true);
    }
  });
  it('turns a ruler reading into a print scale and refuses more than 3% off', () => {
    // TRADE.md §2.2 (S32): a 1 inch square printed 15/16 is 6.25% small.
    expect(printScale(25.4, (15 / 16) * 25.4)).toBeCloseTo(0.9375, 6);
    expect(printScaleProblem(0.9375)).toMatch(/93\.8%.*100%/);
    expect(printScaleProblem(0.98)).toBeNull();
    expect(printScaleProblem(1.03)).toBeNull();
    expect(printScaleProblem(1.031)).toMatch(/more than 3% off/);
    expect(printScaleProblem(0)).toMatch(/ruler/);
  });
});
