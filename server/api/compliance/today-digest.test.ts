import pino from "pino";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createTestApp, drainMail, type Agent, type TestApp, signInOnce } from "../../../tests/helpers/test-app";
import { seedCompany } from "../../../tests/helpers/fixtures";
import { createDb } from "../../db/client";
import { detectors, digestRuns, outboxMessages } from "../../db/schema/index";
import type { AppContext } from "../../context";
import { createSmtpMailer } from "../../mail/mailer";
import { createMailQueue } from "../../mail/mail-queue";
import { runDueDigests, sendDigest } from "../../jobs/digest";
import type { Role } from "#core/domain/roles";

let t: TestApp;
let co: Awaited<ReturnType<typeof seedCompany>>;
let other: Awaited<ReturnType<typeof seedCompany>>;
let systemId: string;
let findingId: string;
const signInOnceAs = signInOnce(() => t.app);

const signedIn = (role: Role, company = co): Promise<Agent> => signInOnceAs(company.people[role]);

const localToday = (zone: string, now = new Date()) =>
  new Intl.DateTimeFormat("en-CA", { timeZone: zone, year: "numeric", month: "2-digit", day: "2-digit" }).format(now);
const daysBefore = (date: string, days: number) =>
  new Date(Date.parse(`${date}T00:00:00Z`) - days * 86_400_000).toISOString().slice(0, 10);

beforeAll(async () => {
  t = await createTestApp();
  co = await seedCompany(t.ctx, "Marigold Lane Grocers");
  other = await seedCompany(t.ctx, "Quillfield Foods");
  const lead = await signedIn("lead-tech");
  systemId = (
    await lead.post(`/api/stores/${co.store.id}/systems`, {
      name: "Rack A",
      refrigerantId: "R-448A",
      fullCharge: { value: 100, unit: "lb" },
      applianceType: "commercial-refrigeration",
      automaticLeakDetection: false,
    })
  ).body.id;
  const today = localToday("America/New_York");
  const tech = await signedIn("technician");
  // 5 lb into 100 lb 30 days after the last addition: 60.8 % > 20 % (40 CFR 84.102; docs/reference/standards.md §1).
  await tech.post(`/api/systems/${systemId}/charge-additions`, {
    addedOn: daysBefore(today, 57),
    amount: { value: 3, unit: "lb" },
    reason: "Top-up",
  });
  await tech.post(`/api/systems/${systemId}/charge-additions`, {
    addedOn: daysBefore(today, 27),
    amount: { value: 5, unit: "lb" },
    reason: "Low-level alarm",
  });
  findingId = (
    await tech.post(`/api/stores/${co.store.id}/findings`, { systemId, status: "confirmed", component: "coil" })
  ).body.id;
  await t.ctx.db.insert(detectors).values({
    companyId: co.company.id,
    name: "Heated-diode sniffer",
    principle: "heated-diode",
    lastCheckedOn: daysBefore(today, 28),
  });
});
afterAll(() => t.close());

describe("Today", () => {
  it("lists the repair deadline, the system over threshold, the open finding and the detector check, each with its source and link", async () => {
    const r = await (await signedIn("engineer")).get("/api/today");
    expect(r.status).toBe(200);
    const today = localToday("America/New_York");
    const repair = r.body.due.find((d: { kind: string }) => d.kind === "repair");
    // Learned 27 days ago; repair within 30 days [S:R4] → 3 days left.
    expect(repair).toMatchObject({
      systemId,
      daysLeft: 3,
      state: "due-soon",
      link: `/systems/${systemId}#leak-rates`,
      storeName: co.store.name,
    });
    expect(repair.source).toMatch(/40 CFR 84/);
    expect(r.body.overThreshold).toEqual([
      expect.objectContaining({
        systemId,
        thresholdPercent: 20,
        on: daysBefore(today, 27),
        link: `/systems/${systemId}#leak-rates`,
      }),
    ]);
    expect(r.body.overThreshold[0].percent).toBeCloseTo((5 / 100 / (30 / 365)) * 100, 9);
    expect(r.body.openFindings).toEqual([
      expect.objectContaining({
        id: findingId,
        status: "confirmed",
        deadline: repair.dueOn,
        link: `/findings/${findingId}`,
      }),
    ]);
    // Calibrated 28 days ago, company interval 30 days → due in 2 days (common practice).
    expect(r.body.due.find((d: { kind: string }) => d.kind === "detector-check")).toMatchObject({
      daysLeft: 2,
      state: "due-soon",
      link: expect.stringMatching(/^\/detectors#detector-[0-9a-f-]{36}$/),
    });
  });

  it("filters by store, shows store contacts their store only (no detectors), and 404s a stranger's store", async () => {
    const lead = await signedIn("lead-tech");
    const filtered = await lead.get(`/api/today?storeId=${co.otherStore.id}`);
    expect(filtered.body.due).toEqual([]);
    expect(filtered.body.openFindings).toEqual([]);
    const contact = await (await signedIn("store-contact")).get("/api/today");
    expect(contact.body.stores.map((s: { id: string }) => s.id)).toEqual([co.store.id]);
    // Under 500 lb, no automatic leak detection: a yearly inspection after the breach as well [M].
    expect(contact.body.due.map((d: { kind: string }) => d.kind)).toEqual(["repair", "inspection"]);
    expect(contact.body.openFindings).toHaveLength(1);
    const stranger = await signedIn("owner", other);
    expect((await stranger.get(`/api/today?storeId=${co.store.id}`)).status).toBe(404);
    const theirs = await stranger.get("/api/today");
    expect(theirs.body.openFindings).toEqual([]);
    expect((await lead.get("/api/today?storeId=nope")).body.error.fields.storeId).toBe("must be a valid id");
  });
});

describe("the daily digest", () => {
  async function digestsFor(companyId: string) {
    return t.ctx.db.select().from(outboxMessages).where(eq(outboxMessages.companyId, companyId));
  }

  it("is sent once per company and local day across a restart and a second process on the same database", async () => {
    // A second process: its own pool and mailer on the same database and the same SMTP server.
    const second = createDb(t.database.url);
    const logger = pino({ level: "silent" });
    const mailer = createMailQueue(
      second.db,
      createSmtpMailer(
        { host: "127.0.0.1", port: t.smtp.port, secure: false, from: "Plumeline <no-reply@plumeline.test>" },
        true,
      ),
      logger,
    );
    const ctx2: AppContext = { ...t.ctx, db: second.db, pool: second.pool, mailer, logger };
    try {
      // 15:00 UTC is after 06:00 in New York all year.
      const now = new Date(`${localToday("UTC")}T15:00:00Z`);
      const [a, b] = await Promise.all([runDueDigests(t.ctx, now), runDueDigests(ctx2, now)]);
      const mine = [...a, ...b].filter((r) => r.sent);
      expect(mine).toHaveLength(2); // one per company, each sent by exactly one process
      // "Restart": a fresh pass an hour later sends nothing new.
      const later = await runDueDigests(ctx2, new Date(now.getTime() + 3_600_000));
      expect(later.every((r) => !r.sent)).toBe(true);
      // Either process's worker may deliver; both draining at once still sends each message once.
      await Promise.all([mailer.drain(), drainMail(t)]);
      const mail = await digestsFor(co.company.id);
      expect(mail).toHaveLength(1);
      expect(mail[0].to.sort()).toEqual([co.people.engineer.email, co.people.owner.email].sort());
      expect(mail[0].subject).toMatch(/due in the next 7 days/);
      expect(mail[0].text).toContain("Repair: leak rate");
      expect(mail[0].text).toContain(`/systems/${systemId}`);
      // Rules read as citations in the e-mail, never as internal tags.
      expect(mail[0].text).toContain("repair within 30 days of learning of the breach");
      expect(mail[0].text).not.toMatch(/\[(S:|M\]|D\])/);
      expect(mail[0].text).toMatch(/Calibration \/ bump check: Heated-diode sniffer/);
      const runs = await t.ctx.db.select().from(digestRuns).where(eq(digestRuns.companyId, co.company.id));
      expect(runs).toHaveLength(1);
      expect(runs[0].status).toBe("sent");
    } finally {
      mailer.close();
      await second.pool.end();
    }
  });

  it("waits for the local digest hour", async () => {
    await t.ctx.db.delete(digestRuns);
    // 08:00 UTC is 03:00 or 04:00 in New York: before the 06:00 digest hour.
    const early = await runDueDigests(t.ctx, new Date(`${localToday("UTC")}T08:00:00Z`));
    expect(early).toEqual([]);
  });

  it("lets only the owner send today's digest now, once", async () => {
    await t.ctx.db.delete(digestRuns);
    await t.ctx.db.delete(outboxMessages);
    expect((await (await signedIn("engineer")).post("/api/digest/send-now")).status).toBe(403);
    const owner = await signedIn("owner");
    const first = await owner.post("/api/digest/send-now");
    expect(first.body).toMatchObject({ sent: true, itemCount: 2 });
    const again = await owner.post("/api/digest/send-now");
    expect(again.body.sent).toBe(false);
    expect(again.body.message).toMatch(/already sent/);
    await drainMail(t);
    expect(await digestsFor(co.company.id)).toHaveLength(1);
    // Only this company's mail: the other company got none from this owner's action.
    expect(await digestsFor(other.company.id)).toHaveLength(0);
  });

  it("releases the claim when the message cannot even be queued, so the next run retries", async () => {
    await t.ctx.db.delete(digestRuns);
    const failing: AppContext = {
      ...t.ctx,
      mailer: { ...t.ctx.mailer, send: () => Promise.reject(new Error("queue unavailable")) },
    };
    await expect(sendDigest(failing, co.company.id, "manual")).rejects.toThrow(/queue unavailable/);
    expect(await t.ctx.db.select().from(digestRuns).where(eq(digestRuns.companyId, co.company.id))).toHaveLength(0);
    expect((await sendDigest(t.ctx, co.company.id, "manual")).sent).toBe(true);
  });
});
