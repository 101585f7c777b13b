import { addDays, addMonths, compareDates, yearOf, type IsoDate } from "../dates/calendar-date";
import { automaticLeakDetection, type AutomaticLeakDetection } from "./automatic-leak-detection";
import type { Refrigerant } from "../refrigerants/types";
import { applicableLeakRatePart, leakRateThreshold } from "./applicability";
import { assessLeakRate, type AssessedPoint } from "./assess-leak-rate";
import { breachEpisodes, type BreachEpisode } from "./breach-episodes";
import type { FindingRepair } from "./leak-groups";
import { factsOn, inRegime, regimesOf, type SystemRevision } from "./system-revisions";
import { chronicLeakerYears, type ChronicLeakerYear } from "./chronic-leaker";
import { systemCo2e, type SystemCo2e } from "./co2e";
import { followUpVerificationDueDate, initialVerificationDueDate, recheckAfterRepairDueDate } from "./deadlines";
import { inspectionsAfterBreach } from "./inspections-after-breach";
import { leakCheckInterval, nextInspectionDate, type LeakCheckInterval } from "./leak-check-interval";
import { leakDetectionCheckDue } from "./leak-detection-check";
import type { ChargeAddition } from "./leak-rate";
import type { ApplianceType, LeakRateMethod, RuleProfile } from "./rule-profile";
import { formatCalendarDay as day } from "../dates/format-in-zone";
import { DEFAULT_NUMBER_FORMAT, formatGrouped, formatQuantity, type NumberFormat } from "../numbers/number-format";

/** What one system's records say, on one day of the store's calendar. Pure: the caller loads the rows. */
export interface SystemRecords {
  refrigerant: Refrigerant;
  fullChargeKg: number;
  applianceType: ApplianceType;
  automaticLeakDetection: boolean;
  /** The day the system was entered, on the store's calendar (first leak check runs from it). */
  enteredOn: IsoDate;
  additions: readonly ChargeAddition[];
  /** Days a repair of a leak on this system was recorded. */
  repairedOn: readonly IsoDate[];
  /** The same repairs by finding: a leak's additions before its repair are one figure. */
  findingRepairs?: readonly FindingRepair[];
  /** Repaired findings whose verification is not finished: the repair day and a passed initial test's day, if any. */
  pendingFollowUps: readonly { findingId: string; repairedOn: IsoDate; initialTestOn: IsoDate | null }[];
  /** Days a follow-up verification test failed: the repair did not hold. */
  failedFollowUps?: readonly { findingId: string; on: IsoDate }[];
  /** Days a follow-up verification test passed (shortens the rolling-average window). */
  followUpVerifiedOn: readonly IsoDate[];
  leakChecks: readonly { checkedOn: IsoDate; leakFound: boolean }[];
  /** Calendar years whose chronic-leaker report is marked filed (the due item closes). */
  chronicReportsFiled?: readonly number[];
  /**
   * The dated revisions of the facts above (docs/decisions/0043-system-revisions.md); when given,
   * every figure uses the values in force on its date and today's values replace the flat fields.
   */
  revisions?: readonly SystemRevision[];
  /** The day the system was retired (store calendar); from then only reports for earlier years fall due. */
  retiredOn?: IsoDate | null;
  /** EU: factory-sealed and labelled as such (exempt from leak checks below the profile's limit). */
  hermeticallySealed?: boolean;
  /** Checks of the system's leak detection system itself (EU: yearly where one is mandatory). */
  leakDetectionChecks?: readonly { checkedOn: IsoDate; working: boolean }[];
}

export interface DueDate {
  kind:
    | "repair"
    | "initial-test"
    | "follow-up-test"
    | "recheck-after-repair"
    | "inspection"
    | "chronic-leaker-report"
    | "automatic-leak-detection"
    | "leak-detection-check"
    | "retrofit-or-retire-plan"
    | "retrofit-or-retire";
  dueOn: IsoDate;
  what: string;
  source: string;
  findingId?: string;
  /** For a chronic-leaker report: the calendar year it covers. */
  year?: number;
}

export interface SystemStatus {
  points: AssessedPoint[];
  latest: AssessedPoint | null;
  applicability: {
    applies: boolean;
    partId: string | null;
    partTitle: string | null;
    reason: string;
    thresholdPercent: number | null;
    thresholdSource: string | null;
  };
  /** The latest calculation is above the threshold. */
  overThreshold: boolean;
  /** The open breach episode's first exceedance, carrying the episode's repair deadline. */
  unrepairedBreach: AssessedPoint | null;
  /** Every breach episode, oldest first (docs/decisions/0041-repair-clock.md). */
  episodes: BreachEpisode[];
  /**
   * Added per calendar year under a profile with leak-repair parts (none under one without). A year in
   * which no part applied is listed with `noPart`, the rule's reason on its last addition's day.
   */
  chronic: (ChronicLeakerYear & { noPart: string | null })[];
  co2e: SystemCo2e;
  leakCheck: { withLds: LeakCheckInterval; withoutLds: LeakCheckInterval; applied: LeakCheckInterval } | null;
  /** The part's automatic-leak-detection requirement for this system, or null when the part has none. */
  automaticLeakDetection: AutomaticLeakDetection | null;
  nextInspection: { dueOn: IsoDate; reason: string; source: string } | null;
  due: DueDate[];
}

const latestOf = (dates: readonly IsoDate[]) => [...dates].sort(compareDates).at(-1) ?? null;

export function systemStatus(
  profile: RuleProfile,
  method: LeakRateMethod,
  rec: SystemRecords,
  today: IsoDate,
  /** The company's number format, for the figures in the reasons a reader sees. */
  numberFormat: NumberFormat = DEFAULT_NUMBER_FORMAT,
): SystemStatus {
  const revisions: readonly SystemRevision[] = rec.revisions?.length
    ? rec.revisions
    : [{ ...rec, inServiceOn: rec.enteredOn, effectiveFrom: rec.enteredOn, kind: "first" }];
  const on = (date: IsoDate) => factsOn(revisions, date);
  const now = on(today);
  const facts = { ...now, enteredOn: now.inServiceOn };
  // A retrofit starts a new regime: no figure counts days or additions from before it.
  const assessed = regimesOf(revisions).flatMap((regime) =>
    assessLeakRate(
      profile,
      on,
      rec.additions.filter((a) => inRegime(regime, a.date)),
      method,
      rec.followUpVerifiedOn.filter((d) => inRegime(regime, d)),
      rec.findingRepairs ?? [],
      regime.from,
    ),
  );
  // A retrofit or the retirement ends an open breach as a repair does (the leak's refrigerant is gone).
  const retrofits = revisions.filter((r) => r.kind === "retrofit").map((r) => r.effectiveFrom);
  const enders = [...retrofits, ...(rec.retiredOn ? [rec.retiredOn] : [])];
  const episodes = breachEpisodes(profile, assessed, [...rec.repairedOn, ...enders]);
  // Every exceedance of an episode shows the episode's deadline: a later one never extends it.
  const dueOf = new Map(episodes.flatMap((e) => e.exceedances.map((p) => [p, e.repairDue] as const)));
  const points = assessed.map((p) => (dueOf.has(p) ? { ...p, repairDue: dueOf.get(p) } : p));
  const latest = points.at(-1) ?? null;
  const a = applicableLeakRatePart(profile, facts.refrigerant, facts.fullChargeKg, today);
  const threshold = a.applies ? leakRateThreshold(a.part, facts.applianceType) : null;
  const due: DueDate[] = [];

  // The repair clock runs from the first exceedance of the open episode (docs/decisions/0041-repair-clock.md).
  const lastBreach = [...points].reverse().find((p) => p.exceeds) ?? null;
  const open = episodes.at(-1)?.repairedOn === null ? episodes.at(-1)! : null;
  const unrepairedBreach = open ? { ...open.first, repairDue: open.repairDue } : null;
  const breachPart = lastBreach?.partId
    ? (profile.leakRateParts.find((p) => p.id === lastBreach.partId) ?? null)
    : null;
  if (unrepairedBreach?.repairDue && breachPart) {
    due.push({
      kind: "repair",
      dueOn: unrepairedBreach.repairDue,
      what: `Repair: leak rate ${formatGrouped(unrepairedBreach.percent, numberFormat, 1)} % on ${day(unrepairedBreach.date)} is above ${unrepairedBreach.thresholdPercent === null ? "the threshold" : `${formatQuantity(unrepairedBreach.thresholdPercent, numberFormat, 3)} %`}${repairClockNote(open!)}`,
      source: `${breachPart.title}; ${breachPart.repairDays.source}`,
    });
  }

  const part = a.applies ? a.part : breachPart;
  for (const f of rec.pendingFollowUps) {
    if (part && !f.initialTestOn) {
      // Until a passed initial test is recorded (a failed one means the repair did not hold).
      due.push({
        kind: "initial-test",
        dueOn: initialVerificationDueDate(part, f.repairedOn),
        what: `Initial verification test after the repair of ${day(f.repairedOn)}`,
        source: part.initialVerificationDays.source,
        findingId: f.findingId,
      });
    } else if (part && f.initialTestOn) {
      due.push({
        kind: "follow-up-test",
        dueOn: followUpVerificationDueDate(part, f.initialTestOn),
        what: `Follow-up verification test after the initial test of ${day(f.initialTestOn)}`,
        source: part.followUpVerificationDays.source,
        findingId: f.findingId,
      });
    } else if (
      !part &&
      profile.leakChecks &&
      // EU: a leak check with no leak found on or after the repair day is the re-check [S:E6].
      !rec.leakChecks.some((c) => !c.leakFound && compareDates(c.checkedOn, f.repairedOn) >= 0)
    ) {
      due.push({
        kind: "recheck-after-repair",
        dueOn: recheckAfterRepairDueDate(profile, f.repairedOn),
        what: "Leak check after the repair",
        source: profile.leakChecks.recheckAfterRepairMonths.source,
        findingId: f.findingId,
      });
    }
  }

  // Automatic leak detection: shown on the system, and due from its in-service day while missing.
  const ald = automaticLeakDetection(a.applies ? a.part : null, facts);
  if (ald?.required && ald.dueOn && !facts.automaticLeakDetection)
    due.push({
      kind: "automatic-leak-detection",
      dueOn: ald.dueOn,
      what: `Install automatic leak detection (${ald.reason})`,
      source: ald.source,
    });

  due.push(...failedRepairItems(profile, episodes, rec.failedFollowUps ?? [], retrofits, today));

  // Each year is judged by the part that applied to the system in it (none: the year does not count).
  const partOn = (date: IsoDate) => {
    const at = applicableLeakRatePart(profile, on(date).refrigerant, on(date).fullChargeKg, date);
    return at.applies ? at.part : null;
  };
  // A profile without leak-repair parts (EU F-gas) has no chronic-leaker years to list at all.
  const chronic = (
    profile.leakRateParts.length ? chronicLeakerYears(partOn, (date) => on(date).fullChargeKg, rec.additions) : []
  ).map((y) => ({
    ...y,
    noPart:
      y.partId === null && y.lastNotCounted
        ? applicableLeakRatePart(
            profile,
            on(y.lastNotCounted).refrigerant,
            on(y.lastNotCounted).fullChargeKg,
            y.lastNotCounted,
          ).reason
        : null,
  }));
  const thisYear = Number(today.slice(0, 4));
  for (const y of chronic) {
    const yearPart = profile.leakRateParts.find((p) => p.id === y.partId);
    // The report for last year (or this one, once reached) is what can still be acted on.
    if (y.chronic && y.reportDue && y.year >= thisYear - 1 && yearPart && !rec.chronicReportsFiled?.includes(y.year)) {
      due.push({
        kind: "chronic-leaker-report",
        dueOn: y.reportDue,
        year: y.year,
        what: `Chronic-leaker report for ${y.year}: ${formatGrouped(y.percent, numberFormat, 0)} % of the full charge added`,
        source: `${yearPart.chronicLeaker.percentOfFullCharge.source}; ${yearPart.chronicLeaker.reportBy.source}`,
      });
    }
  }

  const co2e = systemCo2e(profile, facts.refrigerant, facts.fullChargeKg);
  const lastCheck = latestOf(rec.leakChecks.map((c) => c.checkedOn));
  let leakCheck: SystemStatus["leakCheck"] = null;
  let nextInspection: SystemStatus["nextInspection"] = null;
  if (profile.leakChecks) {
    const hermeticallySealed = rec.hermeticallySealed ?? false;
    const withLds = leakCheckInterval(profile, facts.refrigerant, facts.fullChargeKg, {
      hasLeakDetection: true,
      hermeticallySealed,
      numberFormat,
    });
    const withoutLds = leakCheckInterval(profile, facts.refrigerant, facts.fullChargeKg, {
      hasLeakDetection: false,
      hermeticallySealed,
      numberFormat,
    });
    const applied = facts.automaticLeakDetection ? withLds : withoutLds;
    leakCheck = { withLds, withoutLds, applied };
    const lds = leakDetectionCheckDue(
      profile,
      applied,
      { inServiceOn: facts.enteredOn, hasLeakDetection: facts.automaticLeakDetection },
      rec.leakDetectionChecks ?? [],
    );
    if (lds) due.push({ kind: "leak-detection-check", ...lds });
    if (applied.required) {
      const from = lastCheck ?? facts.enteredOn;
      nextInspection = {
        dueOn: nextInspectionDate(from, applied.months),
        reason: `${lastCheck ? `last leak check ${day(lastCheck)}` : `no leak check recorded since the system was entered on ${day(facts.enteredOn)}`}; ${applied.reason}`,
        source: profile.leakChecks.co2eBands.source,
      };
    }
  } else if (lastBreach && breachPart) {
    // US: periodic inspections after a breach until enough clean periods in a row. Our reading of
    // "until N periods below the threshold": N consecutive inspections with no leak found since the breach.
    const plan = inspectionsAfterBreach(breachPart, {
      applianceType: facts.applianceType,
      fullChargeKg: facts.fullChargeKg,
      hasAutomaticLeakDetection: facts.automaticLeakDetection,
    });
    // Inspections after a breach belong to the regime the breach happened in: a retrofit ends them as
    // it ends the breach (docs/decisions/0043-system-revisions.md), so an earlier part's breach neither
    // starts nor keeps a run under the part in force now.
    const current = regimesOf(revisions).find((r) => inRegime(r, today));
    const inCurrent = (d: IsoDate) => !current || inRegime(current, d);
    if (plan.required) {
      const run = inspectionRun(
        points.filter((p) => p.exceeds && inCurrent(p.date)).map((p) => p.date),
        rec.leakChecks.filter((c) => inCurrent(c.checkedOn)),
        plan.untilPeriodsBelow,
      );
      if (run) {
        const from = run.lastCheck ?? run.start;
        nextInspection = {
          dueOn: addMonths(from, plan.everyMonths),
          reason: `inspections since the breach of ${day(run.start)}: ${plan.reason} (${run.clean} clean so far${run.lastCheck ? `, last ${day(run.lastCheck)}` : ""})`,
          source: breachPart.inspectionsAfterBreach?.source ?? "",
        };
      }
    }
  }
  if (nextInspection)
    due.push({
      kind: "inspection",
      dueOn: nextInspection.dueOn,
      // EU F-gas speaks of periodic leak checks (2024/573 Art. 5); the US parts of leak inspections.
      what: profile.leakChecks ? "Periodic leak check" : "Leak inspection",
      source: nextInspection.source,
    });

  return {
    points,
    latest,
    applicability: {
      applies: a.applies,
      partId: a.applies ? a.part.id : null,
      partTitle: a.applies ? a.part.title : null,
      reason: a.reason,
      thresholdPercent: threshold?.percent ?? null,
      thresholdSource: threshold?.source ?? null,
    },
    overThreshold: !!latest?.exceeds,
    unrepairedBreach,
    episodes,
    chronic,
    co2e,
    leakCheck,
    automaticLeakDetection: ald,
    // A retired system owes no inspection (docs/decisions/0040-no-record-is-lost.md): none is shown as next.
    nextInspection: rec.retiredOn ? null : nextInspection,
    due: (rec.retiredOn ? due.filter((d) => stillDueWhenRetired(d, rec.retiredOn!)) : due).sort((x, y) =>
      compareDates(x.dueOn, y.dueOn),
    ),
  };
}

/**
 * When a repair does not hold (a failed follow-up verification test, or no repair within the 30
 * days), a retrofit-or-retire plan falls due, to be carried out within a year (docs/reference/standards.md
 * §1 [M]; docs/decisions/0044-readings-and-research-notes.md). The earliest such day not followed by a
 * retrofit starts both items; retirement ends them (a retired system has no due items but reports).
 */
function failedRepairItems(
  profile: RuleProfile,
  episodes: readonly BreachEpisode[],
  failedFollowUps: readonly { findingId: string; on: IsoDate }[],
  retrofits: readonly IsoDate[],
  today: IsoDate,
): DueDate[] {
  type Trigger = { on: IsoDate; why: string; partId: string | null; findingId?: string };
  const triggers: Trigger[] = [
    ...failedFollowUps.map((f) => ({
      on: f.on,
      why: `the follow-up verification test of ${day(f.on)} failed`,
      partId: null,
      findingId: f.findingId,
    })),
    ...episodes
      .filter((e) =>
        e.repairedOn ? compareDates(e.repairedOn, e.repairDue) > 0 : compareDates(today, e.repairDue) > 0,
      )
      .map((e) => ({ on: e.repairDue, why: `no repair by ${day(e.repairDue)}`, partId: e.partId })),
  ].filter((t) => !retrofits.some((r) => compareDates(r, t.on) >= 0));
  const first = triggers.sort((x, y) => compareDates(x.on, y.on))[0];
  if (!first) return [];
  const part =
    profile.leakRateParts.find((p) => p.id === first.partId && p.failedRepair) ??
    profile.leakRateParts.find((p) => p.failedRepair);
  const rule = part?.failedRepair;
  if (!rule) return [];
  const findingId = first.findingId ? { findingId: first.findingId } : {};
  return [
    {
      kind: "retrofit-or-retire-plan",
      dueOn: addDays(first.on, rule.value.planDays),
      what: `Retrofit-or-retire plan: ${first.why}`,
      source: rule.source,
      ...findingId,
    },
    {
      kind: "retrofit-or-retire",
      dueOn: addMonths(first.on, rule.value.carryOutMonths),
      what: `Retrofit or retire the system under its plan (${first.why})`,
      source: rule.source,
      ...findingId,
    },
  ];
}

/**
 * A retired system needs no repair, test or inspection any more, but a chronic-leaker report for a
 * year it was in service is still owed (docs/decisions/0040-no-record-is-lost.md).
 */
function stillDueWhenRetired(d: DueDate, retiredOn: IsoDate): boolean {
  return d.kind === "chronic-leaker-report" && d.year !== undefined && d.year <= yearOf(retiredOn);
}

/**
 * The open run of US inspections after a breach, or null when none is open. Our reading of
 * "until N periods below the threshold" (docs/reference/standards.md §1 [M]): a run starts at a breach, counts
 * consecutive inspections with no leak found, and ends at N; a new breach during a run resets the
 * count but keeps the schedule, which runs from the latest inspection (or the run's start).
 */
export function inspectionRun(
  breachDates: readonly IsoDate[],
  checks: readonly { checkedOn: IsoDate; leakFound: boolean }[],
  untilClean: number,
): { start: IsoDate; lastCheck: IsoDate | null; clean: number } | null {
  type Ev = { on: IsoDate; breach: boolean; leakFound: boolean };
  const evs: Ev[] = [
    ...breachDates.map((on) => ({ on, breach: true, leakFound: true })),
    ...checks.map((c) => ({ on: c.checkedOn, breach: false, leakFound: c.leakFound })),
  ].sort((a, b) => compareDates(a.on, b.on) || (a.breach ? -1 : 1));
  let run: { start: IsoDate; lastCheck: IsoDate | null; clean: number } | null = null;
  for (const e of evs) {
    if (e.breach) {
      if (run) run.clean = 0;
      else run = { start: e.on, lastCheck: null, clean: 0 };
      continue;
    }
    if (!run) continue;
    run.lastCheck = e.on;
    run.clean = e.leakFound ? 0 : run.clean + 1;
    if (run.clean >= untilClean) run = null;
  }
  return run;
}

/**
 * Why the repair deadline is not 30 days after the figure's own date, when it is not: the clock runs
 * from the first exceedance of the episode, and a figure of several additions for one leak from its
 * first addition (docs/decisions/0041-repair-clock.md, 0042-same-leak-additions.md).
 */
function repairClockNote(open: { first: { date: IsoDate; clockFrom: IsoDate }; exceedances: readonly unknown[] }) {
  const fromFirstAddition = open.first.clockFrom !== open.first.date;
  if (open.exceedances.length > 1)
    return ` (first of ${open.exceedances.length} exceedances before a repair; the deadline runs from the first${fromFirstAddition ? `, from its first addition on ${day(open.first.clockFrom)}` : ""})`;
  return fromFirstAddition
    ? ` (the deadline runs from the first addition for this leak, on ${day(open.first.clockFrom)})`
    : "";
}
