/**
 * The field map's view: the shared plan view (src/lib/plan-view/) in metres, px = m · zoom + pan.
 * Kept apart from the drawing so zooming to a suspect spot is plain arithmetic, tested without a canvas.
 */
import { fitView as fitPlan, METRE_BASE, planPoint, planToStage, type View } from "../../../lib/plan-view/coordinates";

/** The whole plan in the canvas, centred, with a margin. */
export function fitView(widthM: number, heightM: number, canvasW: number, canvasH: number, marginPx = 8): View {
  return fitPlan(widthM, heightM, canvasW, canvasH, marginPx);
}

/** Centres plan point (x, y) with `radiusM` filling about a quarter of the shorter side. */
export function focusView(x: number, y: number, radiusM: number, canvasW: number, canvasH: number, base: View): View {
  const want = Math.min(canvasW, canvasH) / 4 / Math.max(radiusM, 0.5);
  const zoom = Math.max(base.zoom, Math.min(want, base.zoom * 8));
  return { zoom, panX: canvasW / 2 - x * zoom, panY: canvasH / 2 - y * zoom };
}

export const toPx = (v: View, x: number, y: number): [number, number] => {
  const s = planToStage(planPoint(x, y), METRE_BASE, v);
  return [s.x, s.y];
};

/** The spot under a click (its ring or its number badge), nearest first; null when none. */
export function spotAt(
  v: View,
  px: number,
  py: number,
  spots: readonly { rank: number; x: number; y: number; radius: number }[],
): number | null {
  let best: { rank: number; d: number } | null = null;
  for (const s of spots) {
    const [cx, cy] = toPx(v, s.x, s.y);
    const r = Math.max(8, s.radius * v.zoom);
    const dRing = Math.hypot(px - cx, py - cy);
    const dBadge = Math.hypot(px - (cx + r * 0.71), py - (cy - r * 0.71));
    const hit = dBadge <= 12 ? dBadge : dRing <= r ? dRing : null;
    if (hit !== null && (!best || hit < best.d)) best = { rank: s.rank, d: hit };
  }
  return best?.rank ?? null;
}
