import { afterAll, beforeAll, describe, expect, it } from "vitest";
import fs from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import { randomUUID } from "node:crypto";
import { createTestApp, type Agent, type TestApp, signIn } from "../../../tests/helpers/test-app";
import { seedCompany } from "../../../tests/helpers/fixtures";
import { makePng } from "../../../tests/helpers/plan-images";
import type { Fixture } from "#core/contracts/fixtures";
import type { Role } from "#core/domain/roles";
import { eq } from "drizzle-orm";
import { plans } from "../../db/schema/index";
import { addRecalibratedVersion } from "./calibration.service";

let t: TestApp;
let uploads: string;
let co: Awaited<ReturnType<typeof seedCompany>>;
let other: Awaited<ReturnType<typeof seedCompany>>;

beforeAll(async () => {
  uploads = await fs.mkdtemp(path.join(os.tmpdir(), "plumeline-layout-"));
  t = await createTestApp({ uploadsDir: uploads });
  co = await seedCompany(t.ctx, "Hollowbrook Provisions");
  other = await seedCompany(t.ctx, "Ridgeway Pantry");
});
afterAll(async () => {
  await t.close();
  await fs.rm(uploads, { recursive: true, force: true });
});

const signedIn = (role: Role, company = co): Promise<Agent> => signIn(t.app, company.people[role]);

async function newStore(a: Agent, name: string): Promise<string> {
  return (await a.post("/api/stores", { name, timeZone: "America/Chicago" })).body.id;
}

async function uploadPlan(a: Agent, storeId: string, w = 400, h = 300) {
  const res = await a.agent
    .post(`/api/stores/${storeId}/plans`)
    .set("X-CSRF-Token", a.csrf)
    .attach("image", await makePng(w, h), "plan.png");
  expect(res.status).toBe(201);
  return res.body;
}

const rect = (x: number, y: number, w: number, h: number): [number, number][] => [
  [x, y],
  [x + w, y],
  [x + w, y + h],
  [x, y + h],
];

function sampleFixtures(): Fixture[] {
  return [
    {
      id: randomUUID(),
      kind: "door-case",
      label: "Frozen 1",
      systemId: null,
      hasFans: true,
      polygon: rect(0.5, 0.5, 3, 1),
      doorCount: 5,
    },
    {
      id: randomUUID(),
      kind: "walk-in-cooler",
      label: "Dairy cooler",
      systemId: null,
      hasFans: true,
      polygon: rect(1, 2, 2, 1.5),
      door: { edge: 0, offset: 0.5, width: 0.9 },
    },
    {
      id: randomUUID(),
      kind: "valve",
      label: "Suction ball valve",
      systemId: null,
      hasFans: false,
      point: { x: 5, y: 4 },
    },
  ];
}

describe("scale calibration", () => {
  it("a 10 ft line of 200 px gives 0.01524 m/px (0.3048 m/ft exactly, NIST SP 811)", async () => {
    const lead = await signedIn("lead-tech");
    const plan = await uploadPlan(lead, await newStore(lead, "Calibration A"));
    const res = await lead.post(`/api/plans/${plan.id}/calibration`, {
      a: { x: 20, y: 30 },
      b: { x: 220, y: 30 },
      length: { value: 10, unit: "ft" },
    });
    expect(res.status).toBe(200);
    expect(res.body.outcome).toBe("first");
    expect(res.body.plan.metresPerPixel).toBeCloseTo(0.01524, 15);
    expect(res.body.plan.calibrated).toBe(true);
    // The plan's extent follows: 400 px × 0.01524 = 6.096 m, 300 px × 0.01524 = 4.572 m.
    expect(res.body.plan.widthM).toBeCloseTo(6.096, 12);
    expect(res.body.plan.heightM).toBeCloseTo(4.572, 12);
    // A diagonal line in metres: a 3-4-5 triangle of 150 × 200 px is 250 px; 5 m / 250 px = 0.02.
    const metric = await lead.post(`/api/plans/${plan.id}/calibration`, {
      a: { x: 0, y: 0 },
      b: { x: 150, y: 200 },
      length: { value: 5, unit: "m" },
    });
    expect(metric.body.plan.metresPerPixel).toBeCloseTo(0.02, 15);
  });

  it("refuses bad calibration lines with field errors, and blank plans", async () => {
    const lead = await signedIn("lead-tech");
    const storeId = await newStore(lead, "Calibration B");
    const plan = await uploadPlan(lead, storeId);
    const short = await lead.post(`/api/plans/${plan.id}/calibration`, {
      a: { x: 10, y: 10 },
      b: { x: 13, y: 14 },
      length: { value: 2, unit: "m" },
    });
    expect(short.status).toBe(400);
    expect(short.body.error.fields.b).toMatch(/only 5\.0 px from a/);
    const outside = await lead.post(`/api/plans/${plan.id}/calibration`, {
      a: { x: -5, y: 10 },
      b: { x: 100, y: 10 },
      length: { value: 0, unit: "yd" },
    });
    expect(outside.status).toBe(400);
    expect(outside.body.error.fields).toMatchObject({
      "length.value": "must be more than 0",
      "length.unit": "must be m or ft",
    });
    const off = await lead.post(`/api/plans/${plan.id}/calibration`, {
      a: { x: -5, y: 10 },
      b: { x: 100, y: 10 },
      length: { value: 3, unit: "m" },
    });
    expect(off.body.error.fields.a).toMatch(/outside the 400 × 300 px image/);
    const blank = (await lead.post(`/api/stores/${storeId}/plans/blank`, { width: 30, depth: 20 })).body;
    expect(
      (
        await lead.post(`/api/plans/${blank.id}/calibration`, {
          a: { x: 0, y: 0 },
          b: { x: 100, y: 0 },
          length: { value: 3, unit: "m" },
        })
      ).status,
    ).toBe(409);
  });

  it("an uncalibrated plan cannot hold fixtures", async () => {
    const lead = await signedIn("lead-tech");
    const plan = await uploadPlan(lead, await newStore(lead, "Calibration C"));
    const res = await lead.put(`/api/plans/${plan.id}/fixtures`, { layoutRevision: 0, fixtures: sampleFixtures() });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/Calibrate the plan's scale first/);
    expect((await lead.get(`/api/plans/${plan.id}/fixtures`)).body.fixtures).toEqual([]);
  });

  it("re-calibrating a plan without sweeps rescales its fixtures in place", async () => {
    const lead = await signedIn("lead-tech");
    const plan = await uploadPlan(lead, await newStore(lead, "Calibration D"));
    await lead.post(`/api/plans/${plan.id}/calibration`, {
      a: { x: 0, y: 0 },
      b: { x: 200, y: 0 },
      length: { value: 4, unit: "m" },
    }); // 0.02 m/px
    const list = sampleFixtures();
    const saved = await lead.put(`/api/plans/${plan.id}/fixtures`, { layoutRevision: 1, fixtures: list });
    expect(saved.status).toBe(200);
    // The same line is really 8 m: every metre doubles, door offsets and widths too.
    const re = await lead.post(`/api/plans/${plan.id}/calibration`, {
      a: { x: 0, y: 0 },
      b: { x: 200, y: 0 },
      length: { value: 8, unit: "m" },
      layoutRevision: saved.body.layoutRevision,
    });
    expect(re.body).toMatchObject({ outcome: "rescaled", plan: { id: plan.id, version: 1, metresPerPixel: 0.04 } });
    const after = (await lead.get(`/api/plans/${plan.id}/fixtures`)).body;
    expect(after.layoutRevision).toBe(saved.body.layoutRevision + 1);
    expect(after.fixtures[0].polygon).toEqual(rect(1, 1, 6, 2));
    expect(after.fixtures[1].door).toEqual({ edge: 0, offset: 1, width: 1.8 });
    expect(after.fixtures[2].point).toEqual({ x: 10, y: 8 });
    // A stale revision on a calibration is a conflict and changes nothing.
    const stale = await lead.post(`/api/plans/${plan.id}/calibration`, {
      a: { x: 0, y: 0 },
      b: { x: 200, y: 0 },
      length: { value: 2, unit: "m" },
      layoutRevision: 1,
    });
    expect(stale.status).toBe(409);
    expect((await lead.get(`/api/plans/${plan.id}`)).body.metresPerPixel).toBe(0.04);
  });
});

async function calibratedPlan(a: Agent, name: string) {
  const storeId = await newStore(a, name);
  const plan = await uploadPlan(a, storeId);
  // 0.05 m/px: the 400 × 300 px drawing is 20 m × 15 m.
  const cal = await a.post(`/api/plans/${plan.id}/calibration`, {
    a: { x: 0, y: 0 },
    b: { x: 200, y: 0 },
    length: { value: 10, unit: "m" },
  });
  return { storeId, plan: cal.body.plan as { id: string; layoutRevision: number } };
}

describe("fixtures: save and load in metres", () => {
  it("round-trips every family with stable ids and bumps the revision", async () => {
    const lead = await signedIn("lead-tech");
    const { storeId, plan } = await calibratedPlan(lead, "Fixtures A");
    const system = (
      await lead.post(`/api/stores/${storeId}/systems`, {
        name: "Rack A",
        refrigerantId: "R-448A",
        fullCharge: { value: 200, unit: "kg" },
        applianceType: "commercial-refrigeration",
        automaticLeakDetection: false,
      })
    ).body;
    const list: Fixture[] = [
      ...sampleFixtures().map((f) => ({ ...f, systemId: system.id })),
      {
        id: randomUUID(),
        kind: "benign-zone",
        label: "Bakery aerosols",
        systemId: null,
        hasFans: false,
        polygon: rect(10, 10, 2, 2),
        note: "Release agent spray",
        typicalPpm: 3,
      },
      {
        id: randomUUID(),
        kind: "gondola",
        label: "Aisle 3",
        systemId: null,
        hasFans: false,
        polygon: [
          [12, 1],
          [19.5, 1],
          [19.5, 2.2],
          [12, 2.2],
        ],
      },
    ];
    const res = await lead.put(`/api/plans/${plan.id}/fixtures`, {
      layoutRevision: plan.layoutRevision,
      fixtures: list,
    });
    expect(res.status).toBe(200);
    expect(res.body.layoutRevision).toBe(plan.layoutRevision + 1);
    const loaded = (await (await signedIn("technician")).get(`/api/plans/${plan.id}/fixtures`)).body;
    expect(loaded).toEqual({
      planId: plan.id,
      layoutRevision: plan.layoutRevision + 1,
      bounds: { width: 20, height: 15 },
      fixtures: list,
    });
  });

  it("a second editor with a stale revision gets a clear 409 and nothing is overwritten", async () => {
    const lead = await signedIn("lead-tech");
    const owner = await signedIn("owner");
    const { plan } = await calibratedPlan(lead, "Fixtures B");
    const start = (await owner.get(`/api/plans/${plan.id}/fixtures`)).body.layoutRevision;
    const first = sampleFixtures();
    expect((await lead.put(`/api/plans/${plan.id}/fixtures`, { layoutRevision: start, fixtures: first })).status).toBe(
      200,
    );
    const second = await owner.put(`/api/plans/${plan.id}/fixtures`, { layoutRevision: start, fixtures: [] });
    expect(second.status).toBe(409);
    expect(second.body.error.code).toBe("conflict");
    expect(second.body.error.message).toMatch(/changed by someone else.*revision \d+.*Reload/);
    expect(second.body.error.details).toEqual({ currentRevision: start + 1 });
    const now = (await owner.get(`/api/plans/${plan.id}/fixtures`)).body;
    expect(now.fixtures).toEqual(first);
    // Two saves racing from the same revision: exactly one wins.
    const racers = await Promise.all([
      lead.put(`/api/plans/${plan.id}/fixtures`, { layoutRevision: now.layoutRevision, fixtures: first.slice(0, 1) }),
      owner.put(`/api/plans/${plan.id}/fixtures`, { layoutRevision: now.layoutRevision, fixtures: first.slice(0, 2) }),
    ]);
    expect(racers.map((r) => r.status).sort()).toEqual([200, 409]);
  });

  it("names the bad field: crossing edges, outside the plan, unknown kind, a foreign system, a non-finite number", async () => {
    const lead = await signedIn("lead-tech");
    const { plan } = await calibratedPlan(lead, "Fixtures C");
    const bowtie = {
      id: randomUUID(),
      kind: "island-case",
      label: "",
      systemId: null,
      hasFans: false,
      polygon: [
        [1, 1],
        [3, 3],
        [3, 1],
        [1, 3],
      ],
    };
    const outside = {
      id: randomUUID(),
      kind: "open-case",
      label: "",
      systemId: null,
      hasFans: false,
      polygon: [
        [15, 1],
        [19, 1],
        [25, 4],
      ],
    };
    const unknown = {
      id: randomUUID(),
      kind: "fryer",
      label: "",
      systemId: null,
      hasFans: false,
      polygon: rect(1, 1, 1, 1),
    };
    const twoPoints = {
      id: randomUUID(),
      kind: "wall",
      label: "",
      systemId: null,
      hasFans: false,
      polygon: [
        [1, 1],
        [2, 2],
      ],
    };
    const res = await lead.put(`/api/plans/${plan.id}/fixtures`, {
      layoutRevision: plan.layoutRevision,
      fixtures: [bowtie, outside, unknown, twoPoints],
    });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toMatchObject({
      "fixtures.0.polygon": "has edges that cross each other",
      "fixtures.1.polygon.2": expect.stringMatching(/vertex \(25, 4\) lies outside the plan \(0–20 m × 0–15 m\)/),
      "fixtures.2.kind": expect.stringMatching(/must be one of: open-case/),
      "fixtures.3.polygon": "needs at least 3 vertices",
    });

    const elsewhere = (
      await lead.post(`/api/stores/${co.otherStore.id}/systems`, {
        name: "Other rack",
        refrigerantId: "R-404A",
        fullCharge: { value: 20, unit: "kg" },
        applianceType: "commercial-refrigeration",
        automaticLeakDetection: false,
      })
    ).body;
    const foreign = await lead.put(`/api/plans/${plan.id}/fixtures`, {
      layoutRevision: plan.layoutRevision,
      fixtures: [{ ...sampleFixtures()[2], systemId: elsewhere.id }],
    });
    expect(foreign.body.error.fields).toEqual({ "fixtures.0.systemId": "is not a system of this store" });

    // JSON has no NaN, but 1e400 parses to Infinity: it must be refused, not stored.
    const raw = `{"layoutRevision":${plan.layoutRevision},"fixtures":[{"id":"${randomUUID()}","kind":"coil","label":"","systemId":null,"hasFans":false,"point":{"x":1e400,"y":2}}]}`;
    const inf = await lead.agent
      .put(`/api/plans/${plan.id}/fixtures`)
      .set("X-CSRF-Token", lead.csrf)
      .set("Content-Type", "application/json")
      .send(raw);
    expect(inf.status).toBe(400);
    expect(inf.body.error.fields["fixtures.0.point.x"]).toMatch(/finite/);
    expect((await lead.get(`/api/plans/${plan.id}/fixtures`)).body).toMatchObject({
      fixtures: [],
      layoutRevision: plan.layoutRevision,
    });
  });
});

describe("plan versions", () => {
  it("a new drawing is a new version carrying the fixture ids; the old version keeps its fixtures", async () => {
    const lead = await signedIn("lead-tech");
    const { storeId, plan: v1 } = await calibratedPlan(lead, "Versions A");
    const list = sampleFixtures();
    const saved = (
      await lead.put(`/api/plans/${v1.id}/fixtures`, { layoutRevision: v1.layoutRevision, fixtures: list })
    ).body;

    const v2 = await uploadPlan(lead, storeId, 500, 400);
    expect(v2).toMatchObject({
      version: 2,
      previousPlanId: v1.id,
      alignment: { scale: 1, rotation: 0, tx: 0, ty: 0 },
      alignmentMatched: false,
      fixtureCount: 3,
    });
    const copied = (await lead.get(`/api/plans/${v2.id}/fixtures`)).body;
    expect(copied.fixtures).toEqual(list);

    // Calibrate v2 (0.05 m/px → 25 m × 20 m) and align it: the new drawing is shifted 2 m right, 1 m down.
    const cal = (
      await lead.post(`/api/plans/${v2.id}/calibration`, {
        a: { x: 0, y: 0 },
        b: { x: 200, y: 0 },
        length: { value: 10, unit: "m" },
      })
    ).body;
    const aligned = await lead.put(`/api/plans/${v2.id}/alignment`, {
      previous: [
        { x: 0, y: 0 },
        { x: 10, y: 0 },
      ],
      current: [
        { x: 2, y: 1 },
        { x: 12, y: 1 },
      ],
      layoutRevision: cal.plan.layoutRevision,
    });
    expect(aligned.status).toBe(200);
    expect(aligned.body.alignmentMatched).toBe(true);
    expect(aligned.body.alignment.scale).toBeCloseTo(1, 12);
    expect(aligned.body.alignment.rotation).toBeCloseTo(0, 12);
    expect(aligned.body.alignment.tx).toBeCloseTo(2, 12);
    expect(aligned.body.alignment.ty).toBeCloseTo(1, 12);
    const onV2 = (await lead.get(`/api/plans/${v2.id}/fixtures`)).body.fixtures as Fixture[];
    expect(onV2.map((f) => f.id)).toEqual(list.map((f) => f.id));
    expect((onV2[2] as { point: { x: number; y: number } }).point.x).toBeCloseTo(7, 12);
    expect((onV2[2] as { point: { x: number; y: number } }).point.y).toBeCloseTo(5, 12);

    // Editing v2 never touches v1; v1 itself is read-only now.
    const v2rev = (await lead.get(`/api/plans/${v2.id}/fixtures`)).body.layoutRevision;
    expect(
      (await lead.put(`/api/plans/${v2.id}/fixtures`, { layoutRevision: v2rev, fixtures: onV2.slice(0, 1) })).status,
    ).toBe(200);
    const old = (await lead.get(`/api/plans/${v1.id}/fixtures`)).body;
    expect(old).toMatchObject({ layoutRevision: saved.layoutRevision, fixtures: list });
    const edit = await lead.put(`/api/plans/${v1.id}/fixtures`, { layoutRevision: saved.layoutRevision, fixtures: [] });
    expect(edit.status).toBe(409);
    expect(edit.body.error).toMatchObject({ code: "old_plan_version", details: { currentPlanId: v2.id } });

    const store = (await lead.get(`/api/stores/${storeId}`)).body;
    expect(store.currentPlan.id).toBe(v2.id);
    expect(
      store.planVersions.map((p: { version: number; fixtureCount: number }) => [p.version, p.fixtureCount]),
    ).toEqual([
      [2, 1],
      [1, 3],
    ]);
  });

  it("re-calibrating once sweeps exist makes a new version; the old one does not move", async () => {
    // The versioning path is exercised directly here, on the real database, as well as through
    // a plan that has sweeps.
    const lead = await signedIn("lead-tech");
    const { storeId, plan: v1 } = await calibratedPlan(lead, "Versions C"); // 0.05 m/px
    const list = sampleFixtures();
    const saved = (
      await lead.put(`/api/plans/${v1.id}/fixtures`, { layoutRevision: v1.layoutRevision, fixtures: list })
    ).body;
    const [v1Row] = await t.ctx.db.select().from(plans).where(eq(plans.id, v1.id));
    const calibration = { a: { x: 0, y: 0 }, b: { x: 200, y: 0 }, length: { value: 20, unit: "m" as const } };
    const v2 = await t.ctx.db.transaction((tx) =>
      addRecalibratedVersion(tx, v1Row, { metresPerPixel: 0.1, calibration, userId: null }),
    );
    expect(v2).toMatchObject({
      version: 2,
      previousPlanId: v1.id,
      metresPerPixel: 0.1,
      widthM: 40,
      heightM: 30,
      alignmentMatched: true,
      displayKey: v1Row.displayKey,
    });
    expect(v2.alignment).toEqual({ scale: 2, rotation: 0, tx: 0, ty: 0 });
    const moved = (await lead.get(`/api/plans/${v2.id}/fixtures`)).body.fixtures;
    expect(moved.map((f: Fixture) => f.id)).toEqual(list.map((f) => f.id));
    expect(moved[0].polygon).toEqual(rect(1, 1, 6, 2));
    expect(moved[2].point).toEqual({ x: 10, y: 8 });
    expect((await lead.get(`/api/plans/${v1.id}/fixtures`)).body).toMatchObject({
      layoutRevision: saved.layoutRevision,
      fixtures: list,
    });
    expect((await lead.get(`/api/plans/${v1.id}`)).body.metresPerPixel).toBe(0.05);
    expect((await lead.get(`/api/stores/${storeId}`)).body.currentPlan.id).toBe(v2.id);
  });

  it("the first version has nothing to align to; coinciding points are a field error", async () => {
    const lead = await signedIn("lead-tech");
    const { storeId, plan } = await calibratedPlan(lead, "Versions B");
    const body = {
      previous: [
        { x: 0, y: 0 },
        { x: 1, y: 0 },
      ],
      current: [
        { x: 0, y: 0 },
        { x: 1, y: 0 },
      ],
      layoutRevision: plan.layoutRevision,
    };
    expect((await lead.put(`/api/plans/${plan.id}/alignment`, body)).status).toBe(409);
    const v2 = (await lead.post(`/api/stores/${storeId}/plans/blank`, { width: 20, depth: 15 })).body;
    const same = await lead.put(`/api/plans/${v2.id}/alignment`, {
      ...body,
      current: [
        { x: 3, y: 3 },
        { x: 3, y: 3 },
      ],
      layoutRevision: v2.layoutRevision,
    });
    expect(same.status).toBe(400);
    expect(same.body.error.fields["current.1"]).toMatch(/same point/);
  });
});

describe("plans: role rules", () => {
  it("technicians and engineers read but cannot edit; store contacts reach only their store; other companies get 404", async () => {
    const owner = await signedIn("owner");
    const blank = (await owner.post(`/api/stores/${co.store.id}/plans/blank`, { width: 30, depth: 20 })).body;
    const elsewhere = (await owner.post(`/api/stores/${co.otherStore.id}/plans/blank`, { width: 30, depth: 20 })).body;
    for (const role of ["technician", "engineer"] as Role[]) {
      const a = await signedIn(role);
      expect((await a.get(`/api/plans/${blank.id}/fixtures`)).status).toBe(200);
      expect((await a.put(`/api/plans/${blank.id}/fixtures`, { layoutRevision: 0, fixtures: [] })).status).toBe(403);
      expect((await a.post(`/api/stores/${co.store.id}/plans/blank`, { width: 10, depth: 10 })).status).toBe(403);
    }
    const contact = await signedIn("store-contact");
    expect((await contact.get(`/api/plans/${blank.id}/fixtures`)).status).toBe(200);
    expect((await contact.get(`/api/plans/${elsewhere.id}/fixtures`)).status).toBe(404);
    expect((await contact.get(`/api/stores/${co.otherStore.id}/plans`)).status).toBe(404);
    expect((await contact.put(`/api/plans/${blank.id}/fixtures`, { layoutRevision: 0, fixtures: [] })).status).toBe(
      403,
    );
    const stranger = await signedIn("owner", other);
    expect((await stranger.get(`/api/plans/${blank.id}`)).status).toBe(404);
    expect((await stranger.get(`/api/plans/${blank.id}/fixtures`)).status).toBe(404);
    expect((await stranger.put(`/api/plans/${blank.id}/fixtures`, { layoutRevision: 0, fixtures: [] })).status).toBe(
      404,
    );
    expect(
      (
        await stranger.post(`/api/plans/${blank.id}/calibration`, {
          a: { x: 0, y: 0 },
          b: { x: 100, y: 0 },
          length: { value: 3, unit: "m" },
        })
      ).status,
    ).toBe(404);
  });

  it("blank plans take their size in metres or feet and refuse absurd sizes", async () => {
    const owner = await signedIn("owner");
    const bad = await owner.post(`/api/stores/${co.store.id}/plans/blank`, { width: 0, depth: 9000 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.width).toBe("must be more than 0");
    const huge = await owner.post(`/api/stores/${co.store.id}/plans/blank`, { width: 10, depth: 9000 });
    expect(huge.body.error.fields.depth).toMatch(/at most 2000 m/);
  });
});
