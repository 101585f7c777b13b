import { DomainInputError } from "../input-error";

/**
 * Conventional (abridged) standard atomic weights, IUPAC CIAAW; from memory. Used only to cross-check
 * the catalogue's molar masses and to tell halogenated molecules from the rest.
 */
export const ATOMIC_WEIGHTS: Readonly<Record<string, number>> = {
  H: 1.008,
  C: 12.011,
  N: 14.007,
  O: 15.999,
  F: 18.998,
  Cl: 35.45,
};

/** Element counts of a plain molecular formula: "C2H2F4" → { C: 2, H: 2, F: 4 }. */
export function elementCounts(formula: string): Record<string, number> {
  if (!/^(?:[A-Z][a-z]?\d*)+$/.test(formula))
    throw new DomainInputError("formula", `cannot read ${JSON.stringify(formula)}`);
  const counts: Record<string, number> = {};
  for (const [, el, n] of formula.matchAll(/([A-Z][a-z]?)(\d*)/g)) {
    if (!(el in ATOMIC_WEIGHTS)) throw new DomainInputError("formula", `unknown element ${el} in ${formula}`);
    counts[el] = (counts[el] ?? 0) + (n === "" ? 1 : Number(n));
  }
  return counts;
}

/** Molar mass in g/mol from the formula and the atomic weights above. */
export function molarMassFromFormula(formula: string): number {
  return Object.entries(elementCounts(formula)).reduce((sum, [el, n]) => sum + ATOMIC_WEIGHTS[el] * n, 0);
}

/** Contains fluorine or chlorine bonded into the molecule (what heated-diode sensors respond to). */
export function isHalogenated(formula: string): boolean {
  const c = elementCounts(formula);
  return (c.F ?? 0) > 0 || (c.Cl ?? 0) > 0;
}
