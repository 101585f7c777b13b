import { getPure } from "./catalogue";
import type { Refrigerant } from "./types";

/** Molar mass of dry air, g/mol, used for "heavier or lighter than air" (docs/reference/standards.md §4, M/28.96). */
export const AIR_MOLAR_MASS = 28.96;

/**
 * Molar mass in g/mol. A blend's is the mass-fraction harmonic mean `1 / Σ(wᵢ/Mᵢ)` (moles per gram
 * add up; docs/reference/standards.md §3), not the weighted arithmetic mean.
 */
export function molarMassOf(r: Refrigerant): number {
  if (r.kind !== "blend") return r.molarMass.value;
  const molesPerGram = r.components.reduce((sum, c) => sum + c.massPercent / 100 / getPure(c.id).molarMass.value, 0);
  return 1 / molesPerGram;
}

/** Vapour density relative to air at the same temperature and pressure (ideal gas). */
export function densityRelativeToAir(r: Refrigerant): number {
  return molarMassOf(r) / AIR_MOLAR_MASS;
}
