import { afterAll, beforeAll, expect, it } from "vitest";
import { createTestApp, signIn, type TestApp } from "../../../tests/helpers/test-app";
import { seedCompany } from "../../../tests/helpers/fixtures";
import { detectors } from "../../db/schema/index";
import { createApp } from "../../app";

let t: TestApp;
let co: Awaited<ReturnType<typeof seedCompany>>;
let planId: string;
let detectorId: string;

beforeAll(async () => {
  t = await createTestApp({ syncThrottle: { limit: 4, windowMs: 60_000 } });
  co = await seedCompany(t.ctx, "Sedge Provisions");
  const owner = await signIn(t.app, co.people.owner);
  planId = (await owner.post(`/api/stores/${co.store.id}/plans/blank`, { width: 30, depth: 20, unit: "m" })).body.id;
  const [d] = await t.ctx.db
    .insert(detectors)
    .values({ companyId: co.company.id, name: "IR unit", principle: "infrared", lastCheckedOn: "2026-11-01" })
    .returning();
  detectorId = d.id;
});
afterAll(() => t.close());

it("over the sync limit a batch is answered 503 with Retry-After (never a 4xx), stores nothing, and other members go on", async () => {
  const tech = await signIn(t.app, co.people.technician);
  const startedAt = new Date(Date.now() - 60_000);
  const sweep = await tech.post(`/api/stores/${co.store.id}/sweeps`, {
    id: crypto.randomUUID(),
    planId,
    detectorId,
    fans: "running",
    defrost: false,
    startedAt: startedAt.toISOString(),
  });
  expect(sweep.status).toBe(201); // request 1 of 4
  const batch = () => ({
    readings: [
      {
        id: crypto.randomUUID(),
        x: 2,
        y: 2,
        takenAt: new Date(startedAt.getTime() + 5_000).toISOString(),
        ppm: 1,
        samplePoint: "grille",
      },
    ],
  });
  for (let i = 0; i < 3; i++)
    expect((await tech.post(`/api/sweeps/${sweep.body.id}/readings`, batch())).status).toBe(200);
  const refusedBatch = batch();
  const refused = await tech.post(`/api/sweeps/${sweep.body.id}/readings`, refusedBatch);
  expect(refused.status).toBe(503);
  expect(Number(refused.headers["retry-after"])).toBeGreaterThanOrEqual(1);
  expect(Number(refused.headers["retry-after"])).toBeLessThanOrEqual(60);
  expect(refused.body.error).toMatchObject({ code: "busy" });
  const stored = (await tech.get(`/api/sweeps/${sweep.body.id}/readings`)).body.readings;
  expect(stored).toHaveLength(3);
  expect(stored.map((r: { id: string }) => r.id)).not.toContain(refusedBatch.readings[0].id);

  const lead = await signIn(t.app, co.people["lead-tech"]);
  expect((await lead.post(`/api/sweeps/${sweep.body.id}/readings`, batch())).status).toBe(200);
});

it("the limit holds across two app instances on one database: the count lives in PostgreSQL", async () => {
  // A second app built on the same database, as a second process would be (its own throttle instance).
  const second = createApp({ ...t.ctx });
  const onFirst = await signIn(t.app, co.people.owner);
  const onSecond = await signIn(second, co.people.owner);
  const sweep = await onFirst.post(`/api/stores/${co.store.id}/sweeps`, {
    id: crypto.randomUUID(),
    planId,
    detectorId,
    fans: "running",
    defrost: false,
    startedAt: new Date(Date.now() - 60_000).toISOString(),
  });
  expect(sweep.status).toBe(201); // 1 of 4, on the first
  const codes: number[] = [];
  for (const agent of [onSecond, onFirst, onSecond, onFirst])
    codes.push(
      (
        await agent.post(`/api/sweeps/${sweep.body.id}/readings`, {
          readings: [
            { id: crypto.randomUUID(), x: 3, y: 3, takenAt: new Date().toISOString(), ppm: 2, samplePoint: "grille" },
          ],
        })
      ).status,
    );
  // 2, 3 and 4 of the limit pass, alternating processes; the fifth is over the shared limit.
  expect(codes).toEqual([200, 200, 200, 503]);
});
