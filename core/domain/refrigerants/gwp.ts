import { DomainInputError } from "../input-error";
import { roundHalfUp } from "../numbers/round-half-up";
import { getPure } from "./catalogue";
import { componentsOf, type CompanyRefrigerant, type GwpBasis, type PureRefrigerant, type Refrigerant } from "./types";

export interface GwpTerm {
  id: string;
  massPercent: number;
  gwp: number;
  basis: GwpBasis;
  source: string;
}

export type GwpResult =
  | {
      known: true;
      /** What to show and multiply by: a pure value as listed, a blend rounded half up to a whole number. */
      value: number;
      /** The unrounded mass-weighted sum (equal to `value` for a pure substance). */
      exact: number;
      /** One term per component (one term for a pure substance), each with its basis and source. */
      terms: GwpTerm[];
    }
  | { known: false; missing: string[]; reason: string };

function pureGwp(r: PureRefrigerant, bases: readonly GwpBasis[]) {
  for (const basis of bases) {
    const entry = r.gwp[basis];
    if (entry) return { basis, value: entry.value, source: entry.source };
  }
  return undefined;
}

/**
 * GWP-100 of a refrigerant on an ordered list of bases (the first basis with a value wins per
 * component). Blends: Σ (mass % × component GWP) / 100, rounded half up to a whole number as the
 * published tables do (docs/reference/standards.md §3 test notes). A component with no value on any basis makes
 * the result unknown rather than silently zero: R-448A with HFOs at 0 would read 1386, not 1387.
 */
export function gwpOf(r: Refrigerant, bases: readonly GwpBasis[]): GwpResult {
  if (bases.length === 0) throw new DomainInputError("bases", "list at least one GWP basis");
  const components = componentsOf(r);
  if (r.kind === "company" && !components) return statedGwpOf(r, bases);
  const parts = components
    ? components.map((c) => ({ pure: getPure(c.id), massPercent: c.massPercent }))
    : [{ pure: r as PureRefrigerant, massPercent: 100 }];
  const terms: GwpTerm[] = [];
  const missing: string[] = [];
  for (const { pure, massPercent } of parts) {
    const found = pureGwp(pure, bases);
    if (found) terms.push({ id: pure.id, massPercent, gwp: found.value, basis: found.basis, source: found.source });
    else missing.push(pure.id);
  }
  if (missing.length > 0) {
    return { known: false, missing, reason: `no GWP for ${missing.join(", ")} on ${bases.join(" or ")}` };
  }
  if (!components) return { known: true, value: terms[0].gwp, exact: terms[0].gwp, terms };
  const exact = terms.reduce((sum, t) => sum + t.massPercent * t.gwp, 0) / 100;
  return { known: true, value: roundHalfUp(exact), exact, terms };
}

/**
 * A GWP the company stated counts only on a profile whose bases include the basis it was stated on:
 * an AR5 figure is not silently used where the profile reads AR4.
 */
function statedGwpOf(r: CompanyRefrigerant, bases: readonly GwpBasis[]): GwpResult {
  const stated = r.statedGwp;
  if (!stated)
    return { known: false, missing: [r.name], reason: `${r.name} has neither a composition nor a stated GWP` };
  if (!bases.includes(stated.basis)) {
    return {
      known: false,
      missing: [r.name],
      reason: `the GWP of ${r.name} was stated on ${stated.basis}, which is not among ${bases.join(", ")}`,
    };
  }
  const source = `entered by the company: ${stated.source}`;
  const term = { id: r.id, massPercent: 100, gwp: stated.value, basis: stated.basis, source };
  return { known: true, value: stated.value, exact: stated.value, terms: [term] };
}
