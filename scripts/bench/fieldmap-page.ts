/**
 * Runs in Chromium (bundled by scripts/bench/fieldmap.ts): draws a field over a plan exactly as the
 * field map screen does (paintFieldCanvas + drawFieldLayer) and times it.
 */
import { decodeField, type EncodedGrid } from "#core/domain/fieldmap/field-codec";
import { paintFieldCanvas, drawFieldLayer } from "../../src/features/fieldmap/model/draw-field-layer";
import { concentrationPaint } from "../../src/features/fieldmap/model/scale-paint";
import { fitView } from "../../src/features/fieldmap/model/view";

function planDrawing(w: number, h: number): HTMLCanvasElement {
  const c = document.createElement("canvas");
  c.width = w;
  c.height = h;
  const ctx = c.getContext("2d")!;
  ctx.fillStyle = "#ffffff";
  ctx.fillRect(0, 0, w, h);
  ctx.strokeStyle = "#333";
  for (let i = 0; i < 60; i++) ctx.strokeRect((i * 37) % w, (i * 53) % h, 80, 30);
  return c;
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)];
}

(window as unknown as { benchDraw: unknown }).benchDraw = (
  encoded: EncodedGrid,
  widthM: number,
  heightM: number,
  runs: number,
) => {
  const decodeStart = performance.now();
  const grid = decodeField(encoded);
  const decodeMs = performance.now() - decodeStart;
  const canvas = document.createElement("canvas");
  canvas.width = 1280;
  canvas.height = 768;
  document.body.appendChild(canvas);
  const ctx = canvas.getContext("2d")!;
  const plan = planDrawing(2000, 1200);
  const { paint } = concentrationPaint([0, 120], 2, true);
  const view = fitView(widthM, heightM, canvas.width, canvas.height, 0);
  const times: number[] = [];
  for (let r = 0; r < runs; r++) {
    const t0 = performance.now();
    ctx.clearRect(0, 0, canvas.width, canvas.height);
    ctx.drawImage(plan, view.panX, view.panY, widthM * view.zoom, heightM * view.zoom);
    const painted = paintFieldCanvas(grid, paint);
    drawFieldLayer(ctx, painted, grid, view);
    ctx.getImageData(0, 0, 1, 1); // reading a pixel back waits for the drawing to finish
    times.push(performance.now() - t0);
  }
  return {
    cells: grid.width * grid.height,
    decodeMs,
    firstMs: times[0],
    medianMs: median(times),
    maxMs: Math.max(...times),
  };
};
