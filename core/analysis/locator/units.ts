// Unit conversions and the well-mixed room balance used for the g/yr estimate.

/** Molar volume of an ideal gas at 25 °C and 101.325 kPa, L/mol (RT/P; docs/reference/standards.md §4). */
export const MOLAR_VOLUME_25C_L = 24.465;

/** mg/m³ = ppm × M / Vm (docs/reference/standards.md §4). */
export function ppmToMgPerM3(ppm: number, molarMassGPerMol: number, molarVolumeL = MOLAR_VOLUME_25C_L): number {
  return (ppm * molarMassGPerMol) / molarVolumeL;
}

export function mgPerM3ToPpm(mg: number, molarMassGPerMol: number, molarVolumeL = MOLAR_VOLUME_25C_L): number {
  return (mg * molarVolumeL) / molarMassGPerMol;
}

/** Steady state of V·dC/dt = G − ACH·V·C: C = G/(ACH·V) (Ott 2007, ch. 18; docs/reference/standards.md §7). G in mg/h, C in mg/m³. */
export function wellMixedConcentration(emissionMgPerH: number, airChangesPerH: number, volumeM3: number): number {
  if (!(airChangesPerH > 0) || !(volumeM3 > 0)) throw new Error("air changes per hour and volume must be positive");
  return emissionMgPerH / (airChangesPerH * volumeM3);
}

/** The same balance solved for the emission: G = C·ACH·V, mg/h. */
export function wellMixedEmission(concentrationMgPerM3: number, airChangesPerH: number, volumeM3: number): number {
  return concentrationMgPerM3 * airChangesPerH * volumeM3;
}

export const HOURS_PER_YEAR = 8766; // 365.25 days
