import pino from "pino";
import PgBoss from "pg-boss";
import { sql } from "drizzle-orm";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { createTestDatabase, type TestDatabase } from "../../tests/helpers/test-db";
import { outboxMessages, outgoingMail, securityEvents } from "../db/schema/index";
import { DEFAULT_RETENTION_DAYS, PRUNE_CRON, PRUNE_JOB, pruneOldRows, startPruning } from "./pruning";

let database: TestDatabase;
const NOW = new Date("2026-06-15T12:00:00Z");
const daysAgo = (d: number) => new Date(NOW.getTime() - d * 86_400_000);

beforeAll(async () => {
  database = await createTestDatabase();
});
afterAll(async () => {
  await database.drop();
});
beforeEach(async () => {
  const db = database.db;
  await db.delete(securityEvents);
  await db.delete(outgoingMail);
  await db.delete(outboxMessages);
});

async function ageOf<T>(rows: T[], pick: (r: T) => Date): Promise<number[]> {
  return rows.map((r) => Math.round((NOW.getTime() - pick(r).getTime()) / 86_400_000)).sort((a, b) => a - b);
}

async function seedRows(): Promise<void> {
  const db = database.db;
  for (const d of [10, 365, 399, 401, 800])
    await db.insert(securityEvents).values({ kind: "sign-in", companyId: null, userId: null, at: daysAgo(d) });
  const mail = (state: "queued" | "sent" | "failed", createdDays: number, sentDays: number | null) => ({
    kind: "report" as const,
    to: ["store@larkspur.test"],
    subject: `${state} ${createdDays}`,
    text: "",
    state,
    createdAt: daysAgo(createdDays),
    sentAt: sentDays === null ? null : daysAgo(sentDays),
  });
  await db
    .insert(outgoingMail)
    .values([
      mail("sent", 30, 30),
      mail("sent", 95, 89),
      mail("sent", 100, 91),
      mail("failed", 100, null),
      mail("failed", 364, null),
      mail("failed", 366, null),
      mail("queued", 900, null),
    ]);
  for (const d of [5, 89, 91])
    await db.insert(outboxMessages).values({
      from: "no-reply@plumeline.test",
      to: ["store@larkspur.test"],
      subject: `caught ${d}`,
      text: "",
      rawSize: 100,
      receivedAt: daysAgo(d),
    });
}

describe("pruning old rows", () => {
  it("deletes what is past its retention and keeps the rest, queued mail always", async () => {
    await seedRows();
    // the defaults: security log 400 days, sent mail 90, failed mail 365
    const counts = await pruneOldRows(database.db, DEFAULT_RETENTION_DAYS, NOW);
    expect(counts).toEqual({ securityEvents: 2, sentMail: 1, failedMail: 1, caughtMail: 1 });

    const db = database.db;
    expect(await ageOf(await db.select().from(securityEvents), (r) => r.at)).toEqual([10, 365, 399]);
    const mail = await db.select().from(outgoingMail);
    expect(mail.map((m) => m.subject).sort()).toEqual(["failed 100", "failed 364", "queued 900", "sent 30", "sent 95"]);
    expect(await ageOf(await db.select().from(outboxMessages), (r) => r.receivedAt)).toEqual([5, 89]);

    // a second run (another process, a retry) finds nothing more to delete
    expect(await pruneOldRows(database.db, DEFAULT_RETENTION_DAYS, NOW)).toEqual({
      securityEvents: 0,
      sentMail: 0,
      failedMail: 0,
      caughtMail: 0,
    });
  });

  it("deletes more rows than one batch holds", async () => {
    const old = daysAgo(500);
    await database.db.execute(
      sql`insert into security_events (kind, detail, at) select 'export', '{}'::jsonb, ${old} from generate_series(1, 12000)`,
    );
    await database.db.insert(securityEvents).values({ kind: "export", at: daysAgo(1) });
    const counts = await pruneOldRows(database.db, DEFAULT_RETENTION_DAYS, NOW);
    expect(counts.securityEvents).toBe(12_000);
    expect(await database.db.$count(securityEvents)).toBe(1);
  });

  it("is scheduled daily on the job queue and runs when the job comes", async () => {
    const db = database.db;
    await db.insert(securityEvents).values({ kind: "sign-in", at: new Date(Date.now() - 1000 * 86_400_000) });
    await db.insert(securityEvents).values({ kind: "sign-in", at: new Date() });
    const pruning = await startPruning(db, pino({ level: "silent" }), DEFAULT_RETENTION_DAYS, {
      pollingIntervalS: 0.5,
    });
    const boss = new PgBoss({
      db: { executeSql: (text: string, values: unknown[]) => db.$client.query(text, values) },
      schedule: false,
      supervise: false,
    });
    try {
      const schedules = await db.execute<{ name: string; cron: string; timezone: string }>(
        sql`select name, cron, timezone from pgboss.schedule where name = ${PRUNE_JOB}`,
      );
      expect(schedules.rows).toEqual([{ name: PRUNE_JOB, cron: PRUNE_CRON, timezone: "UTC" }]);
      await boss.start();
      await boss.send(PRUNE_JOB, {});
      let left = 2;
      // The job runs on pg-boss's next poll (0.5 s); up to 20 s for a loaded machine.
      for (let i = 0; i < 200 && left > 1; i++) {
        await new Promise((r) => setTimeout(r, 100));
        left = await db.$count(securityEvents);
      }
      expect(left).toBe(1);
    } finally {
      await boss.stop({ graceful: false, wait: true });
      await pruning.stop();
    }
  });
});
