/**
 * Measures a quilt block photographed beside the printed reference card.
 *
 * The card's four ArUco markers give a homography from the photo to the table's plane in millimetres
 * (TRADE.md §7.1, §7.3: tilt makes one scale factor misread by more than the 1/8 inch tolerance).
 * The plane is then viewed top-down twice: coarsely over everything the photo sees, to tell the
 * block from the table, and finely around the block, where each edge is located to a fraction of
 * a pixel and fitted with a line that shrugs off hanging threads and ragged fabric.
 */
import { CARD, markerCorners } from '../card-geometry';
import {
  applyHomography,
  classifyBySide,
  cornerAngles,
  diagonals,
  invertHomography,
  lineIntersection,
  multiplyHomography,
  normalizeHomography,
  orderCorners,
  otsuThreshold,
  quadSize,
  type Homography,
  type Line,
  type Point,
} from './geometry';
import { loadOpenCv } from './opencv';

// Under jest's sandbox every `Math.` lookup costs ~150 ns, which dominates per-pixel loops: bind them once.
const { PI, abs, atan2, ceil, cos, floor, hypot, max, min, round, sin, sqrt } = Math;

export type RefusalReason =
  | 'card_not_found'
  | 'block_not_found'
  | 'block_touches_edge'
  | 'too_blurry'
  | 'too_dark'
  | 'low_contrast'
  | 'too_small';

export interface MeasureSuccess {
  ok: true;
  widthMm: number;
  heightMm: number;
  diagonalsMm: [number, number];
  cornerAnglesDeg: [number, number, number, number];
  /** Block corners in the photo, TL, TR, BR, BL as the card sees them. */
  cornersPx: Point[];
  /** Each detected marker's corners in the photo. */
  cardCornersPx: Point[][];
  markersFound: number;
  /** Scale of the top-down view the edges were found in. */
  pxPerMm: number;
  /** Photo pixels → real millimetres on the table (print scale applied), row-major, last entry 1. */
  homography: number[];
  timingsMs: Record<string, number>;
}

export interface MeasureRefusal {
  ok: false;
  reason: RefusalReason;
  message: string;
}

export type MeasureResult = MeasureSuccess | MeasureRefusal;

export interface RgbaImage {
  data: Uint8Array | Uint8ClampedArray;
  width: number;
  height: number;
}

export interface MeasureOptions {
  /** How big the card came out of the printer relative to its nominal size (1 = exactly 100%). */
  printScale?: number;
}

/** Top-down view for edge finding: a 16 inch block (16 1/2 unfinished, 419 mm) plus margins stays within ~2000 px. */
export const RECTIFIED_PX_PER_MM = 4.5;
const COARSE_MAX_PX = 1000;
/** The coarse view only has to find the block to within a couple of millimetres. */
const COARSE_MAX_PX_PER_MM = 1;
const MIN_BLOCK_MM = 2 * 25.4;
const MIN_MEAN_LUMINANCE = 40;
/** Coarser than any photo we accept samples the card, so the score reflects blur in mm, not the photo's size. */
const MARKER_VIEW_PX_PER_MM = 2;
const MIN_MARKER_SHARPNESS = 0.16;
/** Lab distance (L weighted by half) between block and table below which the two cannot be told apart. */
const MIN_CONTRAST = 9;
const CARD_MARGIN_MM = 6;
const EDGE_SEARCH_MM = 3;
/** Half the width of the strip looked at across each side: the rough outline's reach plus the edge search. */
const STRIP_HALF_MM = 14;
const OUTSIDE_SLACK = 6;
/** Marks on a patterned table are smaller than this across; a patch of one colour this wide is fabric. */
const PATCH_MIN_MM = 14;
const MIN_MARK_CHROMA = 12;

const MESSAGES: Record<RefusalReason, string> = {
  card_not_found:
    'We could not find the printed card in the photo. Lay the whole card flat beside the block, with all four black corner squares showing, and take the photo again.',
  block_not_found:
    'We could not find the block in the photo. Lay the block flat on a plain surface next to the card, so that the whole block shows, and take the photo again.',
  block_touches_edge:
    'Part of the block is cut off at the edge of the photo. Step back a little, or move the block towards the middle, so that there is table showing all around it, and take the photo again.',
  too_blurry:
    'The photo is blurry. Hold the phone still (rest your elbows on the table if you can), tap the screen on the card to focus, and take the photo again.',
  too_dark:
    'The photo is too dark. Turn on a light or move near a window, without the phone casting a shadow over the block, and take the photo again.',
  low_contrast:
    'The block is too close in colour to the surface under it. Lay it on something of a different colour (a light sheet under a dark block, a dark towel under a light one) and take the photo again.',
  too_small:
    'The block looks smaller than 2 inches, too small to measure reliably. Make sure it is the block lying next to the card, and take the photo closer.',
};

function refuse(reason: RefusalReason): MeasureRefusal {
  return { ok: false, reason, message: MESSAGES[reason] };
}

export async function measureBlockPhoto(image: RgbaImage, options: MeasureOptions = {}): Promise<MeasureResult> {
  // The package's typings lack the aruco and several imgproc bindings this uses.
  const cv: any = await loadOpenCv();
  const printScale = options.printScale ?? 1;
  if (!(printScale > 0)) throw new Error('printScale must be positive');
  const started = performance.now();
  const timingsMs: Record<string, number> = {};
  let lap = started;
  const tick = (name: string) => {
    const now = performance.now();
    timingsMs[name] = round((now - lap) * 10) / 10;
    lap = now;
  };
  const owned: { delete(): void }[] = [];
  const own = <T extends { delete(): void }>(m: T): T => {
    owned.push(m);
    return m;
  };

  try {
    // Wants a DOM ImageData; {data, width, height} is all it reads.
    const rgba = own(cv.matFromImageData(image as any));
    const rgb = own(new cv.Mat());
    cv.cvtColor(rgba, rgb, cv.COLOR_RGBA2RGB);
    const gray = own(new cv.Mat());
    cv.cvtColor(rgba, gray, cv.COLOR_RGBA2GRAY);
    tick('convert');

    if (cv.mean(gray)[0] < MIN_MEAN_LUMINANCE) return refuse('too_dark');

    const markers = detectMarkers(cv, gray, own);
    tick('detect');
    if (markers.length < 3) return refuse(globallyBlurry(cv, gray, own) ? 'too_blurry' : 'card_not_found');

    const H = cardHomography(cv, markers, printScale, own);
    tick('homography');
    if (!H) return refuse('card_not_found');

    if (markerSharpness(cv, gray, markers, H, printScale, own) < MIN_MARKER_SHARPNESS) return refuse('too_blurry');
    tick('sharpness');

    const photo = new Pyramid(cv, rgb, own);
    const coarse = findBlockCoarsely(cv, photo, H, printScale, own);
    tick('coarse');
    if ('reason' in coarse) return refuse(coarse.reason);

    const fine = fitBlockEdges(cv, photo, H, coarse, own);
    tick('fine');
    if ('reason' in fine) return refuse(fine.reason);

    const cornersMm = orderCorners(fine.cornersMm);
    const { width, height } = quadSize(cornersMm);
    if (min(width, height) < MIN_BLOCK_MM) return refuse('too_small');
    const Hinv = invertHomography(H);
    timingsMs.total = round((performance.now() - started) * 10) / 10;
    return {
      ok: true,
      widthMm: width,
      heightMm: height,
      diagonalsMm: diagonals(cornersMm),
      cornerAnglesDeg: cornerAngles(cornersMm),
      cornersPx: applyHomography(Hinv, cornersMm),
      cardCornersPx: markers.map((m) => m.corners),
      markersFound: markers.length,
      pxPerMm: RECTIFIED_PX_PER_MM,
      homography: H,
      timingsMs,
    };
  } finally {
    for (const m of owned.reverse()) m.delete();
  }
}

type Own = <T extends { delete(): void }>(m: T) => T;

interface Marker {
  id: number;
  corners: Point[];
}

function detectMarkers(cv: any, gray: any, own: Own): Marker[] {
  const dictionary = own(cv.getPredefinedDictionary(cv.DICT_4X4_50));
  const params = own(new cv.aruco_DetectorParameters());
  params.cornerRefinementMethod = cv.CORNER_REFINE_SUBPIX;
  params.cornerRefinementWinSize = 5;
  params.cornerRefinementMaxIterations = 50;
  params.cornerRefinementMinAccuracy = 0.01;
  const refine = own(new cv.aruco_RefineParameters(10, 3, true));
  const detector = own(new cv.aruco_ArucoDetector(dictionary, params, refine));
  const corners = own(new cv.MatVector());
  const ids = own(new cv.Mat());
  const rejected = own(new cv.MatVector());
  detector.detectMarkers(gray, corners, ids, rejected);
  const byId = new Map<number, Marker & { perimeter: number }>();
  for (let i = 0; i < ids.rows; i++) {
    const id = ids.data32S[i];
    if (!CARD.markers.some((m) => m.id === id)) continue;
    const c = corners.get(i);
    const d = c.data32F;
    const pts: Point[] = [0, 1, 2, 3].map((k) => [d[2 * k], d[2 * k + 1]]);
    c.delete();
    const perimeter = pts.reduce((s, p, k) => s + hypot(p[0] - pts[(k + 1) % 4][0], p[1] - pts[(k + 1) % 4][1]), 0);
    // A second copy of an id is a misread elsewhere in the photo: keep the larger, the card's.
    const seen = byId.get(id);
    if (!seen || perimeter > seen.perimeter) byId.set(id, { id, corners: pts, perimeter });
  }
  return [...byId.values()].sort((a, b) => a.id - b.id).map(({ id, corners: c }) => ({ id, corners: c }));
}

/** Photo px → real mm. Refuses markers that do not sit where the card puts them. */
function cardHomography(cv: any, markers: Marker[], printScale: number, own: Own): Homography | null {
  const src = markers.flatMap((m) => m.corners.flat());
  const dst = markers.flatMap((m) => markerCorners(m.id).flatMap(([x, y]) => [x * printScale, y * printScale]));
  const srcMat = own(cv.matFromArray(src.length / 2, 1, cv.CV_64FC2, src));
  const dstMat = own(cv.matFromArray(dst.length / 2, 1, cv.CV_64FC2, dst));
  const h = own(cv.findHomography(srcMat, dstMat, 0));
  if (h.rows !== 3) return null;
  const H = normalizeHomography(Array.from(h.data64F as Float64Array));
  // A misread marker would drag the fit: every corner must land within a millimetre of its place.
  const mapped = applyHomography(H, markers.flatMap((m) => m.corners));
  for (let i = 0; i < mapped.length; i++)
    if (hypot(mapped[i][0] - dst[2 * i], mapped[i][1] - dst[2 * i + 1]) > 1) return null;
  return H;
}

/** The Laplacian's spread over the markers, seen top-down at a fixed scale and divided by their contrast, so it compares across photo sizes. */
function markerSharpness(cv: any, gray: any, markers: Marker[], H: Homography, printScale: number, own: Own): number {
  const scale = MARKER_VIEW_PX_PER_MM;
  let best = 0;
  for (const m of markers) {
    const [x0, y0] = markerCorners(m.id)[0].map((v) => (v - 2) * printScale);
    const size = ceil((CARD.markerSizeMm + 4) * printScale * scale);
    const T = multiplyHomography([scale, 0, -scale * x0, 0, scale, -scale * y0, 0, 0, 1], H);
    const patch = own(new cv.Mat());
    const Tm = own(cv.matFromArray(3, 3, cv.CV_64F, T));
    cv.warpPerspective(gray, patch, Tm, new cv.Size(size, size), cv.INTER_AREA, cv.BORDER_REPLICATE, new cv.Scalar());
    const lapl = own(new cv.Mat());
    cv.Laplacian(patch, lapl, cv.CV_32F, 1, 1, 0, cv.BORDER_REPLICATE);
    const mean = own(new cv.Mat());
    const std = own(new cv.Mat());
    cv.meanStdDev(lapl, mean, std);
    const lapStd = std.data64F[0];
    cv.meanStdDev(patch, mean, std);
    const contrast = std.data64F[0];
    if (contrast > 10) best = max(best, lapStd / contrast);
  }
  return best;
}

/** Without a card to judge by: the photo's sharpest edges, at ~1000 px across, against its contrast. */
function globallyBlurry(cv: any, gray: any, own: Own): boolean {
  const f = min(1, 1000 / max(gray.cols, gray.rows));
  const small = own(new cv.Mat());
  cv.resize(gray, small, new cv.Size(round(gray.cols * f), round(gray.rows * f)), 0, 0, cv.INTER_AREA);
  const gx = own(new cv.Mat());
  const gy = own(new cv.Mat());
  cv.Sobel(small, gx, cv.CV_32F, 1, 0, 3);
  cv.Sobel(small, gy, cv.CV_32F, 0, 1, 3);
  const mag = own(new cv.Mat());
  cv.magnitude(gx, gy, mag);
  const g = mag.data32F as Float32Array;
  const sortedG = Float32Array.from(g).sort();
  const p = Array.from(small.data as Uint8Array).sort((a, b) => a - b);
  const contrast = p[floor(p.length * 0.99)] - p[floor(p.length * 0.01)];
  const steepest = sortedG[floor(sortedG.length * 0.999)] / 8;
  // A step of contrast C blurred by σ px has slope C / (σ √(2π)): this is σ at ~1000 px across.
  const sigma = contrast / (sqrt(2 * PI) * max(steepest, 1e-6));
  return sigma > 2.5;
}

interface Coarse {
  /** The block's outline as the coarse view saw it, real mm: good to about a millimetre. */
  outlineMm: Point[];
  /** The table's colours less those found in fabric-wide patches: what the block's edges stand out from. */
  centres: number[][];
  /** Every colour seen along the photo's edge, marks included: what lies beyond a true edge. */
  tableCentres: number[][];
  threshold: number;
  /** How far the table's own colour typically strays from its clusters. */
  tableLevel: number;
}

/** L counts half: shading and the light's fall-off change lightness far more than colour. */
const L_WEIGHT = 0.5;

function labDistance(lab: Float32Array, centres: number[][], nearestOut?: Uint8Array): Float32Array {
  const n = lab.length / 3;
  const out = new Float32Array(n);
  const k = centres.length;
  const flat = Float64Array.from(centres.flat());
  for (let i = 0; i < n; i++) {
    const L = lab[3 * i] * L_WEIGHT;
    const a = lab[3 * i + 1];
    const b = lab[3 * i + 2];
    let best = Infinity;
    let bestC = 0;
    for (let c = 0; c < k; c++) {
      const dL = L - flat[3 * c];
      const da = a - flat[3 * c + 1];
      const db = b - flat[3 * c + 2];
      const d = dL * dL + da * da + db * db;
      if (d < best) {
        best = d;
        bestC = c;
      }
    }
    out[i] = sqrt(best);
    if (nearestOut) nearestOut[i] = bestC;
  }
  return out;
}

function toLab(cv: any, rgb: any, blurPx: number, own: Own): Float32Array {
  const f = own(new cv.Mat());
  rgb.convertTo(f, cv.CV_32FC3, 1 / 255);
  if (blurPx > 0) cv.GaussianBlur(f, f, new cv.Size(0, 0), blurPx, blurPx, cv.BORDER_REPLICATE);
  const lab = own(new cv.Mat());
  cv.cvtColor(f, lab, cv.COLOR_RGB2Lab);
  return new Float32Array(lab.data32F as Float32Array);
}

/** As toLab, through OpenCV's 8-bit conversion: several times faster, and fine to a unit of L or a/b. */
function toLab8(cv: any, rgb: any, blurPx: number, own: Own): Float32Array {
  const blurred = own(new cv.Mat());
  if (blurPx > 0) cv.GaussianBlur(rgb, blurred, new cv.Size(0, 0), blurPx, blurPx, cv.BORDER_REPLICATE);
  else rgb.copyTo(blurred);
  const lab = own(new cv.Mat());
  cv.cvtColor(blurred, lab, cv.COLOR_RGB2Lab);
  // 8-bit Lab stores L scaled to 0–255 and a, b offset by 128.
  const b8 = lab.data as Uint8Array;
  const out = new Float32Array(b8.length);
  for (let i = 0; i < b8.length; i += 3) {
    out[i] = b8[i] * (100 / 255);
    out[i + 1] = b8[i + 1] - 128;
    out[i + 2] = b8[i + 2] - 128;
  }
  return out;
}

/** Deterministic k-means (farthest-point start) on Lab samples; the table may be patterned. */
function kmeans(samples: number[][], k: number): number[][] {
  if (!samples.length) return [[50 * L_WEIGHT, 0, 0]];
  const dist2 = (p: number[], c: number[]) => (p[0] - c[0]) ** 2 + (p[1] - c[1]) ** 2 + (p[2] - c[2]) ** 2;
  const centres = [samples[0].slice()];
  while (centres.length < k) {
    let far = samples[0];
    let farD = -1;
    for (const s of samples) {
      const d = min(...centres.map((c) => dist2(s, c)));
      if (d > farD) {
        farD = d;
        far = s;
      }
    }
    if (farD < 4) break;
    centres.push(far.slice());
  }
  for (let iter = 0; iter < 12; iter++) {
    const sums = centres.map(() => [0, 0, 0, 0]);
    for (const s of samples) {
      let best = 0;
      for (let c = 1; c < centres.length; c++) if (dist2(s, centres[c]) < dist2(s, centres[best])) best = c;
      sums[best][0] += s[0];
      sums[best][1] += s[1];
      sums[best][2] += s[2];
      sums[best][3] += 1;
    }
    sums.forEach((s, c) => {
      if (s[3]) centres[c] = [s[0] / s[3], s[1] / s[3], s[2] / s[3]];
    });
  }
  // A cluster of a handful of samples is more likely the block's corner than the table.
  const counts = centres.map(() => 0);
  for (const s of samples) {
    let best = 0;
    for (let c = 1; c < centres.length; c++) if (dist2(s, centres[c]) < dist2(s, centres[best])) best = c;
    counts[best]++;
  }
  return centres.filter((_, c) => counts[c] >= samples.length * 0.03);
}

/**
 * The table's colours: clusters of the band along the photo's edge that show up all the way round.
 * A colour found along only a stretch of it is something lying across the edge (a block cut off by the
 * frame, a bag, a hand) and must not be taken for the table.
 */
function tableColours(samples: number[][], where: Point[], centre: Point): number[][] {
  const clusters = kmeans(samples, 5);
  const sectors = 16;
  const seenIn = clusters.map(() => new Set<number>());
  const dist2 = (p: number[], c: number[]) => (p[0] - c[0]) ** 2 + (p[1] - c[1]) ** 2 + (p[2] - c[2]) ** 2;
  samples.forEach((s, k) => {
    let best = 0;
    for (let c = 1; c < clusters.length; c++) if (dist2(s, clusters[c]) < dist2(s, clusters[best])) best = c;
    const a = atan2(where[k][1] - centre[1], where[k][0] - centre[0]);
    seenIn[best].add(floor(((a + PI) / (2 * PI)) * sectors) % sectors);
  });
  const table = clusters.filter((_, c) => seenIn[c].size >= sectors * 0.3);
  return table.length ? table : clusters;
}

function photoPxPerMm(H: Homography, at: Point): number {
  const Hinv = invertHomography(H);
  const [a, b, c] = applyHomography(Hinv, [at, [at[0] + 1, at[1]], [at[0], at[1] + 1]]);
  return sqrt(abs((b[0] - a[0]) * (c[1] - a[1]) - (b[1] - a[1]) * (c[0] - a[0])));
}

/** The photo and its halvings (Gaussian pyramid), made when first needed. */
class Pyramid {
  private readonly levels: any[];
  constructor(
    private readonly cv: any,
    base: any,
    private readonly own: Own,
  ) {
    this.levels = [base];
  }
  level(k: number): any {
    while (this.levels.length <= k) {
      const next = this.own(new this.cv.Mat());
      this.cv.pyrDown(this.levels[this.levels.length - 1], next);
      this.levels.push(next);
    }
    return this.levels[k];
  }
}

interface View {
  view: any;
  /** Where the view shows the photo at all, pulled in a little so the photo's own edge never passes for a block's. */
  footprint: any;
  width: number;
  height: number;
  /** Real mm → the view's pixel centres. */
  toView: Homography;
}

/** Warps (a suitably shrunk copy of) the photo to a top-down view of the table; `toView` maps real mm to view pixels. */
function rectify(cv: any, photo: Pyramid, H: Homography, toView: Homography, width: number, height: number, own: Own): View {
  const pxPerMm = hypot(toView[0], toView[3]);
  const [centreMm] = applyHomography(invertHomography(toView), [[width / 2, height / 2]]);
  const photoScale = photoPxPerMm(H, centreMm);
  // Halve the photo first while it is much finer than the view, or warping would alias patterns.
  let level = 0;
  while (level < 6 && photoScale / 2 ** (level + 1) >= 1.5 * pxPerMm) level++;
  const src = photo.level(level);
  // A pyramid level's pixel x sits where the photo's pixel 2^level · x does.
  const Hs = level ? multiplyHomography(H, [2 ** level, 0, 0, 0, 2 ** level, 0, 0, 0, 1]) : H;
  const T = multiplyHomography(toView, Hs);
  const Tm = own(cv.matFromArray(3, 3, cv.CV_64F, T));
  const view = own(new cv.Mat());
  cv.warpPerspective(src, view, Tm, new cv.Size(width, height), cv.INTER_LINEAR, cv.BORDER_CONSTANT, new cv.Scalar(0, 0, 0, 0));
  // The photo's outline is a quadrilateral on the plane (no horizon inside the frame, checked earlier).
  const outline = applyHomography(T, [
    [0, 0],
    [src.cols - 1, 0],
    [src.cols - 1, src.rows - 1],
    [0, src.rows - 1],
  ]).flatMap(([x, y]) => [round(max(-1e6, min(1e6, x))), round(max(-1e6, min(1e6, y)))]);
  const footprint = own(new cv.Mat(height, width, cv.CV_8UC1, new cv.Scalar(0)));
  const poly = own(cv.matFromArray(4, 1, cv.CV_32SC2, outline));
  cv.fillConvexPoly(footprint, poly, new cv.Scalar(255));
  const k = own(cv.getStructuringElement(cv.MORPH_RECT, new cv.Size(5, 5)));
  cv.erode(footprint, footprint, k, new cv.Point(-1, -1), 1, cv.BORDER_CONSTANT, new cv.Scalar(0));
  return { view, footprint, width, height, toView };
}

/** Real mm → pixel centres of an axis-aligned view of the rectangle starting at (x0, y0). */
function alignedView(x0: number, y0: number, pxPerMm: number): Homography {
  return [pxPerMm, 0, -pxPerMm * x0 - 0.5, 0, pxPerMm, -pxPerMm * y0 - 0.5, 0, 0, 1];
}

/** Mask of the card and a margin around it, in a view's pixels. */
function cardMask(cv: any, view: View, printScale: number, own: Own) {
  const m = own(new cv.Mat(view.height, view.width, cv.CV_8UC1, new cv.Scalar(0)));
  const g = CARD_MARGIN_MM;
  const corners: Point[] = [
    [-g, -g],
    [CARD.widthMm * printScale + g, -g],
    [CARD.widthMm * printScale + g, CARD.heightMm * printScale + g],
    [-g, CARD.heightMm * printScale + g],
  ];
  const pts = applyHomography(view.toView, corners).flatMap(([x, y]) => [round(x + 0.5), round(y + 0.5)]);
  const poly = own(cv.matFromArray(4, 1, cv.CV_32SC2, pts));
  cv.fillConvexPoly(m, poly, new cv.Scalar(255));
  return m;
}

/**
 * Morphology with an octagon of radius r, built from alternating 3 x 3 squares and crosses: as round as
 * a disc for our purposes, and far faster than a large elliptical kernel.
 */
function morphOctagon(cv: any, mask: any, r: number, op: 'open' | 'close', own: Own) {
  const square = own(cv.getStructuringElement(cv.MORPH_RECT, new cv.Size(3, 3)));
  const cross = own(cv.getStructuringElement(cv.MORPH_CROSS, new cv.Size(3, 3)));
  const border = cv.morphologyDefaultBorderValue();
  const anchor = new cv.Point(-1, -1);
  const pass = (erode: boolean) => {
    for (let i = 0; i < r; i++) {
      const k = i % 2 === 0 ? square : cross;
      if (erode) cv.erode(mask, mask, k, anchor, 1, cv.BORDER_CONSTANT, border);
      else cv.dilate(mask, mask, k, anchor, 1, cv.BORDER_CONSTANT, border);
    }
  };
  pass(op === 'open');
  pass(op !== 'open');
}

function findBlockCoarsely(cv: any, photo: Pyramid, H: Homography, printScale: number, own: Own): Coarse | { reason: RefusalReason } {
  const rgb = photo.level(0);
  // What the photo sees of the plane, kept to a sane distance from the card (grazing views run off to infinity).
  const border: Point[] = [];
  for (let k = 0; k <= 16; k++) {
    const t = k / 16;
    border.push([t * rgb.cols, 0], [t * rgb.cols, rgb.rows], [0, t * rgb.rows], [rgb.cols, t * rgb.rows]);
  }
  // A horizon inside the frame: the photo is too oblique to map (our camera limits are far from this).
  if (!border.every(([x, y]) => H[6] * x + H[7] * y + H[8] > 0)) return { reason: 'card_not_found' };
  const seen = applyHomography(H, border);
  const cx = (CARD.widthMm * printScale) / 2;
  const cy = (CARD.heightMm * printScale) / 2;
  const reach = 1200;
  const region: [number, number, number, number] = [
    max(cx - reach, min(...seen.map((p) => p[0]))),
    max(cy - reach, min(...seen.map((p) => p[1]))),
    min(cx + reach, max(...seen.map((p) => p[0]))),
    min(cy + reach, max(...seen.map((p) => p[1]))),
  ];
  const scale = min(COARSE_MAX_PX_PER_MM, COARSE_MAX_PX / max(region[2] - region[0], region[3] - region[1]));
  const view = rectify(
    cv,
    photo,
    H,
    alignedView(region[0], region[1], scale),
    max(1, round((region[2] - region[0]) * scale)),
    max(1, round((region[3] - region[1]) * scale)),
    own,
  );
  const card = cardMask(cv, view, printScale, own);
  const lab = toLab8(cv, view.view, 1.5 * scale, own);
  const n = view.width * view.height;
  const foot = bytes(view.footprint);
  const cardPx = bytes(card);

  // The table: what lies in a band just inside the photo's edge (a block touching the edge is refused anyway).
  const bandWidth = max(3, round(0.07 * min(view.width, view.height)));
  const fromEdge = own(new cv.Mat());
  cv.distanceTransform(view.footprint, fromEdge, cv.DIST_L1, 3, cv.CV_32F);
  const inward = new Float32Array(fromEdge.data32F as Float32Array);
  const candidates: number[] = [];
  for (let i = 0; i < n; i++) if (foot[i] && inward[i] <= bandWidth && !cardPx[i]) candidates.push(i);
  const step = max(1, floor(candidates.length / 4000));
  const samples: number[][] = [];
  const where: Point[] = [];
  for (let j = 0; j < candidates.length; j += step) {
    const i = candidates[j];
    samples.push([lab[3 * i] * L_WEIGHT, lab[3 * i + 1], lab[3 * i + 2]]);
    where.push([i % view.width, floor(i / view.width)]);
  }
  const tableCentres = tableColours(samples, where, [view.width / 2, view.height / 2]);
  const nearestCentre = new Uint8Array(n);
  let dist = labDistance(lab, tableCentres, nearestCentre);
  // A printed or spotted table mixes a ground colour with small marks of others. A patch of fabric can
  // share a mark's colour, but not its size: wide regions of a minor colour are fabric, not table.
  const share = tableCentres.map(() => 0);
  for (const s of samples) share[nearestIndex(s, tableCentres)]++;
  const ground = share.indexOf(max(...share));
  const fabricLike = new Set<number>();
  const patchR = max(1, round(PATCH_MIN_MM * 0.5 * scale));
  for (let c = 0; c < tableCentres.length; c++) {
    if (c === ground || share[c] > samples.length * 0.35) continue;
    // Light and shadow make wide regions that differ mostly in lightness; marks differ in colour.
    const [, a0, b0] = tableCentres[ground];
    const [, a1, b1] = tableCentres[c];
    if (hypot(a1 - a0, b1 - b0) < MIN_MARK_CHROMA) continue;
    const minor = own(new cv.Mat(view.height, view.width, cv.CV_8UC1, new cv.Scalar(0)));
    const md = minor.data as Uint8Array;
    for (let i = 0; i < n; i++) md[i] = foot[i] && !cardPx[i] && nearestCentre[i] === c && dist[i] < MIN_CONTRAST ? 255 : 0;
    morphOctagon(cv, minor, patchR, 'open', own);
    if (cv.countNonZero(minor) > (PATCH_MIN_MM * scale) ** 2) fabricLike.add(c);
  }
  const centres = tableCentres.filter((_, c) => !fabricLike.has(c));
  if (fabricLike.size) dist = labDistance(lab, centres);

  const hist = new Array<number>(256).fill(0);
  for (let i = 0; i < n; i++) if (foot[i] && !cardPx[i]) hist[min(255, round(dist[i] * 2))]++;
  const otsu = otsuThreshold(hist).threshold / 2;
  // Otsu splits the most different colours from the rest, and a pieced block's palest patch can fall
  // on the table's side of that split; so never demand more than twice what the table itself strays by.
  const tableSpread = percentile(samples.map((s) => nearest(s, tableCentres)), 0.95);
  const threshold = min(max(otsu, MIN_CONTRAST), max(2 * tableSpread, MIN_CONTRAST));

  const mask = own(new cv.Mat(view.height, view.width, cv.CV_8UC1, new cv.Scalar(0)));
  const md = mask.data as Uint8Array;
  for (let i = 0; i < n; i++) md[i] = foot[i] && !cardPx[i] && dist[i] > threshold ? 255 : 0;
  cleanMask(cv, mask, max(1, round(2 * scale)), max(1, round(4 * scale)), own);

  const blob = largestComponent(cv, mask, own, (MIN_BLOCK_MM * scale * 0.5) ** 2);
  if (!blob) {
    // Either nothing stands out, or what does is too faint to trust.
    return { reason: otsu < MIN_CONTRAST ? 'low_contrast' : 'block_not_found' };
  }
  // A block as alike to the table as the table is to itself: its inside must be clearly further off.
  let inside = 0;
  const ld = blob.labels as Int32Array;
  let count = 0;
  for (let i = 0; i < n; i++) if (ld[i] === blob.label) count++;
  const insideValues = new Float32Array(count);
  for (let i = 0, j = 0; i < n; i++) if (ld[i] === blob.label) insideValues[j++] = dist[i];
  insideValues.sort();
  inside = insideValues[floor(insideValues.length / 2)];
  if (inside < MIN_CONTRAST) return { reason: 'low_contrast' };

  // Any part of it on the photo's edge (the footprint was already pulled in by 2 px).
  const edgeBand = own(new cv.Mat());
  const k3 = own(cv.getStructuringElement(cv.MORPH_RECT, new cv.Size(5, 5)));
  cv.erode(view.footprint, edgeBand, k3, new cv.Point(-1, -1), 1, cv.BORDER_CONSTANT, new cv.Scalar(0));
  const eb = bytes(edgeBand);
  for (let i = 0; i < n; i++) if (ld[i] === blob.label && !eb[i]) return { reason: 'block_touches_edge' };

  const [, , bw, bh] = blob.box;
  if (max(bw, bh) / scale < MIN_BLOCK_MM) return { reason: 'too_small' };
  const outline = outerContour(cv, blob, view.width, view.height, max(2, round(7 * scale)), own).map(
    ([x, y]) => [region[0] + (x + 0.5) / scale, region[1] + (y + 0.5) / scale] as Point,
  );
  if (outline.length < 40) return { reason: 'block_not_found' };
  return {
    outlineMm: outline,
    centres,
    tableCentres,
    threshold,
    tableLevel: percentile(samples.map((p) => nearest(p, tableCentres)), 0.5),
  };
}

function cleanMask(cv: any, mask: any, openR: number, closeR: number, own: Own) {
  morphOctagon(cv, mask, openR, 'open', own);
  morphOctagon(cv, mask, closeR, 'close', own);
}

function largestComponent(cv: any, mask: any, own: Own, minArea: number, near?: Point) {
  const labels = own(new cv.Mat());
  const stats = own(new cv.Mat());
  const centroids = own(new cv.Mat());
  const count = cv.connectedComponentsWithStats(mask, labels, stats, centroids, 8, cv.CV_32S);
  let best = -1;
  let bestScore = 0;
  for (let l = 1; l < count; l++) {
    const area = stats.intAt(l, cv.CC_STAT_AREA);
    if (area < minArea) continue;
    let score = area;
    if (near) {
      const x = stats.intAt(l, cv.CC_STAT_LEFT);
      const y = stats.intAt(l, cv.CC_STAT_TOP);
      const w = stats.intAt(l, cv.CC_STAT_WIDTH);
      const h = stats.intAt(l, cv.CC_STAT_HEIGHT);
      if (near[0] >= x && near[0] < x + w && near[1] >= y && near[1] < y + h) score *= 4;
    }
    if (score > bestScore) {
      bestScore = score;
      best = l;
    }
  }
  if (best < 0) return null;
  return {
    label: best,
    // Copied: a view into the WebAssembly heap goes stale when a later allocation grows it.
    labels: new Int32Array(labels.data32S as Int32Array),
    box: [
      stats.intAt(best, cv.CC_STAT_LEFT),
      stats.intAt(best, cv.CC_STAT_TOP),
      stats.intAt(best, cv.CC_STAT_WIDTH),
      stats.intAt(best, cv.CC_STAT_HEIGHT),
    ] as [number, number, number, number],
    centroid: [centroids.doubleAt(best, 0), centroids.doubleAt(best, 1)] as Point,
  };
}

function outerContour(cv: any, blob: { label: number; labels: Int32Array }, width: number, height: number, openPx: number, own: Own): Point[] {
  const only = own(new cv.Mat(height, width, cv.CV_8UC1, new cv.Scalar(0)));
  const od = only.data as Uint8Array;
  for (let i = 0; i < width * height; i++) od[i] = blob.labels[i] === blob.label ? 255 : 0;
  // Spots of a patterned table touching the block and the first stretch of a thread would pull the
  // enclosing rectangle off the block's sides; a round opening wider than they are takes them off.
  morphOctagon(cv, only, openPx, 'open', own);
  const contours = own(new cv.MatVector());
  const hierarchy = own(new cv.Mat());
  cv.findContours(only, contours, hierarchy, cv.RETR_EXTERNAL, cv.CHAIN_APPROX_NONE);
  let best: Point[] = [];
  for (let i = 0; i < contours.size(); i++) {
    const c = own(contours.get(i));
    if (c.rows <= best.length) continue;
    const d = c.data32S as Int32Array;
    best = [];
    for (let k = 0; k < c.rows; k++) best.push([d[2 * k], d[2 * k + 1]]);
  }
  return best;
}

/**
 * Views the table square-on to the block's enclosing rectangle and looks closely only at four strips,
 * one across each side: the inside of the block and the table beyond never matter for its size.
 */
function fitBlockEdges(cv: any, photo: Pyramid, H: Homography, coarse: Coarse, own: Own): { cornersMm: Point[] } | { reason: RefusalReason } {
  const f = RECTIFIED_PX_PER_MM;
  const outline = own(cv.matFromArray(coarse.outlineMm.length, 1, cv.CV_32FC2, coarse.outlineMm.flat()));
  const rect = cv.minAreaRect(outline);
  const theta = (rect.angle * PI) / 180;
  const [c, s] = [cos(theta), sin(theta)];
  const [cx, cy] = [rect.center.x, rect.center.y];
  const [hw, hh] = [rect.size.width / 2, rect.size.height / 2];
  const M = STRIP_HALF_MM + 1;
  // Real mm → pixels of a view whose axes run along the rectangle's sides, M mm of table around it.
  const toAligned: Homography = [
    f * c,
    f * s,
    f * (-cx * c - cy * s + hw + M) - 0.5,
    -f * s,
    f * c,
    f * (cx * s - cy * c + hh + M) - 0.5,
    0,
    0,
    1,
  ];
  const fullW = ceil(f * (2 * hw + 2 * M));
  const fullH = ceil(f * (2 * hh + 2 * M));
  const points = applyHomography(toAligned, coarse.outlineMm);
  const sides = classifyBySide(
    points,
    { center: [f * (hw + M) - 0.5, f * (hh + M) - 0.5], width: 2 * hw * f, height: 2 * hh * f, angleDeg: 0 },
    // Wide enough for a block 1/4 inch out of square, whose sides stray from the enclosing rectangle.
    { cornerFraction: 0.1, maxOffset: 8 * f },
  );
  const centre: Point = [f * (hw + M) - 0.5, f * (hh + M) - 0.5];
  const band = round(2 * STRIP_HALF_MM * f);
  // Top, right, bottom, left: each strip's origin in the aligned view and its size.
  const strips: [number, number, number, number][] = [
    [0, round(f * (M - STRIP_HALF_MM)), fullW, band],
    [round(f * (M + 2 * hw - STRIP_HALF_MM)), 0, band, fullH],
    [0, round(f * (M + 2 * hh - STRIP_HALF_MM)), fullW, band],
    [round(f * (M - STRIP_HALF_MM)), 0, band, fullH],
  ];
  const lines: Line[] = [];
  for (let side = 0; side < 4; side++) {
    const [ox, oy, w, h] = strips[side];
    const shift: Homography = [1, 0, -ox, 0, 1, -oy, 0, 0, 1];
    const strip = rectify(cv, photo, H, multiplyHomography(shift, toAligned), w, h, own);
    const lab = toLab(cv, strip.view, 0.6, own);
    const dist = labDistance(lab, coarse.centres);
    const beyond = coarse.centres.length === coarse.tableCentres.length ? dist : labDistance(lab, coarse.tableCentres);
    const foot = bytes(strip.footprint);
    // Off the photo there is nothing to see: make it look like table so no edge is found there.
    for (let i = 0; i < dist.length; i++) if (!foot[i]) dist[i] = beyond[i] = 0;
    const pts = points.filter((_, i) => sides[i] === side).map(([x, y]) => [x - ox, y - oy] as Point);
    if (pts.length < 10) return { reason: 'block_not_found' };
    const stripCentre: Point = [centre[0] - ox, centre[1] - oy];
    let line = fitLine(cv, pts, own);
    // Twice: the second pass searches across a line already within a fraction of a millimetre.
    for (let pass = 0; pass < 2; pass++) {
      // The first pass starts from the coarse view's line, good to a couple of millimetres.
      const searchMm = pass === 0 ? 2 * EDGE_SEARCH_MM : EDGE_SEARCH_MM;
      const { points: refined, outside } = refineEdge(line, stripCentre, pts, dist, beyond, w, h, f, searchMm);
      if (refined.length < 20) return { reason: 'block_not_found' };
      // Beyond a true edge lies table. Something else there means only part of the block stood out
      // from a patterned table, and measuring that part would report a wrong size.
      // Judged once the edge is found to a fraction of a millimetre: the rough line's band may still hold
      // the blurred edge itself.
      if (pass === 1 && outside > coarse.tableLevel + OUTSIDE_SLACK) return { reason: 'low_contrast' };
      line = robustLine(cv, refined, own);
    }
    lines.push({ direction: line.direction, point: [line.point[0] + ox, line.point[1] + oy] });
  }
  const fromAligned = invertHomography(toAligned);
  const corners: Point[] = [];
  for (let side = 0; side < 4; side++) {
    const p = lineIntersection(lines[side], lines[(side + 3) % 4]);
    if (!p) return { reason: 'block_not_found' };
    corners.push(applyHomography(fromAligned, [p])[0]);
  }
  return { cornersMm: corners };
}

function fitLine(cv: any, pts: Point[], own: Own, dist = cv.DIST_HUBER): Line {
  const m = own(cv.matFromArray(pts.length, 1, cv.CV_32FC2, pts.flat()));
  const line = own(new cv.Mat());
  cv.fitLine(m, line, dist, 0, 0.01, 0.01);
  const d = line.data32F as Float32Array;
  return { direction: [d[0], d[1]], point: [d[2], d[3]] };
}

/** Huber fit, then drop what lies off it by more than 3 robust sigmas (threads, fray) and fit again. */
function robustLine(cv: any, pts: Point[], own: Own): Line {
  let line = fitLine(cv, pts, own);
  for (let pass = 0; pass < 2; pass++) {
    const [nx, ny] = [-line.direction[1], line.direction[0]];
    const res = pts.map(([x, y]) => (x - line.point[0]) * nx + (y - line.point[1]) * ny);
    const absRes = res.map(abs).sort((a, b) => a - b);
    const sigma = 1.4826 * absRes[floor(absRes.length / 2)];
    const limit = max(3 * sigma, 0.3);
    const kept = pts.filter((_, i) => abs(res[i]) <= limit);
    if (kept.length < 20) break;
    line = fitLine(cv, kept, own, cv.DIST_L2);
  }
  return line;
}

function outwardNormal(line: Line, centre: Point): Point {
  const len = hypot(line.direction[0], line.direction[1]);
  let nx = -line.direction[1] / len;
  let ny = line.direction[0] / len;
  if ((line.point[0] - centre[0]) * nx + (line.point[1] - centre[1]) * ny < 0) {
    nx = -nx;
    ny = -ny;
  }
  return [nx, ny];
}

/**
 * Walks along a roughly fitted edge and, across it, finds where the colour distance from the table
 * crosses halfway between the fabric's and the table's local levels: a sub-pixel edge point that a
 * threshold's bias and the mask's pixel steps do not move.
 */
function refineEdge(
  line: Line,
  centre: Point,
  sidePoints: Point[],
  dist: Float32Array,
  beyond: Float32Array,
  width: number,
  height: number,
  f: number,
  searchMm: number,
): { points: Point[]; outside: number } {
  const len = hypot(line.direction[0], line.direction[1]);
  const [dx, dy] = [line.direction[0] / len, line.direction[1] / len];
  const [nx, ny] = outwardNormal(line, centre);
  // Only as far as this side's own contour points reach: they already stop short of the corners.
  const along = sidePoints.map(([x, y]) => (x - line.point[0]) * dx + (y - line.point[1]) * dy);
  const tFrom = min(...along);
  const tTo = max(...along);
  const sample = (x: number, y: number, map = dist): number => {
    if (x < 0 || y < 0 || x >= width - 1 || y >= height - 1) return NaN;
    const x0 = floor(x);
    const y0 = floor(y);
    const fx = x - x0;
    const fy = y - y0;
    const i = y0 * width + x0;
    return (map[i] * (1 - fx) + map[i + 1] * fx) * (1 - fy) + (map[i + width] * (1 - fx) + map[i + width + 1] * fx) * fy;
  };
  const R = round(searchMm * f);
  const out: Point[] = [];
  const outsides: number[] = [];
  const profile = new Float32Array(2 * R + 1);
  const outerFrom = 2 * R + 1 - round(R * 0.6);
  const farSide = new Float32Array(2 * R + 1 - outerFrom);
  for (let t = tFrom; t <= tTo; t += 1) {
    const bx = line.point[0] + dx * t;
    const by = line.point[1] + dy * t;
    if (bx < R || by < R || bx >= width - R || by >= height - R) continue;
    let valid = true;
    for (let k = -R; k <= R; k++) {
      const v = sample(bx + nx * k, by + ny * k);
      if (Number.isNaN(v)) {
        valid = false;
        break;
      }
      profile[k + R] = v;
    }
    if (!valid) continue;
    const inner = median(profile.subarray(0, round(R * 0.6)));
    const outer = median(profile.subarray(outerFrom));
    if (beyond === dist) outsides.push(outer);
    else {
      for (let k = outerFrom; k <= 2 * R; k++) farSide[k - outerFrom] = sample(bx + nx * (k - R), by + ny * (k - R), beyond);
      outsides.push(median(farSide));
    }
    if (inner - outer < MIN_CONTRAST) continue;
    const level = (inner + outer) / 2;
    // The crossing nearest the rough line, fabric side to table side.
    let bestK = NaN;
    for (let k = -R; k < R; k++) {
      const a = profile[k + R] - level;
      const b = profile[k + R + 1] - level;
      if (a >= 0 && b < 0) {
        const pos = k + a / (a - b);
        if (Number.isNaN(bestK) || abs(pos) < abs(bestK)) bestK = pos;
      }
    }
    if (Number.isNaN(bestK) || abs(bestK) > R * 0.7) continue;
    out.push([bx + nx * bestK, by + ny * bestK]);
  }
  return { points: out, outside: percentile(outsides, 0.5) };
}

function nearestIndex(p: number[], centres: number[][]): number {
  let best = 0;
  let bestD = Infinity;
  centres.forEach((c, k) => {
    const d = (p[0] - c[0]) ** 2 + (p[1] - c[1]) ** 2 + (p[2] - c[2]) ** 2;
    if (d < bestD) {
      bestD = d;
      best = k;
    }
  });
  return best;
}

function nearest(p: number[], centres: number[][]): number {
  return sqrt(min(...centres.map((c) => (p[0] - c[0]) ** 2 + (p[1] - c[1]) ** 2 + (p[2] - c[2]) ** 2)));
}

function percentile(values: number[], q: number): number {
  if (!values.length) return 0;
  const s = [...values].sort((a, b) => a - b);
  return s[min(s.length - 1, floor(q * s.length))];
}

/** A copy: a view into the WebAssembly heap goes stale when a later allocation grows it. */
function bytes(mat: any): Uint8Array {
  return new Uint8Array(mat.data as Uint8Array);
}

function median(values: Float32Array): number {
  const s = values.slice().sort();
  return s[floor(s.length / 2)];
}
