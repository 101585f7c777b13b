import { describe, expect, it } from "vitest";
import type { LiveSuspect } from "#core/analysis/guide/live-guide";
import { LIVE_START, liveReplied, liveRequested, settledSuspect, type LiveState } from "./live-state";

const box = { x: 0, y: 0, width: 10, height: 10 };
const spot = (x: number, radius = 2.5): LiveSuspect => ({
  rank: 1,
  x,
  y: 1,
  radius,
  score: 1,
  fixtureId: "case-3",
  riskPointId: null,
});
const estimate = (s: LiveState, id: number, x: number, radius?: number) =>
  liveReplied(liveRequested(s, id), {
    id,
    kind: "estimate",
    estimate: { kind: "suspects", readings: 10 + id, box, suspects: [spot(x, radius)] },
    ms: 40,
  });

describe("the live state", () => {
  it("drops an answer to an older request than the last one sent", () => {
    const s = liveRequested(estimate(LIVE_START, 1, 5), 2);
    const stale = liveReplied(s, {
      id: 1,
      kind: "estimate",
      estimate: { kind: "no-spot", readings: 3, box },
      ms: 1,
    });
    expect(stale).toBe(s);
  });

  it("clears the previous next probes when a new estimate comes", () => {
    let s = estimate(LIVE_START, 1, 5);
    s = liveReplied(s, {
      id: 1,
      kind: "probes",
      probes: [
        {
          x: 5,
          y: 1.2,
          kind: "case-front",
          fixtureId: "case-3",
          reason: { kind: "narrows", rank: 1, fixtureId: "case-3" },
        },
      ],
      ms: 5,
    });
    expect(s.probes).toHaveLength(1);
    expect(estimate(s, 2, 5).probes).toEqual([]);
  });

  it("calls the first suspect settled after three estimates within its radius, not before", () => {
    let s = estimate(LIVE_START, 1, 5);
    s = estimate(s, 2, 6);
    expect(settledSuspect(s)).toBeNull();
    s = estimate(s, 3, 5.5);
    expect(settledSuspect(s)?.x).toBe(5.5);
  });

  it("does not call it settled while it jumps farther than its radius", () => {
    let s = estimate(LIVE_START, 1, 2);
    s = estimate(s, 2, 8);
    s = estimate(s, 3, 8.5);
    expect(settledSuspect(s)).toBeNull();
    s = estimate(s, 4, 8.2);
    expect(settledSuspect(s)?.x).toBe(8.2);
  });

  it("starts counting again after an estimate without a suspect", () => {
    let s = estimate(LIVE_START, 1, 5);
    s = estimate(s, 2, 5);
    s = liveReplied(liveRequested(s, 3), {
      id: 3,
      kind: "estimate",
      estimate: { kind: "no-spot", readings: 4, box },
      ms: 1,
    });
    s = estimate(s, 4, 5);
    expect(settledSuspect(s)).toBeNull();
  });
});
