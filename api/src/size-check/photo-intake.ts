import { imageSize } from 'image-size';

/** What a photo upload must pass before anything decodes it. */
export const MAX_PHOTO_BYTES = 20 * 1024 * 1024;
/** A decompression-bomb guard: more pixels than any phone camera makes. */
export const MAX_PHOTO_PIXELS = 40_000_000;

export type PhotoType = 'image/jpeg' | 'image/png';

export type IntakeResult =
  | { ok: true; type: PhotoType; width: number; height: number }
  | { ok: false; status: 413 | 415 | 422; message: string };

/** Checks a photo by its content: magic bytes, a readable header, and the pixel count. */
export function checkPhoto(bytes: Buffer): IntakeResult {
  if (bytes.length === 0) return { ok: false, status: 422, message: 'The file is empty. Take the photo again and upload it.' };
  if (bytes.length > MAX_PHOTO_BYTES)
    return { ok: false, status: 413, message: 'The photo is larger than 20 MB. Upload it from the Selvage page, which makes it smaller first.' };
  const isJpeg = bytes[0] === 0xff && bytes[1] === 0xd8 && bytes[2] === 0xff;
  const isPng = bytes.subarray(0, 8).equals(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]));
  if (!isJpeg && !isPng)
    return { ok: false, status: 415, message: 'That file is not a photo Selvage can read. Upload a JPEG or PNG picture.' };
  let size: { width?: number; height?: number };
  try {
    size = imageSize(bytes);
  } catch {
    return { ok: false, status: 422, message: 'The photo seems damaged or incomplete. Take it again and upload it.' };
  }
  const { width = 0, height = 0 } = size;
  if (!width || !height) return { ok: false, status: 422, message: 'The photo seems damaged or incomplete. Take it again and upload it.' };
  if (width * height > MAX_PHOTO_PIXELS)
    return { ok: false, status: 413, message: `The picture has ${Math.round((width * height) / 1e6)} million pixels; Selvage takes up to 40 million.` };
  return { ok: true, type: isJpeg ? 'image/jpeg' : 'image/png', width, height };
}
