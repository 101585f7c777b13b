import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTestApp, type Agent, type TestApp, signIn } from "../../../tests/helpers/test-app";
import { seedCompany } from "../../../tests/helpers/fixtures";
import type { Role } from "#core/domain/roles";

let t: TestApp;
let co: Awaited<ReturnType<typeof seedCompany>>;
let other: Awaited<ReturnType<typeof seedCompany>>;

beforeAll(async () => {
  t = await createTestApp();
  co = await seedCompany(t.ctx, "Marrow Creek Markets");
  other = await seedCompany(t.ctx, "Saltmeadow Co-op");
});
afterAll(() => t.close());

const signedIn = (role: Role, company = co): Promise<Agent> => signIn(t.app, company.people[role]);

const names = (res: { body: { stores: { name: string }[] } }) => res.body.stores.map((s) => s.name);

describe("stores: create, edit, archive", () => {
  it("a lead tech creates and edits a store; bad input gets field errors", async () => {
    const lead = await signedIn("lead-tech");
    const created = await lead.post("/api/stores", {
      name: "  Marrow Creek – Dockside ",
      address: "14 Wharf Row, Dockside",
      timeZone: "America/Denver",
    });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({
      name: "Marrow Creek – Dockside",
      address: "14 Wharf Row, Dockside",
      timeZone: "America/Denver",
      archivedAt: null,
    });

    const bad = await lead.post("/api/stores", { name: "", timeZone: "Mars/Olympus_Mons" });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toEqual({
      name: "is required",
      timeZone: expect.stringMatching(/is not a time zone we know/),
    });

    const edited = await lead.patch(`/api/stores/${created.body.id}`, { timeZone: "Europe/Berlin" });
    expect(edited.status).toBe(200);
    expect(edited.body.timeZone).toBe("Europe/Berlin");
    expect((await lead.patch(`/api/stores/${created.body.id}`, {})).status).toBe(400);
  });

  it("archived stores leave the default list and come back with includeArchived or unarchive", async () => {
    const owner = await signedIn("owner");
    const s = (await owner.post("/api/stores", { name: "Marrow Creek – Old Mill", timeZone: "UTC" })).body;
    const archived = await owner.post(`/api/stores/${s.id}/archive`);
    expect(archived.body.archivedAt).not.toBeNull();
    expect(names(await owner.get("/api/stores"))).not.toContain("Marrow Creek – Old Mill");
    expect(names(await owner.get("/api/stores?includeArchived=true"))).toContain("Marrow Creek – Old Mill");
    // Still readable by id: archiving deletes nothing.
    expect((await owner.get(`/api/stores/${s.id}`)).status).toBe(200);
    const back = await owner.post(`/api/stores/${s.id}/unarchive`);
    expect(back.body.archivedAt).toBeNull();
    expect(names(await owner.get("/api/stores"))).toContain("Marrow Creek – Old Mill");
  });

  it("searches name and address case-insensitively and sorts by name or creation", async () => {
    const owner = await signedIn("owner");
    await owner.post("/api/stores", { name: "zeta Depot", address: "9 Quince Lane", timeZone: "UTC" });
    await owner.post("/api/stores", { name: "Alpha Depot", address: "3 QUINCE LANE", timeZone: "UTC" });
    expect(names(await owner.get("/api/stores?search=quince"))).toEqual(["Alpha Depot", "zeta Depot"]);
    expect(names(await owner.get("/api/stores?search=DEPOT&order=desc"))).toEqual(["zeta Depot", "Alpha Depot"]);
    expect(names(await owner.get("/api/stores?search=depot&sort=created&order=desc"))).toEqual([
      "Alpha Depot",
      "zeta Depot",
    ]);
    // A % typed in the box is a character, not a wildcard.
    expect(names(await owner.get("/api/stores?search=%25"))).toEqual([]);
    const bad = await owner.get("/api/stores?sort=size&includeArchived=maybe");
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(["includeArchived", "sort"]);
  });
});

describe("stores: role rules", () => {
  it.each(["technician", "engineer", "store-contact"] as Role[])(
    "%s cannot create, edit or archive stores",
    async (role) => {
      const a = await signedIn(role);
      expect((await a.post("/api/stores", { name: "Nope", timeZone: "UTC" })).status).toBe(403);
      expect((await a.patch(`/api/stores/${co.store.id}`, { name: "Nope" })).status).toBe(403);
      expect((await a.post(`/api/stores/${co.store.id}/archive`)).status).toBe(403);
    },
  );

  it("technicians read every store of the company; a store contact only theirs", async () => {
    const tech = await signedIn("technician");
    expect((await tech.get(`/api/stores/${co.otherStore.id}`)).status).toBe(200);
    const contact = await signedIn("store-contact");
    expect((await contact.get("/api/stores")).body.stores.map((s: { id: string }) => s.id)).toEqual([co.store.id]);
    expect((await contact.get(`/api/stores/${co.store.id}`)).status).toBe(200);
    expect((await contact.get(`/api/stores/${co.otherStore.id}`)).status).toBe(404);
    expect((await contact.get(`/api/stores?includeArchived=true&search=Hillside`)).body.stores).toEqual([]);
  });

  it("another company's store is 404 for reads and writes", async () => {
    const a = await signedIn("owner", other);
    expect((await a.get(`/api/stores/${co.store.id}`)).status).toBe(404);
    expect((await a.patch(`/api/stores/${co.store.id}`, { name: "Taken" })).status).toBe(404);
    expect((await a.post(`/api/stores/${co.store.id}/archive`)).status).toBe(404);
    expect(
      (await a.get("/api/stores?includeArchived=true")).body.stores.map((s: { id: string }) => s.id),
    ).not.toContain(co.store.id);
  });
});

describe("store detail", () => {
  it("returns the store with its systems, current plan and plan versions", async () => {
    const lead = await signedIn("lead-tech");
    const s = (await lead.post("/api/stores", { name: "Marrow Creek – Fairgrounds", timeZone: "America/Chicago" }))
      .body;
    const empty = await lead.get(`/api/stores/${s.id}`);
    expect(empty.body).toMatchObject({ store: { id: s.id }, systems: [], currentPlan: null, planVersions: [] });
    await lead.post(`/api/stores/${s.id}/systems`, {
      name: "Rack A",
      refrigerantId: "R-448A",
      fullCharge: { value: 300, unit: "lb" },
      applianceType: "commercial-refrigeration",
      automaticLeakDetection: true,
    });
    await lead.post(`/api/stores/${s.id}/plans/blank`, { width: 40, depth: 25 });
    await lead.post(`/api/stores/${s.id}/plans/blank`, { width: 120, depth: 80, unit: "ft" });
    const full = await lead.get(`/api/stores/${s.id}`);
    expect(full.body.systems.map((x: { name: string }) => x.name)).toEqual(["Rack A"]);
    expect(full.body.currentPlan).toMatchObject({ version: 2, source: "blank", calibrated: true });
    // 120 ft × 0.3048 m/ft = 36.576 m exactly (NIST SP 811).
    expect(full.body.currentPlan.widthM).toBeCloseTo(36.576, 12);
    expect(full.body.planVersions.map((p: { version: number }) => p.version)).toEqual([2, 1]);
  });
});
