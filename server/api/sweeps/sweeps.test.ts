import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { agentFor, createTestApp, type Agent, type TestApp } from "../../../tests/helpers/test-app";
import { PASSWORD, seedCompany } from "../../../tests/helpers/fixtures";
import { detectors, systems } from "../../db/schema/index";
import type { Role } from "#core/domain/roles";
import { planHasSweeps } from "../plans/plan-sweeps";

let t: TestApp;
let co: Awaited<ReturnType<typeof seedCompany>>;
let other: Awaited<ReturnType<typeof seedCompany>>;
let planId: string;
let diodeId: string;
let irId: string;
let r448Id: string;
let r744Id: string;

beforeAll(async () => {
  t = await createTestApp();
  co = await seedCompany(t.ctx, "Kestrel Foods");
  other = await seedCompany(t.ctx, "Marram Stores");
  const owner = await as("owner");
  const plan = await owner.post(`/api/stores/${co.store.id}/plans/blank`, { width: 40, depth: 25, unit: "m" });
  planId = plan.body.id;
  const [d] = await t.ctx.db
    .insert(detectors)
    .values({
      companyId: co.company.id,
      name: "Diode sniffer",
      principle: "heated-diode",
      lastCheckedOn: new Date().toISOString().slice(0, 10),
    })
    .returning();
  const [ir] = await t.ctx.db
    .insert(detectors)
    .values({ companyId: co.company.id, name: "IR unit", principle: "infrared", lastCheckedOn: "2020-01-01" })
    .returning();
  diodeId = d.id;
  irId = ir.id;
  const sys = await t.ctx.db
    .insert(systems)
    .values([
      {
        companyId: co.company.id,
        storeId: co.store.id,
        name: "Rack A",
        refrigerantId: "R-448A",
        fullChargeKg: 300,
        applianceType: "commercial-refrigeration",
      },
      {
        companyId: co.company.id,
        storeId: co.store.id,
        name: "CO2 booster",
        refrigerantId: "R-744",
        fullChargeKg: 200,
        applianceType: "commercial-refrigeration",
      },
    ])
    .returning();
  r448Id = sys[0].id;
  r744Id = sys[1].id;
});
afterAll(() => t.close());

async function as(role: Role, company = co): Promise<Agent> {
  const a = await agentFor(t.app);
  await a.post("/api/auth/sign-in", { email: company.people[role].email, password: PASSWORD });
  return a;
}

const startedAt = new Date(Date.now() - 10 * 60_000);
const at = (s: number) => new Date(startedAt.getTime() + s * 1000).toISOString();
const reading = (s: number, extra: Record<string, unknown> = {}) => ({
  id: crypto.randomUUID(),
  x: 1 + s * 0.5,
  y: 3,
  takenAt: at(s),
  ppm: 0,
  samplePoint: "grille",
  ...extra,
});

async function startSweep(a: Agent, body: Record<string, unknown> = {}, storeId = co.store.id) {
  const res = await a.post(`/api/stores/${storeId}/sweeps`, {
    id: crypto.randomUUID(),
    planId,
    detectorId: diodeId,
    systemIds: [r448Id],
    fans: "running",
    defrost: false,
    startedAt: startedAt.toISOString(),
    ...body,
  });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body;
}

describe("starting a sweep", () => {
  it("copies the detector's lag figures, names the technician and is idempotent on its client-made id", async () => {
    const a = await as("technician");
    const id = crypto.randomUUID();
    const s = await startSweep(a, { id });
    // 5 s transport delay and 2 ppm alarm: the detector defaults, common practice, no published source.
    expect(s).toMatchObject({
      id,
      status: "in-progress",
      transportDelayS: 5,
      timeConstantS: 1.5,
      alarmPpm: 2,
      technicianId: co.people.technician.userId,
      readingsRevision: 0,
      warnings: [],
    });
    const again = await a.post(`/api/stores/${co.store.id}/sweeps`, {
      id,
      planId,
      detectorId: diodeId,
      fans: "running",
      defrost: false,
    });
    expect(again.status).toBe(200);
    expect(
      (await a.get(`/api/stores/${co.store.id}/sweeps`)).body.sweeps.filter((x: { id: string }) => x.id === id),
    ).toHaveLength(1);
    expect(await planHasSweeps(t.ctx.db, planId)).toBe(true);
  });

  it("warns when a heated-diode detector hunts R-744, and when a detector is overdue", async () => {
    const a = await as("technician");
    // Heated-diode sensors respond to halogens only; R-744 has none (docs/reference/standards.md §6 via canDetect).
    const s = await startSweep(a, { systemIds: [r448Id, r744Id] });
    expect(s.warnings).toHaveLength(1);
    expect(s.warnings[0]).toMatchObject({ code: "detector-blind", systemId: r744Id });
    expect(s.warnings[0].message).toMatch(/cannot see R-744 on CO2 booster/);
    const overdue = await startSweep(a, { detectorId: irId, systemIds: [] });
    expect(overdue.warnings.map((w: { code: string }) => w.code)).toEqual(["detector-overdue"]);
  });

  it("refuses another store's system, a stranger's plan or detector, with the field named", async () => {
    const a = await as("technician");
    const bad = await a.post(`/api/stores/${co.store.id}/sweeps`, {
      planId,
      detectorId: diodeId,
      systemIds: [crypto.randomUUID()],
      fans: "on",
      defrost: false,
    });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty("fans");
    const sys = await a.post(`/api/stores/${co.store.id}/sweeps`, {
      planId,
      detectorId: diodeId,
      systemIds: [crypto.randomUUID()],
      fans: "stopped",
      defrost: true,
    });
    expect(sys.body.error.fields).toEqual({ "systemIds.0": "is not a system of this store" });
    const wrongPlan = await a.post(`/api/stores/${co.otherStore.id}/sweeps`, {
      planId,
      detectorId: diodeId,
      fans: "stopped",
      defrost: true,
    });
    expect(wrongPlan.body.error.fields).toEqual({ planId: "is not a plan of this store" });
  });
});

describe("readings", () => {
  it("stores the same ids once when a batch is sent twice", async () => {
    const a = await as("technician");
    const s = await startSweep(a);
    const batch = [reading(1), reading(4), reading(8, { ppm: 3.5 })];
    const first = await a.post(`/api/sweeps/${s.id}/readings`, { readings: batch });
    expect(first.body).toMatchObject({
      stored: batch.map((r) => r.id),
      duplicates: [],
      rejected: [],
      readingsRevision: 1,
    });
    const second = await a.post(`/api/sweeps/${s.id}/readings`, { readings: [...batch, batch[0]] });
    expect(second.body).toMatchObject({ stored: [], rejected: [], readingsRevision: 1 });
    expect(second.body.duplicates.sort()).toEqual([...batch.map((r) => r.id), batch[0].id].sort());
    const list = await a.get(`/api/sweeps/${s.id}/readings`);
    expect(list.body.readings.map((r: { id: string }) => r.id)).toEqual(batch.map((r) => r.id));
  });

  it("stores the good readings of a batch and returns each bad one with its reasons", async () => {
    const a = await as("technician");
    const s = await startSweep(a);
    const good = [
      reading(2),
      reading(5, { ppm: 10_000, atLeast: true, samplePoint: "return", note: "display pegged" }),
    ];
    const batch = [
      good[0],
      { ...reading(3), ppm: -1 },
      { ...reading(4), x: 41 }, // plan is 40 m wide
      { ...reading(4), samplePoint: "ceiling" },
      { ...reading(4), ppm: 10_001 },
      { ...reading(4), takenAt: new Date(startedAt.getTime() - 3_600_000).toISOString() },
      { ...reading(4), y: Number.NaN },
      "not a reading",
      good[1],
    ];
    const res = await a.post(`/api/sweeps/${s.id}/readings`, { readings: batch });
    expect(res.status).toBe(200);
    expect(res.body.stored).toEqual(good.map((r) => r.id));
    const reasons = Object.fromEntries(
      res.body.rejected.map((r: { index: number; reasons: Record<string, string> }) => [r.index, r.reasons]),
    );
    expect(Object.keys(reasons).map(Number)).toEqual([1, 2, 3, 4, 5, 6, 7]);
    expect(reasons[1]).toEqual({ ppm: "must be 0 ppm or more" });
    expect(reasons[2].x).toMatch(/outside the plan \(0–40 m × 0–25 m\)/);
    expect(reasons[3].samplePoint).toMatch(/must be one of: grille, supply/);
    expect(reasons[4].ppm).toMatch(/at most 10,000 ppm/);
    expect(reasons[5].takenAt).toBe("is 60 min before the sweep started");
    expect(reasons[6]).toHaveProperty("y");
    expect(res.body.rejected[0].id).toBe((batch[1] as { id: string }).id);
    const list = (await a.get(`/api/sweeps/${s.id}/readings`)).body.readings;
    expect(list[1]).toMatchObject({ ppm: 10_000, atLeast: true, samplePoint: "return", note: "display pegged" });
  });

  it("accepts a device clock hours off when the sweep's start came from the same clock", async () => {
    const a = await as("technician");
    const skewed = new Date(Date.now() + 5 * 3_600_000); // device 5 h fast
    const s = await startSweep(a, { startedAt: skewed.toISOString() });
    const res = await a.post(`/api/sweeps/${s.id}/readings`, {
      readings: [{ ...reading(0), takenAt: new Date(skewed.getTime() + 30_000).toISOString() }],
    });
    expect(res.body.stored).toHaveLength(1);
  });

  it("refuses more than 1,000 readings in one request", async () => {
    const a = await as("technician");
    const s = await startSweep(a);
    const res = await a.post(`/api/sweeps/${s.id}/readings`, {
      readings: Array.from({ length: 1001 }, (_, i) => reading(i)),
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.readings).toMatch(/at most 1000/);
  });

  it("edits and deletes with an audit trail, bumping readingsRevision each time", async () => {
    const a = await as("technician");
    const s = await startSweep(a);
    const r = reading(3, { ppm: 1 });
    await a.post(`/api/sweeps/${s.id}/readings`, { readings: [r] });
    const edit = await a.patch(`/api/sweeps/${s.id}/readings/${r.id}`, { ppm: 1.5, note: "re-read" });
    expect(edit.body).toMatchObject({ reading: { ppm: 1.5, note: "re-read" }, readingsRevision: 2 });
    const badEdit = await a.patch(`/api/sweeps/${s.id}/readings/${r.id}`, { x: -5 });
    expect(badEdit.status).toBe(400);
    expect(badEdit.body.error.fields.x).toMatch(/outside the plan/);
    expect((await a.delete(`/api/sweeps/${s.id}/readings/${r.id}`)).body.readingsRevision).toBe(3);
    expect((await a.delete(`/api/sweeps/${s.id}/readings/${r.id}`)).status).toBe(200); // a retried delete
    expect((await a.get(`/api/sweeps/${s.id}/readings`)).body.readings).toEqual([]);
    const audit = (await a.get(`/api/sweeps/${s.id}/audit`)).body.entries;
    expect(audit.map((e: { action: string }) => e.action)).toEqual(["edit", "delete"]);
    expect(audit[0].before.ppm).toBe(1);
    expect(audit[0].after.ppm).toBe(1.5);
    expect(audit[1].after).toBeNull();
  });

  it("resolves an edit made on two devices by server receive order, keeping both in the audit", async () => {
    const phone = await as("technician");
    const tablet = await as("lead-tech");
    const s = await startSweep(phone);
    const r = reading(6, { ppm: 2 });
    await phone.post(`/api/sweeps/${s.id}/readings`, { readings: [r] });
    // The tablet's edit was made later on its clock but reaches us first; the phone's arrives last and wins.
    await tablet.patch(`/api/sweeps/${s.id}/readings/${r.id}`, { ppm: 4, editedAt: at(120) });
    await phone.patch(`/api/sweeps/${s.id}/readings/${r.id}`, { ppm: 3, editedAt: at(60) });
    expect((await phone.get(`/api/sweeps/${s.id}/readings`)).body.readings[0].ppm).toBe(3);
    const audit = (await phone.get(`/api/sweeps/${s.id}/audit`)).body.entries;
    expect(audit.map((e: { after: { ppm: number } }) => e.after.ppm)).toEqual([4, 3]);
    expect(audit[0].editedAt).toBe(at(120));
  });
});

describe("roles and status", () => {
  it("a store contact reads their store's sweeps but cannot start one or add readings", async () => {
    const s = await startSweep(await as("technician"));
    const contact = await as("store-contact");
    expect((await contact.get(`/api/sweeps/${s.id}`)).status).toBe(200);
    expect((await contact.post(`/api/sweeps/${s.id}/readings`, { readings: [reading(1)] })).status).toBe(403);
    // Nor read the readings and their audit: a store manager gets the report, not the evidence (decision 0072).
    expect((await contact.get(`/api/sweeps/${s.id}/readings`)).status).toBe(403);
    expect((await contact.get(`/api/sweeps/${s.id}/audit`)).status).toBe(403);
    expect(
      (
        await contact.post(`/api/stores/${co.store.id}/sweeps`, {
          planId,
          detectorId: diodeId,
          fans: "running",
          defrost: false,
        })
      ).status,
    ).toBe(403);
    expect((await (await as("engineer")).post(`/api/sweeps/${s.id}/readings`, { readings: [reading(1)] })).status).toBe(
      403,
    );
  });

  it("a store contact of another store and another company get 404", async () => {
    const s = await startSweep(await as("technician"));
    const elsewhere = await startSweep(
      await as("technician"),
      {
        planId: (
          await (await as("owner")).post(`/api/stores/${co.otherStore.id}/plans/blank`, { width: 10, depth: 10 })
        ).body.id,
        systemIds: [],
      },
      co.otherStore.id,
    );
    expect((await (await as("store-contact")).get(`/api/sweeps/${elsewhere.id}`)).status).toBe(404);
    expect((await (await as("owner", other)).get(`/api/sweeps/${s.id}`)).status).toBe(404);
    expect(
      (await (await as("owner", other)).post(`/api/sweeps/${s.id}/readings`, { readings: [reading(1)] })).status,
    ).toBe(404);
    expect((await (await as("owner", other)).get(`/api/stores/${co.store.id}/sweeps`)).status).toBe(404);
  });

  it("lists the sweeps still in progress for resuming, the member's own first, never another company's or a submitted one", async () => {
    const tech = await as("technician");
    const lead = await as("lead-tech");
    const older = await startSweep(lead, { startedAt: new Date(startedAt.getTime() - 60_000).toISOString() });
    const mine = await startSweep(tech, { startedAt: new Date(startedAt.getTime() - 120_000).toISOString() });
    await tech.post(`/api/sweeps/${mine.id}/readings`, { readings: [reading(1), reading(2)] });
    const done = await startSweep(tech);
    expect((await tech.post(`/api/sweeps/${done.id}/submit`, {})).status).toBe(200);

    const res = await tech.get("/api/sweeps/in-progress");
    expect(res.status).toBe(200);
    const list: { id: string; technicianId: string; readingCount: number; status: string }[] = res.body.sweeps;
    const ids = list.map((x) => x.id);
    expect(ids).toContain(older.id);
    expect(ids).not.toContain(done.id);
    expect(list.every((x) => x.status === "in-progress")).toBe(true);
    // The member's own first, even when another member's started later.
    const firstOther = list.findIndex((x) => x.technicianId !== co.people.technician.userId);
    const lastOwn = list.findLastIndex((x) => x.technicianId === co.people.technician.userId);
    expect(lastOwn).toBeLessThan(firstOther);
    expect(list.find((x) => x.id === mine.id)?.readingCount).toBe(2);
    // The lead tech sees the same sweeps with theirs first.
    expect((await lead.get("/api/sweeps/in-progress")).body.sweeps[0].technicianId).toBe(co.people["lead-tech"].userId);
    // Another company sees none of them; a store contact cannot record, so has no resume list.
    const strangers = (await (await as("owner", other)).get("/api/sweeps/in-progress")).body.sweeps as { id: string }[];
    expect(strangers.some((x) => ids.includes(x.id))).toBe(false);
    expect((await (await as("store-contact")).get("/api/sweeps/in-progress")).status).toBe(403);
  });

  it("goes in progress → submitted → reviewed, only an engineer or owner reviews, and a reviewed sweep takes no readings", async () => {
    const tech = await as("technician");
    const s = await startSweep(tech);
    expect((await (await as("engineer")).post(`/api/sweeps/${s.id}/review`)).status).toBe(409);
    expect((await tech.post(`/api/sweeps/${s.id}/submit`)).body.status).toBe("submitted");
    // readings still syncing from the device after submit are accepted
    expect((await tech.post(`/api/sweeps/${s.id}/readings`, { readings: [reading(9)] })).body.stored).toHaveLength(1);
    expect((await tech.post(`/api/sweeps/${s.id}/review`)).status).toBe(403);
    const reviewed = await (await as("engineer")).post(`/api/sweeps/${s.id}/review`);
    expect(reviewed.body).toMatchObject({ status: "reviewed", readingCount: 1 });
    expect((await tech.post(`/api/sweeps/${s.id}/readings`, { readings: [reading(10)] })).status).toBe(409);
  });
});
