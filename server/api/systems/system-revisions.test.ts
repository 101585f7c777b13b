import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { companies } from "../../db/schema/index";
import { createTestApp, type Agent, type TestApp, signInOnce } from "../../../tests/helpers/test-app";
import { seedCompany } from "../../../tests/helpers/fixtures";
import type { Role } from "#core/domain/roles";

let t: TestApp;
let co: Awaited<ReturnType<typeof seedCompany>>;
const signInOnceAs = signInOnce(() => t.app);

beforeAll(async () => {
  t = await createTestApp();
  co = await seedCompany(t.ctx, "Hollybrook Provisions");
});
afterAll(() => t.close());

const signedIn = (role: Role): Promise<Agent> => signInOnceAs(co.people[role]);
const lb = (value: number) => ({ value, unit: "lb" });

describe("dated revisions of a system (docs/decisions/0043-system-revisions.md)", () => {
  let id: string;

  beforeAll(async () => {
    const lead = await signedIn("lead-tech");
    const res = await lead.post(`/api/stores/${co.store.id}/systems`, {
      name: "Rack J (R-22)",
      refrigerantId: "R-22",
      fullCharge: lb(100),
      applianceType: "commercial-refrigeration",
      automaticLeakDetection: false,
      inServiceOn: "2015-04-01",
    });
    expect(res.status).toBe(201);
    expect(res.body.inServiceOn).toBe("2015-04-01");
    id = res.body.id;
    const tech = await signedIn("technician");
    for (const [addedOn, pounds, excluded] of [
      ["2025-06-01", 5, undefined],
      ["2025-09-01", 10, undefined],
    ] as const) {
      const r = await tech.post(`/api/systems/${id}/charge-additions`, {
        addedOn,
        amount: lb(pounds),
        reason: "Top-up",
        ...(excluded ? { excluded } : {}),
      });
      expect(r.status).toBe(201);
    }
  });

  it("refuses to rewrite the dated facts of a system with records by a plain edit", async () => {
    const lead = await signedIn("lead-tech");
    const r = await lead.patch(`/api/systems/${id}`, { fullCharge: lb(200) });
    expect(r.status).toBe(409);
    expect(r.body.error.fields).toEqual({ fullChargeKg: "changes by a dated revision once the system has records" });
    // The name is not a dated fact.
    expect((await lead.patch(`/api/systems/${id}`, { name: "Rack J" })).status).toBe(200);
  });

  it("records a retrofit by an engineer; past Part 82 figures stay Part 82, audited", async () => {
    const body = {
      effectiveFrom: "2026-05-01",
      kind: "retrofit",
      reason: "Converted to R-448A",
      refrigerantId: "R-448A",
    };
    expect((await (await signedIn("lead-tech")).post(`/api/systems/${id}/revisions`, body)).status).toBe(403);
    const engineer = await signedIn("engineer");
    const same = await engineer.post(`/api/systems/${id}/revisions`, { ...body, refrigerantId: "R-22" });
    expect(same.status).toBe(400);
    expect(Object.keys(same.body.error.fields)).toEqual(["refrigerantId"]);
    const noReason = await engineer.post(`/api/systems/${id}/revisions`, { ...body, reason: "" });
    expect(noReason.body.error.fields).toEqual({ reason: "is required" });

    const done = await engineer.post(`/api/systems/${id}/revisions`, { ...body, fullCharge: lb(90) });
    expect(done.status).toBe(201);
    expect(done.body).toMatchObject({ refrigerantId: "R-448A", inServiceOn: "2015-04-01" });
    expect(done.body.fullChargeKg).toBeCloseTo(90 * 0.45359237, 9);

    const tech = await signedIn("technician");
    await tech.post(`/api/systems/${id}/charge-additions`, {
      addedOn: "2026-05-01",
      amount: lb(90),
      reason: "Retrofit fill",
      excluded: "retrofit",
    });
    const rec = (
      await tech.post(`/api/systems/${id}/charge-additions`, { addedOn: "2026-07-01", amount: lb(5), reason: "Top-up" })
    ).body.records;
    // 10/100 ÷ (92/365) × 100 = 39.67 % on R-22 under 40 CFR 82 subpart F [S:R1] stays so after the retrofit;
    // 5/90 ÷ (61/365) × 100 = 33.24 % on R-448A under 40 CFR 84 subpart C [S:R4], days counted from the fill.
    expect(
      rec.leakRates.map((p: { partId: string; percent: number }) => [p.partId, Number(p.percent.toFixed(2))]),
    ).toEqual([
      ["40-cfr-82-subpart-f", 5],
      ["40-cfr-82-subpart-f", 39.67],
      ["40-cfr-84-subpart-c", 33.24],
    ]);
    // The Part 82 breach ended with the retrofit; the Part 84 one is due 1 Jul + 30 days = 31 Jul [S:R4].
    expect(rec.due.filter((d: { kind: string }) => d.kind === "repair").map((d: { dueOn: string }) => d.dueOn)).toEqual(
      ["2026-07-31"],
    );
    expect(rec.audit.map((a: { action: string }) => a.action)).toContain("system-revised");
    expect(rec.audit.find((a: { action: string }) => a.action === "system-revised").summary).toMatch(
      /^Retrofit from 2026-05-01: refrigerant R-22 → R-448A, full charge 45\.36 kg \(100\.0 lb\) → 40\.82 kg \(90\.0 lb\); reason: Converted/,
    );

    const list = await tech.get(`/api/systems/${id}/revisions`);
    expect(list.body.revisions.map((r: { kind: string; refrigerantId: string }) => [r.kind, r.refrigerantId])).toEqual([
      ["first", "R-22"],
      ["retrofit", "R-448A"],
    ]);
    expect(list.body.revisions[1].by).toBe("engineer of Hollybrook Provisions");
  });

  it("writes the audit's masses in both units, the company's first, in its number format", async () => {
    await t.ctx.db
      .update(companies)
      .set({ massUnit: "lb", numberFormat: "1.234,5" })
      .where(eq(companies.id, co.company.id));
    const engineer = await signedIn("engineer");
    const r = await engineer.post(`/api/systems/${id}/revisions`, {
      effectiveFrom: "2026-08-01",
      kind: "change",
      reason: "Larger receiver fitted",
      fullCharge: lb(1500),
    });
    expect(r.status, JSON.stringify(r.body)).toBe(201);
    const audit = (await engineer.get(`/api/systems/${id}/records`)).body.audit as { summary: string }[];
    // 1 lb = 0.45359237 kg exactly (NIST SP 811, appendix B): 90 lb = 40.82 kg, 1,500 lb = 680.39 kg.
    // (Days stay ISO in the stored words; the records page and the PDF write them readably.)
    expect(audit.map((a) => a.summary)).toContain(
      "Change from 2026-08-01: full charge 90,0 lb (40,82 kg) → 1.500,0 lb (680,39 kg); reason: Larger receiver fitted",
    );
  });

  it("lets the facts change freely before any record, as a correction from the in-service day", async () => {
    const lead = await signedIn("lead-tech");
    const s = await lead.post(`/api/stores/${co.store.id}/systems`, {
      name: "Spare unit",
      refrigerantId: "R-404A",
      fullCharge: lb(30),
      applianceType: "commercial-refrigeration",
      automaticLeakDetection: false,
    });
    expect((await lead.patch(`/api/systems/${s.body.id}`, { fullCharge: lb(40) })).status).toBe(200);
    const list = (await lead.get(`/api/systems/${s.body.id}/revisions`)).body.revisions;
    expect(list.map((r: { kind: string }) => r.kind)).toEqual(["first", "correction"]);
    expect(
      (await lead.patch(`/api/systems/${s.body.id}`, { inServiceOn: "2999-01-01" })).body.error.fields,
    ).toMatchObject({
      inServiceOn: expect.stringMatching(/must not be after today/),
    });
  });
});
