import { describe, expect, it } from "vitest";
import { liveWorkerBody } from "./live-worker-body";
import type { LiveReply, LiveRequest } from "./live-messages";

const rect = (x0: number, y0: number, x1: number, y1: number): [number, number][] => [
  [x0, y0],
  [x1, y0],
  [x1, y1],
  [x0, y1],
];

// An invented 24 x 8 m aisle with three cases on the north wall; a walk east along y = 2, a tap every
// metre every 2 s, over a plume that halves every metre from the front of the middle case (x = 12).
function request(id: number, ppmScale = 14, count = 22): LiveRequest {
  const t0 = Date.parse("2026-03-02T13:10:00Z");
  return {
    id,
    plan: {
      width: 24,
      height: 8,
      obstacles: [],
      fixtures: [0, 1, 2].map((k) => ({
        id: `case-${k}`,
        kind: "open-case" as const,
        polygon: rect(8 + 2.4 * k - 2.4, 0, 8 + 2.4 * k, 1),
        fans: true,
      })),
      riskPoints: [],
      backgroundZones: [],
    },
    instrument: { transportDelayS: 0, timeConstantS: 0, alarmPpm: 2 },
    startedAt: new Date(t0).toISOString(),
    readings: Array.from({ length: count }, (_, i) => ({
      id: `r${String(i).padStart(2, "0")}`,
      x: 1 + i,
      y: 2,
      takenAt: new Date(t0 + 2000 * i).toISOString(),
      ppm: Math.round(0.4 + ppmScale * 0.5 ** Math.hypot(1 + i - 9, 1)),
      atLeast: false,
      samplePoint: "grille" as const,
      note: "",
    })),
    from: null,
  };
}

/** The body with a hand-run task queue, so a test decides when the worker's turns come. */
function harness() {
  const replies: LiveReply[] = [];
  const tasks: (() => void)[] = [];
  const body = liveWorkerBody({ post: (r) => replies.push(r), later: (f) => tasks.push(f), now: () => 0 });
  const drain = () => {
    while (tasks.length) tasks.shift()!();
  };
  return { body, replies, tasks, drain };
}

describe("the live-guide worker's message handling", () => {
  it("answers the estimate, then the next probes, for the same request", () => {
    const h = harness();
    h.body.receive(request(1));
    h.drain();
    expect(h.replies.map((r) => [r.id, r.kind])).toEqual([
      [1, "estimate"],
      [1, "probes"],
    ]);
    const estimate = h.replies[0];
    expect(estimate.kind === "estimate" && estimate.estimate.kind).toBe("suspects");
    const probes = h.replies[1];
    expect(probes.kind === "probes" && probes.probes.length).toBeGreaterThan(0);
  });

  it("works only on the newest of the requests that wait, and answers none of the older ones", () => {
    const h = harness();
    h.body.receive(request(1));
    h.body.receive(request(2));
    h.body.receive(request(3));
    h.drain();
    expect(new Set(h.replies.map((r) => r.id))).toEqual(new Set([3]));
  });

  it("drops an older request that arrives after a newer one", () => {
    const h = harness();
    h.body.receive(request(5));
    h.body.receive(request(4));
    h.drain();
    expect(new Set(h.replies.map((r) => r.id))).toEqual(new Set([5]));
  });

  it("skips the next-probe step of a request a newer one has superseded", () => {
    const h = harness();
    h.body.receive(request(1));
    h.tasks.shift()!(); // the estimate of request 1
    h.body.receive(request(2)); // arrives before request 1's probes run
    h.drain();
    expect(h.replies.map((r) => [r.id, r.kind])).toEqual([
      [1, "estimate"],
      [2, "estimate"],
      [2, "probes"],
    ]);
  });

  it("says which field of a bad message is wrong, and keeps working after it", () => {
    const h = harness();
    const bad = { ...request(7), readings: [{ ...request(7).readings[0], ppm: "twelve" }] };
    h.body.receive(bad);
    h.body.receive("not a request");
    expect(h.replies).toHaveLength(2);
    expect(h.replies[0]).toMatchObject({ id: 7, kind: "failed" });
    expect(h.replies[0].kind === "failed" && h.replies[0].problems.join(" ")).toMatch(/readings\.0\.ppm/);
    expect(h.replies[1]).toMatchObject({ id: -1, kind: "failed" });
    h.body.receive(request(8));
    h.drain();
    expect(h.replies.slice(2).map((r) => r.kind)).toEqual(["estimate", "probes"]);
  });

  it("answers a reading the locator refuses with the locator's reason instead of throwing", () => {
    const h = harness();
    const req = request(9);
    req.readings[3] = { ...req.readings[3], x: 80 }; // off the 24 m plan
    h.body.receive(req);
    h.drain();
    expect(h.replies).toHaveLength(1);
    expect(h.replies[0].kind === "failed" && h.replies[0].problems.join(" ")).toMatch(/outside the 24 m x 8 m plan/);
  });

  it("answers 'no alarm' and no probes while nothing reaches the alarm, and for a sweep with no readings yet", () => {
    const h = harness();
    h.body.receive(request(1, 0.5));
    h.drain();
    h.body.receive({ ...request(2), readings: [] });
    h.drain();
    expect(h.replies.map((r) => (r.kind === "estimate" ? r.estimate.kind : r.kind))).toEqual([
      "no-alarm",
      "probes",
      "no-alarm",
      "probes",
    ]);
  });
});
