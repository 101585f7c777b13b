import { inArray } from "drizzle-orm";
import type { AppContext } from "../../context";
import { systemRevisions } from "../../db/schema/index";
import { compareDates } from "#core/domain/dates/calendar-date";

/** Revisions in the order they take effect (same day: the later recorded wins). */
export function orderedRevisions<T extends { effectiveFrom: string; recordedAt: Date }>(rows: readonly T[]): T[] {
  return [...rows].sort(
    (a, b) => compareDates(a.effectiveFrom, b.effectiveFrom) || a.recordedAt.getTime() - b.recordedAt.getTime(),
  );
}

/** Revisions of several systems, in effect order, one query. */
export async function revisionsOf(ctx: AppContext, systemIds: readonly string[]) {
  if (systemIds.length === 0) return [];
  return orderedRevisions(
    await ctx.db
      .select()
      .from(systemRevisions)
      .where(inArray(systemRevisions.systemId, [...systemIds])),
  );
}
