import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import fs from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import { agentFor, createTestApp, type TestApp } from "../../../tests/helpers/test-app";
import { DEMO_SIGN_INS, seedDemoIfEmpty } from "./demo";
import { cpuPool } from "../../jobs/cpu-pool";
import { FIXTURE_FAMILY } from "#core/contracts/fixture-kinds";

let t: TestApp;
let uploads: string;
beforeAll(async () => {
  uploads = await fs.mkdtemp(path.join(os.tmpdir(), "plumeline-demo-"));
  t = await createTestApp({ uploadsDir: uploads });
});
afterAll(async () => {
  await t.close();
  await fs.rm(uploads, { recursive: true, force: true });
});

describe("demo seed", () => {
  it("seeds once and ships the demo store fully mapped", async () => {
    // The demo password is hashed once, on the CPU pool: the seed runs at start-up in a server
    // that already answers, and bcrypt at the production cost would hold its event loop.
    const run = vi.spyOn(cpuPool(), "run");
    expect(await seedDemoIfEmpty(t.ctx)).toBe(true);
    expect(
      run.mock.calls.filter(([task, payload]) => task === "password" && (payload as { op: string }).op === "hash"),
    ).toHaveLength(1);
    run.mockRestore();
    expect(await seedDemoIfEmpty(t.ctx)).toBe(false);

    const lead = await agentFor(t.app);
    const person = DEMO_SIGN_INS.people.find((p) => p.role === "lead-tech")!;
    expect(
      (await lead.post("/api/auth/sign-in", { email: person.email, password: DEMO_SIGN_INS.password })).status,
    ).toBe(200);
    const [store] = (await lead.get("/api/stores")).body.stores;
    expect(store.name).toBe("Larkspur Market – Cedar Hollow");
    const detail = (await lead.get(`/api/stores/${store.id}`)).body;
    expect(detail.systems.map((s: { refrigerantId: string }) => s.refrigerantId).sort()).toEqual([
      "R-404A",
      "R-448A",
      "R-744",
    ]);
    // Every demo system starts its history with a first revision (docs/decisions/0043-system-revisions.md).
    for (const s of detail.systems as { id: string; inServiceOn: string; refrigerantId: string }[]) {
      const { revisions } = (await lead.get(`/api/systems/${s.id}/revisions`)).body;
      expect(revisions.map((r: { kind: string }) => r.kind)).toEqual(["first"]);
      expect(revisions[0]).toMatchObject({ effectiveFrom: s.inServiceOn, refrigerantId: s.refrigerantId });
    }
    expect(detail.currentPlan).toMatchObject({
      calibrated: true,
      source: "image",
      metresPerPixel: 0.05,
      widthM: 60,
      heightM: 36,
    });

    const { fixtures } = (await lead.get(`/api/plans/${detail.currentPlan.id}/fixtures`)).body;
    expect(fixtures.length).toBeGreaterThanOrEqual(38);
    expect(fixtures.length).toBeLessThanOrEqual(48);
    const kinds = new Set(fixtures.map((f: { kind: string }) => f.kind));
    for (const k of [
      "open-case",
      "island-case",
      "door-case",
      "walk-in-cooler",
      "walk-in-freezer",
      "machine-room",
      "wall",
      "gondola",
      "checkout",
      "benign-zone",
      "line-set-drop",
      "valve",
      "coil",
    ]) {
      expect(kinds, k).toContain(k);
    }
    const zone = fixtures.find((f: { kind: string }) => f.kind === "benign-zone");
    expect(zone.typicalPpm).toBe(3);
    const rooms = fixtures.filter((f: { kind: string }) =>
      ["walk-in-cooler", "walk-in-freezer", "machine-room"].includes(f.kind),
    );
    expect(rooms.every((r: { door: unknown }) => r.door !== null)).toBe(true);
    const airVolumes = fixtures.filter(
      (f: { kind: keyof typeof FIXTURE_FAMILY }) =>
        FIXTURE_FAMILY[f.kind] === "air-volume" && f.kind !== "machine-room",
    );
    expect(
      airVolumes.every((f: { systemId: string | null; hasFans: boolean }) => f.systemId !== null && f.hasFans),
    ).toBe(true);

    // The drawing is served through the authorized route.
    const img = await lead.agent.get(detail.currentPlan.image.thumbUrl);
    expect(img.status).toBe(200);
    expect(img.headers["content-type"]).toBe("image/png");
  });
});

describe("demo records", () => {
  it("show a true picture on Today: one system over threshold with an open finding, one repaired and verified, an inspection due soon", async () => {
    const engineer = await agentFor(t.app);
    const person = DEMO_SIGN_INS.people.find((p) => p.role === "engineer")!;
    expect(
      (await engineer.post("/api/auth/sign-in", { email: person.email, password: DEMO_SIGN_INS.password })).status,
    ).toBe(200);
    const today = (await engineer.get("/api/today")).body;
    expect(today.overThreshold).toHaveLength(1);
    const over = today.overThreshold[0];
    expect(over.refrigerantId).toBe("R-448A");
    // 90 lb into 1,150 lb 76 days after the previous addition: 37.6 % (40 CFR 84.102 annualizing) > 20 % [S:R4].
    expect(over.percent).toBeCloseTo((90 / 1150 / (76 / 365)) * 100, 9);
    const repair = today.due.find((d: { kind: string }) => d.kind === "repair");
    expect(repair).toMatchObject({ systemId: over.systemId, daysLeft: 18 }); // learned 12 days ago, 30 days to repair [S:R4]
    // The open leak first (it has a deadline), then the verified repair waiting for an engineer to close it.
    expect(today.openFindings.map((f: { status: string; deadline: string | null }) => [f.status, f.deadline])).toEqual([
      ["confirmed", repair.dueOn],
      ["verified", null],
    ]);
    expect(today.openFindings[0].systemId).toBe(over.systemId);
    const inspection = today.due.find(
      (d: { kind: string; systemId: string }) => d.kind === "inspection" && d.systemId === over.systemId,
    );
    // Quarterly since the first breach 88 days ago: three calendar months are 89–92 days [M].
    expect(inspection.daysLeft).toBeGreaterThanOrEqual(1);
    expect(inspection.daysLeft).toBeLessThanOrEqual(4);
    const [store] = today.stores;
    const findings = (await engineer.get(`/api/stores/${store.id}/findings`)).body.findings;
    expect(findings.map((f: { status: string }) => f.status).sort()).toEqual(["closed", "confirmed", "verified"]);
    // The walk-in finding carries the room's wording of the oxygen caution (docs/reference/standards.md §8).
    const coil = findings.find((f: { status: string }) => f.status === "verified");
    expect(coil.fixtureLabel).toBe("Dairy walk-in cooler");
    expect(coil.cautions.find((c: { id: string }) => c.id === "oxygen-displacement").text).toMatch(/In this walk-in/);
  });
});
