import type { Caution, RefrigerantSummary } from "../../contracts/systems";
import { EU_FGAS_PROFILE } from "../../domain/compliance/eu-fgas-profile";
import { US_FEDERAL_PROFILE } from "../../domain/compliance/us-federal-profile";
import { gwpOf } from "../../domain/refrigerants/gwp";
import type { GwpBasis, Refrigerant } from "../../domain/refrigerants/types";
import { cautionsFor } from "../../domain/safety/cautions";

type RuleProfileId = "us-federal" | "eu-fgas" | "custom";

/** The GWP bases of the company's rule profile; a custom profile starts from the US federal one. */
export function gwpBasesFor(profile: RuleProfileId): readonly GwpBasis[] {
  return profile === "eu-fgas" ? EU_FGAS_PROFILE.gwpBases.value : US_FEDERAL_PROFILE.gwpBases.value;
}

export function summarizeRefrigerant(r: Refrigerant, bases: readonly GwpBasis[]): RefrigerantSummary {
  const gwp = gwpOf(r, bases);
  const basis = gwp.known ? [...new Set(gwp.terms.map((t) => t.basis))].join(" + ") : "";
  return {
    id: r.id,
    name: r.name,
    safetyClass: r.safetyClass.value,
    safetyClassSource: r.safetyClass.source,
    gwp: gwp.known ? { value: gwp.value, basis, source: [...new Set(gwp.terms.map((t) => t.source))].join("; ") } : null,
    gwpNote: gwp.known ? (r.kind === "blend" ? "mass-weighted sum of the components' GWP-100, rounded half up" : null) : gwp.reason,
  };
}

/** The cautions the system form shows for this refrigerant (they end by deferring to local codes). */
export function refrigerantCautions(r: Refrigerant): Caution[] {
  return cautionsFor({ refrigerant: r }).map((c) => ({ id: c.id, level: c.level, text: c.text, source: c.source }));
}
