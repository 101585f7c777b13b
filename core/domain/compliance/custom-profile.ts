import { DomainInputError } from "../input-error";
import { parseIsoDate } from "../dates/calendar-date";
import { APPLIANCE_TYPES, type LeakCheckBand, type RuleProfile } from "./rule-profile";
import type { Sourced } from "../refrigerants/types";

/**
 * A custom profile is an editable copy of a built-in one (a state or company rule stricter than the
 * federal one, say). The copy is deep, so editing it never changes the original.
 */
export function copyProfile(base: RuleProfile, id: string, name: string): RuleProfile {
  if (!id.trim()) throw new DomainInputError("id", "is empty");
  if (!name.trim()) throw new DomainInputError("name", "is empty");
  const copy = structuredClone(base);
  // A built-in profile's kind is its id ("us-federal", "eu-fgas").
  return { ...copy, id, name, kind: "custom", basedOn: base.kind === "custom" ? base.basedOn : base.kind };
}

function checkSource(s: Sourced<unknown>, field: string): void {
  if (typeof s?.source !== "string" || s.source.trim() === "") {
    throw new DomainInputError(
      `${field}.source`,
      "every rule value needs its source (a citation, or who set it and why)",
    );
  }
}

function checkNumber(s: Sourced<number>, field: string, min: number, max: number, integer = false): void {
  checkSource(s, field);
  const v = s.value;
  if (typeof v !== "number" || !Number.isFinite(v) || v < min || v > max || (integer && !Number.isInteger(v))) {
    throw new DomainInputError(
      `${field}.value`,
      `must be ${integer ? "a whole number" : "a number"} from ${min} to ${max}, got ${String(v)}`,
    );
  }
}

function checkBands(s: Sourced<LeakCheckBand[]>, field: string): void {
  checkSource(s, field);
  const bands = s.value;
  if (!Array.isArray(bands) || bands.length === 0) throw new DomainInputError(field, "needs at least one band");
  bands.forEach((b, i) => {
    const f = `${field}.value[${i}]`;
    if (!(b.from >= 0)) throw new DomainInputError(`${f}.from`, `must be ≥ 0, got ${b.from}`);
    if (b.to !== null && !(b.to > b.from))
      throw new DomainInputError(`${f}.to`, `must be above from (${b.from}), got ${b.to}`);
    if (i < bands.length - 1 && b.to !== bands[i + 1].from) {
      throw new DomainInputError(
        `${f}.to`,
        `must equal the next band's from (${bands[i + 1].from}) so no charge falls between bands`,
      );
    }
    if (i === bands.length - 1 && b.to !== null)
      throw new DomainInputError(`${f}.to`, "the top band must be open (null)");
    for (const k of ["monthsWithoutLds", "monthsWithLds"] as const) {
      if (!Number.isInteger(b[k]) || b[k] < 1 || b[k] > 120)
        throw new DomainInputError(`${f}.${k}`, `must be a whole number of months from 1 to 120, got ${b[k]}`);
    }
  });
}

/** Checks a profile (typically an edited custom one); throws a DomainInputError naming the field. */
export function validateRuleProfile(p: RuleProfile): void {
  if (!p.id?.trim()) throw new DomainInputError("id", "is empty");
  if (!p.name?.trim()) throw new DomainInputError("name", "is empty");
  checkSource(p.gwpBases, "gwpBases");
  if (!Array.isArray(p.gwpBases.value) || p.gwpBases.value.length === 0)
    throw new DomainInputError("gwpBases.value", "list at least one GWP basis");
  checkNumber(p.recordRetentionYears, "recordRetentionYears", 1, 100, true);
  p.leakRateParts.forEach((part, i) => {
    const f = `leakRateParts[${i}]`;
    for (const t of APPLIANCE_TYPES) checkNumber(part.thresholds[t], `${f}.thresholds.${t}`, 0, 1000);
    checkNumber(part.repairDays, `${f}.repairDays`, 1, 3650, true);
    checkNumber(part.initialVerificationDays, `${f}.initialVerificationDays`, 0, 3650, true);
    checkNumber(part.followUpVerificationDays, `${f}.followUpVerificationDays`, 1, 3650, true);
    checkNumber(part.firstCalculationDays, `${f}.firstCalculationDays`, 1, 3650, true);
    checkNumber(part.maxDaysSinceLastAddition, `${f}.maxDaysSinceLastAddition`, 1, 3650, true);
    checkNumber(part.rollingWindowDays, `${f}.rollingWindowDays`, 1, 3650, true);
    checkNumber(part.chronicLeaker.percentOfFullCharge, `${f}.chronicLeaker.percentOfFullCharge`, 1, 10000);
    checkSource(part.minFullCharge, `${f}.minFullCharge`);
    const limit = part.minFullCharge.value;
    if (!(limit.value >= 0) || (limit.unit !== "lb" && limit.unit !== "kg")) {
      throw new DomainInputError(`${f}.minFullCharge.value`, "must be a non-negative amount in lb or kg");
    }
    if (part.inspectionsAfterBreach) {
      const g = `${f}.inspectionsAfterBreach`;
      checkSource(part.inspectionsAfterBreach, g);
      const v = part.inspectionsAfterBreach.value;
      for (const k of [
        "largeEveryMonths",
        "largeUntilPeriodsBelow",
        "otherEveryMonths",
        "otherUntilPeriodsBelow",
      ] as const) {
        if (!Number.isInteger(v[k]) || v[k] < 1 || v[k] > 120)
          throw new DomainInputError(`${g}.value.${k}`, `must be a whole number from 1 to 120, got ${v[k]}`);
      }
    }
    if (part.effectiveFrom) {
      checkSource(part.effectiveFrom, `${f}.effectiveFrom`);
      parseIsoDate(part.effectiveFrom.value, `${f}.effectiveFrom.value`);
    }
    const { month, day } = part.chronicLeaker.reportBy.value;
    checkSource(part.chronicLeaker.reportBy, `${f}.chronicLeaker.reportBy`);
    // A day every year has: 29 February would fall away in three years of four.
    const longest = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31][month - 1];
    if (!Number.isInteger(month) || longest === undefined)
      throw new DomainInputError(
        `${f}.chronicLeaker.reportBy.value.month`,
        `must be a month from 1 to 12, got ${month}`,
      );
    if (!Number.isInteger(day) || day < 1 || day > longest) {
      throw new DomainInputError(
        `${f}.chronicLeaker.reportBy.value.day`,
        `must be a day from 1 to ${longest} in month ${month} (one that every year has), got ${day}`,
      );
    }
  });
  if (p.leakChecks) {
    checkBands(p.leakChecks.co2eBands, "leakChecks.co2eBands");
    checkBands(p.leakChecks.hfoBands, "leakChecks.hfoBands");
    checkNumber(p.leakChecks.hermeticExemptBelowTonnes, "leakChecks.hermeticExemptBelowTonnes", 0, 1e6);
    checkNumber(p.leakChecks.recheckAfterRepairMonths, "leakChecks.recheckAfterRepairMonths", 1, 120, true);
    if (p.leakChecks.ldsCheckMonths)
      checkNumber(p.leakChecks.ldsCheckMonths, "leakChecks.ldsCheckMonths", 1, 120, true);
  }
}
