import { describe, expect, it } from "vitest";
import type { LocatorPlan } from "#core/domain/layout/to-locator-input";
import { liveWorkerBody } from "./live-worker-body";
import { liveRequest } from "./live-request";
import type { LiveReply } from "./live-messages";

// An invented 24 m aisle with one 12 m case whose fans run (x 6–18 m): the first pass reads level
// along it, 6–7 ppm (the fans mix the gas), and a still-air pass ten minutes later, its fans stopped,
// reads four taps a metre apart round the leak, falling off 0.4 per metre: a model unlike the
// locator's kernel (docs/reference/locator-methods.md §5, pitfall 1). The same store as
// core/analysis/joint-fit.test.ts, here through the Walk screen's request and worker.
const LEAK_X = 9.3;
const t0 = Date.parse("2026-03-02T13:10:00Z");
const at = (s: number) => new Date(t0 + s * 1000).toISOString();
const plan: LocatorPlan = {
  width: 24,
  height: 4,
  obstacles: [],
  fixtures: [
    {
      id: "case",
      kind: "open-case",
      polygon: [
        [6, 0],
        [18, 0],
        [18, 1],
        [6, 1],
      ],
      fans: true,
    },
  ],
  riskPoints: [],
  backgroundZones: [],
};
const sweep = {
  transportDelayS: 0,
  timeConstantS: 0,
  alarmPpm: 2,
  startedAt: at(0),
  passes: [{ id: "p2", fans: "stopped" as const, defrost: false, fixtureId: "case" }],
};
const reading = (i: number, x: number, s: number, ppm: number, passId: string | null) => ({
  id: `r${String(i).padStart(2, "0")}`,
  x,
  y: 1.2,
  takenAt: at(s),
  ppm,
  atLeast: false,
  samplePoint: "grille" as const,
  note: "",
  passId,
});
const first = Array.from({ length: 24 }, (_, i) => {
  const x = i + 0.5;
  return reading(i, x, i * 2, x > 6 && x < 18 ? 6 + ((i * 7) % 3) * 0.5 : x > 5 && x < 19 ? 3 : 0.5, null);
});
const still = [-1.5, -0.5, 0.5, 1.5].map((o, k) =>
  reading(24 + k, LEAK_X + o, 600 + k * 3, Math.round((1 + 30 * 0.4 ** Math.abs(o)) * 10) / 10, "p2"),
);

function suspects(request: ReturnType<typeof liveRequest>) {
  const replies: LiveReply[] = [];
  const tasks: (() => void)[] = [];
  const body = liveWorkerBody({ post: (r) => replies.push(r), later: (f) => tasks.push(f), now: () => 0 });
  body.receive(JSON.parse(JSON.stringify(request)));
  while (tasks.length) tasks.shift()!();
  const reply = replies.find((r) => r.kind === "estimate" || r.kind === "failed");
  if (reply?.kind !== "estimate" || reply.estimate.kind !== "suspects") throw new Error(JSON.stringify(reply));
  return reply.estimate.suspects;
}
const off = (s: { x: number; y: number }) => Math.hypot(s.x - LEAK_X, s.y - 0.5);

describe("the live estimate with a pinpoint pass", () => {
  it("fits the still-air pass's readings in still air, as the server's analysis does: the leak first, no spot drawn along the level line", () => {
    const listed = suspects(liveRequest(1, sweep, plan, [...first, ...still]));
    expect(off(listed[0])).toBeLessThan(0.5);
    expect(listed[0].fixtureId).toBe("case");
    for (const s of listed) expect(off(s)).toBeLessThan(3);
  });

  it("without the pass's conditions the level line draws a spot metres off along the case (decision 0111)", () => {
    const listed = suspects(liveRequest(1, { ...sweep, passes: [] }, plan, [...first, ...still]));
    expect(Math.max(...listed.map(off))).toBeGreaterThan(3);
  });

  it("keeps readings naming a pass the device does not list in the first pass instead of failing", () => {
    const request = liveRequest(1, { ...sweep, passes: [] }, plan, [...first, ...still]);
    expect(request.readings.slice(24).map((r) => r.passId)).toEqual([null, null, null, null]);
    expect(liveRequest(1, sweep, plan, still).passes).toEqual(sweep.passes);
  });
});
