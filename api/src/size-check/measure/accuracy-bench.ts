/**
 * Accuracy and speed of the photo measurement on a generated set (scripts/generate-photo-fixtures.ts):
 *
 *   npx tsx api/src/size-check/measure/accuracy-bench.ts [dir]      (default .data/photo-fixtures)
 *
 * Timings include decoding the JPEG with jimp, as the upload path will.
 */
import { readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { measureBlockPhoto, type MeasureResult } from './measure-photo';
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
  const { Jimp } = await import('jimp');
  const truths: TruthEntry[] = JSON.parse(readFileSync(join(dir, 'truth.json'), 'utf8'));
  await loadOpenCv();
  const rows: BenchRow[] = [];
  for (const t of truths) {
    const started = performance.now();
    const image = await Jimp.read(readFileSync(join(dir, t.file)));
    const decodeMs = performance.now() - started;
    const { data, width, height } = image.bitmap;
    const result = await measureBlockPhoto({ data: new Uint8Array(data.buffer, data.byteOffset, data.byteLength), width, height }, { printScale: t.printScale });
    const ms = performance.now() - started;
    const row: BenchRow = { file: t.file, expect: t.expect, result, widthErrorMm: null, heightErrorMm: null, diagonalErrorMm: null, ms, decodeMs };
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
        `  ${Math.round(ms)} ms (decode ${Math.round(decodeMs)})`,
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
    rows,
  };
  log('');
  log(`valid photos accepted:        ${accepted.length}/${valid.length} = ${pct(accepted.length, valid.length)}  (target >= 90%)`);
  log(`must-refuse photos refused:   ${refused.length}/${mustRefuse.length} = ${pct(refused.length, mustRefuse.length)}  (target >= 95%; ${rightReason.length} for the expected reason)`);
  log(`median |width/height error|:  ${inches(summary.medianErrorMm)}  (target <= 1/32 in = 0.794 mm)`);
  log(`max |width/height error|:     ${inches(summary.maxErrorMm)}  (target <= 1/8 in = 3.175 mm)`);
  log(`within 1/16 inch:             ${(summary.withinSixteenth * 100).toFixed(1)}% of ${errors.length} measurements`);
  log(`time per photo incl. decode:  median ${Math.round(summary.medianMs)} ms, p95 ${Math.round(summary.p95Ms)} ms`);
  return summary;
}

if (require.main === module) {
  const dir = resolve(process.argv[2] ?? join(__dirname, '..', '..', '..', '..', '.data', 'photo-fixtures'));
  runAccuracyBench(dir).catch((error) => {
    console.error(error);
    process.exit(1);
  });
}
