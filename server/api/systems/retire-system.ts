import { and, desc, eq, isNull } from "drizzle-orm";
import type { AppContext } from "../../context";
import { RETIRE_REASON_NAMES, type RetireInput, type SystemRemoval } from "#core/contracts/systems";
import { compareDates } from "#core/domain/dates/calendar-date";
import { formatCalendarDay } from "#core/domain/dates/format-in-zone";
import {
  chargeAdditions,
  complianceAudit,
  findingEvents,
  findings,
  leakChecks,
  leakDetectionChecks,
  systemRevisions,
  systems,
} from "../../db/schema/index";
import type { Viewer } from "../../access/store-access";
import { badRequest, conflict, HttpError } from "../../lib/http-error";
import { eventDay } from "../findings/findings.service";
import { hasRecords } from "./system-has-records";
import { inServiceOnOf } from "../compliance/system-records";
import { companyGwpBases, loadSystem, loadSystemWithStore, refuseRetired, toSystem } from "./systems.service";

const FOREIGN_KEY_VIOLATION = "23503";

/** How the refusal names a leak record's latest event ("must not be before 4 Apr 2026, when …"). */
const LEAK_EVENT_WORDS: Record<(typeof findingEvents.$inferSelect)["kind"], string> = {
  found: "a leak was recorded",
  confirmed: "a leak was confirmed",
  repaired: "a leak was repaired",
  "initial-test": "a repair's initial verification test was recorded",
  "follow-up-test": "a repair's follow-up verification test was recorded",
  closed: "a leak record was closed",
  "closed-left-service": "a leak record was closed as its system left service",
  dismissed: "a suspected leak was dismissed",
};

function isForeignKeyViolation(e: unknown): boolean {
  const cause = (e as { cause?: { code?: string }; code?: string }) ?? {};
  return cause.code === FOREIGN_KEY_VIOLATION || cause.cause?.code === FOREIGN_KEY_VIOLATION;
}

const mustRetire = (name: string) =>
  new HttpError(
    409,
    "records_exist",
    `${name} has records, so it cannot be deleted: retire it instead ("Retire system…"), with the day it left service and the reason.`,
  );

/**
 * Deletes a system that no record names (fixtures linked to it lose the link). One with records is
 * never deleted: the answer is 409 and the client offers "Retire system…", which asks the day and
 * the reason (docs/decisions/0040-no-record-is-lost.md, 0124). The records' foreign keys restrict
 * deletes, so a record written between the check and the delete also ends in that 409.
 */
export async function deleteSystem(ctx: AppContext, viewer: Viewer, systemId: string): Promise<SystemRemoval> {
  const row = await loadSystem(ctx, viewer, systemId);
  refuseRetired(row);
  if (await hasRecords(ctx, systemId)) throw mustRetire(row.name);
  try {
    await ctx.db.transaction(async (tx) => {
      await tx.delete(systemRevisions).where(eq(systemRevisions.systemId, systemId));
      await tx.delete(systems).where(eq(systems.id, systemId));
    });
  } catch (e) {
    if (isForeignKeyViolation(e)) throw mustRetire(row.name);
    throw e;
  }
  return { outcome: "deleted", system: null };
}

/**
 * The latest day any dated record of the system names: a retirement before it would leave a record
 * after it. A leak finding counts by each of its events (found, repaired, tested, closed…), on the
 * store's calendar.
 */
async function lastRecordDay(ctx: AppContext, systemId: string): Promise<{ on: string; what: string } | null> {
  const [add, check, lds, leak] = await Promise.all([
    ctx.db
      .select({ on: chargeAdditions.addedOn })
      .from(chargeAdditions)
      .where(and(eq(chargeAdditions.systemId, systemId), isNull(chargeAdditions.voidedAt)))
      .orderBy(desc(chargeAdditions.addedOn))
      .limit(1),
    ctx.db
      .select({ on: leakChecks.checkedOn })
      .from(leakChecks)
      .where(eq(leakChecks.systemId, systemId))
      .orderBy(desc(leakChecks.checkedOn))
      .limit(1),
    ctx.db
      .select({ on: leakDetectionChecks.checkedOn })
      .from(leakDetectionChecks)
      .where(eq(leakDetectionChecks.systemId, systemId))
      .orderBy(desc(leakDetectionChecks.checkedOn))
      .limit(1),
    ctx.db
      .select({ on: findingEvents.on, kind: findingEvents.kind })
      .from(findingEvents)
      .innerJoin(findings, eq(findings.id, findingEvents.findingId))
      .where(eq(findings.systemId, systemId))
      .orderBy(desc(findingEvents.on))
      .limit(1),
  ]);
  const found = [
    ...add.map((r) => ({ on: r.on, what: "refrigerant was added" })),
    ...check.map((r) => ({ on: r.on, what: "a leak check was recorded" })),
    ...lds.map((r) => ({ on: r.on, what: "its leak detection system was checked" })),
    ...leak.map((r) => ({ on: r.on, what: LEAK_EVENT_WORDS[r.kind] })),
  ].sort((a, b) => compareDates(b.on, a.on));
  return found[0] ?? null;
}

/**
 * Retires a system on the day it left service, with the reason, and an audit row in the same
 * transaction; every record stays for the profile's retention period from that day. The day is on
 * the store's calendar: not after today, not before the in-service day, not before its last record.
 */
export async function retireSystem(
  ctx: AppContext,
  viewer: Viewer,
  userId: string,
  systemId: string,
  input: RetireInput,
): Promise<SystemRemoval> {
  const { row, store } = await loadSystemWithStore(ctx, viewer, systemId);
  refuseRetired(row);
  const retiredOn = eventDay(input.retiredOn, store, "retiredOn");
  const inService = inServiceOnOf(row, store.timeZone);
  if (compareDates(retiredOn, inService) < 0)
    throw badRequest(`Please check: retiredOn ${retiredOn} is before the system entered service (${inService}).`, {
      retiredOn: `must not be before the day it entered service (${formatCalendarDay(inService)})`,
    });
  const last = await lastRecordDay(ctx, systemId);
  if (last && compareDates(retiredOn, last.on) < 0)
    throw badRequest(`Please check: retiredOn ${retiredOn} is before the system's last record (${last.on}).`, {
      retiredOn: `must not be before ${formatCalendarDay(last.on)}, when ${last.what}`,
    });
  const retired = await ctx.db.transaction(async (tx) => {
    const at = new Date();
    const [r] = await tx
      .update(systems)
      .set({
        retiredAt: at,
        retiredOn,
        retiredById: userId,
        retireReasonKind: input.reasonKind,
        retireReason: input.reason,
        updatedAt: at,
      })
      .where(and(eq(systems.id, systemId), isNull(systems.retiredAt)))
      .returning();
    if (!r) throw conflict(`${row.name} was retired meanwhile; its records are kept as they are.`);
    const why = input.reasonKind === "other" ? input.reason : RETIRE_REASON_NAMES[input.reasonKind];
    const note = input.reasonKind !== "other" && input.reason ? ` (${input.reason})` : "";
    await tx.insert(complianceAudit).values({
      companyId: viewer.companyId,
      systemId,
      action: "system-retired",
      byId: userId,
      summary: `${r.name} retired: left service on ${retiredOn}; ${why}${note}; its records are kept`,
    });
    return r;
  });
  return {
    outcome: "retired",
    system: toSystem(retired, await companyGwpBases(ctx, viewer.companyId), true, store.timeZone),
  };
}
