import { describe, expect, it } from "vitest";
import type { LiveProbe } from "../../analysis/guide/live-guide";
import { liveLeadWords, liveSuspectWords, probePlaceWords, probeReasonWords } from "./live-guide-words";
import { wordsContext } from "./present-analysis";

// Names from an invented store's plan.
const names = new Map([
  ["c4", "Dairy 4"],
  ["c5", "Dairy 5"],
  ["wi", "Produce cooler"],
  ["d1", "M1"],
]);
const ctx = (length: "m" | "ft-in") =>
  wordsContext({ length, mass: "kg", numbers: "1,234.5", names, delaySetByHand: false }, 1.5);

const probe = (p: Partial<LiveProbe>): LiveProbe => ({
  x: 1,
  y: 1,
  kind: "case-front",
  fixtureId: "c4",
  reason: { kind: "separates", ranks: [1, 2], fixtureIds: ["c4", "c5"] },
  ...p,
});

describe("the live guide's words", () => {
  it("names what a probe tells apart with the plan's names", () => {
    expect(probeReasonWords(probe({}), ctx("m"))).toBe("tells Dairy 4 from Dairy 5");
    expect(
      probeReasonWords(probe({ reason: { kind: "separates", ranks: [1, 3], fixtureIds: ["c4", "c4"] } }), ctx("m")),
    ).toBe("tells two spots on Dairy 4 apart");
    expect(probeReasonWords(probe({ reason: { kind: "narrows", rank: 2, fixtureId: null } }), ctx("m"))).toBe(
      "narrows down where on suspect 2 the leak is",
    );
  });

  it("before a credible spot, says the probe traces the gas and where it is strongest so far, not a spot", () => {
    expect(probeReasonWords(probe({ reason: { kind: "traces", fixtureId: "c5" } }), ctx("m"))).toBe(
      "finds where along Dairy 5 the alarm's gas is strongest",
    );
    expect(liveLeadWords({ x: 3, y: 0.2, fixtureId: "c4", share: 0.4 }, ctx("m"))).toBe(
      "No credible spot yet: the gas is strongest so far at Dairy 4",
    );
    expect(liveLeadWords({ x: 3, y: 0.2, fixtureId: null, share: 0.4 }, ctx("m"))).toBe(
      "No credible spot yet: the gas is strongest so far here",
    );
  });

  it("says where the probe goes: the case's grille, a room low or high, a line-set drop", () => {
    expect(probePlaceWords(probe({}), ctx("m"))).toBe("Dairy 4, at the front grille");
    expect(probePlaceWords(probe({ kind: "room-low", fixtureId: "wi" }), ctx("m"))).toBe(
      "Produce cooler, low by the floor",
    );
    expect(probePlaceWords(probe({ kind: "room-high", fixtureId: "wi" }), ctx("m"))).toBe(
      "Produce cooler, high by the ceiling",
    );
    expect(probePlaceWords(probe({ kind: "line-set", fixtureId: "d1" }), ctx("m"))).toBe("line-set drop M1");
  });

  it("writes a suspect's radius in the member's length unit", () => {
    const s = { rank: 1, x: 3, y: 1, radius: 2.5, score: 1, fixtureId: "c5", riskPointId: null };
    expect(liveSuspectWords(s, ctx("m"))).toBe("Suspect 1: Dairy 5, within 2.5 m");
    // 2.5 m = 98.4 in = 8 ft 2 in (1 in = 25.4 mm exactly: NIST SP 811, appendix B)
    expect(liveSuspectWords(s, ctx("ft-in"))).toBe("Suspect 1: Dairy 5, within 8 ft 2 in");
  });
});
