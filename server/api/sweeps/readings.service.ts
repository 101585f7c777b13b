import { and, asc, eq, inArray, sql } from "drizzle-orm";
import type { AppContext } from "../../context";
import type { Tx } from "../../db/tx";
import { plans, readingAudit, readings, sweeps, users, type ReadingValues } from "../../db/schema/index";
import {
  readingInput,
  type Reading,
  type ReadingAuditEntry,
  type ReadingEditInput,
  type ReadingsBatchResult,
  type RejectedReading,
} from "#core/contracts/sweeps";
import { readingProblems, type ReadingContext } from "#core/domain/sweeps/reading-checks";
import { HttpError, notFound } from "../../lib/http-error";
import { zodFields } from "../../lib/zod-fields";
import type { Viewer } from "../../access/store-access";
import { loadVisibleSweep, type SweepRow } from "../../access/sweep-access";
import { passIdsOfSweep } from "./passes.service";

type ReadingRow = typeof readings.$inferSelect;

function toReading(r: ReadingRow): Reading {
  return {
    id: r.id,
    sweepId: r.sweepId,
    x: r.x,
    y: r.y,
    takenAt: r.takenAt.toISOString(),
    ppm: r.ppm,
    atLeast: r.atLeast,
    samplePoint: r.samplePoint,
    note: r.note,
    passId: r.passId,
    receivedAt: r.receivedAt.toISOString(),
    updatedAt: r.updatedAt.toISOString(),
  };
}

function valuesOf(r: ReadingRow): ReadingValues {
  return {
    x: r.x,
    y: r.y,
    takenAt: r.takenAt.toISOString(),
    ppm: r.ppm,
    atLeast: r.atLeast,
    samplePoint: r.samplePoint,
    note: r.note,
  };
}

async function contextOf(ctx: AppContext, sweep: SweepRow): Promise<ReadingContext> {
  const [plan] = await ctx.db
    .select({ widthM: plans.widthM, heightM: plans.heightM })
    .from(plans)
    .where(eq(plans.id, sweep.planId));
  return {
    widthM: plan.widthM ?? 0,
    heightM: plan.heightM ?? 0,
    startedAtMs: sweep.startedAt.getTime(),
    nowMs: Date.now(),
  };
}

function assertOpen(sweep: SweepRow): void {
  if (sweep.status === "reviewed") {
    throw new HttpError(
      409,
      "sweep_reviewed",
      "This sweep was reviewed; its readings can no longer change. Start a new sweep for new readings.",
    );
  }
}

/**
 * Inserts a batch as eleven column arrays through unnest: one statement with eleven parameters instead
 * of twelve thousand, which keeps a 1,000-reading upload well inside the sync target. Ids already
 * stored are skipped (on conflict do nothing), so only the newly stored ids come back.
 */
async function insertReadings(tx: Tx, rows: (typeof readings.$inferInsert)[]): Promise<string[]> {
  if (rows.length === 0) return [];
  // sql.param keeps each array ONE parameter (a bare array would expand into a list).
  const col = <T>(f: (r: typeof readings.$inferInsert) => T) => sql.param(rows.map(f));
  const result = await tx.execute<{ id: string }>(sql`
    insert into readings (id, sweep_id, x, y, taken_at, ppm, at_least, sample_point, note, recorded_by_id, pass_id)
    select * from unnest(
      ${col((r) => r.id)}::uuid[], ${col((r) => r.sweepId)}::uuid[], ${col((r) => r.x)}::float8[], ${col((r) => r.y)}::float8[],
      ${col((r) => (r.takenAt as Date).toISOString())}::timestamptz[], ${col((r) => r.ppm)}::float8[], ${col((r) => r.atLeast ?? false)}::boolean[],
      ${col((r) => r.samplePoint)}::text[], ${col((r) => r.note ?? "")}::text[], ${col((r) => r.recordedById ?? null)}::uuid[],
      ${col((r) => r.passId ?? null)}::uuid[]
    )
    on conflict (id) do nothing
    returning id`);
  return result.rows.map((r) => r.id);
}

async function bumpRevision(tx: Tx, sweepId: string): Promise<number> {
  const [row] = await tx
    .update(sweeps)
    .set({ readingsRevision: sql`${sweeps.readingsRevision} + 1` })
    .where(eq(sweeps.id, sweepId))
    .returning({ rev: sweeps.readingsRevision });
  return row.rev;
}

/**
 * Stores a batch of readings. Each is judged alone: good ones are stored, each bad one comes back
 * with its reasons (so an offline queue is never blocked by one bad reading), and an id already
 * stored counts as a duplicate, never as a second reading.
 */
export async function uploadReadings(
  ctx: AppContext,
  viewer: Viewer,
  userId: string,
  sweepId: string,
  items: unknown[],
): Promise<ReadingsBatchResult> {
  const sweep = await loadVisibleSweep(ctx, viewer, sweepId);
  assertOpen(sweep);
  const c = await contextOf(ctx, sweep);
  const rejected: RejectedReading[] = [];
  const good: (typeof readings.$inferInsert)[] = [];
  const seen = new Set<string>();
  const batchDuplicates: string[] = [];
  // A reading names its pass by id; the pass must have reached the server first (the queue sends passes first).
  const named = items.flatMap((item) => {
    const passId = item && typeof item === "object" ? (item as { passId?: unknown }).passId : undefined;
    return typeof passId === "string" && /^[0-9a-f-]{36}$/i.test(passId) ? [passId] : [];
  });
  const knownPasses = await passIdsOfSweep(ctx, sweepId, [...new Set(named)]);
  items.forEach((item, index) => {
    const id =
      item && typeof item === "object" && typeof (item as { id?: unknown }).id === "string"
        ? (item as { id: string }).id
        : null;
    const parsed = readingInput.safeParse(item);
    if (!parsed.success) {
      rejected.push({ index, id, reasons: zodFields(parsed.error) });
      return;
    }
    const r = parsed.data;
    const takenAt = new Date(r.takenAt);
    const problems = readingProblems({ x: r.x, y: r.y, takenAtMs: takenAt.getTime() }, c);
    if (r.passId && !knownPasses.has(r.passId)) problems.passId = "is not a pass of this sweep";
    if (Object.keys(problems).length) {
      rejected.push({ index, id: r.id, reasons: problems });
      return;
    }
    if (seen.has(r.id)) {
      batchDuplicates.push(r.id);
      return;
    }
    seen.add(r.id);
    good.push({
      id: r.id,
      sweepId,
      x: r.x,
      y: r.y,
      takenAt,
      ppm: r.ppm,
      atLeast: r.atLeast,
      samplePoint: r.samplePoint,
      note: r.note,
      passId: r.passId ?? null,
      recordedById: userId,
    });
  });

  return ctx.db.transaction(async (tx) => {
    const stored = await insertReadings(tx, good);
    const storedSet = new Set(stored);
    const notInserted = good.filter((g) => !storedSet.has(g.id!)).map((g) => g.id!);
    const duplicates = [...batchDuplicates];
    if (notInserted.length) {
      const existing = await tx
        .select({ id: readings.id, sweepId: readings.sweepId })
        .from(readings)
        .where(inArray(readings.id, notInserted));
      const owner = new Map(existing.map((e) => [e.id, e.sweepId]));
      for (const id of notInserted) {
        if (owner.get(id) === sweepId) duplicates.push(id);
        else
          rejected.push({
            index: items.findIndex((it) => (it as { id?: unknown })?.id === id),
            id,
            reasons: { id: "is already used by a reading of another sweep" },
          });
      }
    }
    const readingsRevision = stored.length ? await bumpRevision(tx, sweepId) : sweep.readingsRevision;
    rejected.sort((a, b) => a.index - b.index);
    return { stored, duplicates, rejected, readingsRevision };
  });
}

export async function listReadings(ctx: AppContext, viewer: Viewer, sweepId: string): Promise<Reading[]> {
  await loadVisibleSweep(ctx, viewer, sweepId);
  const rows = await ctx.db
    .select()
    .from(readings)
    .where(eq(readings.sweepId, sweepId))
    .orderBy(asc(readings.takenAt), asc(readings.id));
  return rows.map(toReading);
}

async function lockReading(tx: Tx, sweepId: string, readingId: string): Promise<ReadingRow | undefined> {
  const [row] = await tx
    .select()
    .from(readings)
    .where(and(eq(readings.id, readingId), eq(readings.sweepId, sweepId)))
    .for("update");
  return row;
}

/**
 * Edits a reading. Conflict rule: edits are applied in the order they reach the server, so the
 * last one received wins (device clocks cannot be trusted to order edits); the audit trail keeps
 * every version with its device time, so the overwritten edit is never lost.
 */
export async function editReading(
  ctx: AppContext,
  viewer: Viewer,
  userId: string,
  sweepId: string,
  readingId: string,
  input: ReadingEditInput,
): Promise<{ reading: Reading; readingsRevision: number }> {
  const sweep = await loadVisibleSweep(ctx, viewer, sweepId);
  assertOpen(sweep);
  const c = await contextOf(ctx, sweep);
  return ctx.db.transaction(async (tx) => {
    const row = await lockReading(tx, sweepId, readingId);
    if (!row) throw notFound("That reading");
    const next: ReadingValues = { ...valuesOf(row) };
    for (const key of ["x", "y", "takenAt", "ppm", "atLeast", "samplePoint", "note"] as const) {
      if (input[key] !== undefined) (next as unknown as Record<string, unknown>)[key] = input[key];
    }
    next.takenAt = new Date(next.takenAt).toISOString();
    const problems = readingProblems({ x: next.x, y: next.y, takenAtMs: Date.parse(next.takenAt) }, c);
    if (Object.keys(problems).length)
      throw new HttpError(
        400,
        "validation_failed",
        `Please check: ${Object.entries(problems)
          .map(([k, m]) => `${k} ${m}`)
          .join("; ")}.`,
        problems,
      );
    const now = new Date();
    const [updated] = await tx
      .update(readings)
      .set({
        x: next.x,
        y: next.y,
        takenAt: new Date(next.takenAt),
        ppm: next.ppm,
        atLeast: next.atLeast,
        samplePoint: next.samplePoint,
        note: next.note,
        updatedAt: now,
      })
      .where(eq(readings.id, readingId))
      .returning();
    await tx.insert(readingAudit).values({
      sweepId,
      readingId,
      action: "edit",
      before: valuesOf(row),
      after: next,
      byId: userId,
      editedAt: input.editedAt ? new Date(input.editedAt) : null,
      receivedAt: now,
    });
    return { reading: toReading(updated), readingsRevision: await bumpRevision(tx, sweepId) };
  });
}

/** Deletes a reading (kept in the audit trail). Deleting one already deleted is not an error. */
export async function deleteReading(
  ctx: AppContext,
  viewer: Viewer,
  userId: string,
  sweepId: string,
  readingId: string,
  editedAt?: string,
): Promise<{ readingsRevision: number }> {
  const sweep = await loadVisibleSweep(ctx, viewer, sweepId);
  assertOpen(sweep);
  return ctx.db.transaction(async (tx) => {
    const row = await lockReading(tx, sweepId, readingId);
    if (!row) {
      const [gone] = await tx
        .select({ id: readingAudit.id })
        .from(readingAudit)
        .where(
          and(
            eq(readingAudit.readingId, readingId),
            eq(readingAudit.sweepId, sweepId),
            eq(readingAudit.action, "delete"),
          ),
        )
        .limit(1);
      if (gone) return { readingsRevision: sweep.readingsRevision };
      throw notFound("That reading");
    }
    await tx.delete(readings).where(eq(readings.id, readingId));
    await tx.insert(readingAudit).values({
      sweepId,
      readingId,
      action: "delete",
      before: valuesOf(row),
      after: null,
      byId: userId,
      editedAt: editedAt ? new Date(editedAt) : null,
    });
    return { readingsRevision: await bumpRevision(tx, sweepId) };
  });
}

export async function readingAuditTrail(
  ctx: AppContext,
  viewer: Viewer,
  sweepId: string,
): Promise<ReadingAuditEntry[]> {
  await loadVisibleSweep(ctx, viewer, sweepId);
  const rows = await ctx.db
    .select({ a: readingAudit, by: users.name })
    .from(readingAudit)
    .leftJoin(users, eq(users.id, readingAudit.byId))
    .where(eq(readingAudit.sweepId, sweepId))
    .orderBy(asc(readingAudit.id));
  return rows.map(({ a, by }) => ({
    id: a.id,
    readingId: a.readingId,
    action: a.action,
    before: a.before as unknown as Record<string, unknown>,
    after: (a.after as unknown as Record<string, unknown>) ?? null,
    by,
    editedAt: a.editedAt?.toISOString() ?? null,
    receivedAt: a.receivedAt.toISOString(),
  }));
}
