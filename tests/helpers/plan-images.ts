import { crc32 } from "node:zlib";
import { Jimp, JimpMime } from "jimp";

/** A small floor-plan-like image drawn with jimp: white with a dark border (our own drawing). */
async function drawing(width: number, height: number) {
  const img = new Jimp({ width, height, color: 0xffffffff });
  for (let x = 0; x < width; x++) {
    img.setPixelColor(0x222222ff, x, 0);
    img.setPixelColor(0x222222ff, x, height - 1);
  }
  for (let y = 0; y < height; y++) {
    img.setPixelColor(0x222222ff, 0, y);
    img.setPixelColor(0x222222ff, width - 1, y);
  }
  return img;
}

export async function makePng(width: number, height: number): Promise<Buffer> {
  return (await drawing(width, height)).getBuffer(JimpMime.png);
}

export async function makeJpeg(width: number, height: number): Promise<Buffer> {
  return (await drawing(width, height)).getBuffer(JimpMime.jpeg, { quality: 90 });
}

function chunk(type: string, data: Buffer): Buffer {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, "ascii"), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body) >>> 0);
  return Buffer.concat([len, body, crc]);
}

/**
 * A PNG that is only a header (PNG spec §11.2.2 IHDR) declaring width × height: a few dozen
 * bytes that would decode to a huge bitmap — the decompression-bomb case.
 */
export function pngHeaderOnly(width: number, height: number): Buffer {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr[8] = 8; // bit depth
  ihdr[9] = 6; // colour type RGBA
  const signature = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  return Buffer.concat([signature, chunk("IHDR", ihdr), chunk("IEND", Buffer.alloc(0))]);
}

/**
 * Inserts an APP1 Exif segment with one Orientation tag (TIFF 6.0 tag 0x0112; CIPA DC-008 Exif)
 * right after the JPEG's SOI marker. Orientation 6 means "rotate 90° clockwise to view".
 */
export function withExifOrientation(jpeg: Buffer, orientation: number): Buffer {
  const tiff = Buffer.alloc(8 + 2 + 12 + 4);
  tiff.write("MM", 0, "ascii");
  tiff.writeUInt16BE(42, 2);
  tiff.writeUInt32BE(8, 4); // first IFD right after the header
  tiff.writeUInt16BE(1, 8); // one entry
  tiff.writeUInt16BE(0x0112, 10); // Orientation
  tiff.writeUInt16BE(3, 12); // SHORT
  tiff.writeUInt32BE(1, 14); // count
  tiff.writeUInt16BE(orientation, 18);
  tiff.writeUInt32BE(0, 22); // no next IFD
  const payload = Buffer.concat([Buffer.from("Exif\0\0", "binary"), tiff]);
  const header = Buffer.from([0xff, 0xe1, 0, 0]);
  header.writeUInt16BE(payload.length + 2, 2);
  return Buffer.concat([jpeg.subarray(0, 2), header, payload, jpeg.subarray(2)]);
}
