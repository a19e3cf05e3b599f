/** Drawing on an RGBA bitmap by hand: thick lines and dots, enough for the measurement overlay. */
export interface Bitmap {
  data: Uint8Array | Buffer;
  width: number;
  height: number;
}

export function drawDot(img: Bitmap, cx: number, cy: number, r: number, rgb: [number, number, number]): void {
  const x0 = Math.max(0, Math.floor(cx - r));
  const x1 = Math.min(img.width - 1, Math.ceil(cx + r));
  const y0 = Math.max(0, Math.floor(cy - r));
  const y1 = Math.min(img.height - 1, Math.ceil(cy + r));
  for (let y = y0; y <= y1; y++)
    for (let x = x0; x <= x1; x++) {
      if ((x - cx) ** 2 + (y - cy) ** 2 > r * r) continue;
      const i = (y * img.width + x) * 4;
      img.data[i] = rgb[0];
      img.data[i + 1] = rgb[1];
      img.data[i + 2] = rgb[2];
      img.data[i + 3] = 255;
    }
}

/** A line as a run of dots every half pixel: simple, and thick lines need no special cases. */
export function drawLine(img: Bitmap, a: [number, number], b: [number, number], width: number, rgb: [number, number, number]): void {
  const length = Math.hypot(b[0] - a[0], b[1] - a[1]);
  const steps = Math.max(1, Math.ceil(length * 2));
  for (let i = 0; i <= steps; i++) {
    const t = i / steps;
    drawDot(img, a[0] + (b[0] - a[0]) * t, a[1] + (b[1] - a[1]) * t, width / 2, rgb);
  }
}

export function drawPolygon(img: Bitmap, points: [number, number][], width: number, rgb: [number, number, number]): void {
  points.forEach((p, i) => drawLine(img, p, points[(i + 1) % points.length], width, rgb));
}
