import { endsLikeJpeg } from './photo-codec';

/** A JPEG's skeleton: start of image, an EXIF segment holding a thumbnail with its own end marker, a scan. */
function jpeg({ scan, end, trailer = [] }: { scan: number[]; end: boolean; trailer?: number[] }): Uint8Array {
  const thumbnail = [0xff, 0xd8, 0x01, 0x02, 0xff, 0xd9];
  const exifBody = [0x45, 0x78, 0x69, 0x66, 0x00, 0x00, ...thumbnail];
  const app1 = [0xff, 0xe1, 0x00, exifBody.length + 2, ...exifBody];
  const sos = [0xff, 0xda, 0x00, 0x08, 0x01, 0x01, 0x00, 0x00, 0x3f, 0x00];
  return Uint8Array.from([0xff, 0xd8, ...app1, ...sos, ...scan, ...(end ? [0xff, 0xd9] : []), ...trailer]);
}

describe('endsLikeJpeg', () => {
  it('accepts a whole image, with or without data a camera appends after it', () => {
    expect(endsLikeJpeg(jpeg({ scan: [0x12, 0xff, 0x00, 0x34, 0xff, 0xd0, 0x56], end: true }))).toBe(true);
    expect(endsLikeJpeg(jpeg({ scan: [0x12, 0x34], end: true, trailer: [0x53, 0x45, 0x46, 0x54, 0, 0, 0, 0] }))).toBe(true);
  });

  it('refuses an image cut off in its scan, even though the EXIF thumbnail has an end marker', () => {
    expect(endsLikeJpeg(jpeg({ scan: [0x12, 0xff, 0x00, 0x34], end: false }))).toBe(false);
  });

  it('refuses a file cut off inside its header segments', () => {
    expect(endsLikeJpeg(jpeg({ scan: [0x12], end: true }).subarray(0, 12))).toBe(false);
  });

  it('refuses bytes that are not a marker where a segment should start', () => {
    expect(endsLikeJpeg(Uint8Array.from([0xff, 0xd8, 0x00, 0x11, 0xff, 0xd9]))).toBe(false);
  });
});
