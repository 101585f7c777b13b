import { and, asc, eq, inArray, sql } from "drizzle-orm";
import type { AppContext } from "../../context";
import { fixtures, sweepPasses } from "../../db/schema/index";
import type { SweepPass, SweepPassInput } from "#core/contracts/sweeps";
import {
  DEVICE_CLOCK_TOLERANCE_MS,
  READING_AFTER_START_MAX_MS,
  READING_BEFORE_START_TOLERANCE_MS,
} from "#core/contracts/sweeps";
import { FIXTURE_FAMILY, type FixtureKind } from "#core/contracts/fixture-kinds";
import { badRequest, conflict, HttpError } from "../../lib/http-error";
import type { Viewer } from "../../access/store-access";
import { loadVisibleSweep, type SweepRow } from "../../access/sweep-access";

type PassRow = typeof sweepPasses.$inferSelect;

function toPass(r: PassRow, number: number): SweepPass {
  return {
    id: r.id,
    sweepId: r.sweepId,
    number,
    fans: r.fans,
    defrost: r.defrost,
    fixtureId: r.fixtureId,
    startedAt: r.startedAt.toISOString(),
    endedAt: r.endedAt?.toISOString() ?? null,
  };
}

/** The pinpoint passes of some sweeps, numbered 2, 3, … in order of start (the first pass is the sweep's own). */
export async function passesOf(ctx: AppContext, sweepIds: readonly string[]): Promise<Map<string, SweepPass[]>> {
  const out = new Map<string, SweepPass[]>();
  if (sweepIds.length === 0) return out;
  const rows = await ctx.db
    .select()
    .from(sweepPasses)
    .where(inArray(sweepPasses.sweepId, [...sweepIds]))
    .orderBy(asc(sweepPasses.startedAt), asc(sweepPasses.id));
  for (const r of rows) {
    const list = out.get(r.sweepId) ?? [];
    list.push(toPass(r, list.length + 2));
    out.set(r.sweepId, list);
  }
  return out;
}

/** Field → reason for a pass's times and fixture; the times are on the sweep's device clock, as readings are. */
async function passProblems(ctx: AppContext, sweep: SweepRow, input: SweepPassInput): Promise<Record<string, string>> {
  const problems: Record<string, string> = {};
  const start = sweep.startedAt.getTime();
  const began = Date.parse(input.startedAt);
  if (began < start - READING_BEFORE_START_TOLERANCE_MS) problems.startedAt = "is before the sweep started";
  else if (began > start + READING_AFTER_START_MAX_MS) problems.startedAt = "is more than 24 h after the sweep started";
  else if (began > Date.now() + DEVICE_CLOCK_TOLERANCE_MS)
    problems.startedAt = "is more than 24 h in the future (check the device's clock)";
  if (input.endedAt) {
    const ended = Date.parse(input.endedAt);
    if (ended < began) problems.endedAt = "is before the pass started";
    else if (ended > start + READING_AFTER_START_MAX_MS) problems.endedAt = "is more than 24 h after the sweep started";
  }
  if (input.fixtureId) {
    const [f] = await ctx.db
      .select({ kind: fixtures.kind })
      .from(fixtures)
      .where(and(eq(fixtures.planId, sweep.planId), eq(fixtures.id, input.fixtureId)));
    if (!f) problems.fixtureId = "is not a fixture of the sweep's plan";
    else if (FIXTURE_FAMILY[f.kind as FixtureKind] !== "air-volume")
      problems.fixtureId = "is not a case, walk-in or machine room (only those have fans or a defrost)";
  }
  return problems;
}

/**
 * Starts a pinpoint pass or records its end. Idempotent by the device's id: the conditions stay as
 * first stored (a pass's air never changes after its readings were taken), a later end replaces an
 * earlier one, and a resend answers with the stored pass.
 */
export async function savePass(
  ctx: AppContext,
  viewer: Viewer,
  userId: string,
  sweepId: string,
  passId: string,
  input: SweepPassInput,
): Promise<SweepPass> {
  const sweep = await loadVisibleSweep(ctx, viewer, sweepId);
  if (sweep.status === "reviewed")
    throw new HttpError(409, "sweep_reviewed", "This sweep was reviewed; no pass can be added or changed.");
  const problems = await passProblems(ctx, sweep, input);
  if (Object.keys(problems).length)
    throw badRequest(
      `Please check: ${Object.entries(problems)
        .map(([k, m]) => `${k} ${m}`)
        .join("; ")}.`,
      problems,
    );
  const endedAt = input.endedAt ? new Date(input.endedAt) : null;
  const [row] = await ctx.db
    .insert(sweepPasses)
    .values({
      id: passId,
      sweepId,
      fans: input.fans,
      defrost: input.defrost,
      fixtureId: input.fixtureId ?? null,
      startedAt: new Date(input.startedAt),
      endedAt,
      startedById: userId,
    })
    .onConflictDoUpdate({
      target: sweepPasses.id,
      set: { endedAt: sql`coalesce(excluded.ended_at, ${sweepPasses.endedAt})` },
      setWhere: eq(sweepPasses.sweepId, sweepId),
    })
    .returning();
  if (!row) throw conflict("That pass id is already used by another sweep; start the pass again.");
  const list = (await passesOf(ctx, [sweepId])).get(sweepId) ?? [];
  return list.find((p) => p.id === passId) ?? toPass(row, list.length + 2);
}

/** Which of these pass ids are passes of the sweep. */
export async function passIdsOfSweep(ctx: AppContext, sweepId: string, ids: readonly string[]): Promise<Set<string>> {
  if (ids.length === 0) return new Set();
  const rows = await ctx.db
    .select({ id: sweepPasses.id })
    .from(sweepPasses)
    .where(and(eq(sweepPasses.sweepId, sweepId), inArray(sweepPasses.id, [...ids])));
  return new Set(rows.map((r) => r.id));
}
