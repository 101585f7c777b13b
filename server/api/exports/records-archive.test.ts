import Papa from "papaparse";
import { and, eq, inArray } from "drizzle-orm";
import { unzip } from "../../../tests/helpers/unzip";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTestApp, type Agent, type TestApp } from "../../../tests/helpers/test-app";
import { companyFixture, type CompanyFixture } from "../../../tests/helpers/security-fixtures";
import { pdfText } from "../../../tests/helpers/pdf-text";
import {
  chargeAdditions,
  complianceAudit,
  findingEvents,
  findings,
  leakChecks,
  readings,
  securityEvents,
  sweeps,
  systemRevisions,
  systems,
} from "../../db/schema/index";
import { binaryBody } from "../../../tests/helpers/binary-body";

let t: TestApp;
let a: CompanyFixture;
let b: CompanyFixture;

const csvRows = (files: Map<string, Buffer>, name: string) => {
  const parsed = Papa.parse<Record<string, string>>(files.get(`tables/${name}`)!.toString("utf8"), {
    header: true,
    skipEmptyLines: true,
  });
  expect(parsed.errors).toEqual([]);
  return parsed.data;
};

async function download(agent: Agent) {
  return agent.agent.get("/api/company/records-archive.zip").buffer(true).parse(binaryBody);
}

/** The fixture's stores keep New York time. */
const storeToday = () => new Intl.DateTimeFormat("sv-SE", { timeZone: "America/New_York" }).format(new Date());

async function recordsFor(f: CompanyFixture) {
  const { owner, engineer, technician } = f.agents;
  const system = f.main.system;
  await technician.post(`/api/systems/${system}/charge-additions`, {
    amount: { value: 10, unit: "lb" },
    reason: "=SUM(A1) top-up", // a formula-like reason is written as text (decision 0025)
  });
  await technician.post(`/api/systems/${system}/leak-checks`, { leakFound: false });
  for (const step of [{ action: "confirm", component: "flare" }, { action: "repair" }]) {
    const res = await technician.post(`/api/findings/${f.main.finding}/events`, step);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
  }
  await engineer.post(`/api/systems/${system}/revisions`, {
    effectiveFrom: storeToday(),
    kind: "change",
    reason: "Receiver added",
    fullCharge: { value: 320, unit: "kg" },
  });
  await owner.post(`/api/sweeps/${f.main.sweep}/submit`, {});
  const { readings: listed } = (await owner.get("/api/compliance/readings")).body;
  expect((await owner.post("/api/compliance/readings/accept", { text: listed[0].text })).status).toBe(200);
  // The other store's system has a record, so it is retired, not deleted: its records stay in the archive.
  await technician.post(`/api/systems/${f.other.system}/charge-additions`, {
    amount: { value: 2, unit: "kg" },
    reason: "Top-up",
  });
  const removed = await owner.post(`/api/systems/${f.other.system}/retire`, {
    retiredOn: storeToday(),
    reasonKind: "store-closed",
  });
  expect(removed.body.outcome, JSON.stringify(removed.body)).toBe("retired");
}

beforeAll(async () => {
  t = await createTestApp();
  a = await companyFixture(t, "Fernbrook Grocers");
  b = await companyFixture(t, "Quillon Markets");
  await recordsFor(a);
  await recordsFor(b);
}, 180_000);
afterAll(() => t.close());

describe("the owner's record archive", () => {
  it("holds every table of the company's records, read back equal to the database, and nothing of another company", {
    timeout: 180_000,
  }, async () => {
    const res = await download(a.agents.owner);
    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toBe("application/zip");
    expect(res.headers["content-disposition"]).toMatch(
      /attachment; filename="plumeline-records-\d{4}-\d{2}-\d{2}\.zip"/,
    );
    const files = await unzip(res.body as Buffer);
    const co = a.co.company.id;

    // Systems, retired ones included, with their revisions.
    const sysRows = await t.ctx.db.select().from(systems).where(eq(systems.companyId, co));
    const sysCsv = csvRows(files, "systems.csv");
    expect(sysCsv.map((r) => r.id).sort()).toEqual(sysRows.map((r) => r.id).sort());
    const retired = sysCsv.find((r) => r.id === a.other.system)!;
    expect(retired.retired_at_utc).toBe(sysRows.find((r) => r.id === a.other.system)!.retiredAt!.toISOString());
    const revs = await t.ctx.db.select().from(systemRevisions).where(eq(systemRevisions.companyId, co));
    const revCsv = csvRows(files, "system-revisions.csv");
    expect(revCsv.map((r) => r.id).sort()).toEqual(revs.map((r) => r.id).sort());
    const change = revCsv.find((r) => r.reason === "Receiver added")!;
    expect(change).toMatchObject({ effective_from: storeToday(), kind: "change", full_charge_kg: "320" });

    // Charge added: 10 lb is 4.5359237 kg (NIST SP 811, appendix B.8), written unrounded as stored.
    const adds = await t.ctx.db.select().from(chargeAdditions).where(eq(chargeAdditions.companyId, co));
    const addCsv = csvRows(files, "charge-added.csv");
    expect(addCsv.map((r) => r.id).sort()).toEqual(adds.map((r) => r.id).sort());
    const tenLb = addCsv.find((r) => r.system_id === a.main.system)!;
    expect(Number(tenLb.amount_kg)).toBe(10 * 0.45359237);
    expect(tenLb.reason).toBe("'=SUM(A1) top-up");

    const checks = await t.ctx.db.select().from(leakChecks).where(eq(leakChecks.companyId, co));
    expect(csvRows(files, "leak-checks.csv").map((r) => r.id)).toEqual(checks.map((r) => r.id));

    const fRows = await t.ctx.db.select().from(findings).where(eq(findings.companyId, co));
    expect(
      csvRows(files, "findings.csv")
        .map((r) => r.id)
        .sort(),
    ).toEqual(fRows.map((r) => r.id).sort());
    const steps = await t.ctx.db
      .select()
      .from(findingEvents)
      .where(
        inArray(
          findingEvents.findingId,
          fRows.map((r) => r.id),
        ),
      );
    const stepCsv = csvRows(files, "finding-steps.csv");
    expect(stepCsv.map((r) => r.id).sort()).toEqual(steps.map((r) => r.id).sort());
    expect(stepCsv.filter((r) => r.finding_id === a.main.finding).map((r) => r.kind)).toEqual([
      "found",
      "confirmed",
      "repaired",
    ]);

    const audit = await t.ctx.db.select().from(complianceAudit).where(eq(complianceAudit.companyId, co));
    const auditCsv = csvRows(files, "compliance-audit.csv");
    expect(auditCsv.map((r) => r.id).sort()).toEqual(audit.map((r) => r.id).sort());
    expect(auditCsv.map((r) => r.action).sort()).toEqual(["reading-accepted", "system-retired", "system-revised"]);
    expect(csvRows(files, "chronic-leaker-filings.csv")).toEqual([]);
    const [accepted] = csvRows(files, "rule-readings-accepted.csv");
    expect(accepted).toMatchObject({ profile_id: "us-federal", by_id: a.co.people.owner.userId });

    const sw = await t.ctx.db.select().from(sweeps).where(eq(sweeps.companyId, co));
    expect(
      csvRows(files, "sweeps.csv")
        .map((r) => r.id)
        .sort(),
    ).toEqual(sw.map((r) => r.id).sort());
    const rd = await t.ctx.db.select().from(readings).where(eq(readings.sweepId, a.main.sweep));
    const rdCsv = csvRows(files, "readings.csv").filter((r) => r.sweep_id === a.main.sweep);
    expect(rdCsv.map((r) => [r.id, Number(r.ppm), r.taken_at_utc])).toEqual(
      rd.map((r) => [r.id, r.ppm, r.takenAt.toISOString()]),
    );

    // A statement per system (the retired one too) and the submitted sweep's report.
    const names = [...files.keys()];
    expect(names.filter((n) => n.startsWith("statements/"))).toHaveLength(sysRows.length);
    expect(names.filter((n) => n.startsWith("sweep-reports/"))).toHaveLength(1);
    const statement = names.find((n) => n.startsWith("statements/") && n.includes(a.other.system.slice(0, 8)))!;
    const text = (await pdfText(files.get(statement)!)).join(" ");
    expect(text).toContain(sysRows.find((r) => r.id === a.other.system)!.name);
    expect(files.get("README.txt")!.toString("utf8")).toContain("tables/systems.csv (2 rows)");

    // Nothing of the other company, in any CSV or the readme.
    const plain = names.filter((n) => n.endsWith(".csv") || n.endsWith(".txt"));
    for (const n of plain) {
      const body = files.get(n)!.toString("utf8");
      for (const s of b.secrets) expect(body.includes(s), `${n} holds ${s}`).toBe(false);
    }
  });

  it("is written to the security log as an export", async () => {
    const rows = await t.ctx.db
      .select()
      .from(securityEvents)
      .where(and(eq(securityEvents.companyId, a.co.company.id), eq(securityEvents.kind, "export")));
    expect(rows.map((r) => (r.detail as { what?: string }).what)).toContain("records-archive.zip");
  });

  it("is for the owner only", async () => {
    for (const role of ["lead-tech", "engineer", "technician", "store-contact"] as const) {
      const res = await a.agents[role].get("/api/company/records-archive.zip");
      expect(res.status, role).toBe(403);
    }
  });
});
