import { Jimp, JimpMime } from "jimp";
import type { Fixture } from "#core/contracts/fixtures";
import { DEMO_PLAN } from "./demo-layout";

/** Plots a straight line with Bresenham's algorithm (integer steps, no anti-aliasing). */
function line(img: InstanceType<typeof Jimp>, x0: number, y0: number, x1: number, y1: number, color: number) {
  let [x, y] = [Math.round(x0), Math.round(y0)];
  const [tx, ty] = [Math.round(x1), Math.round(y1)];
  const dx = Math.abs(tx - x),
    dy = -Math.abs(ty - y);
  const sx = x < tx ? 1 : -1,
    sy = y < ty ? 1 : -1;
  let err = dx + dy;
  const { width, height } = img.bitmap;
  for (;;) {
    if (x >= 0 && y >= 0 && x < width && y < height) img.setPixelColor(color, x, y);
    if (x === tx && y === ty) return;
    const e2 = 2 * err;
    if (e2 >= dy) {
      err += dy;
      x += sx;
    }
    if (e2 <= dx) {
      err += dx;
      y += sy;
    }
  }
}

/**
 * A plain floor drawing of the demo store made from its own fixture outlines: what a scanned
 * plan would show (walls, cases, shelving), so the demo's editor has a drawing under it.
 */
export async function drawDemoPlan(
  fixtures: readonly Fixture[],
): Promise<{ png: Buffer; thumb: Buffer; widthPx: number; heightPx: number }> {
  const widthPx = Math.round(DEMO_PLAN.widthM / DEMO_PLAN.metresPerPixel);
  const heightPx = Math.round(DEMO_PLAN.heightM / DEMO_PLAN.metresPerPixel);
  const img = new Jimp({ width: widthPx, height: heightPx, color: 0xfbfaf7ff });
  const px = (m: number) => m / DEMO_PLAN.metresPerPixel;
  for (const f of fixtures) {
    if ("point" in f || f.kind === "benign-zone") continue; // points and zones are Plumeline's, not the drawing's
    const color = f.kind === "wall" ? 0x1f1f1fff : 0x6b6b6bff;
    const poly = f.polygon;
    for (let i = 0; i < poly.length; i++) {
      const [ax, ay] = poly[i];
      const [bx, by] = poly[(i + 1) % poly.length];
      line(img, px(ax), px(ay), px(bx), px(by), color);
    }
  }
  const png = await img.getBuffer(JimpMime.png);
  const thumb = await img.clone().resize({ w: 320 }).getBuffer(JimpMime.png);
  return { png, thumb, widthPx, heightPx };
}
