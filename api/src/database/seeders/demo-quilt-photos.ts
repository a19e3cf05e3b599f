import { Jimp } from 'jimp';
import seedrandom from 'seedrandom';

/**
 * Invented "photographs" of demo quilts: a pieced top of squares and half-square triangles in a small
 * palette, with a border, drawn from a seed so every demo database gets the same pictures. They are
 * for the demo only (the ballot pages look like a show's), never for tests of measurement.
 */
const PALETTES = [
  [0x1f4e5fff, 0xe8a33dff, 0xf4ead5ff, 0xa63d2fff, 0x6b8f71ff],
  [0x3b2f63ff, 0xc9a0dcff, 0xfaf3e3ff, 0x2e7d7aff, 0xd9734eff],
  [0x8c2f39ff, 0xf2d0a4ff, 0xfff8eeff, 0x35524aff, 0xb6862cff],
  [0x22577aff, 0x80ced7ff, 0xfdfcdcff, 0xf07167ff, 0x38a3a5ff],
];

export async function quiltPhoto(seed: string, widthIn: number, heightIn: number): Promise<{ display: Buffer; thumb: Buffer }> {
  const rng = seedrandom(seed);
  const palette = PALETTES[Math.floor(rng() * PALETTES.length)];
  const long = 640;
  const scale = long / Math.max(widthIn, heightIn);
  const w = Math.round(widthIn * scale);
  const h = Math.round(heightIn * scale);
  const border = Math.round(Math.min(w, h) * 0.07);
  const cols = Math.max(3, Math.round(widthIn / 8));
  const cell = (w - 2 * border) / cols;
  const rows = Math.max(3, Math.floor((h - 2 * border) / cell));
  const cellH = (h - 2 * border) / rows;
  const blocks = Array.from({ length: rows * cols }, () => ({ a: palette[Math.floor(rng() * palette.length)], b: palette[Math.floor(rng() * palette.length)], tri: rng() < 0.55, flip: rng() < 0.5 }));
  const image = new Jimp({ width: w, height: h, color: palette[0] });
  image.scan(0, 0, w, h, (x, y, idx) => {
    let colour = shade(palette[0], 0.72);
    if (x >= border && x < w - border && y >= border && y < h - border) {
      const cx = Math.min(cols - 1, Math.floor((x - border) / cell));
      const cy = Math.min(rows - 1, Math.floor((y - border) / cellH));
      const u = (x - border - cx * cell) / cell;
      const v = (y - border - cy * cellH) / cellH;
      const blk = blocks[cy * cols + cx];
      const second = blk.tri ? (blk.flip ? u + v > 1 : u > v) : false;
      colour = second ? blk.b : blk.a;
      // A darker seam line between blocks, and a little cloth texture.
      if (u < 0.015 || v < 0.015) colour = shade(colour, 0.8);
    }
    const jitter = 1 + (rng() - 0.5) * 0.06;
    image.bitmap.data[idx] = clamp(((colour >>> 24) & 255) * jitter);
    image.bitmap.data[idx + 1] = clamp(((colour >>> 16) & 255) * jitter);
    image.bitmap.data[idx + 2] = clamp(((colour >>> 8) & 255) * jitter);
    image.bitmap.data[idx + 3] = 255;
  });
  const display = await image.getBuffer('image/jpeg', { quality: 82 });
  image.resize({ w: Math.round((w * 320) / Math.max(w, h)) });
  const thumb = await image.getBuffer('image/jpeg', { quality: 75 });
  return { display, thumb };
}

const clamp = (n: number) => Math.max(0, Math.min(255, Math.round(n)));
function shade(rgba: number, k: number): number {
  const r = clamp(((rgba >>> 24) & 255) * k);
  const g = clamp(((rgba >>> 16) & 255) * k);
  const b = clamp(((rgba >>> 8) & 255) * k);
  return ((r << 24) | (g << 16) | (b << 8) | 255) >>> 0;
}
