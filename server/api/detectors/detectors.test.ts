import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { agentFor, createTestApp, type Agent, type TestApp } from "../../../tests/helpers/test-app";
import { PASSWORD, seedCompany } from "../../../tests/helpers/fixtures";
import type { Role } from "#core/domain/roles";
import { checkStatus } from "./detectors.service";

let t: TestApp;
let co: Awaited<ReturnType<typeof seedCompany>>;
let other: Awaited<ReturnType<typeof seedCompany>>;

beforeAll(async () => {
  t = await createTestApp();
  co = await seedCompany(t.ctx, "Kestrel Foods");
  other = await seedCompany(t.ctx, "Marram Stores");
});
afterAll(() => t.close());

async function as(role: Role, company = co): Promise<Agent> {
  const a = await agentFor(t.app);
  await a.post("/api/auth/sign-in", { email: company.people[role].email, password: PASSWORD });
  return a;
}

describe("detectors", () => {
  it("a lead tech registers one with the common-practice defaults", async () => {
    const a = await as("lead-tech");
    const res = await a.post("/api/detectors", {
      name: "Van 3 diode sniffer",
      principle: "heated-diode",
      lastCheckedOn: "2026-11-20",
    });
    expect(res.status).toBe(201);
    // 5 s transport delay and 2 ppm alarm: common practice, no published source.
    expect(res.body).toMatchObject({ transportDelayS: 5, alarmPpm: 2, checkDueOn: "2026-12-20" });
    const list = await (await as("technician")).get("/api/detectors");
    expect(list.body.detectors.map((d: { name: string }) => d.name)).toContain("Van 3 diode sniffer");
  });

  it("gives field errors for bad values", async () => {
    const res = await (await as("owner")).post("/api/detectors", {
      name: "",
      principle: "nose",
      transportDelayS: -1,
      alarmPpm: 0,
      lastCheckedOn: "2026-02-30x",
      levelScale: [{ level: "1", minPpm: 5, maxPpm: 3 }],
    });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual([
      "alarmPpm",
      "lastCheckedOn",
      "levelScale.0.maxPpm",
      "name",
      "principle",
      "transportDelayS",
    ]);
  });

  it("only lead techs and owners manage them; store contacts cannot list them", async () => {
    expect((await (await as("technician")).post("/api/detectors", { name: "X", principle: "infrared" })).status).toBe(
      403,
    );
    expect((await (await as("engineer")).post("/api/detectors", { name: "X", principle: "infrared" })).status).toBe(
      403,
    );
    expect((await (await as("store-contact")).get("/api/detectors")).status).toBe(403);
    // Engineers read them: detector calibration checks are on their Today screen.
    expect((await (await as("engineer")).get("/api/detectors")).status).toBe(200);
  });

  it("engineers read the detectors (docs/product.md: engineers read everything); store contacts read none", async () => {
    const made = await (await as("lead-tech")).post("/api/detectors", { name: "Bench IR", principle: "infrared" });
    const engineer = await as("engineer");
    const list = await engineer.get("/api/detectors");
    expect(list.status).toBe(200);
    expect(list.body.detectors.map((d: { id: string }) => d.id)).toContain(made.body.id);
    expect((await engineer.get(`/api/detectors/${made.body.id}`)).status).toBe(200);
    expect((await (await as("technician")).get(`/api/detectors/${made.body.id}`)).status).toBe(200);
    expect((await (await as("store-contact")).get(`/api/detectors/${made.body.id}`)).status).toBe(403);
  });

  it("refuses a level scale whose bands overlap or run downwards, naming the band and field", async () => {
    const lead = await as("lead-tech");
    const bad = await lead.post("/api/detectors", {
      name: "LED sniffer",
      principle: "heated-diode",
      levelScale: [
        { level: "1", minPpm: 3, maxPpm: 15 },
        { level: "2", minPpm: 10, maxPpm: 60 },
        { level: "3", minPpm: 5, maxPpm: null },
      ],
    });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(["levelScale.1.minPpm", "levelScale.2.minPpm"]);
    expect(bad.body.error.fields["levelScale.1.minPpm"]).toMatch(/must not overlap level 1/);
    const good = await lead.post("/api/detectors", {
      name: "LED sniffer",
      principle: "heated-diode",
      levelScale: [
        { level: "1", minPpm: 3, maxPpm: 15 },
        { level: "2", minPpm: 15, maxPpm: 60 },
        { level: "3", minPpm: 60, maxPpm: null },
      ],
    });
    expect(good.status, JSON.stringify(good.body)).toBe(201);
    expect(good.body.levelScale).toHaveLength(3);
  });

  it("never shows another company's detector", async () => {
    const mine = await (await as("owner")).post("/api/detectors", { name: "IR unit", principle: "infrared" });
    const stranger = await as("owner", other);
    expect((await stranger.get(`/api/detectors/${mine.body.id}`)).status).toBe(404);
    expect(
      (await stranger.put(`/api/detectors/${mine.body.id}`, { name: "Mine now", principle: "infrared" })).status,
    ).toBe(404);
    expect((await stranger.get("/api/detectors")).body.detectors).toEqual([]);
  });

  it("archives and restores", async () => {
    const a = await as("owner");
    const d = await a.post("/api/detectors", { name: "Old diode", principle: "heated-diode" });
    await a.post(`/api/detectors/${d.body.id}/archive`);
    expect((await a.get("/api/detectors")).body.detectors.some((x: { id: string }) => x.id === d.body.id)).toBe(false);
    expect(
      (await a.get("/api/detectors?includeArchived=true")).body.detectors.some(
        (x: { id: string }) => x.id === d.body.id,
      ),
    ).toBe(true);
    expect((await a.post(`/api/detectors/${d.body.id}/restore`)).body.archivedAt).toBeNull();
  });
});

describe("check status", () => {
  it("is due a whole interval after the last check and overdue the day after", () => {
    expect(checkStatus("2026-01-31", 30, new Date("2026-03-02T12:00:00Z"))).toEqual({
      checkDueOn: "2026-03-02",
      overdue: false,
    });
    expect(checkStatus("2026-01-31", 30, new Date("2026-03-03T12:00:00Z"))).toEqual({
      checkDueOn: "2026-03-02",
      overdue: true,
    });
    // In the store's zone it is still 2 March at 03:00 UTC on the 3rd in Chicago (UTC−6).
    expect(checkStatus("2026-01-31", 30, new Date("2026-03-03T03:00:00Z"), "America/Chicago").overdue).toBe(false);
    expect(checkStatus(null, 30, new Date()).overdue).toBe(true);
  });
});
