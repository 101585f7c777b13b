import { and, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { complianceAudit, readingAcceptances } from "../../db/schema/index";
import { createTestApp, type TestApp, signIn } from "../../../tests/helpers/test-app";
import { seedCompany } from "../../../tests/helpers/fixtures";
import { pdfText } from "../../../tests/helpers/pdf-text";
import { binaryBody } from "../../../tests/helpers/binary-body";

let t: TestApp;
let co: Awaited<ReturnType<typeof seedCompany>>;

beforeAll(async () => {
  t = await createTestApp();
  co = await seedCompany(t.ctx, "Fernhollow Market");
});
afterAll(() => t.close());

describe("research notes never reach a customer (docs/decisions/0044-readings-and-research-notes.md)", () => {
  it("lists the profile's readings once and prints only citations and the 'reading' marker", async () => {
    const tech = await signIn(t.app, co.people.technician);
    const r = await tech.get("/api/compliance/readings");
    expect(r.status).toBe(200);
    expect(r.body.profileName).toMatch(/US federal/);
    const texts = r.body.readings.map((x: { text: string }) => x.text);
    // Follow-up verification within 10 days is [M] in docs/reference/standards.md §1: a reading.
    expect(texts.some((x: string) => /follow-up verification within 10 days/.test(x))).toBe(true);
    expect(new Set(texts).size).toBe(texts.length);

    const lead = await signIn(t.app, co.people["lead-tech"]);
    const sys = await lead.post(`/api/stores/${co.store.id}/systems`, {
      name: "Rack K",
      refrigerantId: "R-404A",
      fullCharge: { value: 100, unit: "lb" },
      applianceType: "commercial-refrigeration",
      automaticLeakDetection: false,
    });
    await tech.post(`/api/systems/${sys.body.id}/charge-additions`, {
      addedOn: "2026-03-01",
      amount: { value: 30, unit: "lb" },
      reason: "Top-up",
    });
    const rec = (await tech.get(`/api/systems/${sys.body.id}/records`)).body;
    const pdf = await tech.agent
      .get(`/api/systems/${sys.body.id}/leak-rate-statement.pdf`)
      .buffer(true)
      .parse(binaryBody);
    const text = (await pdfText(pdf.body as Buffer)).join(" ").replace(/\s+/g, " ");
    for (const out of [text, JSON.stringify(rec.due)])
      expect(out).not.toMatch(/from memory|study guide|ACHR|magazine|Legal Register|not yet confirmed/i);
    expect(text).toContain("“reading”: how the product applies a rule whose text it has not confirmed");
  });
});

describe("accepting a reading (docs/decisions/0048-accepting-readings.md)", () => {
  it("records who accepted which words and when, once, in the compliance audit trail", async () => {
    const owner = await signIn(t.app, co.people.owner);
    const before = (await owner.get("/api/compliance/readings")).body;
    expect(before.profileId).toBe("us-federal");
    expect(before.readings.every((r: { accepted: unknown }) => r.accepted === null)).toBe(true);
    // The repair clock from the first exceedance is the product's reading of 40 CFR 82.157(d) /
    // 84.106 (docs/reference/standards.md §1; docs/decisions/0041-repair-clock.md).
    const clock = before.readings.find((r: { text: string }) => /first leak rate above the threshold/.test(r.text));
    const res = await owner.post("/api/compliance/readings/accept", { text: clock.text, note: "Agreed with counsel" });
    expect(res.status).toBe(200);
    const accepted = res.body.readings.find((r: { text: string }) => r.text === clock.text).accepted;
    expect(accepted).toMatchObject({ by: "owner of Fernhollow Market", note: "Agreed with counsel" });
    expect(Date.now() - Date.parse(accepted.at)).toBeLessThan(60_000);
    expect(res.body.readings.filter((r: { accepted: unknown }) => r.accepted).length).toBe(1);

    // Again: nothing new, the first acceptance stands.
    const again = await owner.post("/api/compliance/readings/accept", { text: clock.text, note: "twice" });
    expect(again.body.readings.find((r: { text: string }) => r.text === clock.text).accepted).toEqual(accepted);
    const audit = await t.ctx.db
      .select()
      .from(complianceAudit)
      .where(and(eq(complianceAudit.companyId, co.company.id), eq(complianceAudit.action, "reading-accepted")));
    expect(audit).toHaveLength(1);
    expect(audit[0].summary).toContain(clock.text);

    // Everyone sees the acceptance; another company's list is untouched.
    const tech = await signIn(t.app, co.people.technician);
    const seen = (await tech.get("/api/compliance/readings")).body.readings;
    expect(seen.find((r: { text: string }) => r.text === clock.text).accepted.by).toBe("owner of Fernhollow Market");
    const other = await seedCompany(t.ctx, "Wrenfield Foods");
    const stranger = await signIn(t.app, other.people.owner);
    const theirs = (await stranger.get("/api/compliance/readings")).body.readings;
    expect(theirs.every((r: { accepted: unknown }) => r.accepted === null)).toBe(true);
  });

  it("refuses words that are not listed now, naming the field, and is the owner's to give", async () => {
    const owner = await signIn(t.app, co.people.owner);
    const res = await owner.post("/api/compliance/readings/accept", { text: "Leaks may be ignored." });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.text).toMatch(/is not a reading of US federal/);
    const { readings } = (await owner.get("/api/compliance/readings")).body;
    const engineer = await signIn(t.app, co.people.engineer);
    expect((await engineer.post("/api/compliance/readings/accept", { text: readings[0].text })).status).toBe(403);
  });
});

describe("withdrawing an acceptance (docs/decisions/0048-accepting-readings.md)", () => {
  it("keeps the acceptance and the withdrawal in the history, audits both, and lets the owner accept again", async () => {
    const co2 = await seedCompany(t.ctx, "Alderbrook Pantry");
    const owner = await signIn(t.app, co2.people.owner);
    const { readings } = (await owner.get("/api/compliance/readings")).body;
    // The same-leak grouping is the product's reading of "multiple additions for the same leak count
    // together", [M] in docs/reference/standards.md §1 (docs/decisions/0042-same-leak-additions.md).
    const same = readings.find((r: { text: string }) => /for the same leak/.test(r.text));
    await owner.post("/api/compliance/readings/accept", { text: same.text, note: "" });

    const res = await owner.post("/api/compliance/readings/withdraw", {
      text: same.text,
      reason: "Counsel reads visits on different days as separate leaks",
    });
    expect(res.status).toBe(200);
    const after = res.body.readings.find((r: { text: string }) => r.text === same.text);
    expect(after.accepted).toBeNull();
    expect(after.history.map((h: { kind: string }) => h.kind)).toEqual(["accepted", "withdrawn"]);
    expect(after.history[1]).toMatchObject({
      by: "owner of Alderbrook Pantry",
      note: "Counsel reads visits on different days as separate leaks",
    });

    // Nothing to withdraw now: a field error, and nothing written.
    const twice = await owner.post("/api/compliance/readings/withdraw", { text: same.text, reason: "again" });
    expect(twice.status).toBe(400);
    expect(twice.body.error.fields.text).toMatch(/is not accepted now/);

    // Accepted again: a new acceptance; the history keeps all three.
    const again = await owner.post("/api/compliance/readings/accept", { text: same.text, note: "Reconsidered" });
    const last = again.body.readings.find((r: { text: string }) => r.text === same.text);
    expect(last.accepted).toMatchObject({ note: "Reconsidered" });
    expect(last.history.map((h: { kind: string }) => h.kind)).toEqual(["accepted", "withdrawn", "accepted"]);

    const audit = await t.ctx.db
      .select()
      .from(complianceAudit)
      .where(eq(complianceAudit.companyId, co2.company.id))
      .orderBy(complianceAudit.at);
    expect(audit.map((a) => a.action)).toEqual(["reading-accepted", "reading-withdrawn", "reading-accepted"]);
    expect(audit[1].summary).toContain("Counsel reads visits on different days as separate leaks");
    const rows = await t.ctx.db
      .select()
      .from(readingAcceptances)
      .where(eq(readingAcceptances.companyId, co2.company.id));
    expect(rows).toHaveLength(2);
  });

  it("needs a reason and a listed reading, is the owner's alone, and never reaches another company", async () => {
    const co3 = await seedCompany(t.ctx, "Quillon Greens");
    const owner = await signIn(t.app, co3.people.owner);
    const { readings } = (await owner.get("/api/compliance/readings")).body;
    await owner.post("/api/compliance/readings/accept", { text: readings[0].text });
    const noReason = await owner.post("/api/compliance/readings/withdraw", { text: readings[0].text, reason: " " });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error.fields.reason).toBe("is required");
    const unlisted = await owner.post("/api/compliance/readings/withdraw", {
      text: "Leaks may be ignored.",
      reason: "x",
    });
    expect(unlisted.body.error.fields.text).toMatch(/is not a reading of US federal/);
    for (const role of ["engineer", "lead-tech", "technician"] as const) {
      const a = await signIn(t.app, co3.people[role]);
      const r = await a.post("/api/compliance/readings/withdraw", { text: readings[0].text, reason: "no" });
      expect(r.status, role).toBe(403);
    }
    // Another company's owner withdrawing the same words touches only their own (nothing accepted there).
    const stranger = await signIn(t.app, (await seedCompany(t.ctx, "Tarnfield Foods")).people.owner);
    const theirs = await stranger.post("/api/compliance/readings/withdraw", { text: readings[0].text, reason: "no" });
    expect(theirs.status).toBe(400);
    const mine = (await owner.get("/api/compliance/readings")).body.readings[0];
    expect(mine.accepted).not.toBeNull();
    expect(mine.history).toHaveLength(1);
  });
});

describe("a printed statement says whether each reading is accepted (docs/decisions/0048-accepting-readings.md)", () => {
  it("prints 'reading, accepted' after the owner accepts and 'reading, not accepted' after the withdrawal", async () => {
    const co3 = await seedCompany(t.ctx, "Brackenmoor Grocers");
    const owner = await signIn(t.app, co3.people.owner);
    const lead = await signIn(t.app, co3.people["lead-tech"]);
    const sys = await lead.post(`/api/stores/${co3.store.id}/systems`, {
      name: "Rack Q",
      refrigerantId: "R-404A",
      fullCharge: { value: 100, unit: "lb" },
      applianceType: "commercial-refrigeration",
      automaticLeakDetection: false,
    });
    // 30 lb into a 100 lb system: far above 40 CFR 84.106's threshold, so repair and verification steps fall due.
    await lead.post(`/api/systems/${sys.body.id}/charge-additions`, {
      addedOn: "2026-03-01",
      amount: { value: 30, unit: "lb" },
      reason: "Top-up",
    });
    const statement = async () => {
      const pdf = await owner.agent
        .get(`/api/systems/${sys.body.id}/leak-rate-statement.pdf`)
        .buffer(true)
        .parse(binaryBody);
      return (await pdfText(pdf.body as Buffer)).join(" ").replace(/\s+/g, " ");
    };
    const before = await statement();
    expect(before).toMatch(/reading, not accepted/);
    expect(before).not.toMatch(/reading, accepted/);

    const { readings } = (await owner.get("/api/compliance/readings")).body;
    for (const r of readings as { text: string }[])
      await owner.post("/api/compliance/readings/accept", { text: r.text, note: "" });
    const accepted = await statement();
    expect(accepted).toMatch(/reading, accepted/);
    expect(accepted).not.toMatch(/reading, not accepted/);

    for (const r of readings as { text: string }[])
      await owner.post("/api/compliance/readings/withdraw", { text: r.text, reason: "Under review" });
    const withdrawn = await statement();
    expect(withdrawn).toMatch(/reading, not accepted/);
    expect(withdrawn).not.toMatch(/reading, accepted/);
  });
});
