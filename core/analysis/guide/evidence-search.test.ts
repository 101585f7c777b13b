import { describe, expect, it } from "vitest";
import { parseLocatorInput } from "../../contracts/locator-input";
import { rect } from "../pipeline/stage-fixtures";
import { backgroundOf, evidenceProbes, leakSites, provisionalMark, weighSites } from "./evidence-search";
import { probePlaces } from "./probe-places";
import { DRIFT_PENALTY, DRIFT_STRENGTHS, driftChoiceFor, driftKernels } from "./drift-kernels";
import { LOCATOR_SETTINGS } from "../locator/settings";
import { createSourceKernel } from "../locator/source-kernel";
import { driftedKernel } from "../locator/local-drift";

const driftChoice = { kernels: driftKernels(), penalty: DRIFT_PENALTY };

// A 12 x 8 m aisle: a 6 m case against the north wall (y 0..1) and a 4 m island (y 4..5.2) open all
// round, and a line-set drop at the case's back.
const plan = parseLocatorInput({
  plan: {
    width: 12,
    height: 8,
    obstacles: [],
    fixtures: [
      { id: "case-1", kind: "open-case", polygon: rect(1, 0, 7, 1) },
      { id: "island", kind: "island-case", polygon: rect(2, 4, 6, 5.2) },
    ],
    riskPoints: [{ id: "drop-1", kind: "line-set", x: 5.5, y: 0.2 }],
  },
  instrument: { transportDelayS: 0, timeConstantS: 0, alarmPpm: 2 },
  readings: [{ x: 1, y: 2, t: 0, ppm: 0 }],
}).plan;

/** A kernel that halves every 0.6 m: the worked cases below are made with it. */
const kernel = (d: number) => 0.5 ** (d / 0.6);

describe("leakSites", () => {
  it("puts sites along a wall case's back, 0.15 m in, and along an island's middle", () => {
    const sites = leakSites(plan, { x: 4, y: 2.5 }, 10);
    const back = sites.filter((s) => s.fixtureId === "case-1" && s.prior === 1);
    expect(back.length).toBe(20); // 6 m at 0.3 m
    for (const s of back) expect(s.y).toBeCloseTo(0.15, 9);
    const island = sites.filter((s) => s.fixtureId === "island");
    expect(island.length).toBeGreaterThan(0);
    for (const s of island) expect(s.y).toBeCloseTo(4.6, 9);
  });

  it("favours risk points and keeps to the reach", () => {
    const sites = leakSites(plan, { x: 5.5, y: 1 }, 1);
    expect(sites.find((s) => s.x === 5.5 && s.y === 0.2)?.prior).toBeGreaterThan(1);
    for (const s of sites) expect(Math.hypot(s.x - 5.5, s.y - 1)).toBeLessThanOrEqual(1);
  });
});

describe("weighSites and provisionalMark", () => {
  it("puts the mark at the back site behind the peak of readings made by a source there", () => {
    const sites = leakSites(plan, { x: 3, y: 1.5 }, 3).filter((s) => s.prior === 1);
    const leak = { x: 2.95, y: 0.15 };
    const evidence = [1.3, 1.9, 2.5, 3.1, 3.7, 4.3].map((x) => ({
      x,
      y: 1.15,
      ppm: 0.4 + 10 * kernel(Math.hypot(x - leak.x, 1.15 - leak.y)),
    }));
    // the lower quartile of six: the second lowest
    expect(backgroundOf(evidence)).toBeCloseTo(evidence.map((r) => r.ppm).sort((a, b) => a - b)[1], 9);
    const hypotheses = weighSites(sites, evidence, 0.4, kernel);
    expect(hypotheses.reduce((s, h) => s + h.weight, 0)).toBeCloseTo(1, 9);
    const mark = provisionalMark(hypotheses);
    expect(mark).not.toBeNull();
    expect(Math.hypot(mark!.x - leak.x, mark!.y - leak.y)).toBeLessThan(0.2);
    expect(mark!.share).toBeGreaterThan(0.5);
  });

  it("keeps every site alike with no evidence", () => {
    const hypotheses = weighSites(leakSites(plan, { x: 3, y: 1.5 }, 1.5), [], 0, kernel);
    const prior1 = hypotheses.filter((h) => h.fixtureId === "case-1");
    for (const h of prior1) expect(h.weight).toBeCloseTo(prior1[0].weight, 12);
    expect(provisionalMark([])).toBeNull();
  });
});

describe("evidenceProbes", () => {
  it("brackets the peak: after a high reading at one end, the next probe goes along the case, not back to it", () => {
    const sites = leakSites(plan, { x: 3, y: 1.5 }, 3).filter((s) => s.fixtureId === "case-1");
    const places = probePlaces(plan, { x: 3, y: 1.5 }, 3).filter((p) => p.fixtureId === "case-1");
    // One reading of 8 ppm in front of x = 3.1: the gas may come from either side of it.
    const evidence = [{ x: 3.1, y: 1.15, ppm: 8 }];
    const hypotheses = weighSites(sites, evidence, 0, kernel);
    const fresh = places.filter((p) => Math.hypot(p.x - 3.1, p.y - 1.15) > 0.3);
    const [next] = evidenceProbes(hypotheses, fresh, kernel, { x: 3.1, y: 1.15 }, 1);
    expect(next.reason).toEqual({ kind: "traces", fixtureId: "case-1" });
    const away = Math.abs(next.x - 3.1);
    expect(away).toBeGreaterThanOrEqual(0.5);
    expect(away).toBeLessThanOrEqual(2.5);
  });
});

describe("weighSites with a drift (decision 0149)", () => {
  // The locator's own kernel and drifted kernels (locator/local-drift.ts), as the live guide uses them.
  const k = LOCATOR_SETTINGS.kernel;
  const plain = createSourceKernel(k.screeningLengthM, k.nearCutoffM, k.truncationM);
  const g = (d: number) => plain.at(d);
  const leak = { x: 2.95, y: 0.15 };
  // A plume carried east along the case front, read every 0.3 m: level for metres downwind, falling fast upwind.
  const carried = driftedKernel(k.screeningLengthM, k.nearCutoffM, k.truncationM, [1, 0]);
  const evidence = Array.from({ length: 21 }, (_, i) => 0.7 + 0.3 * i).map((x) => {
    const dx = x - leak.x;
    const dy = 1.15 - leak.y;
    return { x, y: 1.15, ppm: 0.4 + 30 * carried(Math.hypot(dx, dy), dx, dy) };
  });
  const sites = leakSites(plan, { x: 4, y: 1.5 }, 4).filter((s) => s.fixtureId === "case-1" && s.prior === 1);

  it("marks the plume's upwind edge where the plain kernel marks the middle of its plateau", () => {
    const plainMark = provisionalMark(weighSites(sites, evidence, 0.4, g))!;
    const driftMark = provisionalMark(weighSites(sites, evidence, 0.4, g, 0.5, driftChoice))!;
    expect(plainMark.x - leak.x).toBeGreaterThan(0.6);
    expect(Math.hypot(driftMark.x - leak.x, driftMark.y - leak.y)).toBeLessThan(0.35);
  });

  it("keeps the plain kernel for a plume spread evenly both ways", () => {
    const even = evidence.map((r) => ({ ...r, ppm: 0.4 + 30 * g(Math.hypot(r.x - leak.x, r.y - leak.y)) }));
    const hypotheses = weighSites(sites, even, 0.4, g, 0.5, driftChoice);
    const mark = provisionalMark(hypotheses)!;
    expect(Math.hypot(mark.x - leak.x, mark.y - leak.y)).toBeLessThan(0.35);
    const best = hypotheses.reduce((a, b) => (b.weight > a.weight ? b : a));
    expect(best.shape).toBeUndefined();
  });

  it("weighs a walk-in's sites with the plain kernel only", () => {
    const site = { x: 3, y: 0.15, fixtureId: "room", prior: 1 };
    const [h] = weighSites([site], evidence, 0.4, g, 0.5, driftChoice, new Set(["room"]));
    expect(h.shape).toBeUndefined();
  });

  it("offers drifts only where most cases run their fans", () => {
    expect(driftChoiceFor(plan)).toBeUndefined();
    const fans = { ...plan, fixtures: plan.fixtures.map((f) => ({ ...f, fans: true })) };
    expect(driftChoiceFor(fans)?.kernels.length).toBe(8 * DRIFT_STRENGTHS.length);
  });
});
