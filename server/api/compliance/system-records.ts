import { and, asc, desc, eq, inArray } from "drizzle-orm";
import type { AppContext } from "../../context";
import {
  chargeAdditions,
  chronicLeakerReports,
  companies,
  customRuleProfiles,
  findingEvents,
  findings,
  leakChecks,
  leakDetectionChecks,
  stores,
  systems,
} from "../../db/schema/index";
import { profileFor } from "#core/domain/compliance/company-profile";
import type { ChargeAddition } from "#core/domain/compliance/leak-rate";
import type { LeakRateMethod, RuleProfile } from "#core/domain/compliance/rule-profile";
import { systemStatus, type SystemStatus } from "#core/domain/compliance/system-status";
import { localDateOf } from "#core/domain/dates/time-zone";
import { lookupFor, resolveStored } from "../refrigerants/company-refrigerant-lookup";
import { designationOf } from "#core/domain/refrigerants/types";
import { revisionsOf } from "../systems/revision-rows";
import type { NumberFormat } from "#core/domain/numbers/number-format";

export type SystemRow = typeof systems.$inferSelect;
export type StoreRow = typeof stores.$inferSelect;

export interface CompanyRules {
  profile: RuleProfile;
  method: LeakRateMethod;
  /** The company's number format: the figures in the rules' reasons are written in it. */
  numberFormat?: NumberFormat;
}

/** The latest saved custom profile of a company, or null when none was saved. */
export async function latestCustomProfile(ctx: AppContext, companyId: string) {
  const [row] = await ctx.db
    .select()
    .from(customRuleProfiles)
    .where(eq(customRuleProfiles.companyId, companyId))
    .orderBy(desc(customRuleProfiles.savedAt), desc(customRuleProfiles.id))
    .limit(1);
  return row ?? null;
}

/** The company's rules: the profile its setting names (its own stored one for "custom") and its method. */
export async function companyRules(ctx: AppContext, companyId: string): Promise<CompanyRules> {
  const [c] = await ctx.db
    .select({ ruleProfile: companies.ruleProfile, method: companies.leakRateMethod, number: companies.numberFormat })
    .from(companies)
    .where(eq(companies.id, companyId));
  return rulesOfSettings(ctx, companyId, c);
}

/** The rules from a company row the caller has already read (a custom profile is read from its own table). */
export async function rulesOfSettings(
  ctx: AppContext,
  companyId: string,
  c: { ruleProfile: RuleProfileSetting; method: LeakRateMethod; number: NumberFormat } | undefined,
): Promise<CompanyRules> {
  const setting = c?.ruleProfile ?? "us-federal";
  const custom = setting === "custom" ? ((await latestCustomProfile(ctx, companyId))?.profile ?? null) : null;
  return { profile: profileFor(setting, custom), method: c?.method ?? "annualizing", numberFormat: c?.number };
}

type RuleProfileSetting = (typeof companies.$inferSelect)["ruleProfile"];

export interface SystemWithStatus {
  system: SystemRow;
  store: StoreRow;
  today: string;
  status: SystemStatus;
  /** The designation a reader sees: the R-number, or the company's name for its own refrigerant. */
  refrigerantName: string;
}

/**
 * Loads the records of the given systems (charge added, finding events, leak checks) in four
 * queries and computes each system's status on its store's today.
 */
export async function statusesOf(
  ctx: AppContext,
  rules: CompanyRules,
  rows: { system: SystemRow; store: StoreRow }[],
  now = new Date(),
): Promise<SystemWithStatus[]> {
  if (rows.length === 0) return [];
  const ids = rows.map((r) => r.system.id);
  const [adds, events, checks, ldsChecks, filed, revisions, lookup] = await Promise.all([
    ctx.db
      .select()
      .from(chargeAdditions)
      .where(inArray(chargeAdditions.systemId, ids))
      .orderBy(asc(chargeAdditions.addedOn), asc(chargeAdditions.recordedAt)),
    ctx.db
      .select({
        systemId: findings.systemId,
        findingId: findingEvents.findingId,
        kind: findingEvents.kind,
        on: findingEvents.on,
        result: findingEvents.result,
        status: findingEvents.status,
      })
      .from(findingEvents)
      .innerJoin(findings, eq(findings.id, findingEvents.findingId))
      .where(inArray(findings.systemId, ids))
      .orderBy(asc(findingEvents.at), asc(findingEvents.id)),
    ctx.db.select().from(leakChecks).where(inArray(leakChecks.systemId, ids)),
    ctx.db.select().from(leakDetectionChecks).where(inArray(leakDetectionChecks.systemId, ids)),
    ctx.db
      .select({ systemId: chronicLeakerReports.systemId, year: chronicLeakerReports.year })
      .from(chronicLeakerReports)
      .where(inArray(chronicLeakerReports.systemId, ids)),
    revisionsOf(ctx, ids),
    // The company's own refrigerants count as the catalogue's do (docs/decisions/0073).
    lookupFor(ctx, rows[0].system.companyId),
  ]);
  return rows.map(({ system, store }) => {
    const today = localDateOf(now, store.timeZone);
    const additions: ChargeAddition[] = adds
      .filter((a) => a.systemId === system.id)
      .map((a) => ({
        id: a.id,
        date: a.addedOn,
        amountKg: a.amountKg,
        voided: a.voidedAt !== null,
        findingId: a.findingId,
        ...(a.excluded ? { excluded: a.excluded } : {}),
      }));
    const mine = events.filter((e) => e.systemId === system.id);
    const byFinding = new Map<string, typeof mine>();
    for (const e of mine) byFinding.set(e.findingId, [...(byFinding.get(e.findingId) ?? []), e]);
    const pendingFollowUps: { findingId: string; repairedOn: string; initialTestOn: string | null }[] = [];
    for (const [findingId, list] of byFinding) {
      const last = list.at(-1)!;
      if (last.status !== "repaired") continue;
      const repair = [...list].reverse().find((e) => e.kind === "repaired");
      if (!repair) continue;
      const after = list.slice(list.indexOf(repair) + 1);
      const initial = after.find((e) => e.kind === "initial-test" && e.result === "passed");
      pendingFollowUps.push({ findingId, repairedOn: repair.on, initialTestOn: initial?.on ?? null });
    }
    const status = systemStatus(
      rules.profile,
      rules.method,
      {
        refrigerant: resolveStored(lookup, system.refrigerantId),
        fullChargeKg: system.fullChargeKg,
        applianceType: system.applianceType,
        automaticLeakDetection: system.automaticLeakDetection,
        enteredOn: inServiceOnOf(system, store.timeZone),
        // Every figure uses the values in force on its date (docs/decisions/0043-system-revisions.md).
        revisions: revisions
          .filter((r) => r.systemId === system.id)
          .map((r) => ({
            effectiveFrom: r.effectiveFrom,
            kind: r.kind,
            refrigerant: resolveStored(lookup, r.refrigerantId),
            fullChargeKg: r.fullChargeKg,
            applianceType: r.applianceType,
            automaticLeakDetection: r.automaticLeakDetection,
            inServiceOn: r.inServiceOn,
          })),
        additions,
        repairedOn: mine.filter((e) => e.kind === "repaired").map((e) => e.on),
        findingRepairs: mine.filter((e) => e.kind === "repaired").map((e) => ({ findingId: e.findingId, on: e.on })),
        pendingFollowUps,
        followUpVerifiedOn: mine.filter((e) => e.kind === "follow-up-test" && e.result === "passed").map((e) => e.on),
        failedFollowUps: mine
          .filter((e) => e.kind === "follow-up-test" && e.result === "failed")
          .map((e) => ({ findingId: e.findingId, on: e.on })),
        leakChecks: checks
          .filter((c) => c.systemId === system.id)
          .map((c) => ({ checkedOn: c.checkedOn, leakFound: c.leakFound })),
        chronicReportsFiled: filed.filter((f) => f.systemId === system.id).map((f) => f.year),
        retiredOn: retiredOnOf(system, store.timeZone),
        hermeticallySealed: system.hermeticallySealed,
        leakDetectionChecks: ldsChecks
          .filter((c) => c.systemId === system.id)
          .map((c) => ({ checkedOn: c.checkedOn, working: c.working })),
      },
      today,
      rules.numberFormat,
    );
    return {
      system,
      store,
      today,
      status,
      refrigerantName: designationOf(resolveStored(lookup, system.refrigerantId)),
    };
  });
}

/**
 * The day a system entered service: as entered, else (a row written without one) the store's day it was
 * created, as the backfill of migration 0010 set it. Never the UTC day: an evening entry in New York is
 * already tomorrow in UTC.
 */
export function inServiceOnOf(system: Pick<SystemRow, "inServiceOn" | "createdAt">, timeZone: string): string {
  return system.inServiceOn ?? localDateOf(system.createdAt, timeZone);
}

/** The day a system left service: as asked since it was (decision 0124), else the store's day of the retirement. */
export function retiredOnOf(system: Pick<SystemRow, "retiredAt" | "retiredOn">, timeZone: string): string | null {
  if (!system.retiredAt) return null;
  return system.retiredOn ?? localDateOf(system.retiredAt, timeZone);
}

/** One system with its store, in the viewer's company (the caller checks store visibility). */
export async function systemWithStore(ctx: AppContext, companyId: string, systemId: string) {
  const [row] = await ctx.db
    .select({ system: systems, store: stores })
    .from(systems)
    .innerJoin(stores, eq(stores.id, systems.storeId))
    .where(and(eq(systems.id, systemId), eq(systems.companyId, companyId)));
  return row ?? null;
}
