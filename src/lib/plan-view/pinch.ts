import { panBy, stagePoint, zoomAbout, type View, type ZoomLimits } from "./coordinates";

/** Two fingers on the stage, in the stage's pixels. */
export type Fingers = readonly [{ x: number; y: number }, { x: number; y: number }];

export interface PinchStep {
  /** Ratio of the fingers' spread to the last step's (1 when the spread was 0). */
  factor: number;
  /** Midpoint between the fingers now. */
  centre: { x: number; y: number };
  /** How far the midpoint moved since the last step (two-finger pan). */
  dx: number;
  dy: number;
}

const spread = (f: Fingers) => Math.hypot(f[0].x - f[1].x, f[0].y - f[1].y);
const middle = (f: Fingers) => ({ x: (f[0].x + f[1].x) / 2, y: (f[0].y + f[1].y) / 2 });

/** The step between two readings of the same two fingers. */
export function pinchStep(before: Fingers, after: Fingers): PinchStep {
  const was = spread(before);
  const a = middle(before);
  const b = middle(after);
  return { factor: was > 0 ? spread(after) / was : 1, centre: b, dx: b.x - a.x, dy: b.y - a.y };
}

/**
 * The one pinch gesture of every plan screen: zoom about the fingers' midpoint, then follow the
 * midpoint, so the plan point under the fingers stays under them.
 */
export function applyPinch(view: View, step: PinchStep, limits: ZoomLimits): View {
  const zoomed = zoomAbout(view, stagePoint(step.centre.x - step.dx, step.centre.y - step.dy), step.factor, limits);
  return panBy(zoomed, step.dx, step.dy);
}
