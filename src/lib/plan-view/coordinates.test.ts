import { describe, expect, it } from "vitest";
import {
  fitView,
  imagePoint,
  imageToPlan,
  imageToStage,
  planLengthToStage,
  planPoint,
  planToImage,
  planToStage,
  stageLengthToPlan,
  stagePoint,
  stageToImage,
  stageToPlan,
  zoomAbout,
  type View,
} from "./coordinates";

const view: View = { panX: 100, panY: 50, zoom: 2 };

describe("coordinates", () => {
  it("converts plan metres to image pixels by metres per pixel and back", () => {
    // 0.01524 m/px (10 ft over 200 px): 3.048 m is 200 px.
    expect(planToImage(planPoint(3.048, 0), 0.01524).x).toBeCloseTo(200, 9);
    expect(imageToPlan(imagePoint(200, 100), 0.01524)).toEqual(planPoint(200 * 0.01524, 100 * 0.01524));
  });
  it("applies pan and zoom between image and stage, and inverts exactly", () => {
    expect(imageToStage(imagePoint(10, 20), view)).toEqual(stagePoint(120, 90));
    expect(stageToImage(stagePoint(120, 90), view)).toEqual(imagePoint(10, 20));
    const p = planPoint(12.5, 7.25);
    const back = stageToPlan(planToStage(p, 0.02, view), 0.02, view);
    expect(back.x).toBeCloseTo(12.5, 12);
    expect(back.y).toBeCloseTo(7.25, 12);
  });
  it("converts screen lengths to metres at the current zoom", () => {
    // 8 px on screen at zoom 2 is 4 image px; at 0.05 m/px that is 0.2 m.
    expect(stageLengthToPlan(8, 0.05, view)).toBeCloseTo(0.2, 12);
    expect(planLengthToStage(0.2, 0.05, view)).toBeCloseTo(8, 12);
  });
  it("zooms about an anchor, keeping the point under it fixed", () => {
    const anchor = stagePoint(300, 200);
    const before = stageToImage(anchor, view);
    const zoomed = zoomAbout(view, anchor, 1.5);
    expect(zoomed.zoom).toBe(3);
    const after = stageToImage(anchor, zoomed);
    expect(after.x).toBeCloseTo(before.x, 12);
    expect(after.y).toBeCloseTo(before.y, 12);
    expect(zoomAbout(view, anchor, 1000).zoom).toBe(40);
  });
  it("fits an image into a viewport, centred", () => {
    const v = fitView(1000, 500, 532, 532, 16);
    expect(v.zoom).toBe(0.5);
    expect(v.panX).toBe(16);
    expect(v.panY).toBe(141);
  });
  it("refuses a scale of zero", () => {
    expect(() => imageToPlan(imagePoint(1, 1), 0)).toThrow(/metresPerPixel must be a finite number above 0/);
  });
});
