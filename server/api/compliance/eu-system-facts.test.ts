import Papa from "papaparse";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTestApp, type Agent, type TestApp, signInOnce } from "../../../tests/helpers/test-app";
import { seedCompany } from "../../../tests/helpers/fixtures";
import { pdfText } from "../../../tests/helpers/pdf-text";
import { unzip } from "../../../tests/helpers/unzip";
import type { Role } from "#core/domain/roles";
import { binaryBody } from "../../../tests/helpers/binary-body";

let t: TestApp;
let co: Awaited<ReturnType<typeof seedCompany>>;
let other: Awaited<ReturnType<typeof seedCompany>>;
const signInOnceAs = signInOnce(() => t.app);

const settings = (ruleProfile: string) => ({
  name: "Brambleholt Markt",
  lengthUnit: "m",
  massUnit: "kg",
  ruleProfile,
  leakRateMethod: "annualizing",
  detectorCheckIntervalDays: 30,
});

beforeAll(async () => {
  t = await createTestApp();
  co = await seedCompany(t.ctx, "Brambleholt Markt");
  other = await seedCompany(t.ctx, "Dunmere Foods");
  expect((await (await signInOnceAs(co.people.owner)).put("/api/company/settings", settings("eu-fgas"))).status).toBe(
    200,
  );
});
afterAll(() => t.close());

const signedIn = (role: Role): Promise<Agent> => signInOnceAs(co.people[role]);
async function newSystem(body: Record<string, unknown>) {
  const res = await (await signedIn("lead-tech")).post(`/api/stores/${co.store.id}/systems`, {
    refrigerantId: "R-404A",
    applianceType: "commercial-refrigeration",
    automaticLeakDetection: false,
    ...body,
  });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.id as string;
}

describe("hermetically sealed equipment under EU F-gas (docs/reference/standards.md §2 [S:E1])", () => {
  it("exempts a labelled hermetic unit below 10 t CO2e from periodic leak checks; the same unit unsealed owes one a year", async () => {
    // 2 kg R-404A × 3922 / 1000 = 7.844 t CO2e (2024/573 Art. 3 [S:E7]; GWP [S:E1]): the 5–50 t band.
    const sealed = await newSystem({
      name: "Bakery display (plug-in)",
      fullCharge: { value: 2, unit: "kg" },
      hermeticallySealed: true,
      inServiceOn: "2025-05-01",
    });
    const plain = await newSystem({
      name: "Deli counter (plug-in)",
      fullCharge: { value: 2, unit: "kg" },
      inServiceOn: "2025-05-01",
    });
    const engineer = await signedIn("engineer");
    const s = (await engineer.get(`/api/systems/${sealed}/records`)).body;
    expect(s.system.hermeticallySealed).toBe(true);
    expect(s.leakCheck).toMatchObject({ appliedMonths: null, reason: "hermetically sealed and below 10 t CO2e" });
    expect(s.nextInspection).toBeNull();
    expect(s.due).toEqual([]);
    const p = (await engineer.get(`/api/systems/${plain}/records`)).body;
    expect(p.system.hermeticallySealed).toBe(false);
    // Every 12 months without a leak detection system [S:E1], from the in-service day.
    expect(p.nextInspection.dueOn).toBe("2026-05-01");

    // Marked later, once the unit has records: a plain property (decision 0122), its change on the audit trail.
    const tech = await signedIn("technician");
    expect(
      (await tech.post(`/api/systems/${plain}/leak-checks`, { checkedOn: "2026-04-20", leakFound: false })).status,
    ).toBe(201);
    const lead = await signedIn("lead-tech");
    expect((await lead.patch(`/api/systems/${plain}`, { hermeticallySealed: "yes" })).body.error.fields).toEqual({
      hermeticallySealed: "must be true or false",
    });
    const marked = await lead.patch(`/api/systems/${plain}`, { hermeticallySealed: true });
    expect(marked.status, JSON.stringify(marked.body)).toBe(200);
    const after = (await engineer.get(`/api/systems/${plain}/records`)).body;
    expect(after.nextInspection).toBeNull();
    expect(after.audit.map((a: { action: string; summary: string }) => [a.action, a.summary])).toEqual([
      [
        "system-hermetic-changed",
        "Deli counter (plug-in) marked hermetically sealed (factory-sealed, labelled as such)",
      ],
    ]);

    // The statement says so (the CSV too, on every row: see the retired bottle cooler below).
    const pdf = await engineer.agent
      .get(`/api/systems/${sealed}/leak-rate-statement.pdf`)
      .buffer(true)
      .parse(binaryBody);
    const text = (await pdfText(pdf.body as Buffer)).join(" ").replace(/\s+/g, " ");
    expect(text).toContain("hermetically sealed: yes (factory-sealed, labelled as such)");
    expect(text).toContain("hermetically sealed and below 10 t CO2e");
    expect(text).not.toContain("Next leak check");
  });

  it("does not exempt a hermetic unit of 10 t CO2e or more", async () => {
    // 3 kg × 3922 = 11.766 t: not below 10 t [S:E1], so every 12 months.
    const id = await newSystem({
      name: "Freezer island (plug-in)",
      fullCharge: { value: 3, unit: "kg" },
      hermeticallySealed: true,
      inServiceOn: "2025-06-15",
    });
    const rec = (await (await signedIn("engineer")).get(`/api/systems/${id}/records`)).body;
    expect(rec.leakCheck.appliedMonths).toBe(12);
    expect(rec.nextInspection.dueOn).toBe("2026-06-15");
  });
});

describe("the leak detection system's own check (2024/573 Art. 5, docs/reference/standards.md §2 [S:E2,E5])", () => {
  it("falls due a year after the in-service day, then a year after the last check that found it working; each check audited", async () => {
    // 150 kg R-404A × 3922 / 1000 = 588.3 t CO2e: ≥ 500 t, a leak detection system is mandatory [S:E2,E5],
    // leak checks every 6 months with it [S:E1].
    const id = await newSystem({
      name: "Rack 1 (medium temperature)",
      fullCharge: { value: 150, unit: "kg" },
      automaticLeakDetection: true,
      inServiceOn: "2025-09-15",
    });
    const engineer = await signedIn("engineer");
    let rec = (await engineer.get(`/api/systems/${id}/records`)).body;
    expect(rec.leakDetectionCheckOwed).toBe(true);
    expect(rec.leakCheck).toMatchObject({ appliedMonths: 6, ldsRequired: true });
    const due = () => rec.due.find((d: { kind: string }) => d.kind === "leak-detection-check");
    expect(due()).toMatchObject({
      dueOn: "2026-09-15",
      what: "Check of the leak detection system (at least every 12 months; in service since 15 Sept 2025)",
      link: `/systems/${id}#lds-checks`,
    });

    const tech = await signedIn("technician");
    const bad = await tech.post(`/api/systems/${id}/leak-detection-checks`, { checkedOn: "2026-03-01" });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toEqual({ working: "must be true or false" });
    const future = await tech.post(`/api/systems/${id}/leak-detection-checks`, {
      checkedOn: "2999-01-01",
      working: true,
    });
    expect(future.status).toBe(400);
    expect(future.body.error.fields.checkedOn).toMatch(/must not be after today/);
    const stranger = await signInOnceAs(other.people.technician);
    expect(
      (await stranger.post(`/api/systems/${id}/leak-detection-checks`, { checkedOn: "2026-03-01", working: true }))
        .status,
    ).toBe(404);
    expect(
      (
        await (
          await signedIn("store-contact")
        ).post(`/api/systems/${id}/leak-detection-checks`, {
          checkedOn: "2026-03-01",
          working: true,
        })
      ).status,
    ).toBe(403);

    const ok = await tech.post(`/api/systems/${id}/leak-detection-checks`, {
      checkedOn: "2026-03-01",
      working: true,
      note: "Sensors bump-tested, alarm relay tripped",
    });
    expect(ok.status).toBe(201);
    expect(
      (await tech.post(`/api/systems/${id}/leak-detection-checks`, { checkedOn: "2026-06-10", working: false })).status,
    ).toBe(201);
    rec = (await engineer.get(`/api/systems/${id}/records`)).body;
    // The clock runs from the check that found it working; the faulty one does not restart it.
    expect(due().dueOn).toBe("2027-03-01");
    expect(due().what).toContain("the check of 10 Jun 2026 found a fault");
    expect(
      rec.leakDetectionChecks.map((c: { checkedOn: string; working: boolean }) => [c.checkedOn, c.working]),
    ).toEqual([
      ["2026-03-01", true],
      ["2026-06-10", false],
    ]);
    expect(rec.audit.map((a: { action: string }) => a.action)).toEqual([
      "leak-detection-checked",
      "leak-detection-checked",
    ]);
    // A system with such a record is retired, never deleted.
    expect((await (await signedIn("lead-tech")).delete(`/api/systems/${id}`)).status).toBe(409);

    const csv = Papa.parse<Record<string, string>>((await engineer.get(`/api/systems/${id}/records.csv`)).text, {
      header: true,
    });
    expect(
      csv.data
        .filter((r) => r.record.startsWith("leak detection"))
        .map((r) => [r.date, r.record, r.reason, r.hermetically_sealed]),
    ).toEqual([
      ["2026-03-01", "leak detection system check (working)", "Sensors bump-tested, alarm relay tripped", "no"],
      ["2026-06-10", "leak detection system check (fault found)", "", "no"],
    ]);
    const pdf = await engineer.agent.get(`/api/systems/${id}/leak-rate-statement.pdf`).buffer(true).parse(binaryBody);
    const text = (await pdfText(pdf.body as Buffer)).join(" ").replace(/\s+/g, " ");
    expect(text).toContain("Checks of the leak detection system");
    expect(text).toContain("Sensors bump-tested, alarm relay tripped");
    expect(text).toContain("Check of the leak detection system (at least every 12 months");
  });

  it("is no record a US federal company keeps: Part 84 as we hold it states no such check", async () => {
    const id = await newSystem({ name: "Rack 2", fullCharge: { value: 150, unit: "kg" }, inServiceOn: "2025-09-15" });
    const owner = await signedIn("owner");
    expect((await owner.put("/api/company/settings", settings("us-federal"))).status).toBe(200);
    try {
      const res = await (await signedIn("technician")).post(`/api/systems/${id}/leak-detection-checks`, {
        checkedOn: "2026-03-01",
        working: true,
      });
      expect(res.status).toBe(400);
      expect(res.body.error.fields.checkedOn).toMatch(/sets no check of a leak detection system/);
      const rec = (await (await signedIn("engineer")).get(`/api/systems/${id}/records`)).body;
      expect(rec.leakDetectionCheckOwed).toBe(false);
      expect(rec.due.map((d: { kind: string }) => d.kind)).not.toContain("leak-detection-check");
    } finally {
      expect((await owner.put("/api/company/settings", settings("eu-fgas"))).status).toBe(200);
    }
  });
});

describe("a retired system's day and reason in its CSV and statement (decision 0124)", () => {
  it("lists the retirement as a row of the CSV and says it on the statement", async () => {
    const id = await newSystem({
      name: "Old bottle cooler (plug-in)",
      fullCharge: { value: 1.5, unit: "kg" },
      hermeticallySealed: true,
      inServiceOn: "2020-04-01",
    });
    await (await signedIn("technician")).post(`/api/systems/${id}/leak-checks`, {
      checkedOn: "2026-02-01",
      leakFound: false,
    });
    const retired = await (await signedIn("lead-tech")).post(`/api/systems/${id}/retire`, {
      retiredOn: "2026-03-31",
      reasonKind: "replaced",
      reason: "by Rack 1",
    });
    expect(retired.status, JSON.stringify(retired.body)).toBe(200);
    const engineer = await signedIn("engineer");
    const csv = Papa.parse<Record<string, string>>((await engineer.get(`/api/systems/${id}/records.csv`)).text, {
      header: true,
    });
    expect(
      csv.data.filter((r) => r.record === "system retired").map((r) => [r.date, r.reason, r.hermetically_sealed]),
    ).toEqual([["2026-03-31", "Replaced by another system: by Rack 1", "yes"]]);
    const pdf = await engineer.agent.get(`/api/systems/${id}/leak-rate-statement.pdf`).buffer(true).parse(binaryBody);
    const text = (await pdfText(pdf.body as Buffer)).join(" ").replace(/\s+/g, " ");
    // Kept 5 years from the day it left service (2024/573 Art. 7, docs/reference/standards.md §2 [S:E8b]).
    expect(text).toContain("Retired on 31 Mar 2026 (Replaced by another system: by Rack 1)");
    expect(text).toContain("kept at least until 31 Mar 2031");
  });
});

describe("the owner's archive holds the system's own facts (docs/decisions/0046, 0122–0124)", () => {
  it("lists every detection system check, and each system's hermetic mark, retirement day and reason", async () => {
    const owner = await signedIn("owner");
    const zip = await owner.agent.get("/api/company/records-archive.zip").buffer(true).parse(binaryBody);
    expect(zip.status).toBe(200);
    const files = await unzip(zip.body as Buffer);
    const table = (name: string) =>
      Papa.parse<Record<string, string>>(files.get(`tables/${name}`)!.toString("utf8"), { header: true }).data;
    expect(table("leak-detection-checks.csv").map((r) => [r.checked_on, r.working, r.note])).toEqual([
      ["2026-03-01", "true", "Sensors bump-tested, alarm relay tripped"],
      ["2026-06-10", "false", ""],
    ]);
    const cooler = table("systems.csv").find((r) => r.name === "Old bottle cooler (plug-in)")!;
    expect([cooler.hermetically_sealed, cooler.retired_on, cooler.retire_reason_kind, cooler.retire_reason]).toEqual([
      "true",
      "2026-03-31",
      "replaced",
      "by Rack 1",
    ]);
    // Nothing of another company's records.
    expect([...files.values()].map((f) => f.toString("latin1")).join("\n")).not.toContain("Dunmere Foods");
  });
});
