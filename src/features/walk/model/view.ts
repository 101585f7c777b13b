// The Walk screen's view: plan metres ↔ screen pixels. stage = plan × scale + pan, where scale is
// screen pixels per metre. One module, so taps and drawing never disagree.

export interface WalkView {
  scale: number;
  panX: number;
  panY: number;
}

export const MIN_SCALE = 2;
export const MAX_SCALE = 400;

export function toPlan(view: WalkView, sx: number, sy: number): { x: number; y: number } {
  return { x: (sx - view.panX) / view.scale, y: (sy - view.panY) / view.scale };
}

export function toStage(view: WalkView, x: number, y: number): { x: number; y: number } {
  return { x: x * view.scale + view.panX, y: y * view.scale + view.panY };
}

/** The whole plan centred in the box, with a small margin. */
export function fitView(widthM: number, heightM: number, boxW: number, boxH: number, margin = 12): WalkView {
  const scale = Math.max(MIN_SCALE, Math.min((boxW - 2 * margin) / widthM, (boxH - 2 * margin) / heightM));
  return { scale, panX: (boxW - widthM * scale) / 2, panY: (boxH - heightM * scale) / 2 };
}

/** Zoom by `factor` keeping the plan point under (sx, sy) fixed on screen. */
export function zoomAt(view: WalkView, sx: number, sy: number, factor: number): WalkView {
  const scale = Math.max(MIN_SCALE, Math.min(MAX_SCALE, view.scale * factor));
  const k = scale / view.scale;
  return { scale, panX: sx - (sx - view.panX) * k, panY: sy - (sy - view.panY) * k };
}
