import { afterAll, beforeAll, describe, expect, it } from "vitest";
import Papa from "papaparse";
import { PDFDocument } from "pdf-lib";
import { eq } from "drizzle-orm";
import { agentFor, createTestApp, drainMail, type Agent, type TestApp } from "../../../tests/helpers/test-app";
import { PASSWORD, seedCompany } from "../../../tests/helpers/fixtures";
import { pdfText } from "../../../tests/helpers/pdf-text";
import { caseLineFixtures, caseWalkReadings } from "../../../tests/helpers/sweep-walk";
import { detectors, outboxMessages, reportSends, users } from "../../db/schema/index";
import type { Role } from "#core/domain/roles";

let t: TestApp;
let co: Awaited<ReturnType<typeof seedCompany>>;
let sweepId: string;
let readings: Record<string, unknown>[];
const caseId = crypto.randomUUID();
const dropId = crypto.randomUUID();
const startedAt = new Date(Date.now() - 40 * 60_000);

async function as(role: Role): Promise<Agent> {
  const a = await agentFor(t.app);
  await a.post("/api/auth/sign-in", { email: co.people[role].email, password: PASSWORD });
  return a;
}

/** supertest collects binary bodies as Buffers with this parser. */
const binary = (
  res: NodeJS.ReadableStream & { setEncoding(e: string): void; on: Function },
  cb: (e: Error | null, b: Buffer) => void,
) => {
  const chunks: Buffer[] = [];
  res.on("data", (c: Buffer) => chunks.push(c));
  res.on("end", () => cb(null, Buffer.concat(chunks)));
};

beforeAll(async () => {
  t = await createTestApp();
  co = await seedCompany(t.ctx, "Ćwikła & Sons Grocers");
  const owner = await as("owner");
  const plan = await owner.post(`/api/stores/${co.store.id}/plans/blank`, { width: 30, depth: 12, unit: "m" });
  const put = await owner.put(`/api/plans/${plan.body.id}/fixtures`, {
    layoutRevision: plan.body.layoutRevision,
    fixtures: caseLineFixtures(caseId, dropId),
  });
  expect(put.status).toBe(200);
  const [d] = await t.ctx.db
    .insert(detectors)
    .values({
      companyId: co.company.id,
      name: "Diode sniffer",
      principle: "heated-diode",
      lastCheckedOn: new Date().toISOString().slice(0, 10),
    })
    .returning();
  const tech = await as("technician");
  const s = await tech.post(`/api/stores/${co.store.id}/sweeps`, {
    id: crypto.randomUUID(),
    planId: plan.body.id,
    detectorId: d.id,
    fans: "stopped",
    defrost: false,
    startedAt: startedAt.toISOString(),
  });
  sweepId = s.body.id;
  readings = caseWalkReadings(startedAt);
  expect((await tech.post(`/api/sweeps/${sweepId}/readings`, { readings })).body.rejected).toEqual([]);
});
afterAll(async () => {
  await t.ctx.analysisRunner?.close();
  await t.close();
});

describe("sweep report PDF", () => {
  it("is a valid PDF holding the store name and the top suspect spot", async () => {
    const eng = await as("engineer");
    const analysis = await eng.get(`/api/sweeps/${sweepId}/analysis`);
    const top = analysis.body.candidates[0];
    expect(top.fixtureId).toBe(caseId);
    const res = await eng.agent
      .get(`/api/sweeps/${sweepId}/report.pdf`)
      .buffer(true)
      .parse(binary as never);
    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toMatch(/application\/pdf/);
    expect(res.headers["content-disposition"]).toMatch(/attachment; filename="sweep-.*\.pdf"/);
    const bytes = res.body as Buffer;
    // parsed back by a general-purpose PDF library (pdf-lib)
    const doc = await PDFDocument.load(bytes);
    expect(doc.getPageCount()).toBeGreaterThanOrEqual(2);
    expect(doc.getTitle()).toBe(`Sweep report — ${co.store.name}`);
    // the text as a viewer extracts it (ToUnicode CMaps, ISO 32000-1 §9.10): the store's accented name
    // prints (full TTF embedded), and the top suspect is listed first with its fixture and score
    const text = (await pdfText(bytes)).join("\n");
    expect(text).toContain(co.store.name);
    expect(text).toContain(`1. Dairy 1–4 — at `);
    expect(text).toContain(`score ${top.score.toFixed(2)}`);
    expect(text).toContain(top.nextCheck.slice(0, 30));
    expect(text).toMatch(/Readings \(\d+\)/);
    // Atkinson Hyperlegible embedded, not a standard-14 font
    expect(bytes.toString("latin1")).toMatch(/\/FontFile2/);
    expect(bytes.toString("latin1")).toMatch(/AtkinsonHyperlegible/);
  });

  it("is readable by the store contact of this store only", async () => {
    expect((await (await as("store-contact")).agent.get(`/api/sweeps/${sweepId}/report.pdf`)).status).toBe(200);
    const otherStore = await (await as("owner")).post(`/api/stores/${co.otherStore.id}/plans/blank`, {
      width: 10,
      depth: 10,
      unit: "m",
    });
    const [d] = await t.ctx.db.select().from(detectors).where(eq(detectors.companyId, co.company.id));
    const s2 = await (await as("technician")).post(`/api/stores/${co.otherStore.id}/sweeps`, {
      id: crypto.randomUUID(),
      planId: otherStore.body.id,
      detectorId: d.id,
      fans: "running",
      defrost: false,
      startedAt: startedAt.toISOString(),
    });
    const contact = await as("store-contact");
    expect((await contact.agent.get(`/api/sweeps/${s2.body.id}/report.pdf`)).status).toBe(404);
    // The readings behind a report are the service team's evidence, not the store's (decision 0072).
    expect((await contact.agent.get(`/api/sweeps/${sweepId}/readings.csv`)).status).toBe(403);
  });
});

describe("readings CSV", () => {
  it("round-trips through papaparse with raw and corrected positions in metres", async () => {
    const res = await (await as("engineer")).agent.get(`/api/sweeps/${sweepId}/readings.csv`);
    expect(res.status).toBe(200);
    expect(res.headers["content-type"]).toMatch(/text\/csv/);
    const parsed = Papa.parse<Record<string, string>>(res.text, { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.meta.fields).toEqual([
      "reading_id",
      "local_time",
      "seconds_from_start",
      "raw_x_m",
      "raw_y_m",
      "corrected_x_m",
      "corrected_y_m",
      "ppm",
      "at_least",
      "sample_point",
      "flags",
      "note",
    ]);
    expect(parsed.data).toHaveLength(readings.length);
    for (let i = 0; i < readings.length; i++) {
      const r = readings[i];
      expect(parsed.data[i].reading_id).toBe(r.id);
      expect(Number(parsed.data[i].raw_x_m)).toBeCloseTo(r.x as number, 3);
      expect(Number(parsed.data[i].ppm)).toBe(r.ppm);
      expect(parsed.data[i].corrected_x_m).not.toBe("");
    }
  });

  it("follows a reader who prefers feet: columns and values in decimal feet", async () => {
    await t.ctx.db.update(users).set({ lengthUnit: "ft-in" }).where(eq(users.id, co.people.engineer.userId));
    const res = await (await as("engineer")).agent.get(`/api/sweeps/${sweepId}/readings.csv`);
    const parsed = Papa.parse<Record<string, string>>(res.text, { header: true, skipEmptyLines: true });
    // 1 ft = 0.3048 m exactly (international yard and pound agreement, 1959)
    expect(Number(parsed.data[0].raw_x_ft)).toBeCloseTo((readings[0].x as number) / 0.3048, 3);
    await t.ctx.db.update(users).set({ lengthUnit: null }).where(eq(users.id, co.people.engineer.userId));
  });
});

describe("e-mailing the report", () => {
  it("sends the PDF to the store contact and a typed address through SMTP, and records who sent what to whom", async () => {
    const eng = await as("engineer");
    const res = await eng.post(`/api/sweeps/${sweepId}/report/send`, {
      storeContacts: true,
      addresses: ["area.manager@example.org"],
      message: "Monthly sweep attached.",
    });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.recipients.sort()).toEqual(
      [co.people["store-contact"].email.toLowerCase(), "area.manager@example.org"].sort(),
    );
    // Answered once queued; the queue's worker (drained here) hands it to SMTP.
    expect(res.body.delivery).toMatchObject({ state: "queued", attempts: 0, error: null });
    expect(await drainMail(t)).toBe(1);
    // the fake SMTP server files what it received (Outbox table)
    const caught = await t.ctx.db.select().from(outboxMessages).where(eq(outboxMessages.subject, res.body.subject));
    expect(caught).toHaveLength(1);
    expect(caught[0].to.sort()).toEqual(res.body.recipients.sort());
    expect(caught[0].attachments).toHaveLength(1);
    expect(caught[0].attachments[0]).toMatchObject({ filename: res.body.filename, contentType: "application/pdf" });
    expect(caught[0].attachments[0].size).toBeGreaterThan(10_000);
    expect(caught[0].companyId).toBe(co.company.id);
    const [row] = await t.ctx.db.select().from(reportSends).where(eq(reportSends.id, res.body.id));
    expect(row).toMatchObject({ sweepId, sentById: co.people.engineer.userId, filename: res.body.filename });
    const sends = await eng.get(`/api/sweeps/${sweepId}/report/sends`);
    expect(sends.body.sends[0]).toMatchObject({
      id: res.body.id,
      sentBy: "engineer of Ćwikła & Sons Grocers",
      delivery: { state: "sent", attempts: 1, error: null },
    });
  });

  it("needs reports.send, a recipient, and well-formed addresses", async () => {
    expect(
      (await (await as("technician")).post(`/api/sweeps/${sweepId}/report/send`, { addresses: ["x@example.org"] }))
        .status,
    ).toBe(403);
    expect(
      (await (await as("store-contact")).post(`/api/sweeps/${sweepId}/report/send`, { addresses: ["x@example.org"] }))
        .status,
    ).toBe(403);
    const eng = await as("engineer");
    const none = await eng.post(`/api/sweeps/${sweepId}/report/send`, {});
    expect(none.status).toBe(400);
    expect(none.body.error.fields.addresses).toMatch(/at least one recipient/);
    const bad = await eng.post(`/api/sweeps/${sweepId}/report/send`, { addresses: ["not-an-address"] });
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body.error.fields)).toMatch(/e-mail address/);
  });
});
