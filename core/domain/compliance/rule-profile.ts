import type { IsoDate } from "../dates/calendar-date";
import type { GwpBasis, Sourced } from "../refrigerants/types";

/**
 * A rule profile is the data a company works under. Every threshold, deadline, interval and date
 * lives here with its source tag (docs/reference/standards.md: [S:id] sourced, [M] from memory, [D] derived), so
 * that when a regulation changes only the data changes; the functions in this folder read it.
 */

export type ApplianceType = "commercial-refrigeration" | "industrial-process" | "comfort-cooling";
export const APPLIANCE_TYPES: readonly ApplianceType[] = [
  "commercial-refrigeration",
  "industrial-process",
  "comfort-cooling",
];

export type LeakRateMethod = "annualizing" | "rolling-average";

export interface MassLimit {
  value: number;
  unit: "lb" | "kg";
}

/** One US leak-repair regime (40 CFR 82 subpart F or 40 CFR 84 subpart C). */
export interface LeakRatePart {
  id: string;
  title: string;
  /** Which refrigerants it covers: ozone-depleting ones, or non-ODS with GWP above a value. */
  covers: Sourced<{ ozoneDepleting: true } | { ozoneDepleting: false; gwpAbove: number }>;
  /** Applies from this full charge (inclusive: "≥ 50 lb"). */
  minFullCharge: Sourced<MassLimit>;
  /** Applies to calculations on or after this date (inclusive). */
  effectiveFrom?: Sourced<IsoDate>;
  /** Leak-rate thresholds in % per year; a rate *above* the threshold is a breach. */
  thresholds: Record<ApplianceType, Sourced<number>>;
  /** Repair within this many days of learning of the breach. */
  repairDays: Sourced<number>;
  /** Initial verification test within this many days of the repair (0: the day of the repair). */
  initialVerificationDays: Sourced<number>;
  /** Follow-up verification test within this many days of the initial test. */
  followUpVerificationDays: Sourced<number>;
  /** Annualizing method: days used when no earlier addition exists. */
  firstCalculationDays: Sourced<number>;
  /** Cap on the days since the last addition ("the shorter of … or 365 days"). */
  maxDaysSinceLastAddition: Sourced<number>;
  /** Rolling average: window in days, shortened by a successful follow-up verification. */
  rollingWindowDays: Sourced<number>;
  /** Periodic leak inspections after a breach, until the rate stays below the threshold. */
  inspectionsAfterBreach?: Sourced<{
    /** Systems of these types at or above `largeFromCharge` are inspected every `largeEveryMonths`. */
    largeTypes: ApplianceType[];
    largeFromCharge: MassLimit;
    largeEveryMonths: number;
    /** …until this many consecutive inspection periods are below the threshold. */
    largeUntilPeriodsBelow: number;
    otherEveryMonths: number;
    otherUntilPeriodsBelow: number;
    /** Waived while an automatic leak detection system, calibrated yearly, watches the system. */
    waivedWithAutomaticLeakDetection: boolean;
  }>;
  /** Automatic leak detection required for these types from this full charge. */
  automaticLeakDetectionRequired?: Sourced<{
    types: ApplianceType[];
    fromCharge: MassLimit;
    /**
     * When it must be installed, by the system's in-service day: within `withinDays` of it, or by a
     * fixed date `by`. A system in service before every listed range has no install deadline.
     */
    installDeadlines?: { inServiceFrom: IsoDate; inServiceBefore?: IsoDate; withinDays?: number; by?: IsoDate }[];
  }>;
  /** When a repair does not hold: a retrofit-or-retire plan within `planDays`, carried out within `carryOutMonths`. */
  failedRepair?: Sourced<{ planDays: number; carryOutMonths: number }>;
  chronicLeaker: {
    /** Added in one calendar year, as % of full charge; reaching it ("≥") flags the system. */
    percentOfFullCharge: Sourced<number>;
    /** Report due by this month/day of the following year. */
    reportBy: Sourced<{ month: number; day: number }>;
  };
}

/** An EU leak-check band by CO2e (Annex I gases) or by kg (HFOs); lower edge inclusive, upper exclusive. */
export interface LeakCheckBand {
  from: number;
  /** Exclusive upper edge; null for the open top band. */
  to: number | null;
  monthsWithoutLds: number;
  monthsWithLds: number;
  /** A leak detection system is mandatory in this band. */
  ldsRequired: boolean;
}

export interface LeakCheckRules {
  /** Bands in tonnes CO2e for Annex I gases (HFCs and mixtures containing them). */
  co2eBands: Sourced<LeakCheckBand[]>;
  /** Bands in kg for Annex II section 1 gases (HFOs). */
  hfoBands: Sourced<LeakCheckBand[]>;
  /** Hermetically sealed, labelled equipment below this CO2e is exempt. */
  hermeticExemptBelowTonnes: Sourced<number>;
  /** After a repair, re-check within this many months. */
  recheckAfterRepairMonths: Sourced<number>;
}

export interface RuleProfile {
  id: string;
  name: string;
  kind: "us-federal" | "eu-fgas" | "custom";
  /** For a custom profile: the id of the profile it was copied from. */
  basedOn?: string;
  /** GWP bases in order of preference (first with a value wins, per component). */
  gwpBases: Sourced<GwpBasis[]>;
  /** US-style leak-rate regimes, tried in order; absent where the law has none (EU). */
  leakRateParts: LeakRatePart[];
  leakChecks?: LeakCheckRules;
  recordRetentionYears: Sourced<number>;
}
