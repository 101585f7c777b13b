import type { Caution, RefrigerantSummary } from "#core/contracts/systems";
import { gwpOf } from "#core/domain/refrigerants/gwp";
import { componentsOf, designationOf, type GwpBasis, type Refrigerant } from "#core/domain/refrigerants/types";
import { cautionsFor, type CautionRules } from "#core/domain/safety/cautions";

/** The GWP bases a company's profile prescribes and its stated choice in words. */
export interface GwpChoice {
  bases: readonly GwpBasis[];
  statement: string;
}

export function summarizeRefrigerant(r: Refrigerant, choice: GwpChoice): RefrigerantSummary {
  const gwp = gwpOf(r, choice.bases);
  const basis = gwp.known ? [...new Set(gwp.terms.map((t) => t.basis))].join(" + ") : "";
  return {
    id: r.id,
    name: r.name,
    designation: designationOf(r),
    enteredByCompany: r.kind === "company",
    ...(r.kind === "company" && r.components ? { components: r.components.map((c) => ({ ...c })) } : {}),
    safetyClass: r.safetyClass.value,
    safetyClassSource: r.safetyClass.source,
    gwp: gwp.known
      ? {
          value: gwp.value,
          basis,
          statement:
            r.kind === "company" && r.statedGwp
              ? `stated by the company on ${r.statedGwp.basis} (${r.statedGwp.source})`
              : choice.statement,
          source: [...new Set(gwp.terms.map((t) => t.source))].join("; "),
        }
      : null,
    gwpNote: gwp.known
      ? componentsOf(r)
        ? "mass-weighted sum of the components' GWP-100, rounded half up"
        : r.kind === "company"
          ? "stated by the company"
          : null
      : gwp.reason,
  };
}

/** The cautions the system form shows for this refrigerant (they end by deferring to local codes). */
export function refrigerantCautions(r: Refrigerant, rules: CautionRules = "us"): Caution[] {
  return cautionsFor({ refrigerant: r, rules }).map((c) => ({
    id: c.id,
    level: c.level,
    text: c.text,
    source: c.source,
  }));
}
