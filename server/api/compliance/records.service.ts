import { and, asc, desc, eq, inArray, isNull, max } from "drizzle-orm";
import type { z } from "zod";
import type { AppContext } from "../../context";
import type {
  ChargeAdditionView,
  SystemRecordsView,
  chargeAdditionInput,
  chargeCorrectionInput,
  chronicReportInput,
  leakCheckInput,
  leakDetectionCheckInput,
} from "#core/contracts/compliance";
import {
  chargeAdditions,
  chronicLeakerReports,
  complianceAudit,
  findingEvents,
  findings,
  leakChecks,
  leakDetectionChecks,
  memberships,
  users,
} from "../../db/schema/index";
import type { AssessedPoint } from "#core/domain/compliance/assess-leak-rate";
import type { LeakRatePart } from "#core/domain/compliance/rule-profile";
import { recordRetention } from "#core/domain/compliance/retention";
import { chargeToKg, companyGwpBases, refuseRetired, toSystem } from "../systems/systems.service";
import { badRequest, conflict, notFound, HttpError } from "../../lib/http-error";
import { eventDay } from "../findings/findings.service";
import { loadVisibleStore, type Viewer } from "../../access/store-access";
import { systemDueItems } from "./due-items";
import { hasRecords } from "../systems/system-has-records";
import { companyRules, retiredOnOf, statusesOf, systemWithStore, type CompanyRules } from "./system-records";
import { profileWording } from "#core/domain/compliance/company-profile";
import { readableDays } from "#core/domain/compliance/audit-entry";

type AdditionInput = z.output<typeof chargeAdditionInput>;
type CorrectionInput = z.output<typeof chargeCorrectionInput>;
type LeakCheckInput = z.output<typeof leakCheckInput>;
type ChronicReportInput = z.output<typeof chronicReportInput>;
type LeakDetectionCheckInput = z.output<typeof leakDetectionCheckInput>;

/** The system and its store when the viewer may see them; 404 otherwise (never 403). */
export async function visibleSystem(ctx: AppContext, viewer: Viewer, systemId: string) {
  const row = await systemWithStore(ctx, viewer.companyId, systemId);
  if (!row) throw notFound("That system");
  try {
    await loadVisibleStore(ctx, viewer, row.store.id);
  } catch (err) {
    // Only "not your store" becomes "not found"; a database outage stays a 503.
    if (err instanceof HttpError) throw notFound("That system");
    throw err;
  }
  return row;
}

const toRow = (p: AssessedPoint) => ({
  date: p.date,
  method: p.method,
  percent: p.percent,
  countedKg: p.countedKg,
  days: p.days,
  windowStart: p.windowStart ?? null,
  additionIds: p.additionIds,
  partId: p.partId,
  thresholdPercent: p.thresholdPercent,
  thresholdSource: p.thresholdSource,
  exceeds: p.exceeds,
  repairDue: p.repairDue ?? null,
});

async function additionViews(ctx: AppContext, systemId: string): Promise<ChargeAdditionView[]> {
  const rows = await ctx.db
    .select()
    .from(chargeAdditions)
    .where(eq(chargeAdditions.systemId, systemId))
    .orderBy(asc(chargeAdditions.addedOn), asc(chargeAdditions.recordedAt));
  const ids = [
    ...new Set(rows.flatMap((r) => [r.technicianId, r.recordedById, r.voidedById].filter((x): x is string => !!x))),
  ];
  const names = new Map(
    (ids.length
      ? await ctx.db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, ids))
      : []
    ).map((u) => [u.id, u.name]),
  );
  return rows.map((r) => ({
    id: r.id,
    systemId: r.systemId,
    addedOn: r.addedOn,
    amountKg: r.amountKg,
    enteredValue: r.enteredValue,
    enteredUnit: r.enteredUnit,
    technician: names.get(r.technicianId) ?? "",
    reason: r.reason,
    excluded: r.excluded,
    findingId: r.findingId,
    correctsId: r.correctsId,
    recordedBy: names.get(r.recordedById) ?? "",
    recordedAt: r.recordedAt.toISOString(),
    voided: r.voidedAt
      ? {
          at: r.voidedAt.toISOString(),
          by: names.get(r.voidedById ?? "") ?? "",
          reason: r.voidReason ?? "",
          byEntryId: rows.find((c) => c.correctsId === r.id)?.id ?? null,
        }
      : null,
  }));
}

export async function getSystemRecords(
  ctx: AppContext,
  viewer: Viewer,
  systemId: string,
  now = new Date(),
  /** The company's rules when the caller has read them already (a statement, the archive). */
  preloaded?: CompanyRules,
): Promise<SystemRecordsView> {
  const row = await visibleSystem(ctx, viewer, systemId);
  const rules = preloaded ?? (await companyRules(ctx, viewer.companyId));
  const [s] = await statusesOf(ctx, rules, [row], now);
  const st = s.status;
  // Independent reads of the system's records: asked together, not one after another.
  const [checks, ldsChecks, reports, audit, withRecords, latestStep] = await Promise.all([
    ctx.db
      .select({ c: leakChecks, by: users.name })
      .from(leakChecks)
      .innerJoin(users, eq(users.id, leakChecks.byId))
      .where(eq(leakChecks.systemId, systemId))
      .orderBy(asc(leakChecks.checkedOn), asc(leakChecks.recordedAt)),
    ctx.db
      .select({ c: leakDetectionChecks, by: users.name })
      .from(leakDetectionChecks)
      .innerJoin(users, eq(users.id, leakDetectionChecks.byId))
      .where(eq(leakDetectionChecks.systemId, systemId))
      .orderBy(asc(leakDetectionChecks.checkedOn), asc(leakDetectionChecks.recordedAt)),
    ctx.db
      .select({ r: chronicLeakerReports, by: users.name })
      .from(chronicLeakerReports)
      .innerJoin(users, eq(users.id, chronicLeakerReports.filedById))
      .where(eq(chronicLeakerReports.systemId, systemId)),
    ctx.db
      .select({ a: complianceAudit, by: users.name })
      .from(complianceAudit)
      .innerJoin(users, eq(users.id, complianceAudit.byId))
      .where(eq(complianceAudit.systemId, systemId))
      .orderBy(desc(complianceAudit.at), desc(complianceAudit.id)),
    hasRecords(ctx, systemId),
    // A finding closed because the system left service is dated after the retirement (docs/decisions/0166).
    ctx.db
      .select({ on: max(findingEvents.on) })
      .from(findingEvents)
      .innerJoin(findings, eq(findings.id, findingEvents.findingId))
      .where(eq(findings.systemId, systemId)),
  ]);
  const system = toSystem(
    row.system,
    await companyGwpBases(ctx, viewer.companyId, rules),
    withRecords,
    row.store.timeZone,
  );
  const lc = st.leakCheck;
  return {
    system,
    store: { id: row.store.id, name: row.store.name, timeZone: row.store.timeZone },
    today: s.today,
    profile: {
      id: rules.profile.id,
      name: rules.profile.name,
      method: rules.method,
      retentionYears: rules.profile.recordRetentionYears.value,
      retentionSource: rules.profile.recordRetentionYears.source,
      wording: profileWording(rules.profile),
      leakRateRules: rules.profile.leakRateParts.length > 0,
    },
    retention: recordRetention(rules.profile, retiredOnOf(row.system, row.store.timeZone), latestStep[0]?.on ?? null),
    applicability: st.applicability,
    automaticLeakDetection: st.automaticLeakDetection,
    leakRates: st.points.map(toRow),
    latest: st.latest ? toRow(st.latest) : null,
    overThreshold: st.overThreshold,
    // The rule the listed years were judged by: the part of the latest year (after a retrofit that may be
    // the part before it, docs/decisions/0043-system-revisions.md), else the part in force today.
    chronicRule: chronicRuleOf(
      rules.profile.leakRateParts.find(
        (p) =>
          p.id === (st.chronic.filter((y) => y.partId).at(-1)?.partId ?? st.applicability.partId ?? st.latest?.partId),
      ) ?? null,
    ),
    chronic: st.chronic.map((y) => {
      const f = reports.find((x) => x.r.year === y.year);
      return {
        year: y.year,
        addedKg: y.addedKg,
        percent: y.percent,
        chronic: y.chronic,
        reportDue: y.reportDue ?? null,
        notCountedKg: y.notCountedKg,
        // No leak-repair part applied in the year: listed so the totals add up, not judged (decision 0127).
        noPart: y.noPart === null ? null : readableDays(y.noPart),
        filed: f
          ? {
              on: f.r.filedOn,
              by: f.by,
              reference: f.r.reference,
              note: f.r.note,
              recordedAt: f.r.recordedAt.toISOString(),
            }
          : null,
      };
    }),
    audit: audit.map((x) => ({ at: x.a.at.toISOString(), by: x.by, action: x.a.action, summary: x.a.summary })),
    co2e: st.co2e.known
      ? { known: true, tonnes: st.co2e.tonnes, gwp: st.co2e.gwp, source: st.co2e.gwpSource }
      : { known: false, tonnes: null, gwp: null, source: st.co2e.reason },
    leakCheck: lc
      ? {
          withLdsMonths: lc.withLds.required ? lc.withLds.months : null,
          withoutLdsMonths: lc.withoutLds.required ? lc.withoutLds.months : null,
          appliedMonths: lc.applied.required ? lc.applied.months : null,
          ldsRequired: lc.applied.required ? lc.applied.ldsRequired : false,
          reason: lc.applied.reason,
        }
      : null,
    nextInspection: st.nextInspection,
    due: systemDueItems(s, now),
    additions: await additionViews(ctx, systemId),
    leakChecks: checks.map((x) => ({
      id: x.c.id,
      checkedOn: x.c.checkedOn,
      leakFound: x.c.leakFound,
      note: x.c.note,
      by: x.by,
    })),
    leakDetectionChecks: ldsChecks.map((x) => ({
      id: x.c.id,
      checkedOn: x.c.checkedOn,
      working: x.c.working,
      note: x.c.note,
      by: x.by,
    })),
    leakDetectionCheckOwed: !!st.leakCheck?.applied.required && st.leakCheck.applied.ldsRequired,
    cautions: system.cautions,
  };
}

const MONTHS = [
  "January",
  "February",
  "March",
  "April",
  "May",
  "June",
  "July",
  "August",
  "September",
  "October",
  "November",
  "December",
];
function chronicRuleOf(part: LeakRatePart | null) {
  if (!part) return null;
  const c = part.chronicLeaker;
  return {
    percent: c.percentOfFullCharge.value,
    reportBy: `${c.reportBy.value.day} ${MONTHS[c.reportBy.value.month - 1]} of the next year`,
    source: `${c.percentOfFullCharge.source}; ${c.reportBy.source}`,
  };
}

async function checkAdditionRefs(
  ctx: AppContext,
  viewer: Viewer,
  systemId: string,
  input: AdditionInput,
): Promise<void> {
  if (input.technicianId) {
    const [m] = await ctx.db
      .select({ role: memberships.role })
      .from(memberships)
      .where(and(eq(memberships.userId, input.technicianId), eq(memberships.companyId, viewer.companyId)));
    if (!m || m.role === "store-contact")
      throw badRequest("Please check: technicianId is not a technician of this company.", {
        technicianId: "is not a member of this company who services systems",
      });
  }
  if (input.findingId) {
    const [f] = await ctx.db
      .select({ id: findings.id })
      .from(findings)
      .where(
        and(
          eq(findings.id, input.findingId),
          eq(findings.systemId, systemId),
          eq(findings.companyId, viewer.companyId),
        ),
      );
    if (!f)
      throw badRequest("Please check: findingId is not a finding on this system.", {
        findingId: "is not a finding on this system",
      });
  }
}

function values(viewer: Viewer, userId: string, systemId: string, addedOn: string, input: AdditionInput) {
  return {
    companyId: viewer.companyId,
    systemId,
    addedOn,
    amountKg: chargeToKg(input.amount),
    enteredValue: input.amount.value,
    enteredUnit: input.amount.unit,
    technicianId: input.technicianId ?? userId,
    reason: input.reason,
    excluded: input.excluded,
    findingId: input.findingId,
    recordedById: userId,
  };
}

export async function addCharge(
  ctx: AppContext,
  viewer: Viewer,
  userId: string,
  systemId: string,
  input: AdditionInput,
) {
  const { store, system } = await visibleSystem(ctx, viewer, systemId);
  refuseRetired(system);
  const addedOn = eventDay(input.addedOn, store, "addedOn");
  await checkAdditionRefs(ctx, viewer, systemId, input);
  const [row] = await ctx.db
    .insert(chargeAdditions)
    .values(values(viewer, userId, systemId, addedOn, input))
    .returning({ id: chargeAdditions.id });
  const records = await getSystemRecords(ctx, viewer, systemId);
  return { addition: records.additions.find((a) => a.id === row.id)!, records };
}

async function loadLiveAddition(ctx: AppContext, viewer: Viewer, id: string) {
  const [row] = await ctx.db
    .select()
    .from(chargeAdditions)
    .where(and(eq(chargeAdditions.id, id), eq(chargeAdditions.companyId, viewer.companyId)));
  if (!row) throw notFound("That charge-added entry");
  await visibleSystem(ctx, viewer, row.systemId).catch(() => {
    throw notFound("That charge-added entry");
  });
  return row;
}

/**
 * A correction: a new entry naming the old one, and the old one voided, in one transaction. The
 * old row keeps its values; only its void columns are set (the audit trail shows both).
 */
export async function correctCharge(
  ctx: AppContext,
  viewer: Viewer,
  userId: string,
  id: string,
  input: CorrectionInput,
) {
  const old = await loadLiveAddition(ctx, viewer, id);
  const { store } = await visibleSystem(ctx, viewer, old.systemId);
  const addedOn = eventDay(input.addedOn ?? old.addedOn, store, "addedOn");
  await checkAdditionRefs(ctx, viewer, old.systemId, input);
  const newId = await ctx.db.transaction(async (tx) => {
    const voided = await tx
      .update(chargeAdditions)
      .set({ voidedAt: new Date(), voidedById: userId, voidReason: input.voidReason })
      .where(and(eq(chargeAdditions.id, old.id), eq(chargeAdditions.companyId, viewer.companyId), isLive()))
      .returning({ id: chargeAdditions.id });
    if (voided.length === 0)
      throw conflict("That entry was already voided or corrected; correct the entry that replaced it instead.");
    const [row] = await tx
      .insert(chargeAdditions)
      .values({ ...values(viewer, userId, old.systemId, addedOn, input), correctsId: old.id })
      .returning({ id: chargeAdditions.id });
    return row.id;
  });
  const records = await getSystemRecords(ctx, viewer, old.systemId);
  return { addition: records.additions.find((a) => a.id === newId)!, records };
}

export async function voidCharge(ctx: AppContext, viewer: Viewer, userId: string, id: string, voidReason: string) {
  const old = await loadLiveAddition(ctx, viewer, id);
  const voided = await ctx.db
    .update(chargeAdditions)
    .set({ voidedAt: new Date(), voidedById: userId, voidReason })
    .where(and(eq(chargeAdditions.id, old.id), isLive()))
    .returning({ id: chargeAdditions.id });
  if (voided.length === 0) throw conflict("That entry was already voided.");
  return getSystemRecords(ctx, viewer, old.systemId);
}

function isLive() {
  return isNull(chargeAdditions.voidedAt);
}

export async function addLeakCheck(
  ctx: AppContext,
  viewer: Viewer,
  userId: string,
  systemId: string,
  input: LeakCheckInput,
) {
  const { store, system } = await visibleSystem(ctx, viewer, systemId);
  refuseRetired(system);
  const checkedOn = eventDay(input.checkedOn, store, "checkedOn");
  await ctx.db.insert(leakChecks).values({
    companyId: viewer.companyId,
    systemId,
    checkedOn,
    leakFound: input.leakFound,
    note: input.note,
    byId: userId,
  });
  return getSystemRecords(ctx, viewer, systemId);
}

/**
 * Records a check of the system's leak detection system (a record of its own kind, EU: at least
 * every 12 months where one is mandatory, docs/reference/standards.md §2 [S:E2,E5]), with an audit
 * row in the same transaction. Only where the profile has leak checks: the US parts we hold state
 * no such check (decision 0123).
 */
export async function addLeakDetectionCheck(
  ctx: AppContext,
  viewer: Viewer,
  userId: string,
  systemId: string,
  input: LeakDetectionCheckInput,
) {
  const { store, system } = await visibleSystem(ctx, viewer, systemId);
  refuseRetired(system);
  const checkedOn = eventDay(input.checkedOn, store, "checkedOn");
  const rules = await companyRules(ctx, viewer.companyId);
  if (!rules.profile.leakChecks)
    throw badRequest(`Please check: ${rules.profile.name} sets no check of a leak detection system.`, {
      checkedOn: `${rules.profile.name} sets no check of a leak detection system; record a leak check instead`,
    });
  await ctx.db.transaction(async (tx) => {
    await tx.insert(leakDetectionChecks).values({
      companyId: viewer.companyId,
      systemId,
      checkedOn,
      working: input.working,
      note: input.note,
      byId: userId,
    });
    await tx.insert(complianceAudit).values({
      companyId: viewer.companyId,
      systemId,
      action: "leak-detection-checked",
      byId: userId,
      summary: `Leak detection system checked on ${checkedOn}: ${input.working ? "working" : "fault found"}${input.note ? ` (${input.note})` : ""}`,
    });
  });
  return getSystemRecords(ctx, viewer, systemId);
}

/**
 * Marks the chronic-leaker report for a calendar year filed, signed by the member recording it,
 * with an audit entry in the same transaction. Only a year the records show as chronic can be
 * filed, and only once it is over: the report covers the whole year (40 CFR 82 subpart F /
 * 84 subpart C, report by 1 March of the next year [S:R7]).
 */
export async function fileChronicReport(
  ctx: AppContext,
  viewer: Viewer,
  userId: string,
  systemId: string,
  input: ChronicReportInput,
) {
  const { store } = await visibleSystem(ctx, viewer, systemId);
  const filedOn = eventDay(input.filedOn, store, "filedOn");
  const records = await getSystemRecords(ctx, viewer, systemId);
  const year = records.chronic.find((y) => y.year === input.year);
  if (!year?.chronic) {
    throw badRequest(`Please check: year ${input.year} is not a chronic-leaker year of this system.`, {
      year: `is not a year in which this system reached the chronic-leaker share of its full charge`,
    });
  }
  if (filedOn < `${input.year + 1}-01-01`) {
    throw badRequest(`Please check: filedOn ${filedOn} is before the end of ${input.year}.`, {
      filedOn: `must be in ${input.year + 1} or later: the report covers the whole of ${input.year}`,
    });
  }
  if (year.filed)
    throw conflict(`The report for ${input.year} was already marked filed on ${year.filed.on} by ${year.filed.by}.`);
  await ctx.db.transaction(async (tx) => {
    const inserted = await tx
      .insert(chronicLeakerReports)
      .values({
        companyId: viewer.companyId,
        systemId,
        year: input.year,
        filedOn,
        reference: input.reference,
        note: input.note,
        filedById: userId,
      })
      .onConflictDoNothing()
      .returning({ id: chronicLeakerReports.id });
    if (inserted.length === 0) throw conflict(`The report for ${input.year} was already marked filed.`);
    await tx.insert(complianceAudit).values({
      companyId: viewer.companyId,
      systemId,
      action: "chronic-report-filed",
      byId: userId,
      summary: `Chronic-leaker report for ${input.year} marked filed on ${filedOn}${input.reference ? ` (reference ${input.reference})` : ""}`,
    });
  });
  return getSystemRecords(ctx, viewer, systemId);
}
