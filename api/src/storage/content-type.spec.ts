import { sniffContentType } from './content-type';

const pad = (bytes: number[]) => Buffer.concat([Buffer.from(bytes), Buffer.alloc(16)]);

describe('sniffContentType', () => {
  // Signatures: PDF "%PDF-" (ISO 32000), PNG 8-byte signature (RFC 2083), JPEG SOI FF D8 FF,
  // GIF87a/GIF89a, WebP "RIFF....WEBP" (RFC 9649).
  it('recognises each accepted type by its first bytes', () => {
    expect(sniffContentType(Buffer.from('%PDF-1.7\n%âãÏÓ\n'))).toBe('application/pdf');
    expect(sniffContentType(pad([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]))).toBe('image/png');
    expect(sniffContentType(pad([0xff, 0xd8, 0xff, 0xe0]))).toBe('image/jpeg');
    expect(sniffContentType(Buffer.from('GIF89a\x01\x00\x01\x00\x00\x00\x00'))).toBe('image/gif');
    expect(sniffContentType(Buffer.from('RIFF\x24\x00\x00\x00WEBPVP8 '))).toBe('image/webp');
  });
  it('refuses everything else, whatever it is called', () => {
    expect(sniffContentType(Buffer.from('<html><script>alert(1)</script></html>'))).toBeNull();
    expect(sniffContentType(Buffer.from('PK\x03\x04 this is a zip file'))).toBeNull();
    expect(sniffContentType(Buffer.from('%PD'))).toBeNull();
    expect(sniffContentType(Buffer.alloc(0))).toBeNull();
  });
});
