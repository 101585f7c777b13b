/**
 * The plan view shared by every screen that shows a plan (layout editor, Walk, field map,
 * comparison): three coordinate spaces as distinct branded types and the ONE module that converts
 * between them (models store only plan metres; pixels exist only between the image and the stage).
 *
 * - PlanPoint: metres, origin at the plan's top-left corner, x right, y down.
 * - ImagePoint: pixels of the plan's display image (origin top-left).
 * - StagePoint: screen pixels of the stage or canvas, after the view's pan and zoom.
 *
 * A view maps its base unit to the stage: stage = base × zoom + pan. The layout editor's base is
 * the image pixel (plan = image × metresPerPixel); the Walk screen and the field map draw in
 * metres, so their base is the metre (`METRE_BASE`: zoom is then screen pixels per metre).
 */

declare const space: unique symbol;
type Branded<S extends string> = { readonly x: number; readonly y: number; readonly [space]: S };

export type PlanPoint = Branded<"plan">;
export type ImagePoint = Branded<"image">;
export type StagePoint = Branded<"stage">;

/** The stage's pan (screen px of the base origin) and zoom (screen px per base unit). */
export interface View {
  readonly panX: number;
  readonly panY: number;
  readonly zoom: number;
}

/** How far a screen lets its view zoom, in screen px per base unit. */
export interface ZoomLimits {
  readonly min: number;
  readonly max: number;
}

/** The layout editor's limits (base: image pixels). */
export const IMAGE_ZOOM: ZoomLimits = { min: 0.05, max: 40 };
/** Views whose base unit is the metre: `planToStage(p, METRE_BASE, view)`. */
export const METRE_BASE = 1;

export function planPoint(x: number, y: number): PlanPoint {
  return { x, y } as PlanPoint;
}
export function imagePoint(x: number, y: number): ImagePoint {
  return { x, y } as ImagePoint;
}
export function stagePoint(x: number, y: number): StagePoint {
  return { x, y } as StagePoint;
}

function checkScale(metresPerPixel: number): void {
  if (!(Number.isFinite(metresPerPixel) && metresPerPixel > 0)) {
    throw new RangeError(`metresPerPixel must be a finite number above 0, got ${metresPerPixel}`);
  }
}

export function imageToPlan(p: ImagePoint, metresPerPixel: number): PlanPoint {
  checkScale(metresPerPixel);
  return planPoint(p.x * metresPerPixel, p.y * metresPerPixel);
}

export function planToImage(p: PlanPoint, metresPerPixel: number): ImagePoint {
  checkScale(metresPerPixel);
  return imagePoint(p.x / metresPerPixel, p.y / metresPerPixel);
}

export function imageToStage(p: ImagePoint, view: View): StagePoint {
  return stagePoint(p.x * view.zoom + view.panX, p.y * view.zoom + view.panY);
}

export function stageToImage(p: StagePoint, view: View): ImagePoint {
  return imagePoint((p.x - view.panX) / view.zoom, (p.y - view.panY) / view.zoom);
}

export function planToStage(p: PlanPoint, metresPerPixel: number, view: View): StagePoint {
  return imageToStage(planToImage(p, metresPerPixel), view);
}

export function stageToPlan(p: StagePoint, metresPerPixel: number, view: View): PlanPoint {
  return imageToPlan(stageToImage(p, view), metresPerPixel);
}

/** A length on screen (e.g. an 8 px snap tolerance) in plan metres at the current zoom. */
export function stageLengthToPlan(pixels: number, metresPerPixel: number, view: View): number {
  checkScale(metresPerPixel);
  return (pixels / view.zoom) * metresPerPixel;
}

/** A length in plan metres as screen pixels at the current zoom (for scale bars). */
export function planLengthToStage(metres: number, metresPerPixel: number, view: View): number {
  checkScale(metresPerPixel);
  return (metres / metresPerPixel) * view.zoom;
}

const clamp = (zoom: number, limits: ZoomLimits) => Math.min(limits.max, Math.max(limits.min, zoom));

/**
 * Zooms by `factor` keeping the point under `anchor` fixed on screen (wheel, buttons and pinch
 * zoom about the cursor, a focus or the fingers' midpoint). Zoom is clamped to `limits`.
 */
export function zoomAbout(view: View, anchor: StagePoint, factor: number, limits: ZoomLimits = IMAGE_ZOOM): View {
  if (!(Number.isFinite(factor) && factor > 0)) throw new RangeError(`zoom factor must be above 0, got ${factor}`);
  const zoom = clamp(view.zoom * factor, limits);
  const under = stageToImage(anchor, view);
  return { zoom, panX: anchor.x - under.x * zoom, panY: anchor.y - under.y * zoom };
}

/** The view moved by (dx, dy) screen pixels. */
export function panBy(view: View, dx: number, dy: number): View {
  return { ...view, panX: view.panX + dx, panY: view.panY + dy };
}

/**
 * The view that fits content of the given size (in base units) into a viewport, centred, with a
 * margin; the zoom is clamped to `limits` (none by default).
 */
export function fitView(
  contentWidth: number,
  contentHeight: number,
  viewportWidth: number,
  viewportHeight: number,
  marginPx = 16,
  limits: ZoomLimits = { min: 0, max: Infinity },
): View {
  const zoom = clamp(
    Math.min((viewportWidth - 2 * marginPx) / contentWidth, (viewportHeight - 2 * marginPx) / contentHeight),
    limits,
  );
  return { zoom, panX: (viewportWidth - contentWidth * zoom) / 2, panY: (viewportHeight - contentHeight * zoom) / 2 };
}
