/**
 * The field map for the report, drawn on the server with jimp: the plan drawing (or a plain sheet for
 * a blank plan), the field in the screen's own ramp with unknown areas hatched, fixture outlines and
 * the suspect spots' uncertainty circles. The spots' numbers are set as text by the PDF on top.
 */
import { Jimp, JimpMime } from "jimp";
import type { FieldGridLike } from "#core/domain/fieldmap/field-grid";
import { renderFieldRgba } from "#core/domain/fieldmap/render-field";

export interface FieldMapDrawing {
  planImage: Buffer | null;
  widthM: number;
  heightM: number;
  field: FieldGridLike;
  lut: Uint8ClampedArray;
  index(ppm: number): number;
  outlines: readonly (readonly (readonly [number, number])[])[];
  spots: readonly { x: number; y: number; radiusM: number }[];
  /** Output width in pixels when drawn on a plain sheet, or when the plan drawing is wider than this. */
  widthPx: number;
}

type Image = InstanceType<typeof Jimp>;

function blend(img: Image, x: number, y: number, rgb: readonly [number, number, number], alpha: number) {
  const { width, height, data } = img.bitmap;
  const xi = Math.round(x);
  const yi = Math.round(y);
  if (xi < 0 || yi < 0 || xi >= width || yi >= height) return;
  const p = (yi * width + xi) * 4;
  for (let c = 0; c < 3; c++) data[p + c] = Math.round(data[p + c] * (1 - alpha) + rgb[c] * alpha);
  data[p + 3] = 255;
}

function dot(img: Image, x: number, y: number, r: number, rgb: readonly [number, number, number], alpha = 1) {
  for (let dy = -r; dy <= r; dy++)
    for (let dx = -r; dx <= r; dx++) if (dx * dx + dy * dy <= r * r) blend(img, x + dx, y + dy, rgb, alpha);
}

function line(
  img: Image,
  a: readonly [number, number],
  b: readonly [number, number],
  r: number,
  rgb: readonly [number, number, number],
  alpha = 1,
) {
  const n = Math.max(1, Math.ceil(Math.hypot(b[0] - a[0], b[1] - a[1])));
  for (let k = 0; k <= n; k++) dot(img, a[0] + ((b[0] - a[0]) * k) / n, a[1] + ((b[1] - a[1]) * k) / n, r, rgb, alpha);
}

function ring(
  img: Image,
  cx: number,
  cy: number,
  radius: number,
  thickness: number,
  rgb: readonly [number, number, number],
) {
  const n = Math.max(24, Math.ceil(2 * Math.PI * radius));
  for (let k = 0; k < n; k++) {
    const a = (2 * Math.PI * k) / n;
    dot(img, cx + radius * Math.cos(a), cy + radius * Math.sin(a), thickness, rgb);
  }
}

/**
 * Lays the field's RGBA cells over the bitmap, nearest cell per pixel, alpha-blended (source over):
 * one pass, instead of scaling a layer and compositing it (several times slower in jimp).
 */
function overlayField(img: Image, field: FieldGridLike, rgba: Uint8ClampedArray, pxPerM: number) {
  const { width, height, data } = img.bitmap;
  const cellsPerPx = 1 / (pxPerM * field.cellSize);
  for (let y = 0; y < height; y++) {
    const j = Math.floor((y + 0.5) * cellsPerPx);
    if (j >= field.height) break;
    for (let x = 0; x < width; x++) {
      const i = Math.floor((x + 0.5) * cellsPerPx);
      if (i >= field.width) break;
      const s = (j * field.width + i) * 4;
      const a = rgba[s + 3] / 255;
      if (a === 0) continue;
      const p = (y * width + x) * 4;
      data[p] = Math.round(data[p] * (1 - a) + rgba[s] * a);
      data[p + 1] = Math.round(data[p + 1] * (1 - a) + rgba[s + 1] * a);
      data[p + 2] = Math.round(data[p + 2] * (1 - a) + rgba[s + 2] * a);
    }
  }
}

export async function renderFieldMapPng(d: FieldMapDrawing): Promise<Buffer> {
  if (!(d.widthM > 0 && d.heightM > 0)) throw new RangeError("plan width and height must be more than 0 m");
  let base: Image;
  if (d.planImage) {
    base = (await Jimp.read(d.planImage)) as Image;
    // keep the drawing's own pixels unless it is much wider than the page needs (resizing is slow)
    if (base.bitmap.width > d.widthPx * 1.25) base.resize({ w: Math.round(d.widthPx) });
  } else {
    const W = Math.round(d.widthPx);
    base = new Jimp({
      width: W,
      height: Math.max(1, Math.round((W * d.heightM) / d.widthM)),
      color: 0xf3f2eeff,
    }) as Image;
  }
  const pxPerM = base.bitmap.width / d.widthM;
  const { field } = d;
  overlayField(base, field, renderFieldRgba(field, { lut: d.lut, index: d.index, opacity: 190, hatch: 4 }), pxPerM);
  const ink: [number, number, number] = [40, 44, 52];
  for (const poly of d.outlines) {
    for (let k = 0; k < poly.length; k++) {
      const a = poly[k];
      const b = poly[(k + 1) % poly.length];
      line(base, [a[0] * pxPerM, a[1] * pxPerM], [b[0] * pxPerM, b[1] * pxPerM], 1, ink, 0.7);
    }
  }
  for (const s of d.spots) {
    const r = Math.max(6, s.radiusM * pxPerM);
    ring(base, s.x * pxPerM, s.y * pxPerM, r, 2, [255, 255, 255]);
    ring(base, s.x * pxPerM, s.y * pxPerM, r, 1, [20, 20, 60]);
    dot(base, s.x * pxPerM, s.y * pxPerM, 3, [20, 20, 60]);
  }
  return base.getBuffer(JimpMime.png);
}
