import Papa from "papaparse";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { agentFor, createTestApp, type Agent, type TestApp } from "../../../tests/helpers/test-app";
import { PASSWORD, seedCompany } from "../../../tests/helpers/fixtures";
import { pdfText } from "../../../tests/helpers/pdf-text";
import { companies, complianceAudit } from "../../db/schema/index";
import { binaryBody } from "../../../tests/helpers/binary-body";

// The statement and the records CSV show an auditor the system's dated revisions (why a figure uses
// the charge it uses, docs/decisions/0126) and its audit trail on the store's clock, the UTC instant
// kept in the CSV (docs/decisions/0125). The store keeps New York time (tests/helpers/fixtures.ts).
let t: TestApp;
let engineer: Agent;
let systemId: string;

beforeAll(async () => {
  t = await createTestApp();
  const co = await seedCompany(t.ctx, "Brackenfield Grocers");
  await t.ctx.db.update(companies).set({ massUnit: "lb" }).where(eq(companies.id, co.company.id));
  engineer = await agentFor(t.app);
  await engineer.post("/api/auth/sign-in", { email: co.people.engineer.email, password: PASSWORD });
  const owner = await agentFor(t.app);
  await owner.post("/api/auth/sign-in", { email: co.people.owner.email, password: PASSWORD });
  systemId = (
    await owner.post(`/api/stores/${co.store.id}/systems`, {
      name: "Rack E (dairy)",
      refrigerantId: "R-22",
      fullCharge: { value: 100, unit: "lb" },
      applianceType: "commercial-refrigeration",
      automaticLeakDetection: false,
      inServiceOn: "2015-04-01",
    })
  ).body.id;
  await engineer.post(`/api/systems/${systemId}/charge-additions`, {
    addedOn: "2026-01-10",
    amount: { value: 12, unit: "lb" },
    reason: "Top-up",
  });
  const retrofit = await engineer.post(`/api/systems/${systemId}/revisions`, {
    effectiveFrom: "2026-03-02",
    kind: "retrofit",
    reason: "R-22 phase-out",
    refrigerantId: "R-448A",
    fullCharge: { value: 180, unit: "lb" },
  });
  expect(retrofit.status, JSON.stringify(retrofit.body)).toBe(201);
}, 60_000);
afterAll(() => t.close());

describe("the statement's system history and audit trail", () => {
  it("lists each revision with its day, what it set, the reason and who recorded it", async () => {
    const res = await engineer.agent
      .get(`/api/systems/${systemId}/leak-rate-statement.pdf`)
      .buffer(true)
      .parse(binaryBody);
    expect(res.status).toBe(200);
    const text = (await pdfText(res.body as Buffer)).join(" ").replace(/\s+/g, " ");
    const history = text.slice(text.indexOf("System history"), text.indexOf("Rule profile"));
    // 100 lb = 45.36 kg, 180 lb = 81.65 kg (1 lb = 0.45359237 kg, NIST SP 811); lb first for an lb company.
    for (const words of [
      "1 Apr 2015",
      "first values",
      "refrigerant R-22",
      "100.0 lb (45.36 kg)",
      "2 Mar 2026",
      "retrofit",
      "refrigerant from R-22 to R-448A",
      "180.0 lb (81.65 kg)",
      "R-22 phase-out",
      "engineer of Brackenfield Grocers",
    ])
      expect(history, words).toContain(words);
    expect(history).not.toMatch(/\d{4}-\d\d-\d\d/);
  });

  it("prints the audit trail on the store's clock, its days as every other day", async () => {
    const [row] = await t.ctx.db.select().from(complianceAudit).where(eq(complianceAudit.systemId, systemId));
    const res = await engineer.agent
      .get(`/api/systems/${systemId}/leak-rate-statement.pdf`)
      .buffer(true)
      .parse(binaryBody);
    const text = (await pdfText(res.body as Buffer)).join(" ").replace(/\s+/g, " ");
    const trail = text.slice(text.indexOf("Audit trail"), text.indexOf("Record keeping"));
    expect(trail).toContain("When (store time)");
    expect(trail).toContain("Retrofit from 2 Mar 2026");
    // New York is UTC−5 in winter, UTC−4 in summer (IANA tz database): the zone is named, never UTC.
    expect(trail).toMatch(/\d{1,2} [A-Z][a-z]{2} \d{4}, \d\d:\d\d GMT-[45]/);
    expect(trail).not.toMatch(/UTC|\d{4}-\d\d-\d\d/);
    expect(row.action).toBe("system-revised");
  });

  it("gives the CSV a row per revision and per audit entry, the moment in store time and the instant in UTC", async () => {
    const res = await engineer.get(`/api/systems/${systemId}/records.csv`);
    const parsed = Papa.parse<Record<string, string>>(res.text, { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    const header = parsed.meta.fields!;
    expect(header).toContain("recorded_at_utc");
    expect(header.indexOf("full_charge_lb")).toBeLessThan(header.indexOf("full_charge_kg"));
    const revisions = parsed.data.filter((r) => r.record.startsWith("system revision"));
    expect(revisions.map((r) => [r.record, r.date, r.refrigerant, r.full_charge_lb, r.reason])).toEqual([
      ["system revision: first", "2015-04-01", "R-22", "100", expect.any(String)],
      ["system revision: retrofit", "2026-03-02", "R-448A", "180", "R-22 phase-out"],
    ]);
    expect(revisions[1].changed).toBe(
      "refrigerant from R-22 to R-448A; full charge from 100 lb (45.3592 kg) to 180 lb (81.6466 kg)",
    );
    expect(revisions[1].full_charge_kg).toBe("81.6466");

    const [row] = await t.ctx.db.select().from(complianceAudit).where(eq(complianceAudit.systemId, systemId));
    const audit = parsed.data.find((r) => r.record === "audit trail: system-revised")!;
    expect(audit.recorded_at_utc).toBe(row.at.toISOString());
    expect(audit.recorded_at).toMatch(/^\d{1,2} [A-Z][a-z]{2} \d{4}, \d\d:\d\d GMT-[45]$/);
    expect(audit.reason).toContain("Retrofit from 2 Mar 2026");
    // Every other row keeps its moment both ways too.
    const charge = parsed.data.find((r) => r.record === "charge added")!;
    expect(charge.recorded_at_utc).toMatch(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}Z$/);
    expect(charge.recorded_at).toMatch(/GMT-[45]$/);
  });
});

describe("the statement's list of refrigerant added", () => {
  it("lists every entry, and says which the leak rate does not count (the fill after a retrofit, 40 CFR 82.157)", async () => {
    const fill = await engineer.post(`/api/systems/${systemId}/charge-additions`, {
      addedOn: "2026-03-02",
      amount: { value: 165, unit: "lb" },
      reason: "Retrofit fill",
      excluded: "retrofit",
    });
    expect(fill.status, JSON.stringify(fill.body)).toBe(201);
    const res = await engineer.agent
      .get(`/api/systems/${systemId}/leak-rate-statement.pdf`)
      .buffer(true)
      .parse(binaryBody);
    const text = (await pdfText(res.body as Buffer)).join(" ").replace(/\s+/g, " ");
    const added = text.slice(text.indexOf("Refrigerant added"), text.indexOf("Leak rate at every addition"));
    // 12 lb = 5.44 kg and 165 lb = 74.84 kg (NIST SP 811).
    expect(added).toMatch(/10 Jan 2026 12\.0 lb \(5\.44 kg\) .*Top-up counted/);
    expect(added).toMatch(/2 Mar 2026 165\.0 lb \(74\.84 kg\) .*Retrofit fill not counted: fill after a retrofit/);
  });
});
