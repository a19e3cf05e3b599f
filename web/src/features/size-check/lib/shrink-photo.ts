/** The longest edge a photo keeps before it goes up: plenty for 1/16 inch, and quick on a phone. */
export const MAX_PHOTO_EDGE = 2400;

function toJpeg(canvas: HTMLCanvasElement | OffscreenCanvas, quality: number): Promise<Blob | null> {
  if ('convertToBlob' in canvas) return canvas.convertToBlob({ type: 'image/jpeg', quality }).catch(() => null);
  return new Promise((resolve) => canvas.toBlob(resolve, 'image/jpeg', quality));
}

function jpegName(name: string): string {
  const base = name.replace(/\.[^./\\]+$/, '') || 'block';
  return `${base}.jpg`;
}

/**
 * Shrinks a photo in the browser to at most MAX_PHOTO_EDGE pixels on its long edge, turned the way
 * the camera meant (EXIF orientation), as a JPEG at quality 0.9. A photo that is already small
 * enough goes up as it is; so does any photo this browser cannot decode (the api then judges it).
 */
export async function shrinkPhoto(file: File, maxEdge = MAX_PHOTO_EDGE): Promise<File> {
  if (typeof createImageBitmap !== 'function') return file;
  let bitmap: ImageBitmap;
  try {
    bitmap = await createImageBitmap(file, { imageOrientation: 'from-image' });
  } catch {
    return file;
  }
  try {
    const long = Math.max(bitmap.width, bitmap.height);
    if (long <= maxEdge) return file;
    const scale = maxEdge / long;
    const width = Math.max(1, Math.round(bitmap.width * scale));
    const height = Math.max(1, Math.round(bitmap.height * scale));
    const canvas = document.createElement('canvas');
    canvas.width = width;
    canvas.height = height;
    const context = canvas.getContext('2d');
    if (!context) return file;
    context.imageSmoothingEnabled = true;
    context.imageSmoothingQuality = 'high';
    context.drawImage(bitmap, 0, 0, width, height);
    const blob = await toJpeg(canvas, 0.9);
    if (!blob) return file;
    return new File([blob], jpegName(file.name), { type: 'image/jpeg', lastModified: file.lastModified });
  } finally {
    bitmap.close();
  }
}
