import { afterAll, beforeAll, describe, expect, it } from "vitest";
import fs from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import { agentFor, createTestApp, type Agent, type TestApp } from "../../../tests/helpers/test-app";
import { DEMO_SIGN_INS, seedDemoIfEmpty } from "./demo";

let t: TestApp;
let uploads: string;
let eng: Agent;
let storeId: string;

beforeAll(async () => {
  uploads = await fs.mkdtemp(path.join(os.tmpdir(), "plumeline-demo-sweeps-"));
  t = await createTestApp({ uploadsDir: uploads });
  expect(await seedDemoIfEmpty(t.ctx)).toBe(true);
  eng = await agentFor(t.app);
  const person = DEMO_SIGN_INS.people.find((p) => p.role === "engineer")!;
  await eng.post("/api/auth/sign-in", { email: person.email, password: DEMO_SIGN_INS.password });
  storeId = (await eng.get("/api/stores")).body.stores[0].id;
});
afterAll(async () => {
  await t.ctx.analysisRunner?.close();
  await t.close();
  await fs.rm(uploads, { recursive: true, force: true });
});

type SweepSummary = { id: string; startedAt: string; status: string; fans: string };
type Spot = { x: number; y: number; radius: number; fixtureId: string | null };

describe("the demo's leak story", () => {
  it("has six monthly sweeps counted back from today: a leak at Dairy 3 grows, is pinpointed and repaired, and is gone", async () => {
    const sweeps: SweepSummary[] = (await eng.get(`/api/stores/${storeId}/sweeps`)).body.sweeps;
    expect(sweeps).toHaveLength(6);
    const byDate = [...sweeps].sort((a, b) => a.startedAt.localeCompare(b.startedAt));
    const ageDays = byDate.map((s) => (Date.now() - Date.parse(s.startedAt)) / 86_400_000);
    expect(ageDays[0]).toBeGreaterThan(140);
    expect(ageDays[5]).toBeLessThan(7);
    expect(byDate.map((s) => s.status)).toEqual(["reviewed", "reviewed", "reviewed", "reviewed", "reviewed", "submitted"]);

    const plan = (await eng.get(`/api/stores/${storeId}`)).body.currentPlan;
    const fixtures: { id: string; label: string }[] = (await eng.get(`/api/plans/${plan.id}/fixtures`)).body.fixtures;
    const label = (id: string | null) => fixtures.find((f) => f.id === id)?.label ?? null;
    const spots: Spot[][] = [];
    for (const s of byDate) {
      const res = await eng.get(`/api/sweeps/${s.id}/analysis`);
      expect(res.status, JSON.stringify(res.body).slice(0, 300)).toBe(200);
      spots.push(res.body.candidates);
    }
    // month 1: clean; months 2–4: the top suspect on Dairy 3; month 5: clean after the repair
    expect(spots[0]).toEqual([]);
    for (const k of [1, 2, 3]) expect(label(spots[k][0].fixtureId)).toBe("Dairy 3");
    expect(spots[4]).toEqual([]);
    // the latest: a small new suspect on the meat line
    expect(label(spots[5][0].fixtureId)).toBe("Meat 2");

    // the finding made from the pinpointing sweep, repaired, lies within the top suspect's radius
    const { findings } = (await eng.get(`/api/stores/${storeId}/findings`)).body;
    const repaired = findings.find((f: { sweepId: string }) => f.sweepId === byDate[3].id);
    expect(repaired).toMatchObject({ source: "suspect-spot", status: "repaired", component: "brazed-joint" });
    const top = spots[3][0];
    expect(Math.hypot(top.x - repaired.x, top.y - repaired.y)).toBeLessThanOrEqual(top.radius + 0.25);
    expect(byDate[3].fans).toBe("stopped");
  });

  it("lists per-fixture peaks over the last 12 months, the fixtures that got worse first", async () => {
    const res = await eng.get(`/api/stores/${storeId}/fixture-trends`);
    expect(res.status).toBe(200);
    const { sweeps, fixtures, a, b } = res.body;
    expect(sweeps).toHaveLength(6);
    // default: the latest sweep against the one before; the meat line got worse
    expect([a, b]).toEqual([sweeps[4].id, sweeps[5].id]);
    expect(fixtures[0].label).toBe("Meat 2");
    expect(fixtures[0].change).toBeGreaterThan(0);
    expect(fixtures[0].levels).toHaveLength(6);
    // the months the Dairy 3 leak grew
    const grew = await eng.get(`/api/stores/${storeId}/fixture-trends?a=${sweeps[1].id}&b=${sweeps[3].id}`);
    expect(grew.body.fixtures[0].label).toMatch(/^Dairy [234]$/);
    const dairy3 = grew.body.fixtures.find((f: { label: string }) => f.label === "Dairy 3");
    expect(dairy3.levels[3].peakPpm).toBeGreaterThan(dairy3.levels[0].peakPpm);
    const bad = await eng.get(`/api/stores/${storeId}/fixture-trends?a=${crypto.randomUUID()}`);
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.a).toMatch(/not a sweep of this store/);
  });
});
