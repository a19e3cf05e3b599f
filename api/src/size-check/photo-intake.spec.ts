import { checkPhoto } from './photo-intake';

function png(width: number, height: number): Buffer {
  // A PNG signature and IHDR chunk are enough for the header check (PNG spec, RFC 2083 §4.1.1).
  const ihdr = Buffer.alloc(25);
  ihdr.writeUInt32BE(13, 0);
  ihdr.write('IHDR', 4, 'ascii');
  ihdr.writeUInt32BE(width, 8);
  ihdr.writeUInt32BE(height, 12);
  ihdr[16] = 8;
  ihdr[17] = 6;
  return Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), ihdr]);
}

describe('checkPhoto', () => {
  it('refuses empty, non-image and disguised files by content', () => {
    expect(checkPhoto(Buffer.alloc(0))).toMatchObject({ ok: false, status: 422 });
    expect(checkPhoto(Buffer.from('just some text, named photo.jpg'))).toMatchObject({ ok: false, status: 415 });
    expect(checkPhoto(Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"></svg>'))).toMatchObject({ ok: false, status: 415 });
  });
  it('refuses a 60,000 x 60,000 PNG before decoding it', () => {
    const res = checkPhoto(png(60_000, 60_000));
    expect(res).toMatchObject({ ok: false, status: 413 });
  });
  it('accepts a plausible photo header', () => {
    expect(checkPhoto(png(4000, 3000))).toEqual({ ok: true, type: 'image/png', width: 4000, height: 3000 });
  });
  it('refuses a truncated JPEG header', () => {
    expect(checkPhoto(Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0x00]))).toMatchObject({ ok: false, status: 422 });
  });
});
