import type { LengthUnit, MassUnit } from "#core/contracts/units";
import { NUMBER_FORMAT_NAMES, type NumberFormat } from "#core/domain/numbers/number-format";
import type { CompanySettings } from "#core/contracts/company";

export const LENGTH_LABELS: Record<LengthUnit, string> = { m: "Metres", "ft-in": "Feet and inches" };
export const MASS_LABELS: Record<MassUnit, string> = { kg: "Kilograms (kg)", lb: "Pounds (lb)" };

export const NUMBER_FORMAT_LABELS: Record<NumberFormat, string> = { ...NUMBER_FORMAT_NAMES };

export const RULE_PROFILE_LABELS: Record<CompanySettings["ruleProfile"], string> = {
  "us-federal": "US federal (EPA refrigerant management)",
  "eu-fgas": "EU F-gas",
  custom: "Custom (the company's own profile, below)",
};

export const LEAK_RATE_METHOD_LABELS: Record<CompanySettings["leakRateMethod"], string> = {
  annualizing: "Annualizing",
  "rolling-average": "Rolling average",
};

export const PAPER_LABELS: Record<NonNullable<CompanySettings["paperSize"]>, string> = {
  profile: "Follow the rule profile (US Letter under US rules, A4 under EU F-gas)",
  letter: "US Letter (8.5 × 11 in)",
  a4: "A4 (210 × 297 mm)",
};

export function optionsOf<K extends string>(labels: Record<K, string>) {
  return (Object.keys(labels) as K[]).map((value) => ({ value, label: labels[value] }));
}
