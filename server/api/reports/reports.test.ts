import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import Papa from "papaparse";
import { PDFDocument } from "pdf-lib";
import { eq } from "drizzle-orm";
import { agentFor, createTestApp, drainMail, type Agent, type TestApp } from "../../../tests/helpers/test-app";
import { PASSWORD, seedCompany } from "../../../tests/helpers/fixtures";
import { pdfText } from "../../../tests/helpers/pdf-text";
import { caseLineFixtures, caseWalkReadings } from "../../../tests/helpers/sweep-walk";
import pino from "pino";
import { companies, detectors, outboxMessages, outgoingMail, reportSends, systems, users } from "../../db/schema/index";
import type { AppContext } from "../../context";
import { createJobQueue, JOBS_DEAD_LETTER, type JobQueue } from "../../jobs/job-queue";
import { startJobs } from "../../jobs/job-kinds";
import { prepareReports, REPORT_PDF_JOB } from "./report-pdf-job";
import type { Role } from "#core/domain/roles";
import { binaryBody } from "../../../tests/helpers/binary-body";

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

beforeAll(async () => {
  t = await createTestApp();
  co = await seedCompany(t.ctx, "Ćwikła & Sons Grocers");
  const owner = await as("owner");
  const plan = await owner.post(`/api/stores/${co.store.id}/plans/blank`, { width: 30, depth: 12, unit: "m" });
  const [rack] = await t.ctx.db
    .insert(systems)
    .values({
      companyId: co.company.id,
      storeId: co.store.id,
      name: "Rack B",
      refrigerantId: "R-448A",
      fullChargeKg: 250,
      applianceType: "commercial-refrigeration",
    })
    .returning();
  const put = await owner.put(`/api/plans/${plan.body.id}/fixtures`, {
    layoutRevision: plan.body.layoutRevision,
    fixtures: caseLineFixtures(caseId, dropId).map((f) => (f.id === caseId ? { ...f, systemId: rack.id } : f)),
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
    const res = await eng.agent.get(`/api/sweeps/${sweepId}/report.pdf`).buffer(true).parse(binaryBody);
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
    // the presenter's words: names, not ids; the strength in the case's system's refrigerant (lines joined)
    const flat = text.replace(/\s+/g, " ");
    expect(flat).toContain("Look at the line-set drop Drop D2");
    expect(flat).toContain("inside the open case Dairy 1–4");
    expect(flat).toMatch(/of R-448A if well mixed/);
    expect(flat).toMatch(/R-448A \(86\.28 g\/mol, the refrigerant of Rack B\) for spots? 1/);
    expect(flat).toMatch(/Delay check/);
    expect(text).not.toContain(caseId);
    expect(text).not.toContain(dropId);
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
    // Answered as soon as the send is recorded: the PDF is made afterwards by a job ("preparing"),
    // which queues the e-mail; drained here, in-process, as the job and the mail worker would.
    expect(res.body.delivery).toMatchObject({ state: "preparing", attempts: 0, error: null });
    expect(res.body.bytes).toBeNull();
    const waiting = await eng.get("/api/outbox/on-its-way");
    expect(waiting.body.messages).toContainEqual(
      expect.objectContaining({ kind: "report", subject: res.body.subject, state: "preparing", attempts: 0 }),
    );
    expect(await drainMail(t)).toBe(1);
    // the fake SMTP server files what it received (Outbox table)
    const caught = await t.ctx.db.select().from(outboxMessages).where(eq(outboxMessages.subject, res.body.subject));
    expect(caught).toHaveLength(1);
    expect(caught[0].to.sort()).toEqual(res.body.recipients.sort());
    // the suspect worded by the same presenter as the PDF: by name, never by id
    // nothing found yet: the suspect spots to check, in rank order (core/domain/reports/report-mail-text.ts)
    expect(caught[0].text).toContain("Suspect spots to check:\n1. Dairy 1–4 at ");
    expect(caught[0].text).toContain("one source inside the open case Dairy 1–4 explains them best");
    expect(caught[0].text).not.toContain(caseId);
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
      bytes: caught[0].attachments[0].size,
      delivery: { state: "sent", attempts: 1, error: null },
    });
  });

  it("names the confirmed finding first, before an earlier suspected one at the top suspect spot", async () => {
    const eng = await as("engineer");
    const tech = await as("technician");
    const top = (await eng.get(`/api/sweeps/${sweepId}/analysis`)).body.candidates[0];
    const suspected = await tech.post(`/api/stores/${co.store.id}/findings`, {
      source: "suspect-spot",
      status: "suspected",
      sweepId,
      fixtureId: caseId,
      x: top.x,
      y: top.y,
      foundAt: new Date(Date.now() - 20 * 60_000).toISOString(),
    });
    expect(suspected.status, JSON.stringify(suspected.body)).toBe(201);
    // Confirmed later, at the drop at the far end of the line: not the top suspect spot.
    const confirmed = await tech.post(`/api/stores/${co.store.id}/findings`, {
      status: "confirmed",
      sweepId,
      fixtureId: dropId,
      component: "flare",
      x: 21,
      y: 5,
      note: "bubbles at the flare nut",
      foundAt: new Date(Date.now() - 10 * 60_000).toISOString(),
    });
    expect(confirmed.status, JSON.stringify(confirmed.body)).toBe(201);
    const res = await eng.post(`/api/sweeps/${sweepId}/report/send`, { addresses: ["store.manager@example.org"] });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    await drainMail(t);
    const mail = (await t.ctx.db.select().from(outboxMessages)).find((m) =>
      m.to.includes("store.manager@example.org"),
    )!;
    const paragraphs = mail.text.split("\n\n");
    const first = paragraphs.findIndex((p) => /^Confirmed leak: Drop D2, Flare/.test(p));
    const second = paragraphs.findIndex((p) =>
      /^Suspected, not yet confirmed: Dairy 1–4, [^(]*\(suspect spot 1\b/.test(p),
    );
    expect(first, mail.text).toBeGreaterThan(0);
    expect(second, mail.text).toBeGreaterThan(first);
    expect(mail.text).toContain("bubbles at the flare nut");
    // The top spot is answered by the suspected finding: it is not listed again as "still to check".
    expect(mail.text).not.toMatch(/still to check:\n1\. /);
  });

  it("the e-mailed PDF lists findings before suspects, confirmed first, in the company's number format and the sender's units", async () => {
    const [before] = await t.ctx.db
      .select({ numberFormat: companies.numberFormat, lengthUnit: companies.lengthUnit, massUnit: companies.massUnit })
      .from(companies)
      .where(eq(companies.id, co.company.id));
    // A company writing 1.234,5 with lb and feet; this engineer reads lengths in metres.
    await t.ctx.db
      .update(companies)
      .set({ numberFormat: "1.234,5", lengthUnit: "ft-in", massUnit: "lb" })
      .where(eq(companies.id, co.company.id));
    await t.ctx.db.update(users).set({ lengthUnit: "m" }).where(eq(users.id, co.people.engineer.userId));
    try {
      const eng = await as("engineer");
      const res = await eng.post(`/api/sweeps/${sweepId}/report/send`, { addresses: ["records@example.org"] });
      expect(res.status, JSON.stringify(res.body)).toBe(201);
      // The job's work, in-process: the PDF it made waits with the queued message.
      await prepareReports(t.ctx);
      const [mail] = await t.ctx.db.select().from(outgoingMail).where(eq(outgoingMail.subjectId, res.body.id));
      expect(mail.state).toBe("queued");
      const pdf = Buffer.from(mail.attachments[0].contentBase64, "base64");
      const flat = (await pdfText(pdf)).join("\n").replace(/\s+/g, " ");
      // Findings first, the confirmed leak before the earlier suspicion, then the suspect spots.
      const confirmed = flat.indexOf("Confirmed leak — Drop D2, Flare");
      const suspected = flat.indexOf("Suspected, not yet confirmed — Dairy 1–4");
      const spots = flat.indexOf("Suspect spots");
      expect(confirmed, flat).toBeGreaterThan(0);
      expect(suspected).toBeGreaterThan(confirmed);
      expect(spots).toBeGreaterThan(suspected);
      // 1.234,5: a decimal comma (core/domain/numbers/number-format.ts), in positions, score and background.
      expect(flat).toMatch(/1\. Dairy 1–4 — at \d+,\d m, \d+,\d m \(within \d+,\d m\), score \d,\d\d/);
      expect(flat).toMatch(/Background \d+,\d ppm/);
      expect(flat).not.toMatch(/score \d\.\d\d/);
      // The company works in pounds: the strength in lb (or oz) a year first, kg (or g) in brackets, and
      // the two agree (1 lb = 0.45359237 kg exactly, 16 oz; NIST SP 811, B.8), within their two significant figures.
      const both = flat.match(/about ([\d.,]+) (lb|oz)\/yr \(([\d.,]+) (kg|g)\/yr\) of R-448A/);
      expect(both, flat).not.toBeNull();
      const read = (v: string) => Number(v.replace(/\./g, "").replace(",", "."));
      const kg = read(both![1]) * (both![2] === "lb" ? 0.45359237 : 0.45359237 / 16);
      const other = read(both![3]) / (both![4] === "kg" ? 1 : 1000);
      expect(Math.abs(kg - other) / other).toBeLessThan(0.1); // each side rounded to two figures: at most 5 % off
      expect(flat).not.toMatch(/of the strongest, about [\d.,]+ (kg|g)\/yr/);
    } finally {
      await t.ctx.db.update(companies).set(before).where(eq(companies.id, co.company.id));
      await t.ctx.db.update(users).set({ lengthUnit: null }).where(eq(users.id, co.people.engineer.userId));
      await drainMail(t);
    }
  });

  it("prints the sweep report on the company's paper setting", async () => {
    const pageSize = async () => {
      const res = await (await as("engineer")).agent
        .get(`/api/sweeps/${sweepId}/report.pdf`)
        .buffer(true)
        .parse(binaryBody);
      const page = (await PDFDocument.load(res.body as Buffer)).getPage(0);
      return [Math.round(page.getWidth()), Math.round(page.getHeight())];
    };
    // ISO 216 A4 = 595.28 × 841.89 pt; US Letter = 612 × 792 pt. The company works under the US profile.
    expect(await pageSize()).toEqual([612, 792]);
    await t.ctx.db.update(companies).set({ paperSize: "a4" }).where(eq(companies.id, co.company.id));
    try {
      expect(await pageSize()).toEqual([595, 842]);
    } finally {
      await t.ctx.db.update(companies).set({ paperSize: "profile" }).where(eq(companies.id, co.company.id));
    }
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
    // Each bad address in a list is named in its own field error; the good ones raise none.
    const list = await eng.post(`/api/sweeps/${sweepId}/report/send`, {
      addresses: ["ok@example.org", "dana@", "also.ok@example.org", "lee at example.org"],
    });
    expect(list.status).toBe(400);
    expect(list.body.error.fields).toEqual({
      "addresses.1": "“dana@” is not an e-mail address",
      "addresses.3": "“lee at example.org” is not an e-mail address",
    });
    expect(list.body.error.message).toContain("“dana@” is not an e-mail address");
  });
});

describe("the report's PDF as a job", () => {
  const quiet = pino({ level: "silent" });
  const started: JobQueue[] = [];
  const jobQueue = () => {
    const q = createJobQueue(t.database.db, quiet, { pollingIntervalS: 0.5 });
    started.push(q);
    return q;
  };
  /** A worker in its own context (as another process would be), leaving the app's own untouched. */
  async function worker(overrides: Partial<AppContext> = {}, retries?: { limit: number; delayS: number }) {
    const ctx: AppContext = { ...t.ctx, ...overrides };
    await startJobs(ctx, jobQueue(), { digests: false, retries });
    return ctx;
  }
  /** The app queues jobs but takes none (RUN_JOBS=false): whatever runs them is another worker. */
  async function queueOnly() {
    const q = jobQueue();
    await startJobs(t.ctx, q, { digests: false, work: false });
    return q;
  }
  async function sendState(agent: Agent, sendId: string, want: string) {
    const by = Date.now() + 60_000;
    for (;;) {
      const res = await agent.get(`/api/sweeps/${sweepId}/report/sends`);
      const send = res.body.sends.find((x: { id: string }) => x.id === sendId);
      if (send?.delivery?.state === want || Date.now() > by) return send;
      await new Promise((r) => setTimeout(r, 250));
    }
  }
  afterEach(async () => {
    t.ctx.jobs = undefined;
    for (const q of started.splice(0)) await q.stop(2_000);
  });

  it("is made by a worker in another process while the app that took the send only queues it", async () => {
    const web = await queueOnly();
    expect(web.working).toBe(false);
    await worker();
    const eng = await as("engineer");
    const res = await eng.post(`/api/sweeps/${sweepId}/report/send`, { addresses: ["dc.manager@example.org"] });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.delivery.state).toBe("preparing");
    // The worker makes the PDF and queues the e-mail (the mail worker is not running here: drained below).
    const queued = await sendState(eng, res.body.id, "queued");
    // The Outbox lists it as on its way until it is sent.
    const onItsWay = async () =>
      (await eng.get("/api/outbox/on-its-way")).body.messages.filter((m: { to: string[] }) =>
        m.to.includes("dc.manager@example.org"),
      );
    expect(await onItsWay()).toEqual([
      expect.objectContaining({ kind: "report", subject: res.body.subject, state: "queued", error: null }),
    ]);
    expect(queued.delivery).toMatchObject({ state: "queued", attempts: 0, error: null });
    expect(queued.bytes).toBeGreaterThan(10_000);
    const { rows } = await t.ctx.pool.query("select state from pgboss.job where name = $1 and data->>'sendId' = $2", [
      REPORT_PDF_JOB,
      res.body.id,
    ]);
    expect(rows.map((r) => r.state)).toEqual(["completed"]);
    expect(await drainMail(t)).toBe(1);
    expect(await onItsWay()).toEqual([]);
    const mail = (await t.ctx.db.select().from(outboxMessages)).find((m) => m.to.includes("dc.manager@example.org"))!;
    expect(mail.attachments).toEqual([expect.objectContaining({ contentType: "application/pdf", size: queued.bytes })]);
    expect(mail.text).toContain("sent you the sweep report for");
  }, 120_000);

  it("a PDF that cannot be made leaves the send failed with a plain reason, listed for the owner; Send again makes it", async () => {
    await queueOnly();
    // The CPU pool's drawing fails on every try (no retries: the last try is the first).
    await worker(
      { reportRunner: { run: () => Promise.reject(new Error("the drawing ran out of memory")) } as never },
      { limit: 0, delayS: 1 },
    );
    const eng = await as("engineer");
    const res = await eng.post(`/api/sweeps/${sweepId}/report/send`, { addresses: ["audit@example.org"] });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.delivery.state).toBe("preparing");
    const failed = await sendState(eng, res.body.id, "failed");
    expect(failed.delivery).toMatchObject({
      state: "failed",
      attempts: 0,
      error: "The PDF report could not be made: the drawing ran out of memory",
    });
    expect(failed.bytes).toBeNull();
    const outbox = await eng.get("/api/outbox/on-its-way");
    expect(outbox.body.messages).toContainEqual(
      expect.objectContaining({
        kind: "report",
        to: ["audit@example.org"],
        state: "failed",
        error: failed.delivery.error,
      }),
    );
    // The dead job is in the dead-letter queue and on the owner's Failed jobs list, with the reason.
    const dead = await t.ctx.pool.query("select data from pgboss.job where name = $1", [JOBS_DEAD_LETTER]);
    expect(dead.rows.map((r) => r.data.sendId)).toContain(res.body.id);
    const owner = await as("owner");
    const list = await owner.get("/api/jobs/failed");
    expect(list.body.jobs).toContainEqual(
      expect.objectContaining({
        kind: "report",
        subjectId: res.body.id,
        to: ["audit@example.org"],
        reason: "The PDF report could not be made: the drawing ran out of memory",
      }),
    );
    for (const q of started.splice(0)) await q.stop(2_000);
    t.ctx.jobs = undefined;
    // "Send again" tries the PDF again (not a mail without its attachment); drained in-process here.
    const again = await eng.post(`/api/sweeps/${sweepId}/report/sends/${res.body.id}/retry`);
    expect(again.status, JSON.stringify(again.body)).toBe(200);
    expect(again.body.delivery).toMatchObject({ state: "preparing", error: null });
    await drainMail(t);
    const sent = await sendState(eng, res.body.id, "sent");
    expect(sent.delivery.state).toBe("sent");
    const mail = (await t.ctx.db.select().from(outboxMessages)).find((m) => m.to.includes("audit@example.org"))!;
    expect(mail.attachments).toHaveLength(1);
  }, 120_000);
});
