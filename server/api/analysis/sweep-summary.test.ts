import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { agentFor, createTestApp, type Agent, type TestApp } from "../../../tests/helpers/test-app";
import { PASSWORD, seedCompany } from "../../../tests/helpers/fixtures";
import { caseLineFixtures, caseWalkReadings } from "../../../tests/helpers/sweep-walk";
import { detectors } from "../../db/schema/index";
import type { Role } from "#core/domain/roles";
import { localDateOf } from "#core/domain/dates/time-zone";

let t: TestApp;
let co: Awaited<ReturnType<typeof seedCompany>>;
let other: Awaited<ReturnType<typeof seedCompany>>;
const caseId = crypto.randomUUID();
const dropId = crypto.randomUUID();
const sweepIds: string[] = [];

async function as(role: Role, company = co): Promise<Agent> {
  const a = await agentFor(t.app);
  await a.post("/api/auth/sign-in", { email: company.people[role].email, password: PASSWORD });
  return a;
}

beforeAll(async () => {
  t = await createTestApp();
  co = await seedCompany(t.ctx, "Osterley Fresh");
  other = await seedCompany(t.ctx, "Pellworth Stores");
  const owner = await as("owner");
  const plan = await owner.post(`/api/stores/${co.store.id}/plans/blank`, { width: 30, depth: 12, unit: "m" });
  await owner.put(`/api/plans/${plan.body.id}/fixtures`, {
    layoutRevision: plan.body.layoutRevision,
    fixtures: caseLineFixtures(caseId, dropId),
  });
  const [d] = await t.ctx.db
    .insert(detectors)
    .values({ companyId: co.company.id, name: "Diode sniffer", principle: "heated-diode" })
    .returning();
  const tech = await as("technician");
  // Two sweeps a month apart: the first with a strong leak (one display pegged), the second quieter.
  for (const [daysAgo, peak] of [
    [40, 90],
    [10, 30],
  ] as const) {
    const startedAt = new Date(Date.now() - daysAgo * 86_400_000);
    const s = await tech.post(`/api/stores/${co.store.id}/sweeps`, {
      id: crypto.randomUUID(),
      planId: plan.body.id,
      detectorId: d.id,
      fans: "stopped",
      defrost: false,
      startedAt: startedAt.toISOString(),
    });
    const walk = caseWalkReadings(startedAt, { x: 12, y: 3 }, peak);
    if (daysAgo === 40) {
      const top = walk.reduce((m, r) => ((r.ppm as number) > (m.ppm as number) ? r : m));
      top.atLeast = true;
    }
    expect((await tech.post(`/api/sweeps/${s.body.id}/readings`, { readings: walk })).body.rejected).toEqual([]);
    expect((await tech.post(`/api/sweeps/${s.body.id}/submit`, {})).status).toBeLessThan(300);
    sweepIds.push(s.body.id);
  }
  for (const f of [
    { status: "confirmed", component: "coil", sweepId: sweepIds[0], x: 12, y: 3 },
    { status: "suspected", sweepId: sweepIds[0], x: 20, y: 3 },
  ]) {
    const res = await tech.post(`/api/stores/${co.store.id}/findings`, f);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
  }
}, 120_000);
afterAll(async () => {
  await t.ctx.analysisRunner?.close();
  await t.close();
});

describe("store sweep summary", () => {
  it("gives each of the last sweeps, oldest first, its peak, findings and (once analysed) its suspect spots", async () => {
    const eng = await as("engineer");
    const before = await eng.get(`/api/stores/${co.store.id}/sweep-summary`);
    expect(before.status).toBe(200);
    expect(before.body.sweeps.map((s: { id: string }) => s.id)).toEqual(sweepIds);
    const [first, second] = before.body.sweeps;
    // caseWalkReadings: background 0.4 ppm + peak × e^(−d/1.2) sampled along the walk, so the highest
    // reading is at most 90.4 ppm and, with a tap within a metre of the source, above 40 % of it.
    expect(first.peakPpm).toBeGreaterThan(36);
    expect(first.peakPpm).toBeLessThanOrEqual(90.4);
    expect(first.peakAtLeast).toBe(true);
    expect(second.peakAtLeast).toBe(false);
    expect(second.peakPpm).toBeLessThan(first.peakPpm);
    expect(first).toMatchObject({ findings: 2, confirmed: 1 });
    expect(second).toMatchObject({ findings: 0, confirmed: 0, suspects: null });
    expect(first.suspects).toBeNull(); // nothing analysed yet: the summary never runs the locator itself

    const analysis = await eng.get(`/api/sweeps/${sweepIds[0]}/analysis?wait=true`);
    expect(analysis.status).toBe(200);
    const after = await eng.get(`/api/stores/${co.store.id}/sweep-summary`);
    expect(after.body.sweeps[0].suspects).toBe(analysis.body.candidates.length);
    expect(after.body.sweeps[0].suspects).toBeGreaterThan(0);
  });

  it("counts a finding closed because its system left service as confirmed only if it was (docs/decisions/0166)", async () => {
    const lead = await as("lead-tech");
    const sys = await lead.post(`/api/stores/${co.store.id}/systems`, {
      name: "Rack K",
      refrigerantId: "R-448A",
      fullCharge: { value: 300, unit: "lb" },
      applianceType: "commercial-refrigeration",
      automaticLeakDetection: false,
      inServiceOn: "2026-01-01",
    });
    expect(sys.status).toBe(201);
    const tech = await as("technician");
    const ids: string[] = [];
    for (const f of [
      { status: "confirmed", component: "valve", sweepId: sweepIds[1], systemId: sys.body.id },
      { status: "suspected", sweepId: sweepIds[1], systemId: sys.body.id },
    ])
      ids.push((await tech.post(`/api/stores/${co.store.id}/findings`, f)).body.id);
    const today = localDateOf(new Date(), co.store.timeZone);
    expect(
      (await lead.post(`/api/systems/${sys.body.id}/retire`, { retiredOn: today, reasonKind: "removed" })).status,
    ).toBe(200);
    const eng = await as("engineer");
    for (const id of ids)
      expect((await eng.post(`/api/findings/${id}/events`, { action: "close-left-service" })).status).toBe(200);
    const second = (await eng.get(`/api/stores/${co.store.id}/sweep-summary`)).body.sweeps[1];
    expect(second).toMatchObject({ findings: 2, confirmed: 1 });
  });

  it("is another company's 404 and a bad id's field error", async () => {
    const stranger = await as("owner", other);
    expect((await stranger.get(`/api/stores/${co.store.id}/sweep-summary`)).status).toBe(404);
    const bad = await stranger.get(`/api/stores/not-a-store/sweep-summary`);
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.storeId).toBe("must be a valid id");
  });
});
