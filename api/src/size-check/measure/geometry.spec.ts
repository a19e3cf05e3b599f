import {
  applyHomography,
  cameraHomography,
  classifyBySide,
  cornerAngleDeg,
  cornerAngles,
  diagonalDifference,
  diagonals,
  distance,
  invertHomography,
  lineIntersection,
  multiplyHomography,
  normalizeHomography,
  orderCorners,
  otsuThreshold,
  quadSize,
  type Point,
} from './geometry';
import { loadOpenCv } from './opencv';

const INCH = 25.4;

describe('homographies', () => {
  it('maps points exactly, including the projective divide', () => {
    const h = [2, 0, 10, 0, 3, -5, 0, 0, 1];
    expect(applyHomography(h, [[1, 2], [0, 0]])).toEqual([[12, 1], [10, -5]]);
    // w = 0.5 x + 1 = 2 at x = 2: every coordinate halves.
    expect(applyHomography([1, 0, 0, 0, 1, 0, 0.5, 0, 1], [[2, 4]])).toEqual([[1, 2]]);
  });
  it('inverts and composes', () => {
    const h = [1.2, 0.1, 30, -0.2, 0.9, 12, 0.0004, -0.0003, 1];
    const id = normalizeHomography(multiplyHomography(h, invertHomography(h)));
    [1, 0, 0, 0, 1, 0, 0, 0, 1].forEach((v, i) => expect(id[i]).toBeCloseTo(v, 12));
    const [p] = applyHomography(invertHomography(h), applyHomography(h, [[37, -12]]));
    expect(p[0]).toBeCloseTo(37, 10);
    expect(p[1]).toBeCloseTo(-12, 10);
  });
});

describe('distances, lines and angles', () => {
  it('measures a 3-4-5 triangle', () => {
    expect(distance([1, 1], [4, 5])).toBe(5);
  });
  it('intersects lines and refuses parallel ones', () => {
    expect(lineIntersection({ point: [0, 1], direction: [1, 0] }, { point: [3, -7], direction: [0, 2] })).toEqual([3, 1]);
    const p = lineIntersection({ point: [0, 0], direction: [1, 1] }, { point: [4, 0], direction: [-1, 1] })!;
    expect(p[0]).toBeCloseTo(2, 12);
    expect(p[1]).toBeCloseTo(2, 12);
    expect(lineIntersection({ point: [0, 0], direction: [1, 1] }, { point: [0, 1], direction: [2, 2] })).toBeNull();
  });
  it('gives corner angles of a square, a parallelogram and a straight line', () => {
    expect(cornerAngleDeg([1, 0], [0, 0], [0, 1])).toBeCloseTo(90, 12);
    expect(cornerAngleDeg([1, 0], [0, 0], [1, 1])).toBeCloseTo(45, 12);
    expect(cornerAngleDeg([1, 0], [0, 0], [-1, 0])).toBeCloseTo(180, 12);
    const para: Point[] = [[0, 0], [10, 0], [11, 10], [1, 10]];
    const angles = cornerAngles(para);
    expect(angles.reduce((a, b) => a + b, 0)).toBeCloseTo(360, 10);
    expect(angles[0]).toBeCloseTo(90 - (Math.atan(0.1) * 180) / Math.PI, 10);
  });
  it('compares diagonals: zero for a rectangle, the exact gap for a parallelogram', () => {
    const rect: Point[] = [[0, 0], [12.5, 0], [12.5, 6.5], [0, 6.5]];
    expect(diagonalDifference(rect)).toBe(0);
    // Top edge slid 1/4 inch right: diagonals sqrt(12.75² + 12.5²) and sqrt(12.25² + 12.5²).
    const skew: Point[] = [[0.25, 0], [12.75, 0], [12.5, 12.5], [0, 12.5]];
    expect(diagonals(skew)[0]).toBeCloseTo(Math.hypot(12.25, 12.5), 12);
    expect(diagonalDifference(skew)).toBeCloseTo(Math.hypot(12.75, 12.5) - Math.hypot(12.25, 12.5), 12);
    expect(quadSize(skew)).toEqual({ width: 12.5, height: Math.hypot(0.25, 12.5) });
  });
  it('orders corners TL, TR, BR, BL whatever order they come in', () => {
    const tl: Point = [10, 10];
    const tr: Point = [110, 20];
    const br: Point = [100, 120];
    const bl: Point = [0, 110];
    expect(orderCorners([br, tl, bl, tr])).toEqual([tl, tr, br, bl]);
  });
  it('sorts contour points to the side they lie on and drops corners and strays', () => {
    const rect = { center: [0, 0] as Point, width: 100, height: 50, angleDeg: 0 };
    const opts = { cornerFraction: 0.1, maxOffset: 3 };
    expect(classifyBySide([[0, -25], [50, 0], [0, 26], [-49, 5], [49, -24], [0, -40]], rect, opts)).toEqual([0, 1, 2, 3, -1, -1]);
    const turned = { ...rect, angleDeg: 90 };
    expect(classifyBySide([[25, 0], [0, 50]], turned, opts)).toEqual([0, 1]);
  });
  it("finds Otsu's split between two humps and says how clean it is", () => {
    const hist = new Array(256).fill(0);
    hist[20] = 100;
    hist[200] = 50;
    const { threshold, separation } = otsuThreshold(hist);
    expect(threshold).toBeGreaterThanOrEqual(20);
    expect(threshold).toBeLessThan(200);
    expect(separation).toBeCloseTo(1, 12);
  });
});

describe('why one scale factor is not enough (TRADE.md §7.3, derived)', () => {
  const side = 12.5 * INCH;
  it('a 10° tilt reads 12 1/2 as about 12.31 with one scale, and exactly 12 1/2 through the homography', () => {
    // A distant camera leaning 10° about the x axis: x keeps its scale, y shrinks by cos 10°.
    const s = 4; // px per mm across the tilt axis
    const h = [s, 0, 100, 0, s * Math.cos((10 * Math.PI) / 180), 80, 0, 0, 1];
    const card = applyHomography(h, [[0, 0], [180, 0]]);
    const oneScale = distance(card[0], card[1]) / 180; // px per mm from the card's width
    const block = applyHomography(h, [[200, 0], [200, side]]);
    const misread = distance(block[0], block[1]) / oneScale / INCH;
    expect(misread).toBeCloseTo(12.31, 2);
    const back = applyHomography(invertHomography(h), block);
    expect(Math.abs(distance(back[0], back[1]) / INCH - 12.5)).toBeLessThan(0.001);
  });
  it('holds with a real perspective camera too: the homography still gives 12 1/2', () => {
    const h = cameraHomography({
      rollDeg: 17,
      tiltDeg: 10,
      tiltAxisDeg: 0,
      target: [250, 150],
      distanceMm: 900,
      focalPx: 3000,
      principalPoint: [2000, 1500],
    });
    const corners: Point[] = [[300, 0], [300 + side, 0], [300 + side, side], [300, side]];
    const photo = applyHomography(h, corners);
    const back = applyHomography(invertHomography(h), photo);
    const { width, height } = quadSize(back);
    expect(Math.abs(width / INCH - 12.5)).toBeLessThan(0.001);
    expect(Math.abs(height / INCH - 12.5)).toBeLessThan(0.001);
  });
  it('the synthetic camera has the tilt it was asked for', () => {
    // At the point looked at, a lean of t shortens lengths along the lean by cos t and keeps the others.
    const h = cameraHomography({ rollDeg: 0, tiltDeg: 25, tiltAxisDeg: 0, target: [0, 0], distanceMm: 1000, focalPx: 2000, principalPoint: [0, 0] });
    const e = 1e-4;
    const [o, x, y] = applyHomography(h, [[0, 0], [e, 0], [0, e]]);
    expect(o[0]).toBeCloseTo(0, 9);
    expect(o[1]).toBeCloseTo(0, 9);
    expect(distance(o, x) / e).toBeCloseTo(2, 5);
    expect(distance(o, y) / e / 2).toBeCloseTo(Math.cos((25 * Math.PI) / 180), 5);
  });
});

describe('against OpenCV', () => {
  it('findHomography recovers a known homography from exact point pairs', async () => {
    const cv = await loadOpenCv();
    const h = [1.1, 0.05, 40, -0.08, 0.95, 25, 0.0002, -0.0001, 1];
    const src: Point[] = [[0, 0], [180, 0], [180, 120], [0, 120], [50, 60], [120, 30], [90, 100], [10, 80]];
    const dst = applyHomography(h, src);
    const a = cv.matFromArray(src.length, 1, cv.CV_64FC2, src.flat());
    const b = cv.matFromArray(dst.length, 1, cv.CV_64FC2, dst.flat());
    const found = cv.findHomography(a, b, 0);
    try {
      const got = Array.from(found.data64F as Float64Array);
      h.forEach((v, i) => expect(Math.abs(got[i] - v)).toBeLessThan(1e-6));
    } finally {
      a.delete();
      b.delete();
      found.delete();
    }
  });
  it('minAreaRect measures a rectangle rotated by a known angle', async () => {
    const cv = await loadOpenCv();
    const angle = 23;
    const a = (angle * Math.PI) / 180;
    const [w, hgt, cx, cy] = [700, 420, 800, 600];
    const pts: Point[] = [[-w / 2, -hgt / 2], [w / 2, -hgt / 2], [w / 2, hgt / 2], [-w / 2, hgt / 2]].map(([x, y]) => [
      cx + x * Math.cos(a) - y * Math.sin(a),
      cy + x * Math.sin(a) + y * Math.cos(a),
    ]);
    const mat = cv.matFromArray(4, 1, cv.CV_32FC2, pts.flat());
    try {
      const r = cv.minAreaRect(mat);
      const sides = [r.size.width, r.size.height].sort((x, y) => y - x);
      expect(Math.abs(sides[0] - w)).toBeLessThan(0.01);
      expect(Math.abs(sides[1] - hgt)).toBeLessThan(0.01);
      // OpenCV reports the angle in (0, 90]; the rectangle's own 23° may come back as 23 or 23 - 90 + 90.
      const reported = ((r.angle % 90) + 90) % 90;
      expect(Math.abs(reported - angle)).toBeLessThan(0.01);
      expect(Math.abs(r.center.x - cx)).toBeLessThan(0.01);
      expect(Math.abs(r.center.y - cy)).toBeLessThan(0.01);
    } finally {
      mat.delete();
    }
  });
});
