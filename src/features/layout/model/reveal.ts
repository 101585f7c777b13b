/**
 * Bringing new copies into view: a duplicate or a row of copies made while zoomed in can land
 * past the stage's edge, where the lead tech would not see that anything happened. The view
 * moves as little as it can: not at all when the box is on screen, a pan when it fits at this
 * zoom, and a zoom out (about the box) only when it does not.
 */
import type { View } from "../../../lib/plan-view/coordinates";

/** A box in the view's base units (the editor's: image pixels). */
export interface BaseBox {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

function axis(pan: number, zoom: number, lo: number, hi: number, size: number, margin: number): number {
  const a = lo * zoom + pan;
  const b = hi * zoom + pan;
  if (b - a > size - 2 * margin) return (size - (lo + hi) * zoom) / 2; // centred: it cannot fit with margins
  if (a < margin) return pan + margin - a;
  if (b > size - margin) return pan - (b - (size - margin));
  return pan;
}

export function revealBox(view: View, box: BaseBox, stage: { width: number; height: number }, marginPx = 16): View {
  const w = box.maxX - box.minX;
  const h = box.maxY - box.minY;
  const room = (n: number) => Math.max(1, n - 2 * marginPx);
  const fitZoom = Math.min(w > 0 ? room(stage.width) / w : Infinity, h > 0 ? room(stage.height) / h : Infinity);
  const zoom = Math.min(view.zoom, fitZoom);
  const panX = axis(view.panX, zoom, box.minX, box.maxX, stage.width, marginPx);
  const panY = axis(view.panY, zoom, box.minY, box.maxY, stage.height, marginPx);
  return panX === view.panX && panY === view.panY && zoom === view.zoom ? view : { panX, panY, zoom };
}
