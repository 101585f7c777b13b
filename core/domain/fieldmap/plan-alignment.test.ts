import { describe, expect, it } from "vitest";
import { applySimilarity, similarityFromTwoPoints } from "../../analysis/geometry/similarity";
import { alignmentBetween } from "./plan-alignment";

describe("alignment between plan versions", () => {
  // v2 was re-drawn 1.05× larger and turned 90°; the lead tech matched two points on each
  const v1v2 = similarityFromTwoPoints([2, 3], [20, 3], [10, 1], [10, 1 + 18 * 1.05]);
  // v3 only shifted by (−0.5, 0.25)
  const v2v3 = similarityFromTwoPoints([0, 0], [10, 0], [-0.5, 0.25], [9.5, 0.25]);
  const plans = [
    { id: "v1", previousPlanId: null, alignment: null },
    { id: "v2", previousPlanId: "v1", alignment: v1v2 },
    { id: "v3", previousPlanId: "v2", alignment: v2v3 },
  ];

  it("maps the two matched points exactly, in both directions", () => {
    const t = alignmentBetween(plans, "v1", "v2");
    // the two matched points of the stored alignment (hand-chosen above)
    for (const [a, b] of [
      [
        [2, 3],
        [10, 1],
      ],
      [
        [20, 3],
        [10, 1 + 18 * 1.05],
      ],
    ] as const) {
      const m = applySimilarity(t, a);
      expect(m[0]).toBeCloseTo(b[0], 10);
      expect(m[1]).toBeCloseTo(b[1], 10);
      const back = applySimilarity(alignmentBetween(plans, "v2", "v1"), b);
      expect(back[0]).toBeCloseTo(a[0], 10);
      expect(back[1]).toBeCloseTo(a[1], 10);
    }
  });

  it("composes across versions: v1 → v3 is v1 → v2 then v2 → v3", () => {
    const t = alignmentBetween(plans, "v1", "v3");
    const via = applySimilarity(v2v3, applySimilarity(v1v2, [2, 3]));
    const direct = applySimilarity(t, [2, 3]);
    expect(direct[0]).toBeCloseTo(via[0], 10);
    expect(direct[1]).toBeCloseTo(via[1], 10);
    // the matched point (2, 3) lands on (10, 1) in v2 and then shifts by (−0.5, 0.25)
    expect(direct[0]).toBeCloseTo(9.5, 10);
    expect(direct[1]).toBeCloseTo(1.25, 10);
  });

  it("is the identity on one version and refuses plans of different stores", () => {
    expect(alignmentBetween(plans, "v2", "v2")).toEqual({ scale: 1, rotation: 0, tx: 0, ty: 0 });
    expect(() => alignmentBetween([...plans, { id: "x", previousPlanId: null, alignment: null }], "v1", "x")).toThrow(
      /not versions/,
    );
  });
});
