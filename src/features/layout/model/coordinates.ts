/**
 * The three coordinate spaces of the layout editor, as distinct branded types, and the ONE
 * module that converts between them (the model stores only plan metres; pixels exist only
 * between the image and the stage).
 *
 * - PlanPoint: metres, origin at the plan's top-left corner, x right, y down.
 * - ImagePoint: pixels of the plan's display image (origin top-left).
 * - StagePoint: screen pixels of the Konva stage, after the view's pan and zoom.
 *
 * plan = image × metresPerPixel;   stage = image × zoom + pan.
 */

declare const space: unique symbol;
type Branded<S extends string> = { readonly x: number; readonly y: number; readonly [space]: S };

export type PlanPoint = Branded<"plan">;
export type ImagePoint = Branded<"image">;
export type StagePoint = Branded<"stage">;

/** The stage's pan (screen px of the image origin) and zoom (screen px per image px). */
export interface View {
  readonly panX: number;
  readonly panY: number;
  readonly zoom: number;
}

export const MIN_ZOOM = 0.05;
export const MAX_ZOOM = 40;

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

/**
 * Zooms by `factor` keeping the image point under `anchor` fixed on screen (wheel and pinch
 * zoom about the cursor or the fingers' midpoint). Zoom is clamped to [MIN_ZOOM, MAX_ZOOM].
 */
export function zoomAbout(view: View, anchor: StagePoint, factor: number): View {
  if (!(Number.isFinite(factor) && factor > 0)) throw new RangeError(`zoom factor must be above 0, got ${factor}`);
  const zoom = Math.min(MAX_ZOOM, Math.max(MIN_ZOOM, view.zoom * factor));
  const under = stageToImage(anchor, view);
  return { zoom, panX: anchor.x - under.x * zoom, panY: anchor.y - under.y * zoom };
}

/** The view that fits an image of the given pixel size into a viewport, centred, with a margin. */
export function fitView(
  imageWidth: number,
  imageHeight: number,
  viewportWidth: number,
  viewportHeight: number,
  marginPx = 16,
): View {
  const zoom = Math.min(
    MAX_ZOOM,
    Math.max(
      MIN_ZOOM,
      Math.min((viewportWidth - 2 * marginPx) / imageWidth, (viewportHeight - 2 * marginPx) / imageHeight),
    ),
  );
  return { zoom, panX: (viewportWidth - imageWidth * zoom) / 2, panY: (viewportHeight - imageHeight * zoom) / 2 };
}
