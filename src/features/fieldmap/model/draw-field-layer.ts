/**
 * Draws a field grid over the plan: the grid is painted once into an offscreen canvas at one pixel
 * per cell (renderFieldRgba: unknown hatched, thin areas faded) and then scaled onto the view without
 * smoothing, so cells stay crisp and a 96,000-cell field costs one putImageData and one drawImage.
 */
import type { FieldGridLike } from "#core/domain/fieldmap/field-grid";
import { renderFieldRgba } from "#core/domain/fieldmap/render-field";
import type { View } from "../../../lib/plan-view/coordinates";

export interface FieldPaint {
  lut: Uint8ClampedArray;
  index(value: number): number;
  opacity?: number;
}

export function paintFieldCanvas(
  grid: FieldGridLike,
  paint: FieldPaint,
  canvas?: HTMLCanvasElement,
): HTMLCanvasElement {
  const c = canvas ?? document.createElement("canvas");
  c.width = grid.width;
  c.height = grid.height;
  const ctx = c.getContext("2d");
  if (!ctx) throw new Error("no 2D canvas");
  const image = ctx.createImageData(grid.width, grid.height);
  renderFieldRgba(grid, { lut: paint.lut, index: paint.index, opacity: paint.opacity ?? 185, hatch: 4 }, image.data);
  ctx.putImageData(image, 0, 0);
  return c;
}

export function drawFieldLayer(
  ctx: CanvasRenderingContext2D,
  painted: HTMLCanvasElement,
  grid: FieldGridLike,
  view: View,
): void {
  ctx.save();
  ctx.imageSmoothingEnabled = false;
  const size = grid.cellSize * view.zoom;
  ctx.drawImage(painted, view.panX, view.panY, grid.width * size, grid.height * size);
  ctx.restore();
}
