import { compareDates, type IsoDate } from "../dates/calendar-date";
import { DomainInputError, requirePositive } from "../input-error";
import { isOzoneDepleting } from "../refrigerants/catalogue";
import { gwpOf } from "../refrigerants/gwp";
import { designationOf, type Refrigerant } from "../refrigerants/types";
import { KG_PER_POUND } from "../units/mass";
import {
  APPLIANCE_TYPES,
  type ApplianceType,
  type LeakRatePart,
  type MassLimit,
  type RuleProfile,
} from "./rule-profile";

export type Applicability =
  | { applies: true; part: LeakRatePart; reason: string }
  | { applies: false; part: null; reason: string };

/** A charge limit in kg. */
export function massLimitKg(limit: MassLimit): number {
  return limit.unit === "kg" ? limit.value : limit.value * KG_PER_POUND;
}

/**
 * "≥ limit" with a relative tolerance of 1e-9: 50 lb typed in lb and stored in kg
 * (50 × 0.45359237) must count as 50 lb even if a conversion round trip lost the last bit.
 */
function atLeast(kg: number, limitKg: number): boolean {
  return kg >= limitKg * (1 - 1e-9);
}

/**
 * Which leak-repair regime of the profile applies to a system, by refrigerant and full charge on a
 * date: the first part whose substance, charge and date conditions all hold. ODS → Part 82 subpart
 * F from 50 lb; non-ODS with GWP > 53 → Part 84 subpart C from 15 lb, from 1 Jan 2026 (US profile).
 */
export function applicableLeakRatePart(
  profile: RuleProfile,
  refrigerant: Refrigerant,
  fullChargeKg: number,
  onDate: IsoDate,
): Applicability {
  requirePositive(fullChargeKg, "fullChargeKg");
  compareDates(onDate, onDate);
  const ods = isOzoneDepleting(refrigerant);
  const reasons: string[] = [];
  for (const part of profile.leakRateParts) {
    const covers = part.covers.value;
    if (covers.ozoneDepleting !== ods) {
      reasons.push(`${part.title}: ${designationOf(refrigerant)} is ${ods ? "" : "not "}ozone-depleting`);
      continue;
    }
    if (!covers.ozoneDepleting) {
      const g = gwpOf(refrigerant, profile.gwpBases.value);
      if (!g.known) {
        reasons.push(`${part.title}: GWP of ${designationOf(refrigerant)} unknown (${g.reason})`);
        continue;
      }
      if (!(g.value > covers.gwpAbove)) {
        reasons.push(`${part.title}: GWP ${g.value} is not above ${covers.gwpAbove}`);
        continue;
      }
    }
    const limitKg = massLimitKg(part.minFullCharge.value);
    if (!atLeast(fullChargeKg, limitKg)) {
      reasons.push(
        `${part.title}: full charge below ${part.minFullCharge.value.value} ${part.minFullCharge.value.unit}`,
      );
      continue;
    }
    if (part.effectiveFrom && compareDates(onDate, part.effectiveFrom.value) < 0) {
      reasons.push(`${part.title}: applies from ${part.effectiveFrom.value}`);
      continue;
    }
    const limit = part.minFullCharge.value;
    return {
      applies: true,
      part,
      reason: `${part.title}: ${designationOf(refrigerant)}, full charge at least ${limit.value} ${limit.unit}`,
    };
  }
  return {
    applies: false,
    part: null,
    reason: reasons.length ? reasons.join("; ") : `${profile.name} sets no leak-rate threshold`,
  };
}

/** The leak-rate threshold (% per year) for an appliance type under a part, with its source. */
export function leakRateThreshold(
  part: LeakRatePart,
  applianceType: ApplianceType,
): { percent: number; source: string } {
  if (!APPLIANCE_TYPES.includes(applianceType)) {
    throw new DomainInputError(
      "applianceType",
      `must be one of ${APPLIANCE_TYPES.join(", ")}, got ${JSON.stringify(applianceType)}`,
    );
  }
  const t = part.thresholds[applianceType];
  return { percent: t.value, source: t.source };
}

/** A breach is a rate *above* the threshold ("exceeds", 40 CFR 82.157(d)); exactly 20 % is not one. */
export function exceedsThreshold(percent: number, thresholdPercent: number): boolean {
  return percent > thresholdPercent;
}
