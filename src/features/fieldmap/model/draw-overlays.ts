/** The vector layers over the field: fixtures, risk points, the walked path, taps and suspect spots. */
import type { View } from "../../../lib/plan-view/coordinates";
import { backdropOf } from "../../../lib/plan-view/fixture-look";
import { toPx } from "./view";

export interface OverlayFixture {
  id: string;
  kind: string;
  label: string;
  polygon?: readonly (readonly [number, number])[];
  point?: { x: number; y: number };
}

export interface OverlayReading {
  raw: { x: number; y: number };
  corrected: { x: number; y: number };
  ppm: number;
  /** The pass it was taken in: 1 (or absent) for the first, 2, 3, … for pinpoint passes (drawn as squares). */
  pass?: number;
}

export interface OverlaySpot {
  rank: number;
  x: number;
  y: number;
  radius: number;
}

export function drawFixtures(ctx: CanvasRenderingContext2D, view: View, fixtures: readonly OverlayFixture[]): void {
  ctx.save();
  ctx.lineWidth = 1.2;
  for (const f of fixtures) {
    if (!f.polygon) continue;
    ctx.beginPath();
    f.polygon.forEach(([x, y], i) => {
      const [px, py] = toPx(view, x, y);
      if (i === 0) ctx.moveTo(px, py);
      else ctx.lineTo(px, py);
    });
    ctx.closePath();
    const weight = backdropOf(f.kind);
    if (weight === "ink" || weight === "shade") {
      ctx.fillStyle = "rgba(60, 66, 76, 0.55)";
      ctx.fill();
    } else if (weight === "dashed") {
      ctx.setLineDash([5, 4]);
      ctx.strokeStyle = "rgba(40, 90, 110, 0.9)";
      ctx.stroke();
      ctx.setLineDash([]);
    } else {
      ctx.strokeStyle = "rgba(30, 36, 48, 0.85)";
      ctx.stroke();
    }
  }
  ctx.restore();
}

export function drawRiskPoints(ctx: CanvasRenderingContext2D, view: View, fixtures: readonly OverlayFixture[]): void {
  ctx.save();
  for (const f of fixtures) {
    if (!f.point) continue;
    const [px, py] = toPx(view, f.point.x, f.point.y);
    ctx.beginPath();
    ctx.moveTo(px, py - 6);
    ctx.lineTo(px + 6, py);
    ctx.lineTo(px, py + 6);
    ctx.lineTo(px - 6, py);
    ctx.closePath();
    ctx.fillStyle = "#ffffff";
    ctx.fill();
    ctx.lineWidth = 2;
    ctx.strokeStyle = "#1f4e5f";
    ctx.stroke();
  }
  ctx.restore();
}

export function drawPath(ctx: CanvasRenderingContext2D, view: View, readings: readonly OverlayReading[]): void {
  if (readings.length < 2) return;
  ctx.save();
  ctx.beginPath();
  readings.forEach((r, i) => {
    const [px, py] = toPx(view, r.raw.x, r.raw.y);
    if (i === 0) ctx.moveTo(px, py);
    else ctx.lineTo(px, py);
  });
  ctx.setLineDash([4, 4]);
  ctx.lineWidth = 1.5;
  ctx.strokeStyle = "rgba(31, 78, 95, 0.75)";
  ctx.stroke();
  ctx.restore();
}

export function drawTaps(
  ctx: CanvasRenderingContext2D,
  view: View,
  readings: readonly OverlayReading[],
  which: "raw" | "corrected",
  linkToRaw: boolean,
): void {
  ctx.save();
  for (const r of readings) {
    const p = which === "raw" ? r.raw : r.corrected;
    const [px, py] = toPx(view, p.x, p.y);
    if (which === "corrected" && linkToRaw) {
      const [rx, ry] = toPx(view, r.raw.x, r.raw.y);
      if (Math.hypot(rx - px, ry - py) > 2) {
        ctx.beginPath();
        ctx.moveTo(rx, ry);
        ctx.lineTo(px, py);
        ctx.strokeStyle = "rgba(20, 20, 60, 0.35)";
        ctx.lineWidth = 1;
        ctx.stroke();
      }
    }
    ctx.beginPath();
    const size = which === "raw" ? 3.5 : 2.5;
    if ((r.pass ?? 1) > 1) ctx.rect(px - size, py - size, 2 * size, 2 * size);
    else ctx.arc(px, py, size, 0, 2 * Math.PI);
    if (which === "raw") {
      ctx.strokeStyle = "#1c2529";
      ctx.lineWidth = 1.2;
      ctx.stroke();
    } else {
      ctx.fillStyle = "#14143c";
      ctx.fill();
    }
  }
  ctx.restore();
}

export function drawSpots(
  ctx: CanvasRenderingContext2D,
  view: View,
  spots: readonly OverlaySpot[],
  selected: number | null,
): void {
  ctx.save();
  for (const s of spots) {
    const [px, py] = toPx(view, s.x, s.y);
    const r = Math.max(8, s.radius * view.zoom);
    ctx.beginPath();
    ctx.arc(px, py, r, 0, 2 * Math.PI);
    ctx.lineWidth = s.rank === selected ? 4 : 2.5;
    ctx.strokeStyle = "#ffffff";
    ctx.stroke();
    ctx.lineWidth = s.rank === selected ? 2.5 : 1.5;
    ctx.strokeStyle = "#14143c";
    ctx.stroke();
    // the number sits on the ring's upper right so it never hides the centre
    const bx = px + r * 0.71;
    const by = py - r * 0.71;
    ctx.beginPath();
    ctx.arc(bx, by, 10, 0, 2 * Math.PI);
    ctx.fillStyle = "#14143c";
    ctx.fill();
    ctx.lineWidth = 2;
    ctx.strokeStyle = "#ffffff";
    ctx.stroke();
    ctx.fillStyle = "#ffffff";
    ctx.font = "bold 12px 'Atkinson Hyperlegible', sans-serif";
    ctx.textAlign = "center";
    ctx.textBaseline = "middle";
    ctx.fillText(String(s.rank), bx, by + 0.5);
  }
  ctx.restore();
}
