import sharp from "sharp";
import { deflateSync } from "node:zlib";

/** A photo-like JPEG: a gradient with blocks, so orientation can be read back from where the colours are. */
let counter = 0;

/** Each call draws a slightly different picture, so no two test photos share a content hash. */
export async function landscapeJpeg(width = 1200, height = 800, exif?: Record<string, Record<string, string>>, orientation?: number) {
  const g = 20 + (counter++ % 200);
  // Left half red, right half blue: after rotating 90° the red half is on top.
  const left = await sharp({ create: { width: Math.round(width / 2), height, channels: 3, background: { r: 220, g, b: 30 } } }).png().toBuffer();
  let img = sharp({ create: { width, height, channels: 3, background: { r: 30, g, b: 220 } } }).composite([{ input: left, left: 0, top: 0 }]).jpeg({ quality: 85 });
  if (exif) img = img.withExif(exif);
  if (orientation) img = img.withMetadata({ orientation });
  return img.toBuffer();
}

/** A tiny PNG whose header claims the given size: decoders refuse or must not try to allocate it. */
export function pngDeclaring(width: number, height: number): Buffer {
  const crcTable = Array.from({ length: 256 }, (_, n) => {
    let c = n;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    return c >>> 0;
  });
  const crc = (buf: Buffer) => {
    let c = 0xffffffff;
    for (const b of buf) c = crcTable[(c ^ b) & 0xff] ^ (c >>> 8);
    return (c ^ 0xffffffff) >>> 0;
  };
  const chunk = (type: string, data: Buffer) => {
    const len = Buffer.alloc(4);
    len.writeUInt32BE(data.length);
    const td = Buffer.concat([Buffer.from(type, "ascii"), data]);
    const c = Buffer.alloc(4);
    c.writeUInt32BE(crc(td));
    return Buffer.concat([len, td, c]);
  };
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr[8] = 8;
  ihdr[9] = 2;
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk("IHDR", ihdr),
    chunk("IDAT", deflateSync(Buffer.alloc(64))),
    chunk("IEND", Buffer.alloc(0)),
  ]);
}

export const SVG_WITH_SCRIPT = Buffer.from(
  '<svg xmlns="http://www.w3.org/2000/svg" width="800" height="600"><script>alert(1)</script><rect width="800" height="600" fill="red"/></svg>',
);
