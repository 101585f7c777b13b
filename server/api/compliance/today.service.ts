import { and, eq, inArray, isNull, notInArray } from "drizzle-orm";
import type { AppContext } from "../../context";
import type { DueItem, TodayView } from "#core/contracts/compliance";
import { companies, detectors, findings, stores, systems } from "../../db/schema/index";
import { compareDates } from "#core/domain/dates/calendar-date";
import { dueStatus } from "#core/domain/compliance/deadlines";
import { localDateOf } from "#core/domain/dates/time-zone";
import { isStoreScoped } from "#core/domain/roles";
import { checkStatus } from "../detectors/detectors.service";
import { visibleStores, type Viewer } from "../../access/store-access";
import { systemDueItems } from "./due-items";
import { companyRules, retiredOnOf, statusesOf } from "./system-records";
import { profileWording } from "#core/domain/compliance/company-profile";

/** Overdue first, then by date; undated (never checked) at the top of what is overdue. */
export function byUrgency(a: DueItem, b: DueItem): number {
  if (a.dueOn === null || b.dueOn === null) return a.dueOn === null ? (b.dueOn === null ? 0 : -1) : 1;
  return compareDates(a.dueOn, b.dueOn) || a.what.localeCompare(b.what);
}

/**
 * Everything due or open across the stores the viewer may see: deadlines from the rule profile,
 * systems over threshold, open findings, and (for company members) detector checks. Each figure
 * carries the source of its rule and a link to the records beneath it.
 */
export async function today(
  ctx: AppContext,
  viewer: Viewer,
  filter: { storeId?: string } = {},
  now = new Date(),
): Promise<TodayView> {
  const storeRows = await ctx.db
    .select()
    .from(stores)
    .where(
      and(visibleStores(viewer), isNull(stores.archivedAt), filter.storeId ? eq(stores.id, filter.storeId) : undefined),
    );
  const storesById = new Map(storeRows.map((s) => [s.id, s]));
  const ids = storeRows.map((s) => s.id);
  const rules = await companyRules(ctx, viewer.companyId);
  const sysRows = ids.length ? await ctx.db.select().from(systems).where(inArray(systems.storeId, ids)) : [];
  const statuses = await statusesOf(
    ctx,
    rules,
    sysRows.map((s) => ({ system: s, store: storesById.get(s.storeId)! })),
    now,
  );

  const due: DueItem[] = statuses.flatMap((s) => systemDueItems(s, now));
  // Detectors are the company's instruments, not a store's: store contacts do not see them.
  if (!isStoreScoped(viewer.role) && !filter.storeId) {
    const [c] = await ctx.db
      .select({ days: companies.detectorCheckIntervalDays })
      .from(companies)
      .where(eq(companies.id, viewer.companyId));
    const zone = storeRows[0]?.timeZone ?? "UTC";
    const rows = await ctx.db
      .select()
      .from(detectors)
      .where(and(eq(detectors.companyId, viewer.companyId), isNull(detectors.archivedAt)));
    for (const d of rows) {
      const st = checkStatus(d.lastCheckedOn, c.days, now, zone);
      const ds = st.checkDueOn ? dueStatus(st.checkDueOn, now, zone) : { state: "overdue" as const, daysLeft: null };
      due.push({
        kind: "detector-check",
        what: st.checkDueOn
          ? `Calibration / bump check: ${d.name}`
          : `Calibration / bump check: ${d.name} (never recorded)`,
        dueOn: st.checkDueOn,
        ...ds,
        source: `company setting: every ${c.days} days (common practice, no published source)`,
        storeId: null,
        storeName: null,
        systemId: null,
        systemName: null,
        findingId: null,
        detectorId: d.id,
        link: `/detectors#detector-${d.id}`,
      });
    }
  }

  // Over threshold and not yet repaired: a system whose breach was repaired stays on its records
  // page with that rate until the next addition brings a new figure, but needs no action here.
  const overThreshold = statuses
    .filter(
      (s) => s.status.overThreshold && s.status.unrepairedBreach !== null && s.status.latest?.thresholdPercent != null,
    )
    .map((s) => {
      const p = s.status.latest!;
      const part = rules.profile.leakRateParts.find((x) => x.id === p.partId);
      return {
        systemId: s.system.id,
        systemName: s.system.name,
        storeId: s.store.id,
        storeName: s.store.name,
        refrigerantId: s.system.refrigerantId,
        refrigerantName: s.refrigerantName,
        percent: p.percent,
        thresholdPercent: p.thresholdPercent!,
        on: p.date,
        partTitle: part?.title ?? "",
        source: part ? part.thresholds[s.system.applianceType].source : "",
        link: `/systems/${s.system.id}#leak-rates`,
      };
    });

  const open = ids.length
    ? await ctx.db
        .select()
        .from(findings)
        .where(
          and(
            eq(findings.companyId, viewer.companyId),
            inArray(findings.storeId, ids),
            notInArray(findings.status, ["closed", "dismissed"]),
          ),
        )
    : [];
  const systemNames = new Map(sysRows.map((s) => [s.id, s.name]));
  const systemsById = new Map(sysRows.map((s) => [s.id, s]));
  const statusBySystem = new Map(statuses.map((s) => [s.system.id, s]));
  const openFindings = open.map((f) => {
    const store = storesById.get(f.storeId)!;
    const st = f.systemId ? statusBySystem.get(f.systemId) : undefined;
    const sys = f.systemId ? systemsById.get(f.systemId) : undefined;
    const mine =
      st?.status.due.filter((d) =>
        d.findingId
          ? d.findingId === f.id
          : d.kind === "repair" && (f.status === "suspected" || f.status === "confirmed"),
      ) ?? [];
    const first = mine[0];
    return {
      id: f.id,
      storeId: f.storeId,
      storeName: store.name,
      systemId: f.systemId,
      systemName: f.systemId ? (systemNames.get(f.systemId) ?? null) : null,
      status: f.status,
      component: f.component,
      foundOn: localDateOf(f.foundAt, store.timeZone),
      deadline: first?.dueOn ?? null,
      deadlineSource: first?.source ?? null,
      // Open on a retired system: it owes nothing more and waits to be closed as left service (docs/decisions/0166).
      systemRetiredOn: sys ? retiredOnOf(sys, store.timeZone) : null,
      link: `/findings/${f.id}`,
    };
  });
  openFindings.sort((a, b) =>
    a.deadline && b.deadline
      ? compareDates(a.deadline, b.deadline)
      : a.deadline
        ? -1
        : b.deadline
          ? 1
          : compareDates(b.foundOn, a.foundOn),
  );

  return {
    generatedAt: now.toISOString(),
    wording: profileWording(rules.profile),
    stores: storeRows.map((s) => ({
      id: s.id,
      name: s.name,
      timeZone: s.timeZone,
      today: localDateOf(now, s.timeZone),
    })),
    due: due.sort(byUrgency),
    overThreshold,
    systems: statuses
      // Retired systems keep their records page; Today lists the systems in service.
      .filter((s) => s.system.retiredAt === null)
      .map((s) => ({
        id: s.system.id,
        name: s.system.name,
        storeId: s.store.id,
        storeName: s.store.name,
        refrigerantId: s.system.refrigerantId,
        refrigerantName: s.refrigerantName,
        latestPercent: s.status.latest?.percent ?? null,
        latestOn: s.status.latest?.date ?? null,
        thresholdPercent: s.status.latest?.thresholdPercent ?? s.status.applicability.thresholdPercent,
        breachOpen: s.status.unrepairedBreach !== null,
        repairedSince: s.status.overThreshold && s.status.unrepairedBreach === null,
        nextInspection: s.status.nextInspection?.dueOn ?? null,
        link: `/systems/${s.system.id}`,
      }))
      .sort((a, b) => a.storeName.localeCompare(b.storeName) || a.name.localeCompare(b.name)),
    openFindings,
  };
}
