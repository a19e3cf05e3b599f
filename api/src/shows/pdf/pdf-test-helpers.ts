import { execFile } from 'node:child_process';
import { mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';

/**
 * For the specs beside it: reads a rendered PDF back with Poppler (pdftotext, pdfinfo, pdftoppm), the
 * way a person or a printer would see it, rather than trusting what the renderer meant to draw.
 */

const run = promisify(execFile);

async function withFile<T>(pdf: Buffer, use: (file: string, dir: string) => Promise<T>): Promise<T> {
  const dir = await mkdtemp(join(tmpdir(), 'selvage-show-pdf-'));
  try {
    const file = join(dir, 'doc.pdf');
    await writeFile(file, pdf);
    return await use(file, dir);
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}

export async function pageCount(pdf: Buffer): Promise<number> {
  return withFile(pdf, async (file) => {
    const { stdout } = await run('pdfinfo', [file]);
    return Number(/^Pages:\s+(\d+)/m.exec(stdout)?.[1]);
  });
}

export type TextMode = 'layout' | 'raw';

/** The text of one page (1-based), or of every page when `page` is not given. */
export async function pdfText(pdf: Buffer, options: { page?: number; mode?: TextMode } = {}): Promise<string> {
  return withFile(pdf, async (file) => {
    const args = [`-${options.mode ?? 'layout'}`, '-enc', 'UTF-8'];
    if (options.page !== undefined) args.push('-f', String(options.page), '-l', String(options.page));
    const { stdout } = await run('pdftotext', [...args, file, '-'], { maxBuffer: 64 * 1024 * 1024 });
    return stdout;
  });
}

/** The text of every page, one string a page. */
export async function pageTexts(pdf: Buffer, mode: TextMode = 'layout'): Promise<string[]> {
  const text = await pdfText(pdf, { mode });
  const pages = text.split('\f');
  if (pages[pages.length - 1].trim() === '') pages.pop();
  return pages;
}

/** The text with every run of white space made one space. */
export const squash = (text: string): string => text.replace(/\s+/g, ' ').trim();

/** The line of layout text containing `needle`, with runs of spaces collapsed. */
export function lineWith(text: string, needle: string): string {
  const line = text.split('\n').find((l) => l.includes(needle));
  if (line === undefined) throw new Error(`No line contains ${JSON.stringify(needle)} in:\n${text}`);
  return squash(line);
}

/** A word as pdftotext places it, in points from the page's top-left corner. */
export interface Word {
  text: string;
  xMin: number;
  yMin: number;
  xMax: number;
  yMax: number;
}

const ENTITIES: Record<string, string> = { amp: '&', lt: '<', gt: '>', quot: '"', apos: "'" };
const unescape = (s: string) =>
  s.replace(/&(#x[0-9a-f]+|#\d+|[a-z]+);/gi, (m, e: string) =>
    e.startsWith('#x') || e.startsWith('#X')
      ? String.fromCodePoint(parseInt(e.slice(2), 16))
      : e.startsWith('#')
        ? String.fromCodePoint(Number(e.slice(1)))
        : (ENTITIES[e] ?? m),
  );

/** Every word on every page with its bounding box (pdftotext -bbox). */
export async function wordBoxes(pdf: Buffer): Promise<Word[][]> {
  const html = await withFile(pdf, async (file) => (await run('pdftotext', ['-bbox', '-enc', 'UTF-8', file, '-'], { maxBuffer: 64 * 1024 * 1024 })).stdout);
  return html
    .split(/<page\b/)
    .slice(1)
    .map((page) =>
      [...page.matchAll(/<word xMin="([\d.]+)" yMin="([\d.]+)" xMax="([\d.]+)" yMax="([\d.]+)">([^<]*)<\/word>/g)].map((m) => ({
        xMin: Number(m[1]),
        yMin: Number(m[2]),
        xMax: Number(m[3]),
        yMax: Number(m[4]),
        text: unescape(m[5]),
      })),
    );
}

/** An RGB image, three bytes a pixel, row by row. */
export interface RgbImage {
  width: number;
  height: number;
  data: Buffer;
}

/** One page (1-based) rasterised by pdftoppm at `dpi`, read from its PPM output. */
export async function rasterise(pdf: Buffer, page: number, dpi: number): Promise<RgbImage> {
  return withFile(pdf, async (file, dir) => {
    const prefix = join(dir, 'page');
    await run('pdftoppm', ['-r', String(dpi), '-f', String(page), '-l', String(page), '-singlefile', file, prefix]);
    return parsePpm(await readFile(`${prefix}.ppm`));
  });
}

/** Reads a binary PPM (P6, 8 bits a channel). */
export function parsePpm(file: Buffer): RgbImage {
  // Header: "P6", width, height, maxval, separated by white space (comments start with #), then one white space byte.
  let pos = 0;
  const fields: string[] = [];
  while (fields.length < 4) {
    while (pos < file.length && /\s/.test(String.fromCharCode(file[pos]))) pos++;
    if (file[pos] === 0x23) {
      while (pos < file.length && file[pos] !== 0x0a) pos++;
      continue;
    }
    let token = '';
    while (pos < file.length && !/\s/.test(String.fromCharCode(file[pos]))) token += String.fromCharCode(file[pos++]);
    fields.push(token);
  }
  pos++;
  const [magic, w, h, max] = fields;
  if (magic !== 'P6' || max !== '255') throw new Error(`Not an 8-bit binary PPM: ${fields.join(' ')}`);
  const width = Number(w);
  const height = Number(h);
  const data = file.subarray(pos, pos + width * height * 3);
  if (data.length !== width * height * 3) throw new Error('The PPM is cut short.');
  return { width, height, data };
}

/** A rectangle of the image as RGBA (what jsQR reads), clipped to the image. */
export function cropRgba(image: RgbImage, x: number, y: number, width: number, height: number): { data: Uint8ClampedArray; width: number; height: number } {
  const x0 = Math.max(0, Math.round(x));
  const y0 = Math.max(0, Math.round(y));
  const w = Math.min(image.width, Math.round(x + width)) - x0;
  const h = Math.min(image.height, Math.round(y + height)) - y0;
  const out = new Uint8ClampedArray(w * h * 4);
  for (let r = 0; r < h; r++) {
    for (let c = 0; c < w; c++) {
      const src = ((y0 + r) * image.width + (x0 + c)) * 3;
      const dst = (r * w + c) * 4;
      out[dst] = image.data[src];
      out[dst + 1] = image.data[src + 1];
      out[dst + 2] = image.data[src + 2];
      out[dst + 3] = 255;
    }
  }
  return { data: out, width: w, height: h };
}
