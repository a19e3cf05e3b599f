/**
 * Synthetic photographs of a quilt block beside the reference card, with known truth, for the
 * measurement's tests and accuracy benchmark.
 *
 *   npx tsx api/scripts/generate-photo-fixtures.ts [out-dir] [--valid 40] [--refuse 10] [--seed selvage]
 *
 * Writes NNN.jpg and truth.json into out-dir (default `.data/photo-fixtures`, never committed).
 * A scene is drawn top-down on the table's plane in millimetres (the plane is the truth), then
 * photographed by a pinhole camera with roll, tilt, mild barrel distortion, blur, uneven light,
 * noise and JPEG loss. Polygons are rasterised with exact horizontal and 1/4-px vertical coverage
 * because OpenCV's own fillPoly draws shapes about a pixel too fat, which would bias the truth.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import seedrandom from 'seedrandom';
import { CARD } from '../src/size-check/card-geometry';
import {
  applyHomography,
  cameraHomography,
  diagonals,
  invertHomography,
  quadSize,
  type Homography,
  type Point,
} from '../src/size-check/measure/geometry';
import { loadOpenCv, type OpenCv } from '../src/size-check/measure/opencv';

// Under jest's sandbox every `Math.` lookup costs ~150 ns, which dominates per-pixel loops: bind them once.
const { PI, abs, atan2, ceil, cos, exp, floor, hypot, log, max, min, pow, round, sin, sqrt } = Math;

const INCH = 25.4;

export type RefuseReason =
  | 'card_not_found'
  | 'block_not_found'
  | 'block_touches_edge'
  | 'too_blurry'
  | 'too_dark'
  | 'low_contrast'
  | 'too_small';

export type Background = 'mat' | 'wood' | 'white' | 'busy';
export type Print = 'solid' | 'pieced' | 'busy';

export interface SceneSpec {
  background: Background;
  /** Unfinished size in inches (finished + 1/2, TRADE.md §1.1). */
  block: { widthIn: number; heightIn: number; print: Print; outOfSquareMm: number; rotationDeg: number; threads: number } | null;
  card: { printScale: number; rotationDeg: number; side: 'right' | 'left' | 'below' | 'above'; framing: 'full' | 'half' | 'none' };
  camera: {
    megapixels: number;
    portrait: boolean;
    rollDeg: number;
    tiltDeg: number;
    tiltAxisDeg: number;
    /** Radial distortion at the frame's corner, as a fraction of the radius (negative = barrel). */
    barrel: number;
    blurPx: number;
    noise: number;
    /** Strength of the light gradient and of a soft shadow, 0–1. */
    light: number;
    shadow: number;
    exposure: number;
    jpegQuality: number;
    /** How much of the frame the scene fills. */
    fill: number;
  };
  /** Push the block past the frame's edge. */
  blockOffFrame?: boolean;
  /** Make the block the background's colour. */
  camouflage?: boolean;
  expect: 'measure' | RefuseReason;
}

export interface SceneTruth {
  expect: 'measure' | RefuseReason;
  printScale: number;
  widthMm: number | null;
  heightMm: number | null;
  diagonalsMm: [number, number] | null;
  diagonalDifferenceMm: number | null;
  /** Block corners TL, TR, BR, BL in the photo, in OpenCV's pixel convention (centres on integers). */
  cornersPx: Point[] | null;
  /** Plane mm → undistorted photo px. */
  homography: Homography;
  spec: SceneSpec;
}

export interface RenderedScene {
  rgba: Uint8ClampedArray;
  width: number;
  height: number;
  truth: SceneTruth;
}

type RGB = [number, number, number];

const FABRICS: RGB[] = [
  [190, 40, 52], [38, 52, 112], [222, 170, 40], [28, 138, 140], [228, 118, 160], [230, 110, 40],
  [110, 60, 140], [140, 188, 230], [242, 232, 202], [32, 32, 38], [90, 150, 70], [160, 30, 90],
];
const BACKGROUND_BASE: Record<Background, RGB[]> = {
  mat: [[34, 104, 78], [205, 222, 170]],
  wood: [[188, 138, 88], [138, 94, 56]],
  white: [[236, 236, 231]],
  busy: [[224, 214, 190], [70, 110, 160], [200, 80, 60], [60, 60, 60]],
};

function rgbDistance(a: RGB, b: RGB): number {
  return hypot(a[0] - b[0], a[1] - b[1], a[2] - b[2]);
}

/** A canvas of RGBA bytes whose pixel (i, j) covers [x0 + i, x0 + i + 1) × [y0 + j, …) in texture px. */
interface Canvas {
  data: Uint8ClampedArray;
  width: number;
  height: number;
  x0: number;
  y0: number;
}

const SUBROWS = 4;

/**
 * Union coverage (0–1) of polygons over their bounding box: even-odd spans on 4 sub-rows per pixel,
 * each span adding its exact horizontal overlap with every pixel it crosses.
 */
function coverage(polys: Point[][]): { cov: Float32Array; x0: number; y0: number; w: number; h: number } | null {
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (const poly of polys)
    for (const [x, y] of poly) {
      if (x < minX) minX = x;
      if (y < minY) minY = y;
      if (x > maxX) maxX = x;
      if (y > maxY) maxY = y;
    }
  if (!Number.isFinite(minX)) return null;
  const x0 = floor(minX);
  const y0 = floor(minY);
  const w = ceil(maxX) - x0 + 1;
  const h = ceil(maxY) - y0 + 1;
  const cov = new Float32Array(w * h);
  const xs: number[] = [];
  for (const poly of polys) {
    let pMinY = Infinity;
    let pMaxY = -Infinity;
    for (const [, y] of poly) {
      pMinY = min(pMinY, y);
      pMaxY = max(pMaxY, y);
    }
    const rowStart = max(0, floor(pMinY) - y0);
    const rowEnd = min(h - 1, ceil(pMaxY) - y0);
    for (let row = rowStart; row <= rowEnd; row++) {
      for (let k = 0; k < SUBROWS; k++) {
        const ys = y0 + row + (k + 0.5) / SUBROWS;
        xs.length = 0;
        for (let i = 0, n = poly.length; i < n; i++) {
          const [ax, ay] = poly[i];
          const [bx, by] = poly[(i + 1) % n];
          if (ay === by) continue;
          if ((ys >= ay && ys < by) || (ys >= by && ys < ay)) xs.push(ax + ((ys - ay) * (bx - ax)) / (by - ay));
        }
        xs.sort((a, b) => a - b);
        for (let s = 0; s + 1 < xs.length; s += 2) {
          const a = xs[s] - x0;
          const b = xs[s + 1] - x0;
          const ia = floor(a);
          const ib = floor(b);
          const base = row * w;
          const wgt = 1 / SUBROWS;
          if (ia === ib) {
            cov[base + ia] += (b - a) * wgt;
            continue;
          }
          cov[base + ia] += (ia + 1 - a) * wgt;
          for (let i = ia + 1; i < ib; i++) cov[base + i] += wgt;
          if (ib < w) cov[base + ib] += (b - ib) * wgt;
        }
      }
    }
  }
  return { cov, x0, y0, w, h };
}

function fillPolygons(canvas: Canvas, polys: Point[][], colour: RGB, alpha = 1) {
  const c = coverage(polys);
  if (!c) return;
  for (let j = 0; j < c.h; j++) {
    const cy = c.y0 + j - canvas.y0;
    if (cy < 0 || cy >= canvas.height) continue;
    for (let i = 0; i < c.w; i++) {
      const a = min(1, c.cov[j * c.w + i]) * alpha;
      if (a <= 0) continue;
      const cx = c.x0 + i - canvas.x0;
      if (cx < 0 || cx >= canvas.width) continue;
      const o = (cy * canvas.width + cx) * 4;
      canvas.data[o] = canvas.data[o] * (1 - a) + colour[0] * a;
      canvas.data[o + 1] = canvas.data[o + 1] * (1 - a) + colour[1] * a;
      canvas.data[o + 2] = canvas.data[o + 2] * (1 - a) + colour[2] * a;
    }
  }
}

function circle(cx: number, cy: number, r: number, n = 14): Point[] {
  return Array.from({ length: n }, (_, k) => [cx + r * cos((2 * PI * k) / n), cy + r * sin((2 * PI * k) / n)] as Point);
}

/** A thread or bar of given width along a polyline, as one quad per segment. */
function strokePolys(path: Point[], width: number): Point[][] {
  const out: Point[][] = [];
  for (let i = 0; i + 1 < path.length; i++) {
    const [ax, ay] = path[i];
    const [bx, by] = path[i + 1];
    const len = hypot(bx - ax, by - ay) || 1;
    const nx = (-(by - ay) / len) * (width / 2);
    const ny = ((bx - ax) / len) * (width / 2);
    out.push([[ax + nx, ay + ny], [bx + nx, by + ny], [bx - nx, by - ny], [ax - nx, ay - ny]]);
  }
  return out;
}

function rotate([x, y]: Point, deg: number): Point {
  const a = (deg * PI) / 180;
  return [x * cos(a) - y * sin(a), x * sin(a) + y * cos(a)];
}

function gaussian(rng: () => number): number {
  return sqrt(-2 * log(rng() || 1e-12)) * cos(2 * PI * rng());
}

/** Where things lie on the table, in plane mm. */
interface Layout {
  blockCorners: Point[] | null;
  blockToPlane: ((p: Point) => Point) | null;
  blockLocal: { w: number; h: number; shear: number } | null;
  cardToPlane: ((p: Point) => Point) | null;
  cardCorners: Point[] | null;
  bbox: [number, number, number, number];
}

function layout(spec: SceneSpec, rng: () => number): Layout {
  let blockCorners: Point[] | null = null;
  let blockToPlane: ((p: Point) => Point) | null = null;
  let blockLocal: Layout['blockLocal'] = null;
  const pts: Point[] = [];
  if (spec.block) {
    const w = spec.block.widthIn * INCH;
    const h = spec.block.heightIn * INCH;
    const shear = spec.block.outOfSquareMm;
    blockLocal = { w, h, shear };
    // Sheared so the bottom edge slides: the diagonals then differ while top and bottom stay w long.
    const rot = spec.block.rotationDeg;
    const toPlane = (p: Point): Point => {
      const sheared: Point = [p[0] + (shear * p[1]) / h - w / 2 - shear / 2, p[1] - h / 2];
      return rotate(sheared, rot);
    };
    blockToPlane = toPlane;
    blockCorners = [[0, 0], [w, 0], [w, h], [0, h]].map((p) => toPlane(p as Point));
    pts.push(...blockCorners);
  }
  let cardToPlane: ((p: Point) => Point) | null = null;
  let cardCorners: Point[] | null = null;
  if (spec.card.framing !== 'none') {
    const s = spec.card.printScale;
    const cw = CARD.widthMm * s;
    const ch = CARD.heightMm * s;
    const local = [[0, 0], [cw, 0], [cw, ch], [0, ch]].map((p) => rotate([p[0] - cw / 2, p[1] - ch / 2], spec.card.rotationDeg));
    const bx = blockCorners ? max(...blockCorners.map((p) => abs(p[0]))) : 0;
    const by = blockCorners ? max(...blockCorners.map((p) => abs(p[1]))) : 0;
    const ex = max(...local.map((p) => abs(p[0])));
    const ey = max(...local.map((p) => abs(p[1])));
    const gap = 12 + rng() * 30;
    const slide = (rng() - 0.5) * 0.6;
    const centre: Point =
      spec.card.side === 'right' ? [bx + gap + ex, slide * by] :
      spec.card.side === 'left' ? [-(bx + gap + ex), slide * by] :
      spec.card.side === 'below' ? [slide * bx, by + gap + ey] : [slide * bx, -(by + gap + ey)];
    cardToPlane = (p: Point): Point => {
      const r = rotate([p[0] * s - cw / 2, p[1] * s - ch / 2], spec.card.rotationDeg);
      return [r[0] + centre[0], r[1] + centre[1]];
    };
    cardCorners = [[0, 0], [CARD.widthMm, 0], [CARD.widthMm, CARD.heightMm], [0, CARD.heightMm]].map((p) => cardToPlane!(p as Point));
    pts.push(...cardCorners);
  }
  if (!pts.length) pts.push([-150, -150], [150, 150]);
  const margin = 25;
  const bbox: [number, number, number, number] = [
    min(...pts.map((p) => p[0])) - margin,
    min(...pts.map((p) => p[1])) - margin,
    max(...pts.map((p) => p[0])) + margin,
    max(...pts.map((p) => p[1])) + margin,
  ];
  return { blockCorners, blockToPlane, blockLocal, cardToPlane, cardCorners, bbox };
}

/** Barrel distortion about the frame's centre, normalised so `k` is the shift at the corner. */
function distort(p: Point, cx: number, cy: number, rNorm: number, k: number): Point {
  const dx = (p[0] - cx) / rNorm;
  const dy = (p[1] - cy) / rNorm;
  const f = 1 + k * (dx * dx + dy * dy);
  return [cx + dx * f * rNorm, cy + dy * f * rNorm];
}

export async function renderScene(spec: SceneSpec, seed: string | number): Promise<RenderedScene> {
  const cv = await loadOpenCv();
  const rng = seedrandom(String(seed));
  const lay = layout(spec, rng);
  const cam = spec.camera;

  // Frame.
  const aspect = 4 / 3;
  let width = round(sqrt(cam.megapixels * 1e6 * aspect));
  let height = round(width / aspect);
  if (cam.portrait) [width, height] = [height, width];
  const [bx0, by0, bx1, by1] = lay.bbox;
  const target: Point = [(bx0 + bx1) / 2, (by0 + by1) / 2];
  const sceneDiag = hypot(bx1 - bx0, by1 - by0);
  const base = { rollDeg: cam.rollDeg, tiltDeg: cam.tiltDeg, tiltAxisDeg: cam.tiltAxisDeg, target, distanceMm: sceneDiag * 1.1, principalPoint: [0, 0] as Point };
  const unit = applyHomography(cameraHomography({ ...base, focalPx: 1 }), [[bx0, by0], [bx1, by0], [bx1, by1], [bx0, by1]]);
  const ux = max(...unit.map((p) => p[0])) - min(...unit.map((p) => p[0]));
  const uy = max(...unit.map((p) => p[1])) - min(...unit.map((p) => p[1]));
  const focalPx = min((width * cam.fill) / ux, (height * cam.fill) / uy);
  let H = cameraHomography({ ...base, focalPx, principalPoint: [width / 2, height / 2] });
  // Centre the scene's projection, as a photographer would (a shifted principal point, like a crop).
  const proj = applyHomography(H, [[bx0, by0], [bx1, by0], [bx1, by1], [bx0, by1]]);
  let shiftX = width / 2 - (min(...proj.map((p) => p[0])) + max(...proj.map((p) => p[0]))) / 2;
  let shiftY = height / 2 - (min(...proj.map((p) => p[1])) + max(...proj.map((p) => p[1]))) / 2;
  if (spec.card.framing === 'half' && lay.cardCorners && lay.cardToPlane) {
    // Put the card's centre on the frame's nearest edge: half of it (two markers) falls outside.
    const [c] = applyHomography(H, [lay.cardToPlane([CARD.widthMm / 2, CARD.heightMm / 2])]);
    const cx = c[0] + shiftX;
    const cy = c[1] + shiftY;
    const edges = [cx, width - cx, cy, height - cy];
    const nearest = edges.indexOf(min(...edges));
    if (nearest === 0) shiftX -= cx;
    else if (nearest === 1) shiftX += width - cx;
    else if (nearest === 2) shiftY -= cy;
    else shiftY += height - cy;
  }
  if (spec.blockOffFrame && lay.blockCorners) {
    // Slide the frame so the block's far side is cut off by about 4% of the frame.
    const bc = applyHomography(H, lay.blockCorners).map(([x, y]) => [x + shiftX, y + shiftY] as Point);
    const cardSide = spec.card.side;
    if (cardSide === 'right') shiftX -= min(...bc.map((p) => p[0])) + 0.04 * width;
    else if (cardSide === 'left') shiftX += width * 1.04 - max(...bc.map((p) => p[0]));
    else if (cardSide === 'below') shiftY -= min(...bc.map((p) => p[1])) + 0.04 * height;
    else shiftY += height * 1.04 - max(...bc.map((p) => p[1]));
  }
  H = [
    H[0] + shiftX * H[6], H[1] + shiftX * H[7], H[2] + shiftX * H[8],
    H[3] + shiftY * H[6], H[4] + shiftY * H[7], H[5] + shiftY * H[8],
    H[6], H[7], H[8],
  ];
  const Hinv = invertHomography(H);
  const cx = width / 2;
  const cy = height / 2;
  const rNorm = hypot(cx, cy);

  // The plane region the photo sees, and how finely to draw it: a little finer than the photo samples it.
  const border: Point[] = [];
  for (let k = 0; k <= 20; k++) border.push([(k / 20) * width, 0], [(k / 20) * width, height], [0, (k / 20) * height], [width, (k / 20) * height]);
  const seen = applyHomography(Hinv, border);
  const ox = min(...seen.map((p) => p[0])) - 10;
  const oy = min(...seen.map((p) => p[1])) - 10;
  const ex = max(...seen.map((p) => p[0])) + 10;
  const ey = max(...seen.map((p) => p[1])) + 10;
  const probe = applyHomography(H, [[target[0], target[1]], [target[0] + 1, target[1]], ...seen.slice(0, 4)]);
  let photoPxPerMm = hypot(probe[1][0] - probe[0][0], probe[1][1] - probe[0][1]);
  for (const s of seen) {
    const [a, b] = applyHomography(H, [s, [s[0] + 1, s[1]]]);
    photoPxPerMm = max(photoPxPerMm, hypot(b[0] - a[0], b[1] - a[1]));
  }
  // Capped in pixels too: a steep view sees a lot of table, and the WebAssembly heap has limits.
  const texRes = min(12, max(3, photoPxPerMm * 1.3), sqrt(36e6 / ((ex - ox) * (ey - oy))));
  const tw = ceil((ex - ox) * texRes);
  const th = ceil((ey - oy) * texRes);
  const tex: Canvas = { data: new Uint8ClampedArray(tw * th * 4), width: tw, height: th, x0: 0, y0: 0 };
  const toTex = (p: Point): Point => [(p[0] - ox) * texRes, (p[1] - oy) * texRes];

  drawBackground(cv, tex, spec.background, rng, ox, oy, texRes);
  let blockColours: RGB[] = [];
  if (lay.blockToPlane && lay.blockLocal && spec.block) blockColours = drawBlock(tex, spec, lay, rng, toTex, texRes);
  if (lay.cardToPlane) drawCard(cv, tex, lay.cardToPlane, toTex);

  // Photograph: for each photo pixel, undo the distortion, then map back to the plane.
  const texMat = new cv.Mat(th, tw, cv.CV_8UC4);
  const mapX = new cv.Mat(height, width, cv.CV_32FC1);
  const mapY = new cv.Mat(height, width, cv.CV_32FC1);
  const photo = new cv.Mat();
  try {
    texMat.data.set(tex.data);
    // Band-limit the drawing to the photo's sampling so fine grid lines and prints do not alias.
    const pre = (0.5 * texRes) / max(1, photoPxPerMm * 0.8);
    if (pre > 0.6) cv.GaussianBlur(texMat, texMat, new cv.Size(0, 0), pre, pre, cv.BORDER_REPLICATE);
    const mx = new Float32Array(width * height);
    const my = new Float32Array(width * height);
    const k = cam.barrel;
    const [h0, h1, h2, h3, h4, h5, h6, h7, h8] = Hinv;
    for (let y = 0; y < height; y++) {
      for (let x = 0; x < width; x++) {
        const dx = (x - cx) / rNorm;
        const dy = (y - cy) / rNorm;
        const rd2 = dx * dx + dy * dy;
        let f = 1;
        for (let it = 0; it < 4; it++) f = 1 / (1 + k * rd2 * f * f);
        const ux = cx + dx * f * rNorm;
        const uy = cy + dy * f * rNorm;
        const w = h6 * ux + h7 * uy + h8;
        const X = (h0 * ux + h1 * uy + h2) / w;
        const Y = (h3 * ux + h4 * uy + h5) / w;
        const i = y * width + x;
        mx[i] = (X - ox) * texRes - 0.5;
        my[i] = (Y - oy) * texRes - 0.5;
      }
    }
    mapX.data32F.set(mx);
    mapY.data32F.set(my);
    cv.remap(texMat, photo, mapX, mapY, cv.INTER_LINEAR, cv.BORDER_REPLICATE, new cv.Scalar());
    if (cam.blurPx > 0.05) cv.GaussianBlur(photo, photo, new cv.Size(0, 0), cam.blurPx, cam.blurPx, cv.BORDER_REPLICATE);
    const rgba = new Uint8ClampedArray(photo.data);
    light(rgba, width, height, spec, rng);
    return {
      rgba,
      width,
      height,
      truth: makeTruth(spec, lay, H, (p) => distort(p, cx, cy, rNorm, k), blockColours),
    };
  } finally {
    texMat.delete();
    mapX.delete();
    mapY.delete();
    photo.delete();
  }
}

function makeTruth(spec: SceneSpec, lay: Layout, H: Homography, dist: (p: Point) => Point, _colours: RGB[]): SceneTruth {
  const corners = lay.blockCorners;
  const size = corners ? quadSize(corners) : null;
  const diag = corners ? diagonals(corners) : null;
  return {
    expect: spec.expect,
    printScale: spec.card.printScale,
    widthMm: size?.width ?? null,
    heightMm: size?.height ?? null,
    diagonalsMm: diag,
    diagonalDifferenceMm: diag ? abs(diag[0] - diag[1]) : null,
    cornersPx: corners ? applyHomography(H, corners).map(dist) : null,
    homography: H,
    spec,
  };
}

function drawBackground(cv: OpenCv, tex: Canvas, kind: Background, rng: () => number, ox: number, oy: number, res: number) {
  const { data, width, height } = tex;
  const angle = rng() * PI;
  const ca = cos(angle);
  const sa = sin(angle);
  const phase = rng() * 1000;
  const [c0, c1] = BACKGROUND_BASE[kind];
  const halfLine = 0.2;
  for (let j = 0; j < height; j++) {
    const Y = oy + (j + 0.5) / res;
    for (let i = 0; i < width; i++) {
      const X = ox + (i + 0.5) / res;
      let r: number;
      let g: number;
      let b: number;
      if (kind === 'mat') {
        const u = X * ca + Y * sa + phase;
        const v = -X * sa + Y * ca + phase;
        const du = abs(u - round(u / INCH) * INCH);
        const dv = abs(v - round(v / INCH) * INCH);
        const line = max(0, min(1, 0.5 + (halfLine - min(du, dv)) * res));
        r = c0[0] * (1 - line) + c1[0] * line;
        g = c0[1] * (1 - line) + c1[1] * line;
        b = c0[2] * (1 - line) + c1[2] * line;
      } else if (kind === 'wood') {
        const u = X * ca + Y * sa;
        const v = -X * sa + Y * ca;
        const t = v + 4 * sin(u / 53 + phase) + 1.5 * sin(u / 11 + 2 * phase);
        const s = 0.5 + 0.5 * sin((2 * PI * t) / 9);
        const m = pow(s, 3);
        r = c0[0] * (1 - m) + c1[0] * m;
        g = c0[1] * (1 - m) + c1[1] * m;
        b = c0[2] * (1 - m) + c1[2] * m;
      } else {
        r = c0[0];
        g = c0[1];
        b = c0[2];
      }
      const o = (j * width + i) * 4;
      data[o] = r;
      data[o + 1] = g;
      data[o + 2] = b;
      data[o + 3] = 255;
    }
  }
  if (kind === 'busy') {
    const colours = BACKGROUND_BASE.busy.slice(1);
    const area = (width / res) * (height / res);
    const n = round(area / 140);
    const groups: Point[][][] = colours.map(() => []);
    for (let k = 0; k < n; k++) {
      const x = rng() * width;
      const y = rng() * height;
      const r = (1.5 + rng() * 3.5) * res;
      groups[k % colours.length].push(rng() < 0.6 ? circle(x, y, r, 10) : [[x, y - r], [x + r, y + r], [x - r, y + r]]);
    }
    groups.forEach((g, k) => fillPolygons(tex, g, colours[k]));
  }
  void cv;
}

function pickFabrics(rng: () => number, background: Background, n: number): RGB[] {
  const bg = BACKGROUND_BASE[background];
  const ok = FABRICS.filter((f) => bg.every((b) => rgbDistance(f, b) > 90));
  const out: RGB[] = [];
  const pool = [...ok];
  while (out.length < n && pool.length) out.push(pool.splice(floor(rng() * pool.length), 1)[0]);
  return out;
}

function drawBlock(tex: Canvas, spec: SceneSpec, lay: Layout, rng: () => number, toTex: (p: Point) => Point, res: number): RGB[] {
  const block = spec.block!;
  const { w, h } = lay.blockLocal!;
  const toPlane = lay.blockToPlane!;
  const map = (p: Point) => toTex(toPlane(p));
  const colours = spec.camouflage
    ? [BACKGROUND_BASE[spec.background][0].map((c) => c + (rng() - 0.5) * 4) as RGB]
    : pickFabrics(rng, spec.background, block.print === 'solid' ? 1 : 4);

  // The fabric itself, drawn on a layer over the block's bounding box, then cut out by the ragged outline.
  const corners = [[0, 0], [w, 0], [w, h], [0, h]].map((p) => map(p as Point));
  const pad = 60 * res;
  const lx = floor(min(...corners.map((p) => p[0])) - pad);
  const ly = floor(min(...corners.map((p) => p[1])) - pad);
  const lw = ceil(max(...corners.map((p) => p[0])) + pad) - lx;
  const lh = ceil(max(...corners.map((p) => p[1])) + pad) - ly;
  const layer: Canvas = { data: new Uint8ClampedArray(lw * lh * 4), width: lw, height: lh, x0: lx, y0: ly };
  const base = colours[0];
  for (let i = 0; i < lw * lh; i++) {
    layer.data[i * 4] = base[0];
    layer.data[i * 4 + 1] = base[1];
    layer.data[i * 4 + 2] = base[2];
    layer.data[i * 4 + 3] = 255;
  }
  if (block.print === 'pieced') {
    // A grid of squares and half-square triangles, the way simple blocks are pieced.
    const n = 2 + floor(rng() * 3);
    for (let r = 0; r < n; r++)
      for (let c = 0; c < n; c++) {
        const [x0, y0, x1, y1] = [(c * w) / n, (r * h) / n, ((c + 1) * w) / n, ((r + 1) * h) / n];
        const a = colours[floor(rng() * colours.length)];
        fillPolygons(layer, [[[x0, y0], [x1, y0], [x1, y1], [x0, y1]].map((p) => map(p as Point))], a);
        if (rng() < 0.5) {
          const b = colours[floor(rng() * colours.length)];
          fillPolygons(layer, [[[x0, y0], [x1, y0], [x1, y1]].map((p) => map(p as Point))], b);
        }
      }
  } else if (block.print === 'busy') {
    const groups: Point[][][] = colours.map(() => []);
    const n = round((w * h) / 60);
    for (let k = 0; k < n; k++) {
      const p = map([rng() * w, rng() * h]);
      const r = (1 + rng() * 3) * res;
      groups[1 + (k % (colours.length - 1))].push(rng() < 0.7 ? circle(p[0], p[1], r, 10) : strokePolys([[p[0] - r * 2, p[1]], [p[0] + r * 2, p[1] + r]], r * 0.6)[0]);
    }
    groups.forEach((g, k) => fillPolygons(layer, g, colours[k]));
  }

  // Rotary-cut edges are straight to a fraction of a millimetre, with a little fray.
  const outline: Point[] = [];
  const sides: [Point, Point][] = [[[0, 0], [w, 0]], [[w, 0], [w, h]], [[w, h], [0, h]], [[0, h], [0, 0]]];
  for (const [a, b] of sides) {
    const len = hypot(b[0] - a[0], b[1] - a[1]);
    const steps = ceil(len / 1.5);
    const nx = (b[1] - a[1]) / len;
    const ny = -(b[0] - a[0]) / len;
    let jitter = 0;
    for (let s = 0; s < steps; s++) {
      const t = s / steps;
      jitter = 0.6 * jitter + 0.12 * gaussian(rng);
      const fray = s > 0 && rng() < 0.02 ? 0.3 + rng() * 0.5 : 0;
      const off = s === 0 ? 0 : jitter + fray;
      outline.push([a[0] + (b[0] - a[0]) * t + nx * off, a[1] + (b[1] - a[1]) * t + ny * off]);
    }
  }
  const cut = coverage([outline.map(map)])!;
  for (let j = 0; j < cut.h; j++)
    for (let i = 0; i < cut.w; i++) {
      const a = min(1, cut.cov[j * cut.w + i]);
      if (a <= 0) continue;
      const tx = cut.x0 + i;
      const ty = cut.y0 + j;
      if (tx < 0 || ty < 0 || tx >= tex.width || ty >= tex.height) continue;
      const lo = ((ty - ly) * lw + (tx - lx)) * 4;
      const o = (ty * tex.width + tx) * 4;
      for (let ch = 0; ch < 3; ch++) tex.data[o + ch] = tex.data[o + ch] * (1 - a) + layer.data[lo + ch] * a;
    }

  // Hanging threads: thin, wandering, from the edge outwards.
  for (let k = 0; k < block.threads; k++) {
    const side = sides[floor(rng() * 4)];
    const t = 0.1 + rng() * 0.8;
    const [a, b] = side;
    const len = hypot(b[0] - a[0], b[1] - a[1]);
    const nx = (b[1] - a[1]) / len;
    const ny = -(b[0] - a[0]) / len;
    let p: Point = [a[0] + (b[0] - a[0]) * t - nx * 2, a[1] + (b[1] - a[1]) * t - ny * 2];
    let dir = atan2(ny, nx) + (rng() - 0.5);
    const path: Point[] = [p];
    const threadLen = 8 + rng() * 35;
    for (let d = 0; d < threadLen; d += 1.5) {
      dir += (rng() - 0.5) * 0.5;
      p = [p[0] + cos(dir) * 1.5, p[1] + sin(dir) * 1.5];
      path.push(p);
    }
    const colour = rng() < 0.5 ? colours[floor(rng() * colours.length)] : ([235, 230, 215] as RGB);
    fillPolygons(tex, strokePolys(path.map(map), (0.25 + rng() * 0.15) * res), colour);
  }
  return colours;
}

function drawCard(cv: OpenCv, tex: Canvas, toPlane: (p: Point) => Point, toTex: (p: Point) => Point) {
  const m = (p: Point) => toTex(toPlane(p));
  const rect = (x: number, y: number, w: number, h: number): Point[] => [[x, y], [x + w, y], [x + w, y + h], [x, y + h]].map((p) => m(p as Point));
  fillPolygons(tex, [rect(0, 0, CARD.widthMm, CARD.heightMm)], [248, 248, 244]);
  const dict = (cv as any).getPredefinedDictionary((cv as any).DICT_4X4_50);
  const bits = new cv.Mat();
  const black: Point[][] = [];
  try {
    const cell = CARD.markerSizeMm / 6;
    for (const marker of CARD.markers) {
      // One pixel per cell: 4x4 data bits inside a one-cell black border.
      (cv as any).generateImageMarker(dict, marker.id, 6, bits, 1);
      for (let r = 0; r < 6; r++)
        for (let c = 0; c < 6; c++) if (bits.data[r * 6 + c] === 0) black.push(rect(marker.x + c * cell, marker.y + r * cell, cell, cell));
    }
  } finally {
    bits.delete();
    dict.delete();
  }
  const sq = CARD.testSquare;
  const line = 0.4;
  black.push(
    rect(sq.x, sq.y, sq.sizeMm, line), rect(sq.x, sq.y + sq.sizeMm - line, sq.sizeMm, line),
    rect(sq.x, sq.y, line, sq.sizeMm), rect(sq.x + sq.sizeMm - line, sq.y, line, sq.sizeMm),
  );
  for (const [bar, step, ticks] of [[CARD.inchBar, INCH / 2, 12], [CARD.cmBar, 10, 15]] as const) {
    black.push(rect(bar.x, bar.y, bar.lengthMm, 1.2));
    for (let k = 0; k <= ticks; k++) black.push(rect(bar.x + k * step - 0.2, bar.y - (k % 2 ? 2 : 4), 0.4, k % 2 ? 2 : 4));
  }
  fillPolygons(tex, black, [20, 20, 22]);
}

function light(rgba: Uint8ClampedArray, width: number, height: number, spec: SceneSpec, rng: () => number) {
  const cam = spec.camera;
  const dir = rng() * 2 * PI;
  const gx = cos(dir);
  const gy = sin(dir);
  const sx = rng() * width;
  const sy = rng() * height;
  const sr = (0.25 + rng() * 0.3) * max(width, height);
  // A cheap, seeded normal generator: seedrandom per pixel would dominate the render time.
  let state = floor(rng() * 2 ** 31) | 1;
  const uniform = () => {
    state ^= state << 13;
    state ^= state >>> 17;
    state ^= state << 5;
    return ((state >>> 0) + 0.5) / 4294967296;
  };
  let spare: number | null = null;
  const normal = () => {
    if (spare !== null) {
      const s = spare;
      spare = null;
      return s;
    }
    const r = sqrt(-2 * log(uniform()));
    const a = 2 * PI * uniform();
    spare = r * sin(a);
    return r * cos(a);
  };
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const u = ((x - width / 2) * gx + (y - height / 2) * gy) / max(width, height);
      const d2 = ((x - sx) ** 2 + (y - sy) ** 2) / (sr * sr);
      const gain = cam.exposure * (1 + cam.light * u * 1.6) * (1 - cam.shadow * exp(-d2));
      const o = (y * width + x) * 4;
      rgba[o] = rgba[o] * gain + normal() * cam.noise;
      rgba[o + 1] = rgba[o + 1] * gain + normal() * cam.noise;
      rgba[o + 2] = rgba[o + 2] * gain + normal() * cam.noise;
      rgba[o + 3] = 255;
    }
  }
}

/** A varied set: sizes from TRADE.md §1.5 (6 1/2, 9 1/2, 12 1/2 unfinished, up to 16 1/2), then must-refuse scenes. */
export function makeSceneSpecs(valid: number, refuse: number, seed: string, maxMegapixels = 12): SceneSpec[] {
  const rng = seedrandom(`${seed}:specs`);
  const pick = <T>(xs: readonly T[]): T => xs[floor(rng() * xs.length)];
  const between = (a: number, b: number) => a + rng() * (b - a);
  const sizes: [number, number][] = [[6.5, 6.5], [9.5, 9.5], [12.5, 12.5], [12.5, 12.5], [12.5, 6.5], [6.5, 12.5], [16.5, 16.5], [4.5, 4.5]];
  const out: SceneSpec[] = [];
  for (let i = 0; i < valid + refuse; i++) {
    const [widthIn, heightIn] = pick(sizes);
    const background = pick(['mat', 'wood', 'white', 'busy'] as const);
    const print = background === 'busy' ? pick(['solid', 'pieced'] as const) : pick(['solid', 'pieced', 'busy'] as const);
    const spec: SceneSpec = {
      background,
      block: { widthIn, heightIn, print, outOfSquareMm: rng() < 0.25 ? between(1.5, 5) : 0, rotationDeg: between(-12, 12), threads: floor(between(0, 5)) },
      card: { printScale: between(0.97, 1.03), rotationDeg: between(-15, 15), side: pick(['right', 'left', 'below', 'above'] as const), framing: 'full' },
      camera: {
        megapixels: between(3, maxMegapixels),
        portrait: rng() < 0.3,
        rollDeg: between(-30, 30),
        tiltDeg: between(0, 25),
        tiltAxisDeg: between(0, 360),
        barrel: -between(0, 0.01),
        blurPx: between(0.4, 1.4),
        noise: between(1, 5),
        light: between(0, 0.3),
        shadow: between(0, 0.25),
        exposure: between(0.85, 1.05),
        jpegQuality: round(between(70, 92)),
        fill: between(0.78, 0.92),
      },
      expect: 'measure',
    };
    if (i >= valid) {
      const kind = (i - valid) % 6;
      if (kind === 0) {
        spec.card.framing = 'none';
        spec.expect = 'card_not_found';
      } else if (kind === 1) {
        spec.card.framing = 'half';
        spec.expect = 'card_not_found';
      } else if (kind === 2) {
        spec.blockOffFrame = true;
        spec.expect = 'block_touches_edge';
      } else if (kind === 3) {
        spec.camera.exposure = between(0.08, 0.15);
        spec.camera.noise = 2;
        spec.expect = 'too_dark';
      } else if (kind === 4) {
        spec.camera.blurPx = 0;
        spec.expect = 'too_blurry';
      } else {
        spec.background = pick(['white', 'mat'] as const);
        spec.block!.print = 'solid';
        spec.block!.threads = 0;
        spec.camouflage = true;
        spec.expect = 'low_contrast';
      }
    }
    out.push(spec);
  }
  return out;
}

/** Blur for the must-refuse "very blurry" scenes, sized to the frame so it is blurry at any resolution. */
export function veryBlurryPx(spec: SceneSpec): number {
  return 0.006 * sqrt(spec.camera.megapixels * 1e6 * (4 / 3));
}

export async function renderForSet(spec: SceneSpec, seed: string): Promise<RenderedScene> {
  const s = spec.expect === 'too_blurry' ? { ...spec, camera: { ...spec.camera, blurPx: veryBlurryPx(spec) } } : spec;
  return renderScene(s, seed);
}

export async function encodeJpeg(scene: { rgba: Uint8ClampedArray; width: number; height: number }, quality: number): Promise<Buffer> {
  const { Jimp } = await import('jimp');
  const image = new Jimp({ width: scene.width, height: scene.height, data: Buffer.from(scene.rgba.buffer, scene.rgba.byteOffset, scene.rgba.byteLength) });
  return image.getBuffer('image/jpeg', { quality });
}

async function main() {
  const args = process.argv.slice(2);
  const flag = (name: string, fallback: string) => {
    const i = args.indexOf(`--${name}`);
    if (i < 0) return fallback;
    const v = args[i + 1];
    args.splice(i, 2);
    return v;
  };
  const valid = Number(flag('valid', '40'));
  const refuse = Number(flag('refuse', '10'));
  const seed = flag('seed', 'selvage');
  const maxMp = Number(flag('max-mp', '12'));
  const out = resolve(args[0] ?? join(__dirname, '..', '..', '.data', 'photo-fixtures'));
  mkdirSync(out, { recursive: true });
  const specs = makeSceneSpecs(valid, refuse, seed, maxMp);
  const truths: (SceneTruth & { file: string })[] = [];
  for (let i = 0; i < specs.length; i++) {
    const file = `${String(i + 1).padStart(3, '0')}.jpg`;
    const t0 = Date.now();
    const scene = await renderForSet(specs[i], `${seed}:${i}`);
    writeFileSync(join(out, file), await encodeJpeg(scene, specs[i].camera.jpegQuality));
    truths.push({ file, ...scene.truth });
    console.log(`${file} ${scene.width}x${scene.height} ${specs[i].expect} ${((Date.now() - t0) / 1000).toFixed(1)} s`);
  }
  writeFileSync(join(out, 'truth.json'), JSON.stringify(truths, null, 1));
  console.log(`wrote ${specs.length} photos and truth.json to ${out}`);
}

if (require.main === module) {
  main().catch((error) => {
    console.error(error);
    process.exit(1);
  });
}
