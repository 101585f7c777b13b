// The view transform is stage = base × zoom + pan (src/lib/plan-view/coordinates.ts); expected
// values worked by hand from it.
import { describe, expect, it } from "vitest";
import { revealBox } from "./reveal";

const stage = { width: 800, height: 600 };

describe("bringing copies into view", () => {
  it("leaves the view alone when the box is on screen", () => {
    const v = { panX: 0, panY: 0, zoom: 2 };
    expect(revealBox(v, { minX: 100, minY: 100, maxX: 200, maxY: 200 }, stage)).toBe(v);
  });

  it("pans just enough to bring a box past the right and bottom edges in, keeping the zoom", () => {
    // At zoom 2 the box spans 700..900 × 500..560 on screen; 16 px margin: pan by −116 and 0.
    const v = revealBox({ panX: 100, panY: -100, zoom: 2 }, { minX: 300, minY: 300, maxX: 400, maxY: 330 }, stage);
    expect(v).toEqual({ panX: -16, panY: -100, zoom: 2 });
  });

  it("pans a box past the left and top edges in", () => {
    const v = revealBox({ panX: 0, panY: 0, zoom: 1 }, { minX: -50, minY: -20, maxX: 50, maxY: 20 }, stage);
    expect(v).toEqual({ panX: 66, panY: 36, zoom: 1 });
  });

  it("zooms out to the box when it cannot fit at this zoom, and centres it", () => {
    // 1000 base px wide at zoom 4 is 4000 px; 768 px of room: zoom 0.768, centred on x; its top
    // (at 0 on screen) moves down to the 16 px margin.
    const v = revealBox({ panX: 0, panY: 0, zoom: 4 }, { minX: 0, minY: 0, maxX: 1000, maxY: 100 }, stage);
    expect(v.zoom).toBeCloseTo(0.768, 12);
    expect(v.panX).toBeCloseTo(16, 9);
    expect(v.panY).toBe(16);
  });
});
