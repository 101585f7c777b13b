import type { ApplianceType, LeakRatePart, RuleProfile } from "./rule-profile";

/**
 * US federal rules: 40 CFR 82 subpart F (ODS) and 40 CFR 84 subpart C (HFCs and substitutes under
 * the AIM Act). Tags refer to docs/reference/standards.md §1. EPA has proposed delays to some dates
 * (90 FR 47999 [S:R4b]); that is why dates are data here.
 */
/**
 * The rules both parts share, each cited to the part it belongs to: a Part 82 figure cites 82.152 /
 * 82.157, a Part 84 one 84.102 / 84.106 (the 82.157 column of docs/reference/standards.md §1 cites
 * the same values). Tags stay internal; `readableSource` shows the section.
 */
function shared(part: "82" | "84") {
  const rule = part === "82" ? "40 CFR 82.157" : "40 CFR 84.106";
  const rate = part === "82" ? "40 CFR 82.152" : "40 CFR 84.102";
  const thresholdTag = part === "82" ? "[S:R1] 40 CFR 82.157(c)" : "[S:R4] 40 CFR 84.106";
  return {
    thresholds: {
      "commercial-refrigeration": { value: 20, source: `${thresholdTag}, commercial refrigeration` },
      "industrial-process": { value: 30, source: `${thresholdTag}, industrial process refrigeration` },
      "comfort-cooling": { value: 10, source: `${thresholdTag}, comfort cooling and other appliances` },
    },
    repairDays: { value: 30, source: `[S:R4] ${rule}: repair within 30 days of learning of the breach` },
    initialVerificationDays: {
      value: 0,
      source: `[S:R8] ${rule}: initial verification test as soon as practicable after the repair is completed (before the full charge is replaced if the system was evacuated)`,
    },
    followUpVerificationDays: {
      value: 10,
      source: `[M] ${rule}: follow-up verification within 10 days; definition [S:R8]`,
    },
    maxDaysSinceLastAddition: {
      value: 365,
      source: `[S:R7] ${rate}, annualizing method: shorter of the days since the last addition or 365`,
    },
    rollingWindowDays: {
      value: 365,
      source: `[S:R7] ${rate}, rolling average: previous 365 days; shortened by a follow-up verification [M]`,
    },
    inspectionsAfterBreach: {
      value: {
        largeTypes: ["commercial-refrigeration", "industrial-process"] as ApplianceType[],
        largeFromCharge: { value: 500, unit: "lb" as const },
        largeEveryMonths: 3,
        largeUntilPeriodsBelow: 4,
        otherEveryMonths: 12,
        otherUntilPeriodsBelow: 1,
        waivedWithAutomaticLeakDetection: true,
      },
      source: `[M] ${rule}: CR/IPR ≥ 500 lb quarterly until 4 quarters below; others yearly until 1 year below; waived under yearly-calibrated automatic leak detection`,
    },
    failedRepair: {
      value: { planDays: 30, carryOutMonths: 12 },
      source: `[M] ${rule}: when a repair does not hold, a retrofit-or-retire plan within 30 days, carried out within 1 year`,
    },
    chronicLeaker: {
      percentOfFullCharge: {
        value: 125,
        source: `[S:R7] ${part === "82" ? "40 CFR 82.157" : "40 CFR 84.108"}: ≥ 125 % of full charge added in a calendar year`,
      },
      reportBy: { value: { month: 3, day: 1 }, source: "[S:R7] report by 1 March of the following year" },
    },
  } satisfies Partial<LeakRatePart>;
}

export const PART_82_SUBPART_F: LeakRatePart = {
  id: "40-cfr-82-subpart-f",
  title: "40 CFR 82 subpart F (ozone-depleting refrigerants)",
  covers: { value: { ozoneDepleting: true }, source: "[S:R1,R2] since 10 Apr 2020, ODS only" },
  minFullCharge: { value: { value: 50, unit: "lb" }, source: "[S:R1] 40 CFR 82.157(a), full charge ≥ 50 lb" },
  firstCalculationDays: { value: 365, source: "[M] 40 CFR 82.152: no earlier addition: use 365 days" },
  ...shared("82"),
};

export const PART_84_SUBPART_C: LeakRatePart = {
  id: "40-cfr-84-subpart-c",
  title: "40 CFR 84 subpart C (HFCs and substitutes, GWP > 53)",
  covers: { value: { ozoneDepleting: false, gwpAbove: 53 }, source: "[S:R4] HFC or substitute with GWP > 53" },
  minFullCharge: { value: { value: 15, unit: "lb" }, source: "[S:R4] full charge ≥ 15 lb" },
  effectiveFrom: { value: "2026-01-01", source: "[S:R4] from 1 Jan 2026" },
  automaticLeakDetectionRequired: {
    value: {
      types: ["commercial-refrigeration", "industrial-process"],
      fromCharge: { value: 1500, unit: "lb" },
      installDeadlines: [
        { inServiceFrom: "2026-01-01", withinDays: 30 },
        { inServiceFrom: "2017-01-01", inServiceBefore: "2026-01-01", by: "2027-01-01" },
      ],
    },
    source:
      "[S:R4] 40 CFR 84.106: automatic leak detection required for commercial and industrial process refrigeration of 1,500 lb or more; installed within 30 days for systems in service from 2026, by 1 Jan 2027 for 2017–2025 [M]",
  },
  firstCalculationDays: {
    value: 365,
    source: "[M] 40 CFR 84.102: the first calculation after 1 Jan 2026 uses 365 days",
  },
  ...shared("84"),
};

export const US_FEDERAL_PROFILE: RuleProfile = {
  id: "us-federal",
  name: "US federal (40 CFR 82 subpart F, 40 CFR 84 subpart C)",
  kind: "us-federal",
  gwpBases: {
    value: ["AR4", "AR5", "AR6", "EU-517/2014"],
    source:
      "[M] AIM Act exchange values follow AR4; where AR4 lists none, the next basis with a value only decides whether GWP exceeds 53",
    // The product's stated choice, shown beside every GWP and CO2-equivalent figure (docs/decisions/0045-gwp-basis.md).
    note: "IPCC AR4 100-year values (the AIM Act's exchange values); a component with no AR4 value (the HFOs R-1234yf, R-1234ze(E)) takes its AR5 value, where AR5's \"<1\" counts as 1",
  },
  leakRateParts: [PART_82_SUBPART_F, PART_84_SUBPART_C],
  recordRetentionYears: { value: 3, source: "[S:R6,R7]" },
};
