import { describe, expect, it } from "vitest";
import { ALL_ANCHORS, anchorHitRect, selectionHandles, targetSizes, TOUCH_TARGET_PX } from "./touch-targets";

const CORNERS = ["top-left", "top-right", "bottom-left", "bottom-right"];
const EDGES = ["top-center", "bottom-center", "middle-left", "middle-right"];

describe("touch target sizes", () => {
  it("gives a finger targets of at least 48 px and a mouse its small precise ones", () => {
    const touch = targetSizes("touch");
    // Material Design touch target: 48 × 48 dp; WCAG 2.2 SC 2.5.5: at least 44 × 44 CSS px.
    expect(touch.anchorHitPx).toBeGreaterThanOrEqual(48);
    expect(touch.anchorHitPx).toBeGreaterThanOrEqual(44);
    // A pick radius of half the target is a 48 px circle around a corner or a point.
    expect(2 * touch.pickPx).toBeGreaterThanOrEqual(TOUCH_TARGET_PX);
    // Two neighbouring handles' targets must not overlap: the rotate handle sits more than a
    // whole target above the top edge handle's outward reach.
    const top = anchorHitRect("top-center", touch.anchorVisualPx, touch.anchorHitPx);
    const rot = anchorHitRect("rotater", touch.anchorVisualPx, touch.anchorHitPx);
    const c = touch.anchorVisualPx / 2;
    expect(-touch.rotateOffsetPx + (rot.y + rot.height - c)).toBeLessThanOrEqual(top.y - c);
    expect(targetSizes("mouse").anchorHitPx).toBe(12);
  });
});

describe("anchorHitRect", () => {
  const v = 16;
  const c = v / 2;
  it("makes every handle's target 48 × 48 and keeps its drawn square inside it", () => {
    for (const name of [...CORNERS, ...EDGES, "rotater"]) {
      const r = anchorHitRect(name, v, 48);
      expect(r.width, name).toBe(48);
      expect(r.height, name).toBe(48);
      expect(r.x, name).toBeLessThanOrEqual(0);
      expect(r.y, name).toBeLessThanOrEqual(0);
      expect(r.x + r.width, name).toBeGreaterThanOrEqual(v);
      expect(r.y + r.height, name).toBeGreaterThanOrEqual(v);
    }
  });

  it("reaches outward from the outline, covering at most 10 px of the fixture inside", () => {
    // top-left: the fixture lies right of and below the handle's centre.
    const tl = anchorHitRect("top-left", v, 48);
    expect(tl.x + tl.width - c).toBe(10);
    expect(tl.y + tl.height - c).toBe(10);
    const br = anchorHitRect("bottom-right", v, 48);
    expect(c - br.x).toBe(10);
    expect(c - br.y).toBe(10);
    // An edge handle is centred along its edge and reaches out across it.
    const mr = anchorHitRect("middle-right", v, 48);
    expect(c - mr.x).toBe(10);
    expect(mr.y + mr.height / 2).toBe(c);
    const tc = anchorHitRect("top-center", v, 48);
    expect(tc.x + tc.width / 2).toBe(c);
    expect(tc.y + tc.height - c).toBe(10);
    // The rotate handle floats free, centred.
    const rot = anchorHitRect("rotater", v, 48);
    expect(rot.x + rot.width / 2).toBe(c);
    expect(rot.y + rot.height / 2).toBe(c);
  });

  it("is the drawn square itself for a mouse, and refuses sizes that are not positive", () => {
    expect(anchorHitRect("top-left", 12, 12, 6)).toEqual({ x: 0, y: 0, width: 12, height: 12 });
    expect(() => anchorHitRect("top-left", 0, 48)).toThrow(/visualPx and hitPx must be positive/);
  });
});

describe("handles round a small selection", () => {
  const touch = targetSizes("touch");
  it("leave a large fixture's handles as they were", () => {
    const h = selectionHandles(300, 120, touch);
    expect(h.inwardPx).toBe(10);
    expect(h.anchors).toHaveLength(8);
  });

  it("keep a finger-sized middle free on a fixture a little over one target wide", () => {
    // 60 px: handles reach 6 px in from each side, leaving 48 px (Material Design's touch target).
    const h = selectionHandles(60, 200, touch);
    expect(60 - 2 * h.inwardPx).toBe(TOUCH_TARGET_PX);
    expect(h.anchors).toEqual(CORNERS);
  });

  it("put every handle's target outside a fixture smaller than a finger, and only at its corners", () => {
    // A 0.6 m case at 50 px per metre is 30 px on screen.
    const h = selectionHandles(30, 30, touch);
    expect(h.inwardPx).toBe(0);
    expect(h.anchors).toEqual(CORNERS);
    for (const name of h.anchors) {
      const r = anchorHitRect(name, touch.anchorVisualPx, touch.anchorHitPx, h.inwardPx);
      const c = touch.anchorVisualPx / 2;
      // The handle's centre is the outline's corner: the target lies wholly on the outside.
      const x0 = r.x - c;
      const x1 = r.x + r.width - c;
      expect(name.includes("left") ? x1 <= 0 : x0 >= 0).toBe(true);
    }
  });

  it("uses the mouse's small targets with a mouse", () => {
    expect(selectionHandles(30, 30, targetSizes("mouse"))).toEqual({ inwardPx: 9, anchors: ALL_ANCHORS });
  });
});
