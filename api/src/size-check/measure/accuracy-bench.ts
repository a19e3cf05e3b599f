/**
 * Accuracy and speed of the photo measurement on a generated set (scripts/generate-photo-fixtures.ts):
 *
 *   npx tsx api/src/size-check/measure/accuracy-bench.ts [dir]      (default .data/photo-fixtures)
 *
 * Each photo goes through the worker's whole pipeline (decode, measure, display, thumbnail and overlay
 * images), so the times are the server's time per photo. Every photo is also timed again after being
 * shrunk to 2400 px on the long edge and re-encoded, as the web app does before it uploads.
 */
import { readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import processPhoto from '../photo.worker';
import { decodePhoto, encodeJpeg } from '../photo-codec';
import type { MeasureResult } from './measure-photo';
import { loadOpenCv } from './opencv';

const INCH = 25.4;

interface TruthEntry {
  file: string;
  expect: string;
  printScale: number;
  widthMm: number | null;
  heightMm: number | null;
  diagonalDifferenceMm: number | null;
}

export interface BenchRow {
  file: string;
  expect: string;
  result: MeasureResult;
  widthErrorMm: number | null;
  heightErrorMm: number | null;
  diagonalErrorMm: number | null;
  ms: number;
  decodeMs: number;
  /** The same photo as the web app sends it: at most 2400 px on the long edge. */
  browserMs: number;
}

export interface BenchSummary {
  valid: number;
  accepted: number;
  mustRefuse: number;
  refused: number;
  refusedForTheExpectedReason: number;
  medianErrorMm: number;
  maxErrorMm: number;
  withinSixteenth: number;
  medianMs: number;
  p95Ms: number;
  browserMedianMs: number;
  browserP95Ms: number;
  rows: BenchRow[];
}

function quantile(values: number[], q: number): number {
  if (!values.length) return NaN;
  const s = [...values].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.max(0, Math.ceil(q * s.length) - 1))];
}

const pct = (a: number, b: number) => (b ? `${((100 * a) / b).toFixed(1)}%` : 'n/a');
const inches = (mm: number) => `${mm.toFixed(3)} mm = ${(mm / INCH).toFixed(4)} in`;

export async function runAccuracyBench(dir: string, log: (line: string) => void = console.log): Promise<BenchSummary> {
  const truths: TruthEntry[] = JSON.parse(readFileSync(join(dir, 'truth.json'), 'utf8'));
  const cv: any = await loadOpenCv();
  const rows: BenchRow[] = [];
  for (const t of truths) {
    const bytes = new Uint8Array(readFileSync(join(dir, t.file)));
    const output = await processPhoto({ bytes, type: 'image/jpeg', printScale: t.printScale });
    const { result, ms, width, height } = output;
    const decodeMs = output.timingsMs.decode;
    const shrunk = await shrinkLikeTheBrowser(cv, bytes, 2400);
    const browserMs = (await processPhoto({ bytes: shrunk, type: 'image/jpeg', printScale: t.printScale })).ms;
    const row: BenchRow = { file: t.file, expect: t.expect, result, widthErrorMm: null, heightErrorMm: null, diagonalErrorMm: null, ms, decodeMs, browserMs };
    if (result.ok && t.widthMm !== null && t.heightMm !== null) {
      row.widthErrorMm = result.widthMm - t.widthMm;
      row.heightErrorMm = result.heightMm - t.heightMm;
      row.diagonalErrorMm = Math.abs(result.diagonalsMm[0] - result.diagonalsMm[1]) - (t.diagonalDifferenceMm ?? 0);
    }
    rows.push(row);
    log(
      `${t.file} ${width}x${height} expect ${t.expect.padEnd(18)} ` +
        (result.ok
          ? `measured  dW ${row.widthErrorMm?.toFixed(2) ?? '-'} dH ${row.heightErrorMm?.toFixed(2) ?? '-'} dDiag ${row.diagonalErrorMm?.toFixed(2) ?? '-'} mm`
          : `refused   ${result.reason}`) +
        `  ${Math.round(ms)} ms (decode ${Math.round(decodeMs)}; at 2400 px ${Math.round(browserMs)} ms)`,
    );
  }

  const valid = rows.filter((r) => r.expect === 'measure');
  const accepted = valid.filter((r) => r.result.ok);
  const mustRefuse = rows.filter((r) => r.expect !== 'measure');
  const refused = mustRefuse.filter((r) => !r.result.ok);
  const rightReason = refused.filter((r) => !r.result.ok && r.result.reason === r.expect);
  const errors = accepted.flatMap((r) => [Math.abs(r.widthErrorMm ?? NaN), Math.abs(r.heightErrorMm ?? NaN)]).filter(Number.isFinite);
  const times = rows.map((r) => r.ms);
  const summary: BenchSummary = {
    valid: valid.length,
    accepted: accepted.length,
    mustRefuse: mustRefuse.length,
    refused: refused.length,
    refusedForTheExpectedReason: rightReason.length,
    medianErrorMm: quantile(errors, 0.5),
    maxErrorMm: errors.length ? Math.max(...errors) : NaN,
    withinSixteenth: errors.filter((e) => e <= INCH / 16).length / (errors.length || 1),
    medianMs: quantile(times, 0.5),
    p95Ms: quantile(times, 0.95),
    browserMedianMs: quantile(rows.map((r) => r.browserMs), 0.5),
    browserP95Ms: quantile(rows.map((r) => r.browserMs), 0.95),
    rows,
  };
  log('');
  log(`valid photos accepted:        ${accepted.length}/${valid.length} = ${pct(accepted.length, valid.length)}  (target >= 90%)`);
  log(`must-refuse photos refused:   ${refused.length}/${mustRefuse.length} = ${pct(refused.length, mustRefuse.length)}  (target >= 95%; ${rightReason.length} for the expected reason)`);
  log(`median |width/height error|:  ${inches(summary.medianErrorMm)}  (target <= 1/32 in = 0.794 mm)`);
  log(`max |width/height error|:     ${inches(summary.maxErrorMm)}  (target <= 1/8 in = 3.175 mm)`);
  log(`within 1/16 inch:             ${(summary.withinSixteenth * 100).toFixed(1)}% of ${errors.length} measurements`);
  log(`server time per photo (3-12 MP as taken): median ${Math.round(summary.medianMs)} ms, p95 ${Math.round(summary.p95Ms)} ms, max ${Math.round(Math.max(...times))} ms  (target <= 4 s for 12 MP)`);
  log(`server time per photo as the web app sends it (<= 2400 px): median ${Math.round(summary.browserMedianMs)} ms, p95 ${Math.round(summary.browserP95Ms)} ms  (target <= 1 s)`);
  return summary;
}

/** What the web app does before uploading: scale to the long edge and re-encode at quality 0.9. */
async function shrinkLikeTheBrowser(cv: any, bytes: Uint8Array, edge: number): Promise<Uint8Array> {
  const photo = await decodePhoto(bytes, 'image/jpeg');
  const f = Math.min(1, edge / Math.max(photo.width, photo.height));
  const src = cv.matFromImageData(photo);
  const dst = new cv.Mat();
  try {
    cv.resize(src, dst, new cv.Size(Math.round(photo.width * f), Math.round(photo.height * f)), 0, 0, cv.INTER_AREA);
    return await encodeJpeg({ data: new Uint8Array(dst.data), width: dst.cols, height: dst.rows }, 90);
  } finally {
    src.delete();
    dst.delete();
  }
}

if (require.main === module) {
  const dir = resolve(process.argv[2] ?? join(__dirname, '..', '..', '..', '..', '.data', 'photo-fixtures'));
  runAccuracyBench(dir).catch((error) => {
    console.error(error);
    process.exit(1);
  });
}
