import { drawLine, drawPolygon } from './overlay';

const blank = (w: number, h: number) => ({ data: new Uint8Array(w * h * 4), width: w, height: h });
const red = (img: ReturnType<typeof blank>, x: number, y: number) => img.data[(y * img.width + x) * 4] === 255;

describe('overlay drawing', () => {
  it('draws a horizontal line end to end and nothing far from it', () => {
    const img = blank(20, 10);
    drawLine(img, [2, 5], [17, 5], 1, [255, 0, 0]);
    for (let x = 2; x <= 17; x++) expect(red(img, x, 5)).toBe(true);
    expect(red(img, 10, 1)).toBe(false);
  });
  it('closes a polygon and clips at the image edge without throwing', () => {
    const img = blank(10, 10);
    drawPolygon(img, [[1, 1], [8, 1], [8, 8], [1, 8]], 1, [255, 0, 0]);
    expect(red(img, 1, 5)).toBe(true);
    expect(() => drawLine(img, [-5, -5], [15, 15], 3, [255, 0, 0])).not.toThrow();
  });
});
