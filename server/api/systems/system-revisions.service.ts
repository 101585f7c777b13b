import { asc, eq } from "drizzle-orm";
import { orderedRevisions, revisionsOf } from "./revision-rows";
import type { AppContext } from "../../context";
import type { RevisionInput, System } from "#core/contracts/systems";
import { companies, complianceAudit, systemRevisions, systems, users } from "../../db/schema/index";
import { compareDates, type IsoDate } from "#core/domain/dates/calendar-date";
import { badRequest } from "../../lib/http-error";
import { eventDay } from "../findings/findings.service";
import { rulesOfSettings } from "../compliance/system-records";
import type { Viewer } from "../../access/store-access";
import { designationOf } from "#core/domain/refrigerants/types";
import { formatRecordMass } from "#core/domain/units/format-units";
import { holdRefrigerant, lookupFor, resolveStored } from "../refrigerants/company-refrigerant-lookup";
import {
  chargeToKg,
  companyGwpBases,
  knownRefrigerant,
  loadSystem,
  loadSystemWithStore,
  refuseRetired,
  toSystem,
} from "./systems.service";

type RevisionRow = typeof systemRevisions.$inferSelect;
type Facts = Pick<
  RevisionRow,
  "refrigerantId" | "fullChargeKg" | "applianceType" | "automaticLeakDetection" | "inServiceOn"
>;

/** The revision in force on a date: the latest effective on or before it, else the first. */
function inForce(rows: readonly RevisionRow[], date: IsoDate): RevisionRow | null {
  const list = orderedRevisions(rows);
  let found = list[0] ?? null;
  for (const r of list) if (compareDates(r.effectiveFrom, date) <= 0) found = r;
  return found;
}

export async function listRevisions(ctx: AppContext, viewer: Viewer, systemId: string) {
  await loadSystem(ctx, viewer, systemId);
  const lookup = await lookupFor(ctx, viewer.companyId);
  const rows = await ctx.db
    .select({ r: systemRevisions, by: users.name })
    .from(systemRevisions)
    .leftJoin(users, eq(users.id, systemRevisions.byId))
    .where(eq(systemRevisions.systemId, systemId))
    .orderBy(asc(systemRevisions.effectiveFrom), asc(systemRevisions.recordedAt));
  return rows.map(({ r, by }) => ({
    id: r.id,
    effectiveFrom: r.effectiveFrom,
    kind: r.kind,
    refrigerantId: r.refrigerantId,
    refrigerantName: designationOf(resolveStored(lookup, r.refrigerantId)),
    fullChargeKg: r.fullChargeKg,
    applianceType: r.applianceType,
    automaticLeakDetection: r.automaticLeakDetection,
    inServiceOn: r.inServiceOn,
    reason: r.reason,
    by: by ?? "",
    recordedAt: r.recordedAt.toISOString(),
  }));
}

/**
 * Records a dated revision (engineers and owners; audited). It holds the facts in force on its
 * date with the given ones changed, and is in force until the next revision; the `systems` row
 * takes the values in force today. A retrofit must name a refrigerant other than the one in force,
 * and a refrigerant change that is not a correction is a retrofit (docs/decisions/0043-system-revisions.md).
 */
export async function addRevision(
  ctx: AppContext,
  viewer: Viewer,
  userId: string,
  systemId: string,
  input: RevisionInput,
): Promise<System> {
  const { row: system, store } = await loadSystemWithStore(ctx, viewer, systemId);
  refuseRetired(system);
  const effectiveFrom = eventDay(input.effectiveFrom, store, "effectiveFrom");
  const today = eventDay(undefined, store);
  const existing = await revisionsOf(ctx, [systemId]);
  const base: Facts = inForce(existing, effectiveFrom) ?? {
    refrigerantId: system.refrigerantId,
    fullChargeKg: system.fullChargeKg,
    applianceType: system.applianceType,
    automaticLeakDetection: system.automaticLeakDetection,
    inServiceOn: system.inServiceOn ?? effectiveFrom,
  };
  // One read of the company's row: its rules for the refrigerant choice, its units for the audit's words.
  const [company] = await ctx.db
    .select({
      ruleProfile: companies.ruleProfile,
      method: companies.leakRateMethod,
      number: companies.numberFormat,
      mass: companies.massUnit,
    })
    .from(companies)
    .where(eq(companies.id, viewer.companyId));
  const choice = await companyGwpBases(ctx, viewer.companyId, await rulesOfSettings(ctx, viewer.companyId, company));
  const named = (id: string) => {
    const r = choice.lookup(id);
    return r ? designationOf(r) : id;
  };
  const sameRefrigerant =
    input.refrigerantId === undefined || choice.lookup(input.refrigerantId)?.id === base.refrigerantId;
  const facts: Facts = {
    refrigerantId: sameRefrigerant ? base.refrigerantId : knownRefrigerant(input.refrigerantId!, choice.lookup).id,
    fullChargeKg: input.fullCharge !== undefined ? chargeToKg(input.fullCharge) : base.fullChargeKg,
    applianceType: input.applianceType ?? base.applianceType,
    automaticLeakDetection: input.automaticLeakDetection ?? base.automaticLeakDetection,
    inServiceOn: input.inServiceOn !== undefined ? eventDay(input.inServiceOn, store, "inServiceOn") : base.inServiceOn,
  };
  const newRefrigerant = facts.refrigerantId !== base.refrigerantId;
  if (input.kind === "retrofit" && !newRefrigerant)
    throw badRequest(`Please check: a retrofit needs a refrigerant other than ${named(base.refrigerantId)}.`, {
      refrigerantId: `must differ from ${named(base.refrigerantId)}, the refrigerant in force on ${effectiveFrom}`,
    });
  if (input.kind === "change" && newRefrigerant)
    throw badRequest("Please check: a change of refrigerant is a retrofit (or a correction of a wrong entry).", {
      kind: "must be retrofit (new refrigerant) or correction (the refrigerant was entered wrongly)",
    });
  if (compareDates(facts.inServiceOn, effectiveFrom) > 0 && input.kind !== "correction")
    throw badRequest("Please check: the system must be in service on the day the revision takes effect.", {
      effectiveFrom: `must be on or after the in-service day ${facts.inServiceOn}`,
    });
  const mass = (kg: number) => formatRecordMass(kg, company?.mass ?? "kg", company?.number);
  const updated = await ctx.db.transaction(async (tx) => {
    if (newRefrigerant) await holdRefrigerant(tx, viewer.companyId, facts.refrigerantId);
    const [row] = await tx
      .insert(systemRevisions)
      .values({
        companyId: viewer.companyId,
        systemId,
        effectiveFrom,
        kind: input.kind,
        ...facts,
        reason: input.reason,
        byId: userId,
      })
      .returning();
    const now = inForce([...existing, row], today)!;
    const [s] = await tx
      .update(systems)
      .set({
        refrigerantId: now.refrigerantId,
        fullChargeKg: now.fullChargeKg,
        applianceType: now.applianceType,
        automaticLeakDetection: now.automaticLeakDetection,
        inServiceOn: now.inServiceOn,
        updatedAt: new Date(),
      })
      .where(eq(systems.id, systemId))
      .returning();
    await tx.insert(complianceAudit).values({
      companyId: viewer.companyId,
      systemId,
      action: "system-revised",
      byId: userId,
      summary: `${input.kind === "retrofit" ? "Retrofit" : input.kind === "correction" ? "Correction" : "Change"} from ${effectiveFrom}: ${describeChange(base, facts, named, mass)}; reason: ${input.reason}`,
    });
    return s;
  });
  return toSystem(updated, choice, true, store.timeZone);
}

/** The audit's words for a revision; a mass in both units and the company's number format, as the records write it. */
function describeChange(
  before: Facts,
  after: Facts,
  named: (id: string) => string,
  mass: (kg: number) => string,
): string {
  const parts: string[] = [];
  if (before.refrigerantId !== after.refrigerantId)
    parts.push(`refrigerant ${named(before.refrigerantId)} → ${named(after.refrigerantId)}`);
  if (before.fullChargeKg !== after.fullChargeKg)
    parts.push(`full charge ${mass(before.fullChargeKg)} → ${mass(after.fullChargeKg)}`);
  if (before.applianceType !== after.applianceType)
    parts.push(`appliance type ${before.applianceType} → ${after.applianceType}`);
  if (before.automaticLeakDetection !== after.automaticLeakDetection)
    parts.push(`automatic leak detection ${after.automaticLeakDetection ? "added" : "removed"}`);
  if (before.inServiceOn !== after.inServiceOn) parts.push(`in service ${before.inServiceOn} → ${after.inServiceOn}`);
  return parts.join(", ") || "no value changed";
}
