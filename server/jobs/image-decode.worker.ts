/**
 * Runs on the CPU pool: decoding a large plan image or photo takes hundreds of milliseconds of
 * CPU, which must not stall other requests on the event loop. jimp applies the JPEG's EXIF
 * orientation while reading (Jimp.fromBuffer → attemptExifRotate), so the display copy and the
 * thumbnail come out upright.
 */
import { Jimp, JimpMime, ResizeStrategy } from "jimp";
import { workerTask } from "./worker-task";

export interface DecodeRequest {
  data: Uint8Array;
  mime: "image/png" | "image/jpeg";
  displayMaxSide: number;
  thumbMaxSide: number;
}

export interface DecodedImage {
  width: number;
  height: number;
  display: Uint8Array;
  displayWidth: number;
  displayHeight: number;
  thumb: Uint8Array;
}

type Image = Awaited<ReturnType<typeof Jimp.fromBuffer>>;

/**
 * jimp's default resize keeps a Float32 buffer of the target width × the source height × 4 channels:
 * 350 MB for a 40-megapixel plan shrunk to 4096 px. Above this size the bilinear resize is used,
 * which needs only the target bitmap (slightly more aliasing, on a shrink of less than 2:1 here).
 */
const DEFAULT_RESIZE_MAX_BUFFER = 64 * 1024 * 1024;

/** Shrinks in place (jimp's resize mutates) so the longest side is at most maxSide; never enlarges. */
function capInPlace(image: Image, maxSide: number): void {
  const { width, height } = image.bitmap;
  if (Math.max(width, height) <= maxSide) return;
  const w = width >= height ? maxSide : Math.round((width * maxSide) / height);
  const h = width >= height ? Math.round((height * maxSide) / width) : maxSide;
  const floatBuffer = w * height * 4 * Float32Array.BYTES_PER_ELEMENT;
  image.resize({ w, h, ...(floatBuffer > DEFAULT_RESIZE_MAX_BUFFER ? { mode: ResizeStrategy.BILINEAR } : {}) });
}

async function encode(image: { getBuffer: Image["getBuffer"] }, mime: DecodeRequest["mime"]): Promise<Buffer> {
  return mime === "image/png" ? image.getBuffer(JimpMime.png) : image.getBuffer(JimpMime.jpeg, { quality: 85 });
}

async function handle(req: DecodeRequest): Promise<DecodedImage> {
  const image = await Jimp.fromBuffer(Buffer.from(req.data.buffer, req.data.byteOffset, req.data.byteLength));
  const { width, height } = image.bitmap;
  // Shrink the one bitmap in steps (display, then thumbnail from the display copy) instead of
  // cloning the full-size one: a 40-megapixel plan is 160 MB of RGBA, and clones would triple it.
  capInPlace(image, req.displayMaxSide);
  const displayWidth = image.bitmap.width;
  const displayHeight = image.bitmap.height;
  const display = await encode(image, req.mime);
  capInPlace(image, req.thumbMaxSide);
  const thumb = await encode(image, req.mime);
  // Fresh copies: jimp's small buffers may share Node's buffer pool, which cannot be moved.
  return {
    width,
    height,
    display: new Uint8Array(display),
    displayWidth,
    displayHeight,
    thumb: new Uint8Array(thumb),
  };
}

export default workerTask<DecodeRequest, DecodedImage>(handle, {
  transferables: (r) => [r.display.buffer as ArrayBuffer, r.thumb.buffer as ArrayBuffer],
});
