/**
 * The compact form of a field grid on the wire: Float32 little-endian values and one confidence byte
 * per cell, each base64. Pure (atob/btoa exist in browsers and Node ≥ 16), so the client decodes with
 * the same code the tests check.
 */
import type { FieldGridLike } from "./field-grid";

const CHUNK = 0x8000;

export function bytesToBase64(bytes: Uint8Array): string {
  let s = "";
  for (let i = 0; i < bytes.length; i += CHUNK) s += String.fromCharCode(...bytes.subarray(i, i + CHUNK));
  return btoa(s);
}

export function base64ToBytes(text: string): Uint8Array {
  const s = atob(text);
  const out = new Uint8Array(s.length);
  for (let i = 0; i < s.length; i++) out[i] = s.charCodeAt(i);
  return out;
}

const littleEndian = new Uint8Array(new Uint32Array([1]).buffer)[0] === 1;

/** Float32 values as little-endian bytes (a copy). */
export function float32ToBytes(values: Float32Array): Uint8Array {
  const out = new Uint8Array(values.length * 4);
  if (littleEndian) {
    out.set(new Uint8Array(values.buffer, values.byteOffset, values.byteLength));
  } else {
    const view = new DataView(out.buffer);
    for (let i = 0; i < values.length; i++) view.setFloat32(i * 4, values[i], true);
  }
  return out;
}

export function bytesToFloat32(bytes: Uint8Array): Float32Array {
  if (bytes.length % 4 !== 0)
    throw new RangeError(`values: ${bytes.length} bytes is not a whole number of Float32 cells`);
  const out = new Float32Array(bytes.length / 4);
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  for (let i = 0; i < out.length; i++) out[i] = view.getFloat32(i * 4, true);
  return out;
}

export function quantiseConfidence(confidence: Float32Array): Uint8Array {
  const out = new Uint8Array(confidence.length);
  for (let i = 0; i < confidence.length; i++) {
    const c = confidence[i];
    out[i] = c >= 1 ? 255 : c > 0 ? Math.round(c * 255) : 0;
  }
  return out;
}

export function dequantiseConfidence(bytes: Uint8Array): Float32Array {
  const out = new Float32Array(bytes.length);
  for (let i = 0; i < bytes.length; i++) out[i] = bytes[i] / 255;
  return out;
}

export interface EncodedGrid {
  width: number;
  height: number;
  cellSize: number;
  values: string;
  confidence: string;
}

export function encodeField(grid: FieldGridLike): EncodedGrid {
  return {
    width: grid.width,
    height: grid.height,
    cellSize: grid.cellSize,
    values: bytesToBase64(float32ToBytes(grid.values)),
    confidence: bytesToBase64(quantiseConfidence(grid.confidence)),
  };
}

export function decodeField(e: EncodedGrid): FieldGridLike {
  const values = bytesToFloat32(base64ToBytes(e.values));
  const confidence = dequantiseConfidence(base64ToBytes(e.confidence));
  const cells = e.width * e.height;
  if (values.length !== cells) throw new RangeError(`field.values: expected ${cells} cells, got ${values.length}`);
  if (confidence.length !== cells)
    throw new RangeError(`field.confidence: expected ${cells} cells, got ${confidence.length}`);
  return { width: e.width, height: e.height, cellSize: e.cellSize, values, confidence };
}
