/**
 * How big the editor's grab targets are for the pointer in hand. A finger needs a target of
 * about 48 CSS px (Material Design, "Touch targets": 48 × 48 dp; WCAG 2.2 SC 2.5.5 asks 44 × 44 px);
 * a mouse keeps the small, precise targets it always had. Sizes are screen pixels; the view
 * converts them to metres at the current zoom.
 */

export type PointerKind = "mouse" | "touch";

export interface TargetSizes {
  kind: PointerKind;
  /** Side of a drawn transformer handle (what the eye sees). */
  anchorVisualPx: number;
  /** Side of the square a press on a handle may land in. */
  anchorHitPx: number;
  /** How far a press may miss a corner, a point or the first vertex and still get it. */
  pickPx: number;
  /** A press becomes a drag past this distance (a finger wobbles more than a mouse). */
  dragPx: number;
  /** Distance from the outline's top to the rotate handle's centre. */
  rotateOffsetPx: number;
}

// Material Design touch target 48 dp (m2.material.io/develop/web/supporting/touch-target);
// WCAG 2.2 SC 2.5.5 Target Size (Enhanced) 44 × 44 CSS px.
export const TOUCH_TARGET_PX = 48;

export function targetSizes(kind: PointerKind): TargetSizes {
  if (kind === "touch")
    return {
      kind,
      anchorVisualPx: 16,
      anchorHitPx: TOUCH_TARGET_PX,
      pickPx: TOUCH_TARGET_PX / 2,
      dragPx: 8,
      rotateOffsetPx: 72,
    };
  return { kind, anchorVisualPx: 12, anchorHitPx: 12, pickPx: 8, dragPx: 4, rotateOffsetPx: 50 };
}

export interface Rect {
  x: number;
  y: number;
  width: number;
  height: number;
}

/**
 * The hit square of one transformer handle, in the handle's own coordinates (its visual square
 * spans 0..visual on both axes). A big target centred on a corner would cover the fixture under
 * it, and a narrow case would become all handle and no body to drag; so the target reaches
 * outward from the outline and covers at most `inwardPx` of the inside. The rotate handle
 * floats above the outline and is centred. `name` is Konva's anchor name ("top-left",
 * "middle-right", "rotater", ...).
 */
export function anchorHitRect(name: string, visualPx: number, hitPx: number, inwardPx = 10): Rect {
  if (!(visualPx > 0) || !(hitPx > 0))
    throw new RangeError(`anchorHitRect: visualPx and hitPx must be positive (got ${visualPx}, ${hitPx})`);
  const size = Math.max(hitPx, visualPx);
  const c = visualPx / 2;
  // Centre of the handle = the outline's corner or edge midpoint.
  const inward = Math.min(inwardPx, size / 2);
  const along = (lo: boolean, hi: boolean): number => {
    if (lo) return c + inward - size; // reaches out towards negative
    if (hi) return c - inward; // reaches out towards positive
    return c - size / 2;
  };
  const rotater = name.includes("rotater");
  const x = rotater ? c - size / 2 : along(name.includes("left"), name.includes("right"));
  const y = rotater ? c - size / 2 : along(name.includes("top"), name.includes("bottom"));
  return { x, y, width: size, height: size };
}

export const CORNER_ANCHORS = ["top-left", "top-right", "bottom-left", "bottom-right"] as const;
export const ALL_ANCHORS = [...CORNER_ANCHORS, "top-center", "bottom-center", "middle-left", "middle-right"] as const;

/** How far handles may reach into a selection at most (anchorHitRect's default). */
export const MAX_INWARD_PX = 10;

/**
 * The transformer's handles around a selection of this size on screen, so a finger can still
 * grab its body: each handle's target reaches into the outline only as far as leaves a
 * target-sized middle (none of it on a small fixture, whose handles then lie wholly outside),
 * and a side shorter than two targets keeps only its corner handles, so edge handles do not
 * crowd the corners' targets.
 */
export function selectionHandles(
  widthPx: number,
  heightPx: number,
  sizes: TargetSizes,
): { inwardPx: number; anchors: readonly string[] } {
  const side = Math.min(Math.abs(widthPx), Math.abs(heightPx));
  if (Number.isNaN(side))
    throw new RangeError(`selectionHandles: the selection's size must be numbers (got ${widthPx}, ${heightPx})`);
  const inwardPx = Math.max(0, Math.min(MAX_INWARD_PX, (side - sizes.anchorHitPx) / 2));
  return { inwardPx, anchors: side < 2 * sizes.anchorHitPx ? CORNER_ANCHORS : ALL_ANCHORS };
}
