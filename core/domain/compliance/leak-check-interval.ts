import { addMonths, type IsoDate } from "../dates/calendar-date";
import { requireNonNegative } from "../input-error";
import { DEFAULT_NUMBER_FORMAT, formatQuantity, type NumberFormat } from "../numbers/number-format";
import { getPure } from "../refrigerants/catalogue";
import { fgasGroupOfKinds, type FgasGroup } from "../refrigerants/fgas-kinds";
import {
  componentsOf,
  designationOf,
  type Refrigerant,
  type RefrigerantKind,
  type SubstanceClass,
} from "../refrigerants/types";
import { systemCo2e, tonnesForComparison } from "./co2e";
import type { LeakCheckBand, RuleProfile } from "./rule-profile";

/** A company refrigerant entered by its GWP falls in the group of the class the company stated. */
const COMPANY_CLASS_GROUP: Record<SubstanceClass, FgasGroup> = {
  hfc: "annex-I",
  hfo: "annex-II-hfo",
  ods: "not-covered",
  other: "not-covered",
};

/** The EU group of a refrigerant: by its components' kinds (refrigerants/fgas-kinds.ts), or a company's stated class. */
export function fgasGroup(r: Refrigerant): FgasGroup {
  const components = componentsOf(r);
  if (r.kind === "company" && !components) return COMPANY_CLASS_GROUP[r.substanceClass];
  return fgasGroupOfKinds(components ? components.map((c) => getPure(c.id).kind) : [r.kind as RefrigerantKind]);
}

export type LeakCheckInterval =
  | {
      required: true;
      months: number;
      ldsRequired: boolean;
      band: LeakCheckBand;
      measure: "t CO2e" | "kg";
      amount: number;
      reason: string;
    }
  | { required: false; reason: string };

function findBand(bands: LeakCheckBand[], amount: number): LeakCheckBand | undefined {
  return bands.find((b) => amount >= b.from && (b.to === null || amount < b.to));
}

/**
 * The EU leak-check interval for a system: by CO2e band for Annex I gases, by kg band for HFOs,
 * longer with a leak detection system (LDS); band edges are inclusive below ("≥ 5 and < 50 t").
 */
export function leakCheckInterval(
  profile: RuleProfile,
  refrigerant: Refrigerant,
  chargeKg: number,
  options: { hasLeakDetection: boolean; hermeticallySealed?: boolean; numberFormat?: NumberFormat },
): LeakCheckInterval {
  requireNonNegative(chargeKg, "chargeKg");
  // The reason is read by the company: its figures are written in its number format (docs/decisions/0047).
  const n = (v: number) => formatQuantity(v, options.numberFormat ?? DEFAULT_NUMBER_FORMAT);
  const rules = profile.leakChecks;
  if (!rules) return { required: false, reason: `${profile.name} sets no periodic leak checks` };
  const group = fgasGroup(refrigerant);
  if (group === "not-covered")
    return {
      required: false,
      reason: `${designationOf(refrigerant)} is not a fluorinated gas covered by leak-check rules`,
    };

  let amount: number;
  let bands: LeakCheckBand[];
  let measure: "t CO2e" | "kg";
  if (group === "annex-I") {
    const c = systemCo2e(profile, refrigerant, chargeKg);
    if (!c.known) return { required: false, reason: `CO2e unknown: ${c.reason}` };
    amount = tonnesForComparison(c.tonnes);
    bands = rules.co2eBands.value;
    measure = "t CO2e";
    if (options.hermeticallySealed && amount < rules.hermeticExemptBelowTonnes.value) {
      return {
        required: false,
        reason: `hermetically sealed and below ${n(rules.hermeticExemptBelowTonnes.value)} t CO2e`,
      };
    }
  } else {
    amount = chargeKg;
    bands = rules.hfoBands.value;
    measure = "kg";
  }
  const band = findBand(bands, amount);
  if (!band)
    return {
      required: false,
      reason: `${n(amount)} ${measure} is below the first band (${n(bands[0].from)} ${measure})`,
    };
  const months = options.hasLeakDetection ? band.monthsWithLds : band.monthsWithoutLds;
  const top = band.to === null ? `≥ ${n(band.from)}` : `${n(band.from)} to < ${n(band.to)}`;
  return {
    required: true,
    months,
    ldsRequired: band.ldsRequired,
    band,
    measure,
    amount,
    reason: `${n(amount)} ${measure} is in the ${top} ${measure} band: every ${months} months ${options.hasLeakDetection ? "with" : "without"} leak detection${band.ldsRequired ? "; a leak detection system is required" : ""}`,
  };
}

/** The next leak check: the last check plus the interval in calendar months (month ends clamp). */
export function nextInspectionDate(lastCheck: IsoDate, intervalMonths: number): IsoDate {
  return addMonths(lastCheck, intervalMonths, "lastCheck");
}
