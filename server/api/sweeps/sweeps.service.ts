import { and, count, desc, eq, inArray, isNull, sql } from "drizzle-orm";
import { lookupFor } from "../refrigerants/company-refrigerant-lookup";
import type { AppContext } from "../../context";
import { companies, detectors, plans, readings, stores, sweeps, systems, users } from "../../db/schema/index";
import type { CreateSweepInput, Sweep } from "#core/contracts/sweeps";
import { DEVICE_CLOCK_TOLERANCE_MS, SWEEP_UPLOAD_MAX_AGE_MS } from "#core/contracts/sweeps";
import { startWarnings } from "#core/domain/sweeps/start-warnings";
import { badRequest, conflict, HttpError } from "../../lib/http-error";
import { checkStatus } from "../detectors/detectors.service";
import { loadVisibleStore, visibleStores, type Viewer } from "../../access/store-access";
import { loadVisibleSweep, type SweepRow } from "../../access/sweep-access";
import { passesOf } from "./passes.service";

type Parsed = Omit<CreateSweepInput, "systemIds"> & { systemIds: string[] };

async function toSweeps(ctx: AppContext, rows: SweepRow[]): Promise<Sweep[]> {
  if (rows.length === 0) return [];
  const ids = rows.map((r) => r.id);
  const counts = await ctx.db
    .select({ sweepId: readings.sweepId, n: count() })
    .from(readings)
    .where(inArray(readings.sweepId, ids))
    .groupBy(readings.sweepId);
  const byId = new Map(counts.map((c) => [c.sweepId, Number(c.n)]));
  const dets = await ctx.db
    .select({ id: detectors.id, name: detectors.name })
    .from(detectors)
    .where(inArray(detectors.id, [...new Set(rows.map((r) => r.detectorId))]));
  const techs = await ctx.db
    .select({ id: users.id, name: users.name })
    .from(users)
    .where(inArray(users.id, [...new Set(rows.map((r) => r.technicianId))]));
  const passes = await passesOf(ctx, ids);
  const detName = new Map(dets.map((d) => [d.id, d.name]));
  const techName = new Map(techs.map((u) => [u.id, u.name]));
  return rows.map((r) => ({
    id: r.id,
    storeId: r.storeId,
    planId: r.planId,
    detectorId: r.detectorId,
    detectorName: detName.get(r.detectorId) ?? "",
    technicianId: r.technicianId,
    technicianName: techName.get(r.technicianId) ?? "",
    systemIds: r.systemIds,
    fans: r.fans,
    defrost: r.defrost,
    status: r.status,
    transportDelayS: r.transportDelayS,
    timeConstantS: r.timeConstantS,
    alarmPpm: r.alarmPpm,
    warnings: r.warnings,
    startedAt: r.startedAt.toISOString(),
    submittedAt: r.submittedAt?.toISOString() ?? null,
    reviewedAt: r.reviewedAt?.toISOString() ?? null,
    readingsRevision: r.readingsRevision,
    readingCount: byId.get(r.id) ?? 0,
    passes: passes.get(r.id) ?? [],
  }));
}

export async function toSweep(ctx: AppContext, row: SweepRow): Promise<Sweep> {
  return (await toSweeps(ctx, [row]))[0];
}

/**
 * Starts a sweep. A device that started offline sends its own id; a retry with that id returns
 * the stored sweep (created: false) rather than a second one.
 */
export async function createSweep(
  ctx: AppContext,
  viewer: Viewer,
  userId: string,
  storeId: string,
  input: Parsed,
): Promise<{ sweep: Sweep; created: boolean }> {
  const store = await loadVisibleStore(ctx, viewer, storeId);
  if (input.id) {
    const [existing] = await ctx.db.select().from(sweeps).where(eq(sweeps.id, input.id));
    if (existing) {
      if (existing.companyId !== viewer.companyId || existing.storeId !== storeId)
        throw conflict("That sweep id is already in use; start the sweep again.");
      return { sweep: await toSweep(ctx, existing), created: false };
    }
  }
  const [plan] = await ctx.db
    .select()
    .from(plans)
    .where(and(eq(plans.id, input.planId), eq(plans.storeId, storeId)));
  if (!plan)
    throw badRequest("Please check: planId is not a plan of this store.", { planId: "is not a plan of this store" });
  if (plan.widthM === null || plan.heightM === null) {
    throw badRequest("Please check: planId is not calibrated yet; readings are placed in metres.", {
      planId: "is not calibrated yet",
    });
  }
  const [det] = await ctx.db
    .select()
    .from(detectors)
    .where(and(eq(detectors.id, input.detectorId), eq(detectors.companyId, viewer.companyId)));
  if (!det)
    throw badRequest("Please check: detectorId is not one of the company's detectors.", {
      detectorId: "is not one of the company's detectors",
    });
  if (det.archivedAt)
    throw badRequest("Please check: detectorId is archived.", {
      detectorId: "is archived; restore it or pick another",
    });
  const hunted = input.systemIds.length
    ? await ctx.db
        .select()
        .from(systems)
        .where(and(inArray(systems.id, input.systemIds), eq(systems.storeId, storeId)))
    : [];
  const missing = input.systemIds.findIndex((id) => !hunted.some((s) => s.id === id));
  if (missing >= 0)
    throw badRequest(`Please check: systemIds.${missing} is not a system of this store.`, {
      [`systemIds.${missing}`]: "is not a system of this store",
    });

  const now = Date.now();
  const startedAt = input.startedAt ? new Date(input.startedAt) : new Date(now);
  if (startedAt.getTime() > now + DEVICE_CLOCK_TOLERANCE_MS)
    throw badRequest("Please check: startedAt is more than 24 h in the future.", {
      startedAt: "is more than 24 h in the future (check the device's clock)",
    });
  if (startedAt.getTime() < now - SWEEP_UPLOAD_MAX_AGE_MS)
    throw badRequest("Please check: startedAt is more than 60 days ago.", { startedAt: "is more than 60 days ago" });

  const [company] = await ctx.db
    .select({ days: companies.detectorCheckIntervalDays })
    .from(companies)
    .where(eq(companies.id, viewer.companyId));
  const status = checkStatus(det.lastCheckedOn, company.days, startedAt, store.timeZone);
  const warnings = startWarnings(
    { name: det.name, principle: det.principle, ...status },
    hunted,
    await lookupFor(ctx, viewer.companyId),
  );
  // Share lock on the plan: a re-calibration (which locks it for update) either sees this sweep
  // or finishes first, so it never moves fixtures under a sweep.
  const row = await ctx.db.transaction(async (tx) => {
    await tx.select({ id: plans.id }).from(plans).where(eq(plans.id, plan.id)).for("share");
    const [inserted] = await tx
      .insert(sweeps)
      .values({
        ...(input.id ? { id: input.id } : { id: crypto.randomUUID() }),
        companyId: viewer.companyId,
        storeId,
        planId: plan.id,
        detectorId: det.id,
        technicianId: userId,
        systemIds: input.systemIds,
        fans: input.fans,
        defrost: input.defrost,
        transportDelayS: det.transportDelayS,
        timeConstantS: det.timeConstantS,
        alarmPpm: det.alarmPpm,
        warnings,
        startedAt,
      })
      .onConflictDoNothing()
      .returning();
    return inserted;
  });
  if (!row) return createSweep(ctx, viewer, userId, storeId, input); // a racing retry stored it first
  return { sweep: await toSweep(ctx, row), created: true };
}

export async function listSweeps(ctx: AppContext, viewer: Viewer, storeId: string): Promise<Sweep[]> {
  await loadVisibleStore(ctx, viewer, storeId);
  const rows = await ctx.db
    .select()
    .from(sweeps)
    .where(and(eq(sweeps.storeId, storeId), eq(sweeps.companyId, viewer.companyId)))
    .orderBy(desc(sweeps.startedAt));
  return toSweeps(ctx, rows);
}

/** How many in-progress sweeps the resume list shows at most (a technician has a handful). */
export const IN_PROGRESS_LIST_MAX = 50;

/**
 * The company's sweeps still in progress in the stores this viewer sees: the viewer's own first,
 * then the newest. It is where a technician who left a sweep half-way finds it again.
 */
export async function listInProgressSweeps(ctx: AppContext, viewer: Viewer, userId: string): Promise<Sweep[]> {
  const rows = await ctx.db
    .select({ sweep: sweeps })
    .from(sweeps)
    .innerJoin(stores, eq(stores.id, sweeps.storeId))
    .where(
      and(
        eq(sweeps.companyId, viewer.companyId),
        eq(sweeps.status, "in-progress"),
        visibleStores(viewer),
        isNull(stores.archivedAt),
      ),
    )
    .orderBy(sql`${sweeps.technicianId} = ${userId} desc`, desc(sweeps.startedAt))
    .limit(IN_PROGRESS_LIST_MAX);
  return toSweeps(
    ctx,
    rows.map((r) => r.sweep),
  );
}

export async function getSweep(ctx: AppContext, viewer: Viewer, id: string): Promise<Sweep> {
  return toSweep(ctx, await loadVisibleSweep(ctx, viewer, id));
}

/** in progress → submitted (sweeps.record) → reviewed (sweeps.review). Submitting twice is harmless. */
export async function setSweepStatus(
  ctx: AppContext,
  viewer: Viewer,
  userId: string,
  id: string,
  to: "submitted" | "reviewed",
): Promise<Sweep> {
  const row = await loadVisibleSweep(ctx, viewer, id);
  if (row.status === to) return toSweep(ctx, row);
  if (to === "submitted" && row.status !== "in-progress")
    throw new HttpError(409, "conflict", "This sweep was already reviewed.");
  if (to === "reviewed" && row.status !== "submitted")
    throw new HttpError(
      409,
      "conflict",
      "Only a submitted sweep can be reviewed; the technician has not submitted it yet.",
    );
  const patch =
    to === "submitted"
      ? { status: to, submittedAt: new Date() }
      : { status: to, reviewedAt: new Date(), reviewedById: userId };
  const [updated] = await ctx.db.update(sweeps).set(patch).where(eq(sweeps.id, id)).returning();
  return toSweep(ctx, updated);
}
