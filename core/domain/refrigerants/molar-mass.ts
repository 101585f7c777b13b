import { getPure } from "./catalogue";
import { componentsOf, type CatalogueRefrigerant, type Refrigerant } from "./types";

/** Molar mass of dry air, g/mol, used for "heavier or lighter than air" (docs/reference/standards.md §4, M/28.96). */
export const AIR_MOLAR_MASS = 28.96;

/**
 * Molar mass in g/mol. A blend's is the mass-fraction harmonic mean `1 / Σ(wᵢ/Mᵢ)` (moles per gram
 * add up; docs/reference/standards.md §3), not the weighted arithmetic mean.
 */
export function molarMassOf(r: CatalogueRefrigerant): number;
export function molarMassOf(r: Refrigerant): number | null;
export function molarMassOf(r: Refrigerant): number | null {
  const components = componentsOf(r);
  if (components) {
    const molesPerGram = components.reduce((sum, c) => sum + c.massPercent / 100 / getPure(c.id).molarMass.value, 0);
    return 1 / molesPerGram;
  }
  if (r.kind === "company") return r.molarMass;
  return r.kind === "blend" ? null : r.molarMass.value;
}

/** Vapour density relative to air at the same temperature and pressure (ideal gas); null when the molar mass is unknown. */
export function densityRelativeToAir(r: Refrigerant): number | null {
  const m = molarMassOf(r);
  return m === null ? null : m / AIR_MOLAR_MASS;
}
