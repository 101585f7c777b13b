import { and, asc, eq, isNull } from "drizzle-orm";
import type { AppContext } from "../../context";
import { companies, detectors } from "../../db/schema/index";
import type { Detector, DetectorInput } from "#core/contracts/detectors";
import { addDays, compareDates } from "#core/domain/dates/calendar-date";
import { localDateOf } from "#core/domain/dates/time-zone";
import { notFound } from "../../lib/http-error";

type Row = typeof detectors.$inferSelect;

/** When the next calibration / bump check falls due, and whether that is past (today in `timeZone`). */
export function checkStatus(lastCheckedOn: string | null, intervalDays: number, now: Date, timeZone = "UTC") {
  if (!lastCheckedOn) return { checkDueOn: null, overdue: true };
  const checkDueOn = addDays(lastCheckedOn, intervalDays);
  return { checkDueOn, overdue: compareDates(localDateOf(now, timeZone), checkDueOn) > 0 };
}

function toDetector(row: Row, intervalDays: number): Detector {
  return {
    id: row.id,
    name: row.name,
    principle: row.principle,
    transportDelayS: row.transportDelayS,
    timeConstantS: row.timeConstantS,
    alarmPpm: row.alarmPpm,
    lastCheckedOn: row.lastCheckedOn,
    levelScale: row.levelScale ?? null,
    archivedAt: row.archivedAt?.toISOString() ?? null,
    ...checkStatus(row.lastCheckedOn, intervalDays, new Date()),
  };
}

async function intervalOf(ctx: AppContext, companyId: string): Promise<number> {
  const [c] = await ctx.db
    .select({ days: companies.detectorCheckIntervalDays })
    .from(companies)
    .where(eq(companies.id, companyId));
  return c.days;
}

export async function listDetectors(ctx: AppContext, companyId: string, includeArchived: boolean): Promise<Detector[]> {
  const days = await intervalOf(ctx, companyId);
  const rows = await ctx.db
    .select()
    .from(detectors)
    .where(and(eq(detectors.companyId, companyId), includeArchived ? undefined : isNull(detectors.archivedAt)))
    .orderBy(asc(detectors.name));
  return rows.map((r) => toDetector(r, days));
}

export async function getDetector(ctx: AppContext, companyId: string, id: string): Promise<Detector> {
  const [row] = await ctx.db
    .select()
    .from(detectors)
    .where(and(eq(detectors.id, id), eq(detectors.companyId, companyId)));
  if (!row) throw notFound("That detector");
  return toDetector(row, await intervalOf(ctx, companyId));
}

export async function createDetector(ctx: AppContext, companyId: string, input: DetectorInput): Promise<Detector> {
  const [row] = await ctx.db
    .insert(detectors)
    .values({ ...input, companyId })
    .returning();
  return toDetector(row, await intervalOf(ctx, companyId));
}

export async function updateDetector(
  ctx: AppContext,
  companyId: string,
  id: string,
  input: DetectorInput,
): Promise<Detector> {
  const [row] = await ctx.db
    .update(detectors)
    .set(input)
    .where(and(eq(detectors.id, id), eq(detectors.companyId, companyId)))
    .returning();
  if (!row) throw notFound("That detector");
  return toDetector(row, await intervalOf(ctx, companyId));
}

export async function setDetectorArchived(
  ctx: AppContext,
  companyId: string,
  id: string,
  archived: boolean,
): Promise<Detector> {
  const [row] = await ctx.db
    .update(detectors)
    .set({ archivedAt: archived ? new Date() : null })
    .where(and(eq(detectors.id, id), eq(detectors.companyId, companyId)))
    .returning();
  if (!row) throw notFound("That detector");
  return toDetector(row, await intervalOf(ctx, companyId));
}
