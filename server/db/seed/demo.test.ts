import { afterAll, beforeAll, describe, expect, it } from "vitest";
import fs from "node:fs/promises";
import os from "node:os";
import path from "node:path";
import { agentFor, createTestApp, type TestApp } from "../../../tests/helpers/test-app";
import { DEMO_SIGN_INS, seedDemoIfEmpty } from "./demo";
import { FIXTURE_FAMILY } from "../../contracts/fixture-kinds";

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
    expect(await seedDemoIfEmpty(t.ctx)).toBe(true);
    expect(await seedDemoIfEmpty(t.ctx)).toBe(false);

    const lead = await agentFor(t.app);
    const person = DEMO_SIGN_INS.people.find((p) => p.role === "lead-tech")!;
    expect((await lead.post("/api/auth/sign-in", { email: person.email, password: DEMO_SIGN_INS.password })).status).toBe(200);
    const [store] = (await lead.get("/api/stores")).body.stores;
    expect(store.name).toBe("Larkspur Market – Cedar Hollow");
    const detail = (await lead.get(`/api/stores/${store.id}`)).body;
    expect(detail.systems.map((s: { refrigerantId: string }) => s.refrigerantId).sort()).toEqual(["R-404A", "R-448A", "R-744"]);
    expect(detail.currentPlan).toMatchObject({ calibrated: true, source: "image", metresPerPixel: 0.05, widthM: 60, heightM: 36 });

    const { fixtures } = (await lead.get(`/api/plans/${detail.currentPlan.id}/fixtures`)).body;
    expect(fixtures.length).toBeGreaterThanOrEqual(38);
    expect(fixtures.length).toBeLessThanOrEqual(48);
    const kinds = new Set(fixtures.map((f: { kind: string }) => f.kind));
    for (const k of ["open-case", "island-case", "door-case", "walk-in-cooler", "walk-in-freezer", "machine-room", "wall", "gondola", "checkout", "benign-zone", "line-set-drop", "valve", "coil"]) {
      expect(kinds, k).toContain(k);
    }
    const zone = fixtures.find((f: { kind: string }) => f.kind === "benign-zone");
    expect(zone.typicalPpm).toBe(3);
    const rooms = fixtures.filter((f: { kind: string }) => ["walk-in-cooler", "walk-in-freezer", "machine-room"].includes(f.kind));
    expect(rooms.every((r: { door: unknown }) => r.door !== null)).toBe(true);
    const airVolumes = fixtures.filter((f: { kind: keyof typeof FIXTURE_FAMILY }) => FIXTURE_FAMILY[f.kind] === "air-volume" && f.kind !== "machine-room");
    expect(airVolumes.every((f: { systemId: string | null; hasFans: boolean }) => f.systemId !== null && f.hasFans)).toBe(true);

    // The drawing is served through the authorized route.
    const img = await lead.agent.get(detail.currentPlan.image.thumbUrl);
    expect(img.status).toBe(200);
    expect(img.headers["content-type"]).toBe("image/png");
  });
});
