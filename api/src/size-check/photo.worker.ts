/**
 * Runs in a worker thread (piscina) so decoding and measuring a photo never blocks the event loop:
 * decode (EXIF orientation applied), measure, and make the display, thumbnail and overlay images.
 */
import { setPriority } from 'node:os';
import { measureBlockPhoto, type MeasureResult } from './measure/measure-photo';
import { loadOpenCv } from './measure/opencv';
import { decodePhoto, encodeJpeg, type RgbaPhoto } from './photo-codec';
import type { PhotoType } from './photo-intake';

export interface PhotoTask {
  bytes: Uint8Array;
  type: PhotoType;
  printScale: number;
}

export interface PhotoOutput {
  width: number;
  height: number;
  result: MeasureResult;
  display: Uint8Array;
  thumb: Uint8Array;
  overlay: Uint8Array | null;
  /** Where the worker's time went, for the logs and the benchmark. */
  timingsMs: Record<string, number>;
  ms: number;
}

/** Measuring at up to 3000 px on the long edge keeps a 12 MP photo fast without losing accuracy. */
const MEASURE_EDGE = 3000;
/** A phone screen 390 CSS px wide at 3 device pixels per CSS pixel, with room to zoom a little. */
const DISPLAY_EDGE = 1280;
const THUMB_EDGE = 320;

// On Linux a thread's niceness is its own: photos yield the cores to the api's request handling.
try {
  setPriority(10);
} catch {
  // Not permitted here; the pool's size still leaves a core free.
}

export default async function processPhoto(task: PhotoTask): Promise<PhotoOutput> {
  const started = performance.now();
  const timingsMs: Record<string, number> = {};
  let lap = started;
  const tick = (name: string) => {
    const now = performance.now();
    timingsMs[name] = Math.round(now - lap);
    lap = now;
  };
  const cv: any = await loadOpenCv();
  const photo = await decodePhoto(task.bytes, task.type);
  tick('decode');
  const { width, height } = photo;
  const owned: { delete(): void }[] = [];
  const own = <T extends { delete(): void }>(m: T): T => {
    owned.push(m);
    return m;
  };
  try {
    const full = own(cv.matFromImageData(photo as any));
    const shrunk = (mat: any, edge: number) => shrink(cv, mat, edge, own);
    const work = shrunk(full, MEASURE_EDGE);
    tick('prepare');
    const result = await measureBlockPhoto({ data: work.data, width: work.cols, height: work.rows }, { printScale: task.printScale });
    tick('measure');
    const display = shrunk(work, DISPLAY_EDGE);
    const thumb = shrunk(display, THUMB_EDGE);
    let overlay: Uint8Array | null = null;
    if (result.ok) {
      // Mat.clone() in this OpenCV build shares the pixels; copyTo makes a real copy.
      const over = own(new cv.Mat());
      display.copyTo(over);
      const k = display.cols / work.cols; // work pixels → display pixels
      const line = Math.max(3, Math.round(display.cols / 300));
      const poly = (points: [number, number][], rgba: number[]) => {
        const flat = points.flatMap(([x, y]) => [Math.round(x * k), Math.round(y * k)]);
        const pts = own(cv.matFromArray(points.length, 1, cv.CV_32SC2, flat));
        const list = own(new cv.MatVector());
        list.push_back(pts);
        cv.polylines(over, list, true, new cv.Scalar(...rgba), line, cv.LINE_AA);
      };
      for (const marker of result.cardCornersPx) poly(marker, [201, 154, 46, 255]);
      poly(result.cornersPx, [166, 61, 47, 255]);
      for (const [x, y] of result.cornersPx)
        cv.circle(over, new cv.Point(Math.round(x * k), Math.round(y * k)), line * 2, new cv.Scalar(29, 92, 99, 255), -1, cv.LINE_AA);
      overlay = await encodeJpeg(rgba(over), 82);
    }
    const displayJpeg = await encodeJpeg(rgba(display), 82);
    const thumbJpeg = await encodeJpeg(rgba(thumb), 75);
    tick('derive');
    return {
      width,
      height,
      result,
      display: displayJpeg,
      thumb: thumbJpeg,
      overlay,
      timingsMs,
      ms: Math.round(performance.now() - started),
    };
  } finally {
    for (const m of owned.reverse()) m.delete();
  }
}

/**
 * A smaller copy of `mat` with its long edge at most `edge` px. Halving with a Gaussian is fast and
 * does not alias; the last step, by less than a quarter, is bilinear. (OpenCV's area resampling looks
 * the same here and takes several times as long.) New mats are handed to `own` for deletion.
 */
function shrink(cv: any, mat: any, edge: number, own: <T extends { delete(): void }>(m: T) => T): any {
  const f = Math.min(1, edge / Math.max(mat.cols, mat.rows));
  if (f >= 0.999) return mat;
  const target = new cv.Size(Math.round(mat.cols * f), Math.round(mat.rows * f));
  let out = mat;
  while (out.cols * 0.75 > target.width) {
    const half = own(new cv.Mat());
    cv.pyrDown(out, half);
    out = half;
  }
  if (out.cols === target.width && out.rows === target.height) return out;
  const resized = own(new cv.Mat());
  cv.resize(out, resized, target, 0, 0, cv.INTER_LINEAR);
  return resized;
}

export interface ResizeTask {
  bytes: Uint8Array;
  type: PhotoType;
}

export interface ResizeOutput {
  width: number;
  height: number;
  display: Uint8Array;
  thumb: Uint8Array;
}

/** A photo that is only shown, not measured (a show entry): the display and thumbnail images. */
export async function resizePhoto(task: ResizeTask): Promise<ResizeOutput> {
  const cv: any = await loadOpenCv();
  const photo = await decodePhoto(task.bytes, task.type);
  const owned: { delete(): void }[] = [];
  const own = <T extends { delete(): void }>(m: T): T => {
    owned.push(m);
    return m;
  };
  try {
    const full = own(cv.matFromImageData(photo as any));
    const display = shrink(cv, full, DISPLAY_EDGE, own);
    const thumb = shrink(cv, display, THUMB_EDGE, own);
    return { width: photo.width, height: photo.height, display: await encodeJpeg(rgba(display), 82), thumb: await encodeJpeg(rgba(thumb), 75) };
  } finally {
    for (const m of owned.reverse()) m.delete();
  }
}

/** A copy out of OpenCV's heap (which may move when it grows) in the codec's layout. */
function rgba(mat: any): RgbaPhoto {
  return { data: new Uint8Array(mat.data as Uint8Array), width: mat.cols, height: mat.rows };
}
