/**
 * The field map's view: plan metres → canvas pixels (px = m · scale + offset). Kept apart from the
 * drawing so zooming to a suspect spot is plain arithmetic, tested without a canvas.
 */
export interface MapView {
  /** Canvas pixels per plan metre. */
  scale: number;
  ox: number;
  oy: number;
}

export function fitView(widthM: number, heightM: number, canvasW: number, canvasH: number, marginPx = 8): MapView {
  const scale = Math.min((canvasW - 2 * marginPx) / widthM, (canvasH - 2 * marginPx) / heightM);
  return { scale, ox: (canvasW - widthM * scale) / 2, oy: (canvasH - heightM * scale) / 2 };
}

/** Centres plan point (x, y) with `radiusM` filling about a quarter of the shorter side. */
export function focusView(
  x: number,
  y: number,
  radiusM: number,
  canvasW: number,
  canvasH: number,
  base: MapView,
): MapView {
  const want = Math.min(canvasW, canvasH) / 4 / Math.max(radiusM, 0.5);
  const scale = Math.max(base.scale, Math.min(want, base.scale * 8));
  return { scale, ox: canvasW / 2 - x * scale, oy: canvasH / 2 - y * scale };
}

export const toPx = (v: MapView, x: number, y: number): [number, number] => [x * v.scale + v.ox, y * v.scale + v.oy];

/** The spot under a click (its ring or its number badge), nearest first; null when none. */
export function spotAt(
  v: MapView,
  px: number,
  py: number,
  spots: readonly { rank: number; x: number; y: number; radius: number }[],
): number | null {
  let best: { rank: number; d: number } | null = null;
  for (const s of spots) {
    const [cx, cy] = toPx(v, s.x, s.y);
    const r = Math.max(8, s.radius * v.scale);
    const dRing = Math.hypot(px - cx, py - cy);
    const dBadge = Math.hypot(px - (cx + r * 0.71), py - (cy - r * 0.71));
    const hit = dBadge <= 12 ? dBadge : dRing <= r ? dRing : null;
    if (hit !== null && (!best || hit < best.d)) best = { rank: s.rank, d: hit };
  }
  return best?.rank ?? null;
}
