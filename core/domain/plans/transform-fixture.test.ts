import { describe, expect, it } from "vitest";
import { similarityFromTwoPoints } from "../../analysis/geometry/similarity";
import type { Fixture } from "../../contracts/fixtures";
import { transformFixture } from "./transform-fixture";

const room: Fixture = {
  id: "6f1b7a2e-0f5e-4a4b-9d7e-3c2a1b0f9e8d",
  kind: "walk-in-cooler",
  label: "Dairy cooler",
  systemId: null,
  hasFans: true,
  polygon: [
    [0, 0],
    [4, 0],
    [4, 3],
    [0, 3],
  ],
  door: { edge: 0, offset: 1, width: 1 },
};

describe("transformFixture", () => {
  it("scales outlines and door lengths about the origin (re-calibration)", () => {
    const out = transformFixture(room, { scale: 2, rotation: 0, tx: 0, ty: 0 });
    expect(out.polygon).toEqual([
      [0, 0],
      [8, 0],
      [8, 6],
      [0, 6],
    ]);
    expect("door" in out && out.door).toEqual({ edge: 0, offset: 2, width: 2 });
    expect(room.polygon[1]).toEqual([4, 0]); // the input is not changed
  });

  it("rotates a quarter turn and offsets, as two matched points define it", () => {
    // (0,0)→(10,0) and (1,0)→(10,1): a 90° turn (x towards y) and an offset of (10, 0).
    const t = similarityFromTwoPoints([0, 0], [1, 0], [10, 0], [10, 1]);
    const out = transformFixture(room, t);
    const expected = [
      [10, 0],
      [10, 4],
      [7, 4],
      [7, 0],
    ];
    out.polygon.forEach(([x, y], i) => {
      expect(x).toBeCloseTo(expected[i][0], 12);
      expect(y).toBeCloseTo(expected[i][1], 12);
    });
  });

  it("maps points and refuses a degenerate transform", () => {
    const valve: Fixture = {
      id: room.id,
      kind: "valve",
      label: "",
      systemId: null,
      hasFans: false,
      point: { x: 2, y: 3 },
    };
    expect(transformFixture(valve, { scale: 0.5, rotation: 0, tx: 1, ty: 1 })).toMatchObject({
      point: { x: 2, y: 2.5 },
    });
    expect(() => transformFixture(valve, { scale: 0, rotation: 0, tx: 0, ty: 0 })).toThrow(/scale above 0/);
  });
});
