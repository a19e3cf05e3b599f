/**
 * Plane geometry for measuring a block from a photo, kept free of OpenCV so every formula can be
 * checked against exact answers. Homographies are 9 numbers, row-major, acting on [x, y, 1].
 */
export type Point = [number, number];
export type Homography = number[];

/** A line through `point` along `direction` (not necessarily unit length), as cv.fitLine reports it. */
export interface Line {
  point: Point;
  direction: Point;
}

export function applyHomography(h: Homography, points: Point[]): Point[] {
  return points.map(([x, y]) => {
    const w = h[6] * x + h[7] * y + h[8];
    return [(h[0] * x + h[1] * y + h[2]) / w, (h[3] * x + h[4] * y + h[5]) / w];
  });
}

export function multiplyHomography(a: Homography, b: Homography): Homography {
  const out = new Array<number>(9).fill(0);
  for (let r = 0; r < 3; r++)
    for (let c = 0; c < 3; c++)
      for (let k = 0; k < 3; k++) out[r * 3 + c] += a[r * 3 + k] * b[k * 3 + c];
  return out;
}

export function invertHomography(h: Homography): Homography {
  const [a, b, c, d, e, f, g, i, j] = h;
  const A = e * j - f * i;
  const B = -(d * j - f * g);
  const C = d * i - e * g;
  const det = a * A + b * B + c * C;
  if (Math.abs(det) < 1e-300) throw new Error('homography is singular');
  const inv = [
    A, -(b * j - c * i), b * f - c * e,
    B, a * j - c * g, -(a * f - c * d),
    C, -(a * i - b * g), a * e - b * d,
  ];
  return inv.map((v) => v / det);
}

/** Scales so the last entry is 1, the form findHomography returns, so results compare directly. */
export function normalizeHomography(h: Homography): Homography {
  return h.map((v) => v / h[8]);
}

export function distance(a: Point, b: Point): number {
  return Math.hypot(a[0] - b[0], a[1] - b[1]);
}

/** Null for (nearly) parallel lines: two sides of a block never are, so it signals a bad fit. */
export function lineIntersection(a: Line, b: Line): Point | null {
  const [ax, ay] = a.point;
  const [adx, ady] = a.direction;
  const [bx, by] = b.point;
  const [bdx, bdy] = b.direction;
  const cross = adx * bdy - ady * bdx;
  const scale = Math.hypot(adx, ady) * Math.hypot(bdx, bdy);
  if (scale === 0 || Math.abs(cross) < 1e-9 * scale) return null;
  const t = ((bx - ax) * bdy - (by - ay) * bdx) / cross;
  return [ax + adx * t, ay + ady * t];
}

/** Interior angle at `corner` between the rays to `prev` and `next`, in degrees (0–180). */
export function cornerAngleDeg(prev: Point, corner: Point, next: Point): number {
  const ux = prev[0] - corner[0];
  const uy = prev[1] - corner[1];
  const vx = next[0] - corner[0];
  const vy = next[1] - corner[1];
  return (Math.atan2(Math.abs(ux * vy - uy * vx), ux * vx + uy * vy) * 180) / Math.PI;
}

/** Corners in order TL, TR, BR, BL: the diagonals TL–BR and TR–BL. */
export function diagonals(corners: Point[]): [number, number] {
  return [distance(corners[0], corners[2]), distance(corners[1], corners[3])];
}

/** Equal diagonals mean square (TRADE.md §1.9, S25); the gap is how far out of square a block is. */
export function diagonalDifference(corners: Point[]): number {
  const [d1, d2] = diagonals(corners);
  return Math.abs(d1 - d2);
}

/** Width as the mean of top and bottom, height as the mean of left and right: how a quilter's ruler reads a slightly uneven block. */
export function quadSize(corners: Point[]): { width: number; height: number } {
  const [tl, tr, br, bl] = corners;
  return {
    width: (distance(tl, tr) + distance(bl, br)) / 2,
    height: (distance(tl, bl) + distance(tr, br)) / 2,
  };
}

export function cornerAngles(corners: Point[]): [number, number, number, number] {
  const n = corners.length;
  return corners.map((c, i) => cornerAngleDeg(corners[(i + n - 1) % n], c, corners[(i + 1) % n])) as [
    number,
    number,
    number,
    number,
  ];
}

/**
 * Puts four corners in the order TL, TR, BR, BL in a y-down frame: the first corner is the one whose
 * following edge runs most nearly to the right, so a block lying up to 45° askew keeps its width
 * as width.
 */
export function orderCorners(corners: Point[]): Point[] {
  const cx = corners.reduce((s, p) => s + p[0], 0) / corners.length;
  const cy = corners.reduce((s, p) => s + p[1], 0) / corners.length;
  // Clockwise on screen (y down) is increasing atan2 angle.
  const sorted = [...corners].sort((a, b) => Math.atan2(a[1] - cy, a[0] - cx) - Math.atan2(b[1] - cy, b[0] - cx));
  let best = 0;
  let bestScore = -Infinity;
  for (let i = 0; i < 4; i++) {
    const a = sorted[i];
    const b = sorted[(i + 1) % 4];
    const len = distance(a, b) || 1;
    const score = (b[0] - a[0]) / len;
    if (score > bestScore) {
      bestScore = score;
      best = i;
    }
  }
  return [0, 1, 2, 3].map((k) => sorted[(best + k) % 4]);
}

/**
 * Which side of a rotated rectangle each point lies nearest: 0 top, 1 right, 2 bottom, 3 left in the
 * rectangle's own frame (`angleDeg` turns its x axis). Points near a corner, where two sides are
 * about equally near, or far off every side (hanging threads, stray lint) get -1.
 */
export function classifyBySide(
  points: Point[],
  rect: { center: Point; width: number; height: number; angleDeg: number },
  options: { cornerFraction: number; maxOffset: number },
): number[] {
  const a = (rect.angleDeg * Math.PI) / 180;
  const cos = Math.cos(a);
  const sin = Math.sin(a);
  const hw = rect.width / 2;
  const hh = rect.height / 2;
  return points.map(([x, y]) => {
    const dx = x - rect.center[0];
    const dy = y - rect.center[1];
    const u = dx * cos + dy * sin;
    const v = -dx * sin + dy * cos;
    const distances = [Math.abs(v + hh), Math.abs(u - hw), Math.abs(v - hh), Math.abs(u + hw)];
    let side = 0;
    for (let s = 1; s < 4; s++) if (distances[s] < distances[side]) side = s;
    if (distances[side] > options.maxOffset) return -1;
    const along = side % 2 === 0 ? Math.abs(u) / hw : Math.abs(v) / hh;
    if (along > 1 - options.cornerFraction) return -1;
    return side;
  });
}

/** Plane (mm, z = 0) to image pixels for a pinhole camera; used to synthesise photos and in tests. */
export interface CameraSpec {
  /** Turn of the camera about its optical axis. */
  rollDeg: number;
  /** Angle between the optical axis and the plane's normal. */
  tiltDeg: number;
  /** Direction in the plane about which the camera leans (0 leans along +y). */
  tiltAxisDeg: number;
  /** Point of the plane the camera looks at, mm. */
  target: Point;
  distanceMm: number;
  focalPx: number;
  principalPoint: Point;
}

export function cameraHomography(spec: CameraSpec): Homography {
  const rad = Math.PI / 180;
  const t = spec.tiltDeg * rad;
  const phi = spec.tiltAxisDeg * rad;
  const r = spec.rollDeg * rad;
  // Camera looking straight down (z into the plane), then leaned by t about the in-plane axis at phi.
  const ax: [number, number, number] = [Math.cos(phi), Math.sin(phi), 0];
  const rot = axisAngle(ax, t);
  const down = [
    [1, 0, 0],
    [0, 1, 0],
    [0, 0, 1],
  ];
  // World-to-camera rotation: roll about the optical axis after leaning.
  const lean = matMul3(down, transpose3(rot));
  const roll = [
    [Math.cos(r), -Math.sin(r), 0],
    [Math.sin(r), Math.cos(r), 0],
    [0, 0, 1],
  ];
  const R = matMul3(roll, lean);
  // Camera centre: back along the leaned optical axis from the target.
  const opt = [rot[0][2], rot[1][2], rot[2][2]];
  const C = [spec.target[0] - opt[0] * spec.distanceMm, spec.target[1] - opt[1] * spec.distanceMm, -opt[2] * spec.distanceMm];
  const tvec = [0, 1, 2].map((i) => -(R[i][0] * C[0] + R[i][1] * C[1] + R[i][2] * C[2]));
  const f = spec.focalPx;
  const [cx, cy] = spec.principalPoint;
  const K = [
    [f, 0, cx],
    [0, f, cy],
    [0, 0, 1],
  ];
  const M = [
    [R[0][0], R[0][1], tvec[0]],
    [R[1][0], R[1][1], tvec[1]],
    [R[2][0], R[2][1], tvec[2]],
  ];
  const H = matMul3(K, M);
  return normalizeHomography([...H[0], ...H[1], ...H[2]]);
}

function axisAngle(axis: [number, number, number], angle: number): number[][] {
  const [x, y, z] = axis;
  const c = Math.cos(angle);
  const s = Math.sin(angle);
  const C = 1 - c;
  return [
    [c + x * x * C, x * y * C - z * s, x * z * C + y * s],
    [y * x * C + z * s, c + y * y * C, y * z * C - x * s],
    [z * x * C - y * s, z * y * C + x * s, c + z * z * C],
  ];
}

function matMul3(a: number[][], b: number[][]): number[][] {
  return a.map((row) => [0, 1, 2].map((c) => row[0] * b[0][c] + row[1] * b[1][c] + row[2] * b[2][c]));
}

function transpose3(a: number[][]): number[][] {
  return [0, 1, 2].map((r) => [a[0][r], a[1][r], a[2][r]]);
}

/** Otsu's threshold on a histogram: the bin that best separates it into two classes. */
export function otsuThreshold(histogram: ArrayLike<number>): { threshold: number; separation: number } {
  let total = 0;
  let sum = 0;
  for (let i = 0; i < histogram.length; i++) {
    total += histogram[i];
    sum += i * histogram[i];
  }
  let weightBelow = 0;
  let sumBelow = 0;
  let best = 0;
  let bestVariance = -1;
  for (let t = 0; t < histogram.length; t++) {
    weightBelow += histogram[t];
    if (weightBelow === 0) continue;
    const weightAbove = total - weightBelow;
    if (weightAbove === 0) break;
    sumBelow += t * histogram[t];
    const meanBelow = sumBelow / weightBelow;
    const meanAbove = (sum - sumBelow) / weightAbove;
    const variance = weightBelow * weightAbove * (meanBelow - meanAbove) ** 2;
    if (variance > bestVariance) {
      bestVariance = variance;
      best = t;
    }
  }
  const mean = total ? sum / total : 0;
  let spread = 0;
  for (let i = 0; i < histogram.length; i++) spread += histogram[i] * (i - mean) ** 2;
  // Share of the variance the split explains (0–1): low when the histogram has a single hump.
  return { threshold: best, separation: spread > 0 ? bestVariance / total / spread : 0 };
}
