import { requireNonNegative } from "../input-error";
import { roundHalfUp } from "../numbers/round-half-up";
import { gwpOf } from "../refrigerants/gwp";
import { componentsOf, type Refrigerant } from "../refrigerants/types";
import type { RuleProfile } from "./rule-profile";

/** `t CO2e = kg × GWP / 1000` (Regulation (EU) 2024/573 Art. 3 [S:E7]). */
export function co2eTonnes(chargeKg: number, gwp: number): number {
  return (requireNonNegative(chargeKg, "chargeKg") * requireNonNegative(gwp, "gwp")) / 1000;
}

export type SystemCo2e =
  | { known: true; tonnes: number; gwp: number; gwpSource: string }
  | { known: false; reason: string };

/** CO2e of a system's charge with the GWP the profile prescribes (blends rounded as published). */
export function systemCo2e(profile: RuleProfile, refrigerant: Refrigerant, chargeKg: number): SystemCo2e {
  const g = gwpOf(refrigerant, profile.gwpBases.value);
  if (!g.known) return { known: false, reason: g.reason };
  const source =
    componentsOf(refrigerant) !== null
      ? `[D] from components by mass (${g.terms
          .map((t) => t.basis)
          .filter((b, i, a) => a.indexOf(b) === i)
          .join(", ")})`
      : g.terms[0].source;
  return { known: true, tonnes: co2eTonnes(chargeKg, g.value), gwp: g.value, gwpSource: source };
}

/**
 * CO2e cleaned of binary noise for comparing with band edges: 2.5 kg × 2000 / 1000 must be 5 t,
 * not 4.999999999. Rounded to the gram of CO2e (6 decimals of a tonne).
 */
export function tonnesForComparison(tonnes: number): number {
  return roundHalfUp(tonnes, 6);
}

/** The profile's stated GWP basis, shown beside every GWP and CO2-equivalent figure. */
export function gwpBasisStatement(profile: RuleProfile): string {
  return profile.gwpBases.note?.trim() || `GWP-100 from ${profile.gwpBases.value.join(", then ")}`;
}
