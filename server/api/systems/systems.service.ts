import { and, asc, eq, isNull } from "drizzle-orm";
import type { AppContext } from "../../context";
import type { ChargeInput, System, SystemInput, SystemUpdateInput } from "#core/contracts/systems";
import { complianceAudit, systemRevisions, systems } from "../../db/schema/index";
import { companyRules, inServiceOnOf, type CompanyRules } from "../compliance/system-records";
import type { Refrigerant } from "#core/domain/refrigerants/types";
import { KG_PER_POUND } from "#core/domain/units/mass";
import { badRequest, conflict, HttpError, notFound } from "../../lib/http-error";
import { loadVisibleStore, type Viewer } from "../../access/store-access";
import { gwpBasisStatement } from "#core/domain/compliance/co2e";
import { profileWording } from "#core/domain/compliance/company-profile";
import type { CautionRules } from "#core/domain/safety/cautions";
import {
  refrigerantCautions,
  summarizeRefrigerant,
  type GwpChoice,
} from "#core/domain/refrigerants/refrigerant-summary";
import { eventDay } from "../findings/findings.service";
import { localDateOf } from "#core/domain/dates/time-zone";
import { hasRecords, systemsWithRecords } from "./system-has-records";
import {
  holdRefrigerant,
  lookupFor,
  resolveStored,
  type RefrigerantLookup,
} from "../refrigerants/company-refrigerant-lookup";

type SystemRow = typeof systems.$inferSelect;
/** The profile's GWP choice and the company's refrigerants (the catalogue and its own). */
/** The company's GWP choice, its refrigerants, and whose rules its cautions name. */
type Bases = GwpChoice & { lookup: RefrigerantLookup; rules: CautionRules };

/** kg as stored; lb converted at exactly 0.45359237 kg/lb (NIST SP 811, appendix B.8). */
export function chargeToKg(charge: ChargeInput): number {
  return charge.unit === "lb" ? charge.value * KG_PER_POUND : charge.value;
}

/**
 * A refrigerant a system may newly name: from the catalogue, or one the company entered and has
 * not retired. Another company's refrigerant reads as unknown.
 */
export function knownRefrigerant(id: string, lookup: RefrigerantLookup): Refrigerant {
  const r = lookup(id);
  if (!r) {
    throw badRequest(`Please check: refrigerantId ${JSON.stringify(id)} is not a refrigerant you can use.`, {
      refrigerantId: `is not in the catalogue (e.g. R-448A, R-744, R-404A) nor among the company's own refrigerants`,
    });
  }
  if (r.kind === "company" && r.retired)
    throw badRequest(`Please check: ${r.name} was retired by the company.`, {
      refrigerantId: `${r.name} was retired: bring it back under the company's refrigerants first`,
    });
  return r;
}

/** The GWP bases of the profile the company works under (its own, for a custom profile), with its stated basis. */
/** `rules`: the company's rules when the caller has read them already (no second read of the company row). */
export async function companyGwpBases(ctx: AppContext, companyId: string, rules?: CompanyRules): Promise<Bases> {
  const [{ profile }, lookup] = await Promise.all([rules ?? companyRules(ctx, companyId), lookupFor(ctx, companyId)]);
  return {
    bases: profile.gwpBases.value,
    statement: gwpBasisStatement(profile),
    lookup,
    rules: profileWording(profile),
  };
}

/** A system as the API shows it; `hasRecords` says whether it can still be deleted or only retired. */
export function toSystem(row: SystemRow, bases: Bases, hasRecords: boolean, storeTimeZone: string): System {
  // Rows only hold ids checked on write; a missing one is a regression, not bad input.
  const r = resolveStored(bases.lookup, row.refrigerantId);
  return {
    id: row.id,
    storeId: row.storeId,
    name: row.name,
    refrigerantId: r.id,
    fullChargeKg: row.fullChargeKg,
    applianceType: row.applianceType,
    automaticLeakDetection: row.automaticLeakDetection,
    hermeticallySealed: row.hermeticallySealed,
    inServiceOn: inServiceOnOf(row, storeTimeZone),
    retired: row.retiredAt
      ? {
          at: row.retiredAt.toISOString(),
          // Rows retired before the day was asked: the store's day it was recorded.
          on: row.retiredOn ?? localDateOf(row.retiredAt, storeTimeZone),
          reasonKind: row.retireReasonKind,
          reason: row.retireReason ?? "",
        }
      : null,
    hasRecords,
    refrigerant: summarizeRefrigerant(r, bases),
    cautions: refrigerantCautions(r, bases.rules),
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  };
}

/** The store's systems in service; retired ones too when asked (their records stay readable). */
export async function listSystems(
  ctx: AppContext,
  viewer: Viewer,
  storeId: string,
  includeRetired = false,
): Promise<System[]> {
  const store = await loadVisibleStore(ctx, viewer, storeId);
  const bases = await companyGwpBases(ctx, viewer.companyId);
  const rows = await ctx.db
    .select()
    .from(systems)
    .where(and(eq(systems.storeId, storeId), includeRetired ? undefined : isNull(systems.retiredAt)))
    .orderBy(asc(systems.name), asc(systems.id));
  const withRecords = await systemsWithRecords(
    ctx,
    rows.map((r) => r.id),
  );
  return rows.map((r) => toSystem(r, bases, withRecords.has(r.id), store.timeZone));
}

/** A system of the viewer's company in a store they may see, with that store (its calendar dates the system's days). */
export async function loadSystemWithStore(ctx: AppContext, viewer: Viewer, systemId: string) {
  const [row] = await ctx.db
    .select()
    .from(systems)
    .where(and(eq(systems.id, systemId), eq(systems.companyId, viewer.companyId)));
  if (!row) throw notFound("That system");
  try {
    return { row, store: await loadVisibleStore(ctx, viewer, row.storeId) };
  } catch (err) {
    // Only "not your store" becomes "not found"; a database outage stays a 503.
    if (err instanceof HttpError) throw notFound("That system");
    throw err;
  }
}

export async function loadSystem(ctx: AppContext, viewer: Viewer, systemId: string): Promise<SystemRow> {
  return (await loadSystemWithStore(ctx, viewer, systemId)).row;
}

export async function getSystem(ctx: AppContext, viewer: Viewer, systemId: string): Promise<System> {
  const { row, store } = await loadSystemWithStore(ctx, viewer, systemId);
  return toSystem(row, await companyGwpBases(ctx, viewer.companyId), await hasRecords(ctx, systemId), store.timeZone);
}

export async function createSystem(
  ctx: AppContext,
  viewer: Viewer,
  userId: string,
  storeId: string,
  input: SystemInput,
): Promise<System> {
  const store = await loadVisibleStore(ctx, viewer, storeId);
  const choice = await companyGwpBases(ctx, viewer.companyId);
  const r = knownRefrigerant(input.refrigerantId, choice.lookup);
  const facts = {
    refrigerantId: r.id,
    fullChargeKg: chargeToKg(input.fullCharge),
    applianceType: input.applianceType,
    automaticLeakDetection: input.automaticLeakDetection,
    inServiceOn: eventDay(input.inServiceOn, store, "inServiceOn"),
  };
  const hermeticallySealed = input.hermeticallySealed ?? false;
  // The system and its first revision together: history has a starting point from day one.
  const row = await ctx.db.transaction(async (tx) => {
    await holdRefrigerant(tx, viewer.companyId, facts.refrigerantId);
    const [created] = await tx
      .insert(systems)
      .values({ companyId: viewer.companyId, storeId, name: input.name, hermeticallySealed, ...facts })
      .returning();
    await tx.insert(systemRevisions).values({
      companyId: viewer.companyId,
      systemId: created.id,
      effectiveFrom: facts.inServiceOn,
      kind: "first",
      ...facts,
      reason: "Entered",
      byId: userId,
    });
    return created;
  });
  return toSystem(row, choice, false, store.timeZone);
}

/**
 * Edits a system. The name is free to change; the dated facts (charge, refrigerant, type, detection,
 * in-service day) change here only while no record names the system, as a correction from its
 * in-service day. Once records exist, history must not move: such a change is a dated revision
 * (POST /api/systems/:id/revisions, engineers and owners; docs/decisions/0043-system-revisions.md).
 */
export async function updateSystem(
  ctx: AppContext,
  viewer: Viewer,
  userId: string,
  systemId: string,
  input: SystemUpdateInput,
): Promise<System> {
  const { row: loaded, store } = await loadSystemWithStore(ctx, viewer, systemId);
  refuseRetired(loaded);
  // A row written without an in-service day has the store's day it was created: not a change to make.
  const current = { ...loaded, inServiceOn: inServiceOnOf(loaded, store.timeZone) };
  const { name, fullCharge, refrigerantId, hermeticallySealed, ...rest } = input;
  const choice = await companyGwpBases(ctx, viewer.companyId);
  const sameRefrigerant = refrigerantId === undefined || choice.lookup(refrigerantId)?.id === current.refrigerantId;
  const facts = {
    refrigerantId: sameRefrigerant ? current.refrigerantId : knownRefrigerant(refrigerantId, choice.lookup).id,
    fullChargeKg: fullCharge !== undefined ? chargeToKg(fullCharge) : current.fullChargeKg,
    applianceType: rest.applianceType ?? current.applianceType,
    automaticLeakDetection: rest.automaticLeakDetection ?? current.automaticLeakDetection,
    inServiceOn: rest.inServiceOn ?? current.inServiceOn,
  };
  const changed = (Object.keys(facts) as (keyof typeof facts)[]).filter((k) => facts[k] !== current[k]);
  const withRecords = await hasRecords(ctx, systemId);
  const sealedChanged = hermeticallySealed !== undefined && hermeticallySealed !== current.hermeticallySealed;
  if (changed.length > 0 && withRecords) {
    throw new HttpError(
      409,
      "records_exist",
      `${current.name} has records, so ${changed.join(", ")} change by a dated revision (engineers and owners), which keeps past figures as they were.`,
      Object.fromEntries(changed.map((k) => [k, "changes by a dated revision once the system has records"])),
    );
  }
  if (changed.includes("inServiceOn")) eventDay(facts.inServiceOn, store, "inServiceOn");
  const row = await ctx.db.transaction(async (tx) => {
    if (changed.includes("refrigerantId")) await holdRefrigerant(tx, viewer.companyId, facts.refrigerantId);
    const [updated] = await tx
      .update(systems)
      .set({
        ...(name !== undefined ? { name } : {}),
        ...(sealedChanged ? { hermeticallySealed } : {}),
        ...facts,
        updatedAt: new Date(),
      })
      .where(eq(systems.id, systemId))
      .returning();
    // A property, not a dated fact (decision 0122): once records exist its change is on the audit trail.
    if (sealedChanged && withRecords)
      await tx.insert(complianceAudit).values({
        companyId: viewer.companyId,
        systemId,
        action: "system-hermetic-changed",
        byId: userId,
        summary: `${updated.name} ${hermeticallySealed ? "marked" : "no longer marked"} hermetically sealed (factory-sealed, labelled as such)`,
      });
    if (changed.length > 0)
      await tx.insert(systemRevisions).values({
        companyId: viewer.companyId,
        systemId,
        effectiveFrom: facts.inServiceOn,
        kind: "correction",
        ...facts,
        reason: "Edited before any record",
        byId: userId,
      });
    return updated;
  });
  return toSystem(row, choice, withRecords, store.timeZone);
}

/** A retired system's facts are history: no edit and no new record changes them. */
export function refuseRetired(row: { name: string; retiredAt: Date | null; retiredOn: string | null }): void {
  if (row.retiredAt)
    throw conflict(
      `${row.name} was retired on ${row.retiredOn ?? row.retiredAt.toISOString().slice(0, 10)}; its records are kept as they are.`,
    );
}
